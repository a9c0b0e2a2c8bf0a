import { defineCalculator } from '../define';
import { INCOMPRESSIBLE_LIMIT_PA, nozzleExpansibility, orificeExpansibility, scaleFlowToPressureDrop } from '../flow';
import { num, qty } from '../latex';
import { absolutePressure, pressureDrop } from './common-inputs';
import { BENCH_SUCTION_HAZARD } from './hazards';

const STANDARD_AMBIENT_PA = 101325;
/** ISO 5167-2 and -3 give their expansibility formulas for p₂/p₁ ≥ 0.75. */
const ISO_5167_MIN_PRESSURE_RATIO = 0.75;
/** Beyond this ratio of the two test pressures we warn (review E10: the √ rule drifts by 1–3 %). */
const WIDE_RATIO = 3;

type Model = 'square-root' | 'orifice' | 'nozzle';
const EXPANSIBILITY = { orifice: orificeExpansibility, nozzle: nozzleExpansibility } as const;
const EXPANSIBILITY_TEX = {
  orifice: '\\varepsilon = 1 - 0.351\\left[1 - \\tau^{1/\\kappa}\\right]',
  nozzle: '\\varepsilon = \\sqrt{\\frac{\\kappa\\,\\tau^{2/\\kappa}}{\\kappa - 1}\\cdot\\frac{1 - \\tau^{(\\kappa - 1)/\\kappa}}{1 - \\tau}}',
} as const;

/** A share as a plain-text percentage with two significant figures: 0.01145 → "1.1". */
function percentText(share: number): string {
  return String(Number((share * 100).toPrecision(2)));
}

