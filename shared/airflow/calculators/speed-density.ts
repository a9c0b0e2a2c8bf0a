/*
 * Speed-density (review gap G6): the air mass flow an engine computer estimates from manifold
 * pressure, manifold air temperature and engine speed, ṁ = η_v ρ_man V_d N / 2 (four-stroke),
 * ρ_man = p_man / (R_d T_man) (ideal gas, dry air). The volumetric efficiency is referred to
 * the manifold density, so boost is in p_man, not in η_v. Optional checks against a bench flow
 * turned into mass flow (ṁ = ρ Q) and against a mass-air sensor's reading.
 */
import { bound, defineCalculator } from '../define';
import { engineAirDemand } from '../flow';
import { num, qty } from '../latex';
import { densityIdealDry, R_DRY_AIR } from '../moist-air';
import { absolutePressure, airTemperature, displacement, engineSpeed, massFlow, volumeFlow } from './common-inputs';
import { CHARGE_AIR_HAZARD } from './hazards';

/** Above this VE (referred to manifold density) a figure is more likely a slip (our warning limit). */
const HIGH_VE = 1.2;

export const speedDensity = defineCalculator({
  id: 'speed-density',
  title: 'Speed-density air mass and a mass-air sensor check',
  topic: 'Mass flow',
  summary:
    'The air mass flow an engine computer works out from manifold pressure, manifold air temperature and engine speed (ṁ = η_v·ρ_man·V_d·N/2, four-stroke, ρ_man = p/(R·T)). Optionally turns a bench flow into mass flow and compares either figure with a mass-air sensor\'s reading.',
  hazard: CHARGE_AIR_HAZARD,
  inputs: {
    manifoldPressure: {
      ...absolutePressure('Manifold pressure (absolute)', 'p_{man}', { value: 29.7, unit: 'psi' },
        'Absolute pressure in the intake manifold, as a MAP sensor reads it. From a boost gauge, add the barometer reading (15 psi boost + 14.7 psi = 29.7 psi).'),
      defaultUnit: { si: 'kPa', us: 'psi' },
      exampleSi: { value: 205, unit: 'kPa' },
    },
    intakeAirTemperature: airTemperature('Manifold air temperature', 'T_{man}', { value: 48, unit: 'degC' },
      'Temperature of the air in the manifold, after any intercooler. A sensor before the intercooler reads the hotter compressor air and makes the density come out too low.'),
    volumetricEfficiency: {
      label: 'Volumetric efficiency (at manifold density)',
      symbol: '\\eta_{v}',
      kind: 'percent',
      min: bound(0, '%', false),
      max: bound(200, '%'),
      example: { value: 90, unit: '%' },
      help: 'How full the cylinders get compared with their swept volume at the manifold\'s density. Boost is already in the manifold pressure, so this stays near an unboosted engine\'s figure.',
    },
    displacement: displacement({ value: 2.0, unit: 'L' }),
    engineSpeed: engineSpeed('Crankshaft speed. Four-stroke: one fill every two revolutions.'),
    benchFlow: {
      ...volumeFlow('Bench flow, for the check', 'Q_{b}', undefined,
        'The flow the bench measured through the sensor and its housing, to turn into mass flow: the measured figure, not one corrected for the sensor’s own restriction (that air never passed the sensor). Needs the bench air density.'),
      optional: true,
    },
    benchDensity: {
      label: 'Bench air density',
      symbol: '\\rho_{b}',
      kind: 'density',
      optional: true,
      min: bound(0, 'kg/m^3', false),
      help: 'Density of the room air the bench flow is referred to; the air-density calculator gives it.',
    },
    sensorReading: {
      ...massFlow('Mass-air sensor reading', '\\dot m_{s}', { value: 195, unit: 'g/s' },
        'What the mass-air sensor reports (scan tools show g/s). Compared with the bench figure when a bench flow is given, otherwise with the speed-density figure.'),
      defaultUnit: { si: 'g/s', us: 'g/s' },
      optional: true,
    },
  },
  outputs: {
    manifoldDensity: { label: 'Manifold air density', symbol: '\\rho_{man}', kind: 'density', us: 'lb/ft^3' },
    massFlow: { label: 'Air mass flow (speed-density)', symbol: '\\dot m', kind: 'massFlow', us: 'g/s' },
    benchMassFlow: { label: 'Air mass flow from the bench', symbol: '\\dot m_{b}', kind: 'massFlow', us: 'g/s' },
    sensorDifference: { label: 'Sensor difference', symbol: '\\delta', kind: 'percent', us: '%', help: 'Sensor reading over the figure it is compared with, minus 1.' },
  },
  compute(ctx) {
    const p = ctx.value('manifoldPressure');
    const t = ctx.value('intakeAirTemperature');
    const ve = ctx.value('volumetricEfficiency');
    const vd = ctx.value('displacement');
    const n = ctx.value('engineSpeed');
    const rho = densityIdealDry(p, t);
    ctx.step('Manifold air density (ideal gas, dry air)', '\\rho_{man} = \\frac{p_{man}}{R_{d}\\,T_{man}}',
      `\\rho_{man} = \\frac{${qty(p, 'Pa')}}{${num(R_DRY_AIR, 6)}\\,\\mathrm{J/(kg\\,K)} \\times ${qty(t, 'K')}}`,
      `\\rho_{man} = ${qty(rho, 'kg/m^3')}`);
    const m = rho * engineAirDemand(vd, n, ve, 2);
    ctx.step('Four-stroke: one fill of the displacement every two revolutions, at manifold density',
      '\\dot m = \\frac{\\eta_{v}\\,\\rho_{man}\\,V_{d}\\,N}{2}',
      `\\dot m = \\frac{${num(ve)} \\times ${qty(rho, 'kg/m^3')} \\times ${qty(vd, 'm^3')} \\times ${qty(n, '1/s')}}{2}`,
      `\\dot m = ${qty(m, 'kg/s')}`);
    if (ve > HIGH_VE) {
      ctx.warn('volumetricEfficiency', 'Over about 120 % is unusual for a VE referred to manifold density. Check the figure: boost belongs in the manifold pressure, not in the VE.');
    }
    ctx.note('A speed-density figure is only as good as its VE figure and a manifold temperature read after any intercooler.');
    const result: { manifoldDensity: number; massFlow: number; benchMassFlow?: number; sensorDifference?: number } = { manifoldDensity: rho, massFlow: m };

    let reference = m;
    let referenceSymbol = '\\dot m';
    if (ctx.has('benchFlow')) {
      if (!ctx.has('benchDensity')) ctx.fail('benchDensity', 'Turning the bench flow into mass flow needs the bench air density.');
      const q = ctx.value('benchFlow');
      const rhoB = ctx.value('benchDensity');
      const mb = rhoB * q;
      ctx.step('Bench flow as mass flow', '\\dot m_{b} = \\rho_{b}\\,Q_{b}',
        `\\dot m_{b} = ${qty(rhoB, 'kg/m^3')} \\times ${qty(q, 'm^3/s')}`, `\\dot m_{b} = ${qty(mb, 'kg/s')}`);
      result.benchMassFlow = mb;
      reference = mb;
      referenceSymbol = '\\dot m_{b}';
    } else if (ctx.has('benchDensity')) {
      ctx.warn('benchDensity', 'The bench air density is only used with a bench flow.');
    }

    if (ctx.has('sensorReading')) {
      const ms = ctx.value('sensorReading');
      const diff = ms / reference - 1;
      ctx.step(ctx.has('benchFlow') ? 'Sensor against the bench' : 'Sensor against speed-density',
        `\\delta = \\frac{\\dot m_{s}}{${referenceSymbol}} - 1`,
        `\\delta = \\frac{${qty(ms, 'kg/s')}}{${qty(reference, 'kg/s')}} - 1`,
        `\\delta = ${num(diff)} = ${num(diff * 100, 3)}\\,\\%`);
      ctx.note(ctx.has('benchFlow')
        ? 'The bench flow is steady. On a car, pulsing and reverse flow, the sensor housing and the air temperature can make the sensor read differently.'
        : 'The difference holds any error in the VE figure as well as the sensor\'s own error.');
      result.sensorDifference = diff;
    }
    return result;
  },
});
