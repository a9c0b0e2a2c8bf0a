import { bound, defineCalculator } from '../define';
import { engineAirDemand } from '../flow';
import { num, qty } from '../latex';
import { density, displacement, engineSpeed } from './common-inputs';

/** Above this, a VE referred to manifold density is suspect: boost is probably counted twice (review E4). */
const MANIFOLD_VE_WARNING = 1.2;

export const engineDemand = defineCalculator({
  id: 'engine-demand',
  title: 'Engine air demand',
  topic: 'Flow',
  summary:
    'Air an engine draws from its displacement, speed and volumetric efficiency: a four-stroke fills its displacement once every two revolutions, a two-stroke once every revolution. Gives volume flow and, with the density the volumetric efficiency is referred to (manifold or ambient air), mass flow.',
  inputs: {
    displacement: displacement({ value: 5.0, unit: 'L' }),
    speed: engineSpeed('Crankshaft speed.'),
    volumetricEfficiency: {
      label: 'Volumetric efficiency',
      symbol: '\\eta_{v}',
      kind: 'percent',
      min: bound(0, '%', false),
      max: bound(300, '%'),
      example: { value: 85, unit: '%' },
      help: 'How well the cylinders fill, compared with their swept volume filled at the reference density chosen below. Referred to manifold density: about 80–95 % for a good engine, a little over 100 % with a tuned intake, boosted or not. Referred to ambient density, boost pushes it far above 100 %.',
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
    densityReference: {
      label: 'The volumetric efficiency is referred to',
      symbol: '',
      kind: 'option',
      optional: true,
      default: 'manifold',
      options: [
        { value: 'manifold', label: 'Manifold air (in the intake manifold, after any compressor and intercooler)',
          help: 'Measures the ports and valves only. VE values look like an unboosted engine\'s, with or without boost. This course uses it.' },
        { value: 'ambient', label: 'Ambient air (outside the engine)',
          help: 'Measures the whole intake system, compressor included. With boost, VE goes far above 100 %.' },
      ],
      example: 'manifold',
      help: 'Volumetric efficiency only means something against a named density (Heywood, Internal Combustion Engine Fundamentals, §2.10). Enter that same density below, or boost is counted twice.',
    },
    density: density('Air density', { value: 1.2, unit: 'kg/m^3' },
      'Density of the air the volumetric efficiency is referred to: the manifold air or the ambient air, as chosen above. Unboosted, the two are nearly the same.'),
  },
  outputs: {
    volumeFlow: { label: 'Air volume flow', symbol: 'Q', kind: 'volumeFlow', us: 'cfm',
      help: 'Volume at the reference density: the manifold air or the ambient air, as chosen.' },
    massFlow: { label: 'Air mass flow', symbol: '\\dot m', kind: 'massFlow', us: 'lb/min' },
  },
  compute(ctx) {
    const vd = ctx.value('displacement');
    const n = ctx.value('speed');
    const ve = ctx.value('volumetricEfficiency');
    const rho = ctx.value('density');
    const fourStroke = ctx.option('cycle') !== 'two-stroke';
    const manifold = ctx.option('densityReference') !== 'ambient';
    const where = manifold ? 'manifold' : 'ambient';
    if (manifold && ve > MANIFOLD_VE_WARNING) {
      ctx.warn('volumetricEfficiency', 'Over about 120 % is rare for a volumetric efficiency referred to manifold density. With boost, enter the manifold density and an unboosted-like VE; do not count boost twice. A VE referred to ambient density goes with the ambient density.');
    }
    const q = engineAirDemand(vd, n, ve, fourStroke ? 2 : 1);
    const formula = fourStroke ? 'Q = \\frac{V_{d}\\,N\\,\\eta_{v}}{2}' : 'Q = V_{d}\\,N\\,\\eta_{v}';
    const product = `${qty(vd, 'm^3')} \\times ${qty(n, '1/s')} \\times ${num(ve)}`;
    ctx.step(fourStroke
      ? `Four-stroke: one fill of the displacement every two revolutions (volume at ${where} density)`
      : `Two-stroke: one fill per revolution (volume at ${where} density)`,
    formula,
    fourStroke ? `Q = \\frac{${product}}{2}` : `Q = ${product}`,
    `Q = ${qty(q, 'm^3/s')}`);
    const m = rho * q;
    ctx.step(`Mass flow, with the ${where} air density the VE is referred to`,
      `\\dot m = \\rho_{${manifold ? 'man' : 'amb'}}\\,Q`,
      `\\dot m = ${qty(rho, 'kg/m^3')} \\times ${qty(q, 'm^3/s')}`,
      `\\dot m = ${qty(m, 'kg/s')}`);
    return { volumeFlow: q, massFlow: m };
  },
});
