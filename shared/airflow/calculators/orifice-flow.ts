import { bound, defineCalculator } from '../define';
import { circleArea, idealVelocity, INCOMPRESSIBLE_LIMIT_PA, orificeVolumeFlow } from '../flow';
import { num, qty } from '../latex';
import { density, pressureDrop } from './common-inputs';
import { BENCH_SUCTION_HAZARD } from './hazards';

type Unknown = 'volumeFlow' | 'diameter' | 'dischargeCoefficient' | 'pressureDrop';

/**
 * C_d is below 1 for an orifice referred to its bore with the approach velocity neglected. A
 * flow coefficient C/√(1−β⁴) (ISO 5167-1: the discharge coefficient C times the velocity-of-
 * approach factor) or a coefficient referred to a larger-than-minimum area can exceed 1: allowed
 * up to this sane bound, with a warning above 1 (our choice of bound).
 */
const MAX_DISCHARGE_COEFFICIENT = 1.5;
const ABOVE_ONE =
  'is above 1. A plain orifice referred to its bore cannot do that. It is possible only for a flow coefficient that includes the approach speed (ISO 5167-1), or for a coefficient referred to an area other than the bore (see the discharge-coefficient calculator for valves and ports). Check the inputs.';
const LABELS: Record<Unknown, string> = {
  volumeFlow: 'Volume flow',
  diameter: 'Orifice diameter',
  dischargeCoefficient: 'Discharge coefficient',
  pressureDrop: 'Pressure drop',
};

