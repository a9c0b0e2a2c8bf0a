import { defineCalculator } from '../define';
import { paren, qty } from '../latex';
import { absolutePressure } from './common-inputs';
import { COMPRESSED_AIR_HAZARD } from './hazards';

const STANDARD_AMBIENT_PA = 101325;

export const pressureConvert = defineCalculator({
  id: 'pressure-convert',
  title: 'Pressure: units, absolute and gauge',
  topic: 'Pressure',
  summary:
    'Converts a pressure between psi, kPa, bar, inches of mercury, inches of water and more, and between absolute, gauge and vacuum readings using the ambient (barometric) pressure.',
  hazard: COMPRESSED_AIR_HAZARD,
  inputs: {
    pressure: {
      label: 'Pressure',
      symbol: 'p',
      kind: 'pressure',
      example: { value: 30, unit: 'psi' },
      exampleSi: { value: 200, unit: 'kPa' },
      help: 'The reading to convert. Choose below whether it is gauge, absolute or vacuum.',
    },
    kind: {
      label: 'The reading is',
      symbol: '',
      kind: 'option',
      options: [
        { value: 'gauge', label: 'Gauge (relative to the air around you)', help: 'A tyre or boost gauge reads 0 at ambient.' },
        { value: 'absolute', label: 'Absolute (relative to a perfect vacuum)', help: 'A barometer and a MAP sensor read absolute pressure.' },
        { value: 'vacuum', label: 'Vacuum: below ambient, read as a positive number', help: 'A vacuum gauge reads 19 inHg at idle for 19 inHg below the air around you.' },
      ],
      example: 'gauge',
      help: 'Gauge pressure reads zero at ambient; absolute pressure reads zero in a perfect vacuum; a vacuum gauge reads how far below ambient, as a positive number.',
    },
    ambient: {
      ...absolutePressure('Ambient (barometric) pressure', 'p_{amb}', { value: 29.92, unit: 'inHg' },
        'Station pressure from a barometer (not the sea-level figure a weather report gives). Left empty: 101.325 kPa, the standard sea-level atmosphere.'),
      exampleSi: { value: 1013, unit: 'hPa' },
      optional: true,
      default: { value: STANDARD_AMBIENT_PA, unit: 'Pa' },
    },
  },
  outputs: {
    absolute: { label: 'Absolute pressure', symbol: 'p_{abs}', kind: 'pressure', us: 'psi' },
    gauge: { label: 'Gauge pressure', symbol: 'p_{g}', kind: 'pressure', us: 'psi' },
    vacuum: { label: 'Vacuum (below ambient)', symbol: 'p_{vac}', kind: 'pressure', us: 'inHg',
      help: 'How far below ambient, as a vacuum gauge shows it. Shown only for a pressure at or below ambient.' },
  },
  compute(ctx) {
    const p = ctx.value('pressure');
    const ambient = ctx.value('ambient');
    if (!ctx.has('ambient')) {
      ctx.warn('ambient', 'No ambient pressure given: 101.325 kPa (about 14.7 psi, shop common practice) assumed. Use your barometer for real work.');
    }
    const kind = ctx.option('kind');
    let absolute: number;
    let gauge: number;
    if (kind === 'absolute') {
      if (p <= 0) ctx.fail('pressure', 'An absolute pressure must be above zero (zero is a perfect vacuum).');
      absolute = p;
      gauge = p - ambient;
      ctx.step('Gauge pressure is absolute pressure minus ambient',
        'p_{g} = p_{abs} - p_{amb}',
        `p_{g} = ${qty(p, 'Pa')} - ${qty(ambient, 'Pa')}`,
        `p_{g} = ${qty(gauge, 'Pa')}`);
    } else if (kind === 'vacuum') {
      if (p < 0) ctx.fail('pressure', 'A vacuum reading is a positive number (how far below ambient). For a pressure above ambient, choose gauge.');
      if (p >= ambient) ctx.fail('pressure', 'This vacuum is as large as the ambient pressure or larger: nothing can be further below ambient than a perfect vacuum. Check the reading and the ambient pressure.');
      absolute = ambient - p;
      gauge = 0 - p;
      ctx.step('Absolute pressure is ambient minus the vacuum',
        'p_{abs} = p_{amb} - p_{vac}',
        `p_{abs} = ${qty(ambient, 'Pa')} - ${qty(p, 'Pa')}`,
        `p_{abs} = ${qty(absolute, 'Pa')}`);
      ctx.step('Gauge pressure is the vacuum with a minus sign',
        'p_{g} = -p_{vac}',
        `p_{g} = -${qty(p, 'Pa')}`,
        `p_{g} = ${qty(gauge, 'Pa')}`);
      return { absolute, gauge, vacuum: p };
    } else {
      absolute = p + ambient;
      gauge = p;
      if (absolute <= 0) {
        ctx.fail('pressure', 'This gauge reading is below a perfect vacuum at the ambient pressure given: a vacuum gauge cannot read lower than minus the ambient pressure.');
      }
      ctx.step('Absolute pressure is gauge pressure plus ambient',
        'p_{abs} = p_{g} + p_{amb}',
        `p_{abs} = ${paren(qty(p, 'Pa'))} + ${qty(ambient, 'Pa')}`,
        `p_{abs} = ${qty(absolute, 'Pa')}`);
    }
    if (gauge > 0) return { absolute, gauge };
    const vacuum = 0 - gauge;
    ctx.step('Vacuum is how far below ambient, as a positive number',
      'p_{vac} = p_{amb} - p_{abs} = -p_{g}',
      `p_{vac} = -${paren(qty(gauge, 'Pa'))}`,
      `p_{vac} = ${qty(vacuum, 'Pa')}`);
    return { absolute, gauge, vacuum };
  },
});