export const flowAtTestPressure = defineCalculator({
  id: 'flow-at-test-pressure',
  title: 'Flow at another test pressure',
  topic: 'Flow',
  summary:
    'Converts a flow reading taken at one test pressure (pressure drop) to another: for the same restriction, flow scales with the square root of the pressure drop. Optionally corrects for the air being squeezed, with the expansibility of ISO 5167 for an orifice-like or a nozzle-like part.',
  hazard: BENCH_SUCTION_HAZARD,
  inputs: {
    flow: {
      label: 'Measured flow',
      symbol: 'Q_{1}',
      kind: 'volumeFlow',
      min: { value: 0, unit: 'm^3/s', inclusive: false },
      example: { value: 200, unit: 'cfm' },
      exampleSi: { value: 100, unit: 'L/s' },
      help: 'The volume flow read at the first test pressure.',
    },
    fromPressureDrop: {
      ...pressureDrop('Test pressure of the reading', '\\Delta p_{1}', { value: 10, unit: 'inH2O' },
        'The pressure drop across the part when the reading was taken.'),
      exampleSi: { value: 2.5, unit: 'kPa' },
    },
    toPressureDrop: {
      ...pressureDrop('Test pressure wanted', '\\Delta p_{2}', { value: 28, unit: 'inH2O' },
        'The pressure drop you want the flow quoted at (28 inH2O, about 7 kPa, is a common choice for heads).'),
      // 7 kPa: the metric shops' round figure for the 28 inH2O head test pressure (shop common practice).
      exampleSi: { value: 7, unit: 'kPa' },
    },
    model: {
      label: 'How the air is treated',
      symbol: '',
      kind: 'option',
      optional: true,
      default: 'square-root',
      options: [
        { value: 'square-root', label: 'Square root only (air not squeezed)',
          help: 'Q₂ = Q₁·√(Δp₂/Δp₁). Between 10 and 28 inH2O it reads about 1–3 % high; going down in test pressure it reads low.' },
        { value: 'orifice', label: 'Orifice-like part (ISO 5167-2 expansibility)',
          help: 'A sharp-edged restriction, roughly: a plate, a valve at low lift, a nearly shut throttle.' },
        { value: 'nozzle', label: 'Nozzle-like part (ISO 5167-3 expansibility)',
          help: 'A smooth, rounded restriction, roughly: a bellmouth, a venturi, a well-shaped port at high lift.' },
      ],
      example: 'square-root',
      help: 'The square-root rule treats air like water. The two ISO 5167 models add how much the air expands as it speeds up through the part. Real parts sit somewhere between them.',
    },
    ambientPressure: {
      ...absolutePressure('Pressure of the air entering the part (absolute)', 'p_{a}', { value: 29.92, unit: 'inHg' },
        'Only for the orifice and nozzle models. On a bench that draws air through the part, the barometer reading. Left empty: 101.325 kPa, the standard sea-level atmosphere.'),
      exampleSi: { value: 1013, unit: 'hPa' },
      optional: true,
      default: { value: STANDARD_AMBIENT_PA, unit: 'Pa' },
    },
  },
  outputs: {
    flow: { label: 'Flow at the wanted test pressure', symbol: 'Q_{2}', kind: 'volumeFlow', us: 'cfm',
      help: 'Volume flow at the density of the air entering the part, the same as for the reading.' },
    expansibilityRatio: { label: 'Expansibility ratio', symbol: '\\varepsilon_{2}/\\varepsilon_{1}', kind: 'ratio', us: '',
      help: 'Orifice and nozzle models only: how much the squeezing of the air changes the square-root answer.' },
  },
  compute(ctx) {
    const q1 = ctx.value('flow');
    const dp1 = ctx.value('fromPressureDrop');
    const dp2 = ctx.value('toPressureDrop');
    const model = ctx.option('model') as Model;
    const ratio = dp2 / dp1;
    const wide = ratio > WIDE_RATIO || ratio < 1 / WIDE_RATIO;
    if (model === 'square-root') {
      for (const field of ['fromPressureDrop', 'toPressureDrop'] as const) {
        if (ctx.value(field) > INCOMPRESSIBLE_LIMIT_PA) {
          ctx.warn(field, 'Above about 15 kPa (60 inH2O) the air is squeezed noticeably and square-root scaling loses accuracy.');
        }
      }
      if (wide) warnWideSquareRoot(ctx, dp1, dp2, ctx.value('ambientPressure'));
      const q2 = scaleFlowToPressureDrop(q1, dp1, dp2);
      ctx.step('Scale with the square root of the pressure-drop ratio',
        'Q_{2} = Q_{1}\\sqrt{\\frac{\\Delta p_{2}}{\\Delta p_{1}}}',
        `Q_{2} = ${qty(q1, 'm^3/s')} \\times \\sqrt{\\frac{${qty(dp2, 'Pa')}}{${qty(dp1, 'Pa')}}} = ${qty(q1, 'm^3/s')} \\times ${num(Math.sqrt(ratio))}`,
        `Q_{2} = ${qty(q2, 'm^3/s')}`);
      return { flow: q2 };
    }

    const pa = ctx.value('ambientPressure');
    if (!ctx.has('ambientPressure')) {
      ctx.warn('ambientPressure', 'No pressure given for the air entering the part: 101.325 kPa assumed. Use your barometer for real work.');
    }
    for (const field of ['fromPressureDrop', 'toPressureDrop'] as const) {
      const dp = ctx.value(field);
      if (dp >= pa) ctx.fail(field, 'The test pressure must be smaller than the pressure of the air entering the part.');
      if ((pa - dp) / pa < ISO_5167_MIN_PRESSURE_RATIO) {
        ctx.warn(field, 'The pressure falls by more than a quarter across the part: outside the range of the ISO 5167 expansibility formulas (p₂/p₁ ≥ 0.75).');
      }
    }
    if (wide) {
      ctx.warn('toPressureDrop', 'The two test pressures differ by more than 3 times. Over so wide a range the part\'s own discharge coefficient can change too (its flow pattern and Reynolds number), which no model here covers. Measure at the wanted test pressure when you can.');
    }
    const expansibility = EXPANSIBILITY[model];
    const tau1 = (pa - dp1) / pa;
    const tau2 = (pa - dp2) / pa;
    const eps1 = expansibility(tau1);
    const eps2 = expansibility(tau2);
    ctx.step('Pressure ratio across the part at each test pressure',
      '\\tau = \\frac{p_{a} - \\Delta p}{p_{a}}',
      `\\tau_{1} = \\frac{${qty(pa, 'Pa')} - ${qty(dp1, 'Pa')}}{${qty(pa, 'Pa')}},\\quad \\tau_{2} = \\frac{${qty(pa, 'Pa')} - ${qty(dp2, 'Pa')}}{${qty(pa, 'Pa')}}`,
      `\\tau_{1} = ${num(tau1, 6)},\\quad \\tau_{2} = ${num(tau2, 6)}`);
    const tauTex = (tau: number) => num(tau, 6);
    const substituted = model === 'orifice'
      ? (tau: number) => `1 - 0.351 \\times \\left[1 - ${tauTex(tau)}^{1/1.4}\\right]`
      : (tau: number) => `\\sqrt{\\frac{1.4 \\times ${tauTex(tau)}^{2/1.4}}{0.4} \\cdot \\frac{1 - ${tauTex(tau)}^{0.4/1.4}}{1 - ${tauTex(tau)}}}`;
    ctx.step(model === 'orifice'
      ? 'Expansibility of an orifice-like part (ISO 5167-2, κ = 1.4, part much smaller than its approach: β → 0)'
      : 'Expansibility of a nozzle-like part (ISO 5167-3, κ = 1.4, part much smaller than its approach: β → 0)',
    EXPANSIBILITY_TEX[model],
    `\\varepsilon_{1} = ${substituted(tau1)},\\quad \\varepsilon_{2} = ${substituted(tau2)}`,
    `\\varepsilon_{1} = ${num(eps1, 6)},\\quad \\varepsilon_{2} = ${num(eps2, 6)}`);
    const q2 = q1 * (eps2 / eps1) * Math.sqrt(ratio);
    ctx.step('Scale with the square root and the expansibility ratio (same air entering the part, same discharge coefficient)',
      'Q_{2} = Q_{1}\\,\\frac{\\varepsilon_{2}}{\\varepsilon_{1}}\\sqrt{\\frac{\\Delta p_{2}}{\\Delta p_{1}}}',
      `Q_{2} = ${qty(q1, 'm^3/s')} \\times \\frac{${num(eps2, 6)}}{${num(eps1, 6)}} \\times \\sqrt{\\frac{${qty(dp2, 'Pa')}}{${qty(dp1, 'Pa')}}}`,
      `Q_{2} = ${qty(q2, 'm^3/s')}`);
    return { flow: q2, expansibilityRatio: eps2 / eps1 };
  },
});

/** The √ rule over a wide range: how far off it is for an orifice-like and a nozzle-like part. */
function warnWideSquareRoot(ctx: { warn(field: string, message: string): void }, dp1: number, dp2: number, pa: number): void {
  if (dp1 >= pa || dp2 >= pa) return;
  const off = (f: (tau: number) => number) => f((pa - dp1) / pa) / f((pa - dp2) / pa) - 1;
  const orifice = off(orificeExpansibility);
  const nozzle = off(nozzleExpansibility);
  const direction = orifice > 0 ? 'high' : 'low';
  ctx.warn('toPressureDrop', `The two test pressures differ by more than 3 times. Because air is squeezed, the square-root figure reads ${direction} here: by about ${percentText(Math.abs(orifice))} % for an orifice-like part and ${percentText(Math.abs(nozzle))} % for a nozzle-like one. Choose one of those models, or better, measure at the wanted test pressure.`);
}
