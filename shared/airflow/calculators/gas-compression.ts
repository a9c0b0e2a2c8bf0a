import { ABOVE_ZERO_PA, bound, defineCalculator } from '../define';
import { combinedGasLawVolume } from '../compression';
import { qty } from '../latex';
import { airTemperature } from './common-inputs';
import { COMPRESSED_AIR_HAZARD } from './hazards';

const IDEAL_GAS_LIMIT_PA = 2e6;

const absolute = (label: string, symbol: string, example: { value: number; unit: string }, exampleSi: { value: number; unit: string }) => ({
  label, symbol, kind: 'pressure' as const, min: ABOVE_ZERO_PA, example, exampleSi,
  help: 'ABSOLUTE pressure: add the barometric pressure (about 14.7 psi or 100 kPa, shop common practice) to a gauge reading.',
});

export const gasCompression = defineCalculator({
  id: 'gas-compression',
  title: 'Squeezing a fixed mass of air (combined gas law)',
  topic: 'Mass flow',
  summary:
    'Volume of a fixed mass of air after its pressure and temperature change: p₁V₁/T₁ = p₂V₂/T₂ (Boyle\'s law when the temperature stays the same, Charles\'s law when the pressure does).',
  hazard: COMPRESSED_AIR_HAZARD,
  inputs: {
    // 100 kPa (1 bar) for the atmosphere, and 800 kPa absolute for a 7 bar gauge workshop line:
    // the metric shop's round figures (shop common practice).
    pressure1: absolute('Starting pressure (absolute)', 'p_{1}', { value: 14.7, unit: 'psi' }, { value: 100, unit: 'kPa' }),
    volume1: {
      label: 'Starting volume',
      symbol: 'V_{1}',
      kind: 'volume',
      defaultUnit: { si: 'L', us: 'ft^3' },
      min: bound(0, 'm^3', false),
      example: { value: 10, unit: 'ft^3' },
      exampleSi: { value: 300, unit: 'L' },
      help: 'Volume the air takes at the starting pressure and temperature.',
    },
    temperature1: airTemperature('Starting temperature', 'T_{1}', { value: 20, unit: 'degC' }, 'Air temperature at the start.'),
    pressure2: absolute('Final pressure (absolute)', 'p_{2}', { value: 114.7, unit: 'psi' }, { value: 800, unit: 'kPa' }),
    temperature2: {
      ...airTemperature('Final temperature', 'T_{2}', { value: 40, unit: 'degC' }, 'Air temperature at the end. Empty: same as the start (Boyle\'s law).'),
      optional: true,
    },
  },
  outputs: {
    volume2: { label: 'Final volume', symbol: 'V_{2}', kind: 'volume', us: 'ft^3' },
  },
  compute(ctx) {
    const p1 = ctx.value('pressure1');
    const v1 = ctx.value('volume1');
    const t1 = ctx.value('temperature1');
    const p2 = ctx.value('pressure2');
    const t2 = ctx.has('temperature2') ? ctx.value('temperature2') : t1;
    for (const field of ['pressure1', 'pressure2'] as const) {
      if (ctx.value(field) > IDEAL_GAS_LIMIT_PA) {
        ctx.warn(field, 'Above about 2 MPa (290 psi) real air departs from the ideal gas law more and more; treat the result as an estimate.');
      }
    }
    const v2 = combinedGasLawVolume(p1, v1, t1, p2, t2);
    ctx.step(ctx.has('temperature2') ? 'Combined gas law for a fixed mass of air' : 'Boyle\'s law: same temperature, so volume falls as pressure rises',
      '\\frac{p_{1}V_{1}}{T_{1}} = \\frac{p_{2}V_{2}}{T_{2}} \\;\\Rightarrow\\; V_{2} = V_{1}\\,\\frac{p_{1}}{p_{2}}\\,\\frac{T_{2}}{T_{1}}',
      `V_{2} = ${qty(v1, 'm^3')} \\times \\frac{${qty(p1, 'Pa')}}{${qty(p2, 'Pa')}} \\times \\frac{${qty(t2, 'K')}}{${qty(t1, 'K')}}`,
      `V_{2} = ${qty(v2, 'm^3')}`);
    return { volume2: v2 };
  },
});
