import { defineCalculator } from '../define';
import { INCOMPRESSIBLE_LIMIT_PA, scaleFlowToPressureDrop } from '../flow';
import { num, qty } from '../latex';
import { pressureDrop } from './common-inputs';
import { BENCH_SUCTION_HAZARD } from './hazards';

export const flowAtTestPressure = defineCalculator({
  id: 'flow-at-test-pressure',
  title: 'Flow at another test pressure',
  topic: 'Flow',
  summary:
    'Converts a flow reading taken at one test pressure (pressure drop) to another: for the same restriction, flow scales with the square root of the pressure drop.',
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
  },
  outputs: {
    flow: { label: 'Flow at the wanted test pressure', symbol: 'Q_{2}', kind: 'volumeFlow', us: 'cfm' },
  },
  compute(ctx) {
    const q1 = ctx.value('flow');
    const dp1 = ctx.value('fromPressureDrop');
    const dp2 = ctx.value('toPressureDrop');
    for (const field of ['fromPressureDrop', 'toPressureDrop'] as const) {
      if (ctx.value(field) > INCOMPRESSIBLE_LIMIT_PA) {
        ctx.warn(field, 'Above about 15 kPa (60 inH2O) the air is squeezed noticeably and square-root scaling loses accuracy.');
      }
    }
    const q2 = scaleFlowToPressureDrop(q1, dp1, dp2);
    ctx.step('Scale with the square root of the pressure-drop ratio',
      'Q_{2} = Q_{1}\\sqrt{\\frac{\\Delta p_{2}}{\\Delta p_{1}}}',
      `Q_{2} = ${qty(q1, 'm^3/s')} \\times \\sqrt{\\frac{${qty(dp2, 'Pa')}}{${qty(dp1, 'Pa')}}} = ${qty(q1, 'm^3/s')} \\times ${num(Math.sqrt(dp2 / dp1))}`,
      `Q_{2} = ${qty(q2, 'm^3/s')}`);
    return { flow: q2 };
  },
});
