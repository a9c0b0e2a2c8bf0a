/*
 * Sensor correction (our design). A part is flowed with an inline sensor (e.g. a mass-air
 * sensor housing) upstream of it in the path, so the bench's test pressure Δp_t is shared:
 * the sensor takes Δp_s and the part only sees Δp_t − Δp_s, at a slightly lower inlet density.
 * Treating the part as a fixed restriction (ṁ = C√(2 Δp ρ)), the flow it would pass alone at
 * the full test pressure and ambient density, referred to ambient air, is
 *   Q_c = Q_m · √(Δp_t / (Δp_t − Δp_s)) · √(p_a / (p_a − Δp_s))
 * where the first root is square-root scaling of the pressure drop and the second is the
 * density change across the sensor (isothermal). The sensor's own drop scales with the square
 * of the flow through it: Δp_s = Δp_s,ref (Q_m / Q_ref)².
 */
import { bound, defineCalculator } from '../define';
import { scaleFlowToPressureDrop } from '../flow';
import { num, qty } from '../latex';
import { absolutePressure, pressureDrop } from './common-inputs';
import { BENCH_SUCTION_HAZARD } from './hazards';

/** Above this share of the test pressure the fixed-restriction model is stretched (our choice). */
const LARGE_SHARE = 0.25;

export const sensorCorrection = defineCalculator({
  id: 'sensor-correction',
  title: 'Removing an inline sensor\'s own restriction',
  topic: 'Sensors and uncertainty',
  summary:
    'When a part was flowed with a sensor (such as a mass-air sensor housing) in the path, the sensor used up some of the test pressure. This finds the flow the part alone would pass at the full test pressure, by square-root scaling and a small density correction.',
  hazard: BENCH_SUCTION_HAZARD,
  inputs: {
    measuredFlow: {
      label: 'Flow measured with the sensor in place',
      symbol: 'Q_{m}',
      kind: 'volumeFlow',
      min: bound(0, 'm^3/s', false),
      example: { value: 300, unit: 'cfm' },
      exampleSi: { value: 150, unit: 'L/s' },
      help: 'The bench reading, referred to the ambient (inlet) air.',
    },
    testPressure: {
      ...pressureDrop('Test pressure', '\\Delta p_{t}', { value: 28, unit: 'inH2O' },
        'The pressure drop the bench held across sensor and part together.'),
      // 7 kPa: the metric round figure for a 28 inH2O test pressure (shop common practice).
      exampleSi: { value: 7, unit: 'kPa' },
    },
    sensorPressureDrop: {
      ...pressureDrop('Sensor pressure drop', '\\Delta p_{s,ref}', { value: 1.5, unit: 'inH2O' },
        'Pressure drop across the sensor alone, read with a manometer across it during the test, or measured separately at the reference flow below.'),
      exampleSi: { value: 0.4, unit: 'kPa' },
    },
    sensorReferenceFlow: {
      label: 'Flow at which the sensor drop was measured',
      symbol: 'Q_{ref}',
      kind: 'volumeFlow',
      optional: true,
      min: bound(0, 'm^3/s', false),
      help: 'Empty: the sensor drop was read during this same test, at the measured flow.',
    },
    ambientPressure: {
      ...absolutePressure('Ambient pressure (absolute)', 'p_{a}', { value: 29.92, unit: 'inHg' }, 'Barometric pressure at the bench.'),
      exampleSi: { value: 1013, unit: 'hPa' },
    },
  },
  outputs: {
    correctedFlow: { label: 'Flow of the part alone at the test pressure', symbol: 'Q_{c}', kind: 'volumeFlow', us: 'cfm' },
    sensorPressureDrop: { label: 'Sensor pressure drop at the measured flow', symbol: '\\Delta p_{s}', kind: 'pressure', us: 'inH2O' },
    partPressureDrop: { label: 'Pressure drop the part actually saw', symbol: '\\Delta p_{part}', kind: 'pressure', us: 'inH2O' },
    correctionFactor: { label: 'Correction factor', symbol: 'k', kind: 'ratio', us: '' },
  },
  compute(ctx) {
    const qm = ctx.value('measuredFlow');
    const dpt = ctx.value('testPressure');
    const dpRef = ctx.value('sensorPressureDrop');
    const pa = ctx.value('ambientPressure');
    let dps = dpRef;
    if (ctx.has('sensorReferenceFlow')) {
      const qRef = ctx.value('sensorReferenceFlow');
      dps = dpRef * (qm / qRef) ** 2;
      ctx.step('Sensor drop at the measured flow (drop grows with the square of flow)',
        '\\Delta p_{s} = \\Delta p_{s,ref}\\left(\\frac{Q_{m}}{Q_{ref}}\\right)^2',
        `\\Delta p_{s} = ${qty(dpRef, 'Pa')} \\times \\left(\\frac{${qty(qm, 'm^3/s')}}{${qty(qRef, 'm^3/s')}}\\right)^2`,
        `\\Delta p_{s} = ${qty(dps, 'Pa')}`);
    }
    if (dps >= dpt) {
      ctx.fail('sensorPressureDrop', 'The sensor\'s drop is at least the whole test pressure, so the part saw no pressure drop: check the readings.');
    }
    if (dps > LARGE_SHARE * dpt) {
      ctx.warn('sensorPressureDrop', 'The sensor takes more than a quarter of the test pressure; the correction assumes the part behaves as a fixed restriction, so test without the sensor if you can.');
    }
    const dpPart = dpt - dps;
    ctx.step('Pressure drop the part actually saw', '\\Delta p_{part} = \\Delta p_{t} - \\Delta p_{s}',
      `\\Delta p_{part} = ${qty(dpt, 'Pa')} - ${qty(dps, 'Pa')}`, `\\Delta p_{part} = ${qty(dpPart, 'Pa')}`);
    const scaled = scaleFlowToPressureDrop(qm, dpPart, dpt);
    ctx.step('Square-root scaling back to the full test pressure',
      "Q' = Q_{m}\\sqrt{\\frac{\\Delta p_{t}}{\\Delta p_{part}}}",
      `Q' = ${qty(qm, 'm^3/s')} \\times \\sqrt{\\frac{${qty(dpt, 'Pa')}}{${qty(dpPart, 'Pa')}}}`,
      `Q' = ${qty(scaled, 'm^3/s')}`);
    const densityFactor = Math.sqrt(pa / (pa - dps));
    const qc = scaled * densityFactor;
    ctx.step('Density correction: the part breathed air thinned by the sensor\'s drop',
      "Q_{c} = Q'\\sqrt{\\frac{p_{a}}{p_{a} - \\Delta p_{s}}}",
      `Q_{c} = ${qty(scaled, 'm^3/s')} \\times \\sqrt{\\frac{${qty(pa, 'Pa')}}{${qty(pa, 'Pa')} - ${qty(dps, 'Pa')}}} = ${qty(scaled, 'm^3/s')} \\times ${num(densityFactor, 6)}`,
      `Q_{c} = ${qty(qc, 'm^3/s')}`);
    return { correctedFlow: qc, sensorPressureDrop: dps, partPressureDrop: dpPart, correctionFactor: qc / qm };
  },
});
