import { bound, defineCalculator } from '../define';
import { engineAirDemand } from '../flow';
import { num, qty } from '../latex';
import { density } from './common-inputs';

export const engineDemand = defineCalculator({
  id: 'engine-demand',
  title: 'Engine air demand',
  topic: 'Flow',
  summary:
    'Air an engine draws from its displacement, speed and volumetric efficiency: a four-stroke fills its displacement once every two revolutions, a two-stroke once every revolution. Gives volume flow and, with the air density, mass flow.',
  inputs: {
    displacement: {
      label: 'Displacement (all cylinders)',
      symbol: 'V_{d}',
      kind: 'volume',
      defaultUnit: { si: 'L', us: 'in^3' },
      min: bound(0, 'm^3', false),
      example: { value: 5.0, unit: 'L' },
      help: 'Total swept volume of the engine.',
    },
    speed: {
      label: 'Engine speed',
      symbol: 'N',
      kind: 'speed',
      min: bound(0, 'rpm', false),
      max: bound(100000, 'rpm'),
      example: { value: 6000, unit: 'rpm' },
      help: 'Crankshaft speed.',
    },
    volumetricEfficiency: {
      label: 'Volumetric efficiency',
      symbol: '\\eta_{v}',
      kind: 'percent',
      min: bound(0, '%', false),
      max: bound(200, '%'),
      example: { value: 85, unit: '%' },
      help: 'How well the cylinders fill, compared with their swept volume at the density below. Above 100 % happens with tuned intakes and boost.',
    },
    cycle: {
      label: 'Engine cycle',
      symbol: '',
      kind: 'option',
      optional: true,
      default: 'four-stroke',
      options: [
        { value: 'four-stroke', label: 'Four-stroke (one intake stroke per two revolutions)' },
        { value: 'two-stroke', label: 'Two-stroke (one charge per revolution)' },
      ],
      example: 'four-stroke',
      help: 'Most car and truck engines are four-stroke.',
    },
    density: density('Air density', { value: 1.2, unit: 'kg/m^3' },
      'Density of the air the volumetric efficiency refers to (usually the air at the intake).'),
  },
  outputs: {
    volumeFlow: { label: 'Air volume flow', symbol: 'Q', kind: 'volumeFlow', us: 'cfm' },
    massFlow: { label: 'Air mass flow', symbol: '\\dot m', kind: 'massFlow', us: 'lb/min' },
  },
  compute(ctx) {
    const vd = ctx.value('displacement');
    const n = ctx.value('speed');
    const ve = ctx.value('volumetricEfficiency');
    const rho = ctx.value('density');
    const fourStroke = ctx.option('cycle') !== 'two-stroke';
    const q = engineAirDemand(vd, n, ve, fourStroke ? 2 : 1);
    const formula = fourStroke ? 'Q = \\frac{V_{d}\\,N\\,\\eta_{v}}{2}' : 'Q = V_{d}\\,N\\,\\eta_{v}';
    const product = `${qty(vd, 'm^3')} \\times ${qty(n, '1/s')} \\times ${num(ve)}`;
    ctx.step(fourStroke ? 'Four-stroke: one fill of the displacement every two revolutions' : 'Two-stroke: one fill per revolution',
      formula,
      fourStroke ? `Q = \\frac{${product}}{2}` : `Q = ${product}`,
      `Q = ${qty(q, 'm^3/s')}`);
    const m = rho * q;
    ctx.step('Mass flow', '\\dot m = \\rho\\,Q', `\\dot m = ${qty(rho, 'kg/m^3')} \\times ${qty(q, 'm^3/s')}`, `\\dot m = ${qty(m, 'kg/s')}`);
    return { volumeFlow: q, massFlow: m };
  },
});
