import { ABOVE_ZERO_K, ABOVE_ZERO_PA, bound, type ComputeContext, defineCalculator } from '../define';
import { compressorOutletTemperature, correctedMassFlow, GAMMA_AIR, intercoolerOutletTemperature, isentropicOutletTemperature } from '../compression';
import { num, qty } from '../latex';
import { absolutePressure, airTemperature, BAROMETER_UNITS, efficiency, massFlow } from './common-inputs';
import { CHARGE_AIR_HAZARD } from './hazards';

export const boost = defineCalculator({
  id: 'boost',
  title: 'Boost, compressor outlet temperature and intercooling',
  topic: 'Forced induction',
  summary:
    'From boost pressure and ambient conditions: pressure ratio, compressor outlet temperature (isentropic compression with an efficiency, γ = 1.4), intercooler outlet temperature from its effectiveness, and the charge density ratio and mass-flow gain over an unboosted engine. With the engine\'s air mass flow, the corrected mass flow that places it on a compressor map.',
  hazard: CHARGE_AIR_HAZARD,
  inputs: {
    boostPressure: {
      label: 'Boost pressure (gauge, at the manifold)',
      symbol: 'p_{b}',
      kind: 'pressure',
      min: bound(0, 'Pa'),
      example: { value: 10, unit: 'psi' },
      exampleSi: { value: 70, unit: 'kPa' },
      help: 'What a boost gauge reads: manifold pressure above ambient, after the intercooler.',
    },
    ambientPressure: {
      ...absolutePressure('Ambient pressure (absolute)', 'p_{1}', { value: 14.7, unit: 'psi' },
        'Barometric pressure; the compressor inlet is taken at ambient (air-filter drop neglected). About 14.7 psi or 1013 hPa at sea level (shop common practice).'),
      exampleSi: { value: 1013, unit: 'hPa' },
    },
    inletTemperature: airTemperature('Compressor inlet temperature', 'T_{1}', { value: 25, unit: 'degC' }, 'Temperature of the air entering the compressor.'),
    compressorEfficiency: efficiency('Compressor efficiency', '\\eta_{c}', { value: 72, unit: '%' },
      'Isentropic (adiabatic) efficiency at the operating point, from the compressor map: often 60–78 %.'),
    intercoolerEffectiveness: {
      label: 'Intercooler effectiveness',
      symbol: '\\varepsilon',
      kind: 'percent',
      min: bound(0, '%'),
      max: bound(100, '%'),
      optional: true,
      default: 0,
      example: { value: 75, unit: '%' },
      help: 'Share of the possible temperature drop the intercooler achieves (0 % or empty: no intercooler).',
    },
    coolantTemperature: {
      ...airTemperature('Coolant temperature', 'T_{c}', { value: 25, unit: 'degC' },
        'Temperature of the cooling air (air-to-air) or water (air-to-water). Empty: same as the compressor inlet air.'),
      optional: true,
    },
    intercoolerPressureDrop: {
      label: 'Intercooler pressure drop',
      symbol: '\\Delta p_{ic}',
      kind: 'pressure',
      min: bound(0, 'Pa'),
      optional: true,
      default: { value: 0, unit: 'Pa' },
      help: 'Pressure lost across the intercooler and pipes. Empty: neglected (the compressor outlet is then at boost pressure).',
    },
    engineMassFlow: {
      // About what L7's 2.0 L engine takes under boost: 100 g/s unboosted (L6) times a density ratio near 1.5–1.9.
      ...massFlow('Engine air mass flow (for the compressor map)', '\\dot m', { value: 20, unit: 'lb/min' },
        'The real mass of air the engine takes, e.g. from the engine-demand or mass-flow calculator. Give it to find where the engine sits on a compressor map.'),
      exampleSi: { value: 150, unit: 'g/s' },
      optional: true,
    },
    mapReferencePressure: {
      label: 'Map reference pressure (absolute)',
      symbol: 'p_{ref}',
      kind: 'pressure',
      min: ABOVE_ZERO_PA,
      defaultUnit: BAROMETER_UNITS,
      help: 'The inlet pressure the compressor map is drawn for: every map states its own in its legend. Empty: 101.325 kPa (29.92 inHg).',
      optional: true,
      default: { value: 101325, unit: 'Pa' },
    },
    mapReferenceTemperature: {
      label: 'Map reference temperature',
      symbol: 'T_{ref}',
      kind: 'temperature',
      min: ABOVE_ZERO_K,
      help: 'The inlet temperature the compressor map is drawn for: every map states its own in its legend. Empty: 25 °C (298.15 K).',
      optional: true,
      default: { value: 298.15, unit: 'K' },
    },
  },
  outputs: {
    pressureRatio: { label: 'Pressure ratio', symbol: 'PR', kind: 'ratio', us: '' },
    isentropicOutletTemperature: { label: 'Ideal (isentropic) outlet temperature', symbol: 'T_{2s}', kind: 'temperature', us: 'degF' },
    compressorOutletTemperature: { label: 'Compressor outlet temperature', symbol: 'T_{2}', kind: 'temperature', us: 'degF' },
    intercoolerOutletTemperature: { label: 'Intercooler outlet temperature', symbol: 'T_{3}', kind: 'temperature', us: 'degF' },
    densityRatio: { label: 'Density ratio (charge over compressor-inlet air)', symbol: '\\rho_{3}/\\rho_{1}', kind: 'ratio', us: '',
      help: 'Manifold charge density over the density of the air entering the compressor (at the compressor inlet temperature, not the outside air\'s).' },
    massFlowGain: { label: 'Mass-flow gain', symbol: 'G', kind: 'percent', us: '%', help: 'Extra air mass at the same engine speed and volumetric efficiency, over the same engine breathing compressor-inlet air unboosted.' },
    correctedMassFlow: { label: 'Corrected mass flow (for the compressor map)', symbol: '\\dot m_{c}', kind: 'massFlow', us: 'lb/min',
      help: 'Where the engine sits along the map\'s flow axis: the real mass flow referred to the map\'s inlet pressure and temperature. The map\'s speed lines are corrected the same way: N/√(T₁/T_ref). Only with an engine mass flow.' },
  },
  compute(ctx) {
    const boostPa = ctx.value('boostPressure');
    const p1 = ctx.value('ambientPressure');
    const t1 = ctx.value('inletTemperature');
    const eta = ctx.value('compressorEfficiency');
    const eps = ctx.value('intercoolerEffectiveness');
    const tc = ctx.has('coolantTemperature') ? ctx.value('coolantTemperature') : t1;
    const dpIc = ctx.value('intercoolerPressureDrop');
    const p3 = p1 + boostPa;
    const p2 = p3 + dpIc;
    const pr = p2 / p1;
    ctx.step('Pressure ratio across the compressor (absolute pressures)',
      'PR = \\frac{p_{2}}{p_{1}} = \\frac{p_{1} + p_{b} + \\Delta p_{ic}}{p_{1}}',
      `PR = \\frac{${qty(p1, 'Pa')} + ${qty(boostPa, 'Pa')} + ${qty(dpIc, 'Pa')}}{${qty(p1, 'Pa')}}`,
      `PR = ${num(pr)}`);
    const exponent = (GAMMA_AIR - 1) / GAMMA_AIR;
    const t2s = isentropicOutletTemperature(t1, pr);
    ctx.step('Ideal (isentropic) compression, γ = 1.4',
      'T_{2s} = T_{1}\\,PR^{(\\gamma - 1)/\\gamma}',
      `T_{2s} = ${qty(t1, 'K')} \\times ${num(pr)}^{${num(exponent)}}`,
      `T_{2s} = ${qty(t2s, 'K')}`);
    const t2 = compressorOutletTemperature(t1, pr, eta);
    ctx.step('Real compressor: the efficiency adds heat',
      'T_{2} = T_{1}\\left(1 + \\frac{PR^{(\\gamma - 1)/\\gamma} - 1}{\\eta_{c}}\\right)',
      `T_{2} = ${qty(t1, 'K')} \\times \\left(1 + \\frac{${num(pr)}^{${num(exponent)}} - 1}{${num(eta)}}\\right)`,
      `T_{2} = ${qty(t2, 'K')} = ${qty(t2 - 273.15, 'degC', 4)}`);
    if (tc > t2) ctx.warn('coolantTemperature', 'The coolant is hotter than the compressor outlet air: the intercooler would heat the charge.');
    const t3 = intercoolerOutletTemperature(t2, eps, tc);
    ctx.step('Intercooler: removes a share ε of the possible temperature drop',
      'T_{3} = T_{2} - \\varepsilon\\,(T_{2} - T_{c})',
      `T_{3} = ${qty(t2, 'K')} - ${num(eps)} \\times (${qty(t2, 'K')} - ${qty(tc, 'K')})`,
      `T_{3} = ${qty(t3, 'K')} = ${qty(t3 - 273.15, 'degC', 4)}`);
    const densityRatio = (p3 / p1) * (t1 / t3);
    ctx.step('Charge density over the density of the air entering the compressor (ideal gas, manifold pressure)',
      '\\frac{\\rho_{3}}{\\rho_{1}} = \\frac{p_{3}}{p_{1}}\\cdot\\frac{T_{1}}{T_{3}},\\quad p_{3} = p_{1} + p_{b}',
      `\\frac{\\rho_{3}}{\\rho_{1}} = \\frac{${qty(p3, 'Pa')}}{${qty(p1, 'Pa')}} \\times \\frac{${qty(t1, 'K')}}{${qty(t3, 'K')}}`,
      `\\frac{\\rho_{3}}{\\rho_{1}} = ${num(densityRatio)}`);
    const gain = densityRatio - 1;
    ctx.step('Mass-flow gain at the same engine speed and volumetric efficiency',
      'G = \\frac{\\rho_{3}}{\\rho_{1}} - 1',
      `G = ${num(densityRatio)} - 1`,
      `G = ${num(gain)} = ${num(gain * 100, 4)}\\,\\%`);
    const corrected = ctx.has('engineMassFlow') ? correctedFlowStep(ctx, ctx.value('engineMassFlow'), p1, t1) : undefined;
    return {
      pressureRatio: pr,
      isentropicOutletTemperature: t2s,
      compressorOutletTemperature: t2,
      intercoolerOutletTemperature: t3,
      densityRatio,
      massFlowGain: gain,
      ...(corrected === undefined ? {} : { correctedMassFlow: corrected }),
    };
  },
});