export const orificeFlow = defineCalculator({
  id: 'orifice-flow',
  title: 'Flow through a round orifice',
  topic: 'Flow',
  summary:
    'Flow through a round orifice from its diameter, discharge coefficient, pressure drop and air density (Q = C_d·A·√(2Δp/ρ), incompressible), or any one of diameter, discharge coefficient or pressure drop from a known flow.',
  hazard: BENCH_SUCTION_HAZARD,
  inputs: {
    solveFor: {
      label: 'Solve for',
      symbol: '',
      kind: 'option',
      optional: true,
      default: 'volumeFlow',
      options: [
        { value: 'volumeFlow', label: 'Flow (give diameter, C_d, pressure drop, density)' },
        { value: 'diameter', label: 'Diameter (give flow, C_d, pressure drop, density)' },
        { value: 'dischargeCoefficient', label: 'Discharge coefficient (give flow, diameter, pressure drop, density)' },
        { value: 'pressureDrop', label: 'Pressure drop (give flow, diameter, C_d, density)' },
      ],
      example: 'volumeFlow',
      help: 'The one quantity to find; leave that input empty and fill in the others.',
    },
    diameter: {
      label: 'Orifice diameter',
      symbol: 'd',
      kind: 'length',
      optional: true,
      min: bound(0, 'm', false),
      example: { value: 50, unit: 'mm' },
      help: 'Bore of the orifice plate. Needed unless you solve for it.',
    },
    dischargeCoefficient: {
      label: 'Discharge coefficient',
      symbol: 'C_{d}',
      kind: 'ratio',
      optional: true,
      min: bound(0, '', false),
      max: bound(MAX_DISCHARGE_COEFFICIENT, ''),
      example: 0.6,
      help: 'How much of the ideal flow the orifice really passes: about 0.6 for a sharp-edged plate, near 0.98 for a smooth bellmouth. It is below 1 for an orifice referred to its bore. Needed unless you solve for it.',
    },
    pressureDrop: {
      ...pressureDrop('Pressure drop', '\\Delta p', { value: 28, unit: 'inH2O' },
        'Pressure difference across the orifice (on a bench, the orifice\'s own reading, not the test pressure across the part). Needed unless you solve for it.'),
      // 7 kPa: the metric round figure for a 28 inH2O test pressure (shop common practice).
      exampleSi: { value: 7, unit: 'kPa' },
      optional: true,
    },
    density: density('Air density', { value: 1.2, unit: 'kg/m^3' },
      'Density of the air arriving at the orifice; the air-density calculator gives it from temperature, pressure and humidity.'),
    volumeFlow: {
      label: 'Known volume flow',
      symbol: 'Q',
      kind: 'volumeFlow',
      optional: true,
      min: bound(0, 'm^3/s', false),
      help: 'Only when solving for diameter, discharge coefficient or pressure drop.',
    },
  },
  outputs: {
    volumeFlow: { label: 'Volume flow', symbol: 'Q', kind: 'volumeFlow', us: 'cfm' },
    massFlow: { label: 'Mass flow', symbol: '\\dot m', kind: 'massFlow', us: 'lb/min' },
    velocity: { label: 'Mean velocity in the bore', symbol: 'v', kind: 'velocity', us: 'ft/s', help: 'Q/A' },
    diameter: { label: 'Orifice diameter', symbol: 'd', kind: 'length', us: 'in' },
    dischargeCoefficient: { label: 'Discharge coefficient', symbol: 'C_{d}', kind: 'ratio', us: '' },
    pressureDrop: { label: 'Pressure drop', symbol: '\\Delta p', kind: 'pressure', us: 'inH2O' },
  },
  compute(ctx) {
    const unknown = ctx.option('solveFor') as Unknown;
    const need = (name: Unknown): number => {
      if (name === unknown) return Number.NaN;
      if (!ctx.has(name)) ctx.fail(name, `${LABELS[name]} is needed when solving for ${LABELS[unknown].toLowerCase()}.`);
      return ctx.value(name);
    };
    if (ctx.has(unknown)) ctx.warn(unknown, `${LABELS[unknown]} is the quantity being solved for; the value given is ignored.`);
    if (unknown !== 'dischargeCoefficient' && ctx.has('dischargeCoefficient') && ctx.value('dischargeCoefficient') > 1) {
      ctx.warn('dischargeCoefficient', `The discharge coefficient ${ABOVE_ONE}`);
    }
    const rho = ctx.value('density');
    let q = need('volumeFlow');
    let d = need('diameter');
    let cd = need('dischargeCoefficient');
    let dp = need('pressureDrop');
    const symbols = 'Q = C_{d}\\,A\\,\\sqrt{\\frac{2\\,\\Delta p}{\\rho}},\\quad A = \\frac{\\pi d^2}{4}';
    if (unknown === 'volumeFlow') {
      const a = circleArea(d);
      q = orificeVolumeFlow(cd, a, dp, rho);
      ctx.step('Area of the bore', 'A = \\frac{\\pi d^2}{4}', `A = \\frac{\\pi \\times (${qty(d, 'm')})^2}{4}`, `A = ${qty(a, 'm^2')}`);
      ctx.step('Orifice equation (incompressible)', symbols,
        `Q = ${num(cd)} \\times ${qty(a, 'm^2')} \\times \\sqrt{\\frac{2 \\times ${qty(dp, 'Pa')}}{${qty(rho, 'kg/m^3')}}}`,
        `Q = ${qty(q, 'm^3/s')}`);
    } else if (unknown === 'diameter') {
      d = Math.sqrt((4 * q) / (Math.PI * cd * idealVelocity(dp, rho)));
      ctx.step('Orifice equation solved for the diameter', 'd = \\sqrt{\\frac{4\\,Q}{\\pi\\,C_{d}\\sqrt{2\\,\\Delta p/\\rho}}}',
        `d = \\sqrt{\\frac{4 \\times ${qty(q, 'm^3/s')}}{\\pi \\times ${num(cd)} \\times \\sqrt{2 \\times ${qty(dp, 'Pa')} / ${qty(rho, 'kg/m^3')}}}}`,
        `d = ${qty(d, 'm')}`);
    } else if (unknown === 'dischargeCoefficient') {
      const a = circleArea(d);
      cd = q / (a * idealVelocity(dp, rho));
      ctx.step('Orifice equation solved for the discharge coefficient', 'C_{d} = \\frac{Q}{A\\sqrt{2\\,\\Delta p/\\rho}},\\quad A = \\frac{\\pi d^2}{4}',
        `C_{d} = \\frac{${qty(q, 'm^3/s')}}{${qty(a, 'm^2')} \\times \\sqrt{2 \\times ${qty(dp, 'Pa')} / ${qty(rho, 'kg/m^3')}}}`,
        `C_{d} = ${num(cd)}`);
      if (cd > 1) ctx.warn('', `The discharge coefficient comes out at ${Number(cd.toPrecision(3))}, which ${ABOVE_ONE}`);
    } else {
      const a = circleArea(d);
      dp = (rho / 2) * (q / (cd * a)) ** 2;
      ctx.step('Orifice equation solved for the pressure drop', '\\Delta p = \\frac{\\rho}{2}\\left(\\frac{Q}{C_{d}\\,A}\\right)^2,\\quad A = \\frac{\\pi d^2}{4}',
        `\\Delta p = \\frac{${qty(rho, 'kg/m^3')}}{2}\\left(\\frac{${qty(q, 'm^3/s')}}{${num(cd)} \\times ${qty(a, 'm^2')}}\\right)^2`,
        `\\Delta p = ${qty(dp, 'Pa')}`);
    }
    if (dp > INCOMPRESSIBLE_LIMIT_PA) {
      ctx.warn('pressureDrop', 'Above about 15 kPa (60 inH2O) the air is squeezed noticeably; this incompressible orifice equation loses accuracy (ISO 5167 adds an expansibility factor).');
    }
    const area = circleArea(d);
    const mass = rho * q;
    const velocity = q / area;
    ctx.step('Mass flow', '\\dot m = \\rho\\,Q', `\\dot m = ${qty(rho, 'kg/m^3')} \\times ${qty(q, 'm^3/s')}`, `\\dot m = ${qty(mass, 'kg/s')}`);
    ctx.step('Mean velocity through the bore', 'v = \\frac{Q}{A}', `v = \\frac{${qty(q, 'm^3/s')}}{${qty(area, 'm^2')}}`, `v = ${qty(velocity, 'm/s')}`);
    return { volumeFlow: q, massFlow: mass, velocity, diameter: d, dischargeCoefficient: cd, pressureDrop: dp };
  },
});