/**
 * Corrected (referred) mass flow for a compressor map, standard turbomachinery practice
 * (Dixon & Hall, "Fluid Mechanics and Thermodynamics of Turbomachinery"; SAE J1826, from memory):
 * ṁ_c = ṁ·√(T₁/T_ref)/(p₁/p_ref), with the compressor inlet at p₁, T₁.
 */
function correctedFlowStep(ctx: ComputeContext<'mapReferencePressure' | 'mapReferenceTemperature'>, massFlow: number, p1: number, t1: number): number {
  const pRef = ctx.value('mapReferencePressure');
  const tRef = ctx.value('mapReferenceTemperature');
  const corrected = correctedMassFlow(massFlow, p1, t1, pRef, tRef);
  ctx.step('Corrected mass flow: the real mass flow referred to the map\'s inlet conditions',
    '\\dot m_{c} = \\dot m\\,\\frac{\\sqrt{T_{1}/T_{ref}}}{p_{1}/p_{ref}}',
    `\\dot m_{c} = ${qty(massFlow, 'kg/s')} \\times \\frac{\\sqrt{${qty(t1, 'K')} / ${qty(tRef, 'K')}}}{${qty(p1, 'Pa')} / ${qty(pRef, 'Pa')}}`,
    `\\dot m_{c} = ${qty(corrected, 'kg/s')}`);
  const shift = corrected / massFlow - 1;
  if (Math.abs(shift) >= 0.05) {
    const percent = Math.round(Math.abs(shift) * 100);
    ctx.note(`The corrected flow is about ${percent} % ${shift > 0 ? 'above' : 'below'} the real mass flow: on the map, the operating point sits that much further ${shift > 0 ? 'right (towards choke)' : 'left (towards surge)'} than the real flow suggests.`);
  }
  return corrected;
}
