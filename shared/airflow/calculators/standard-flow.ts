import { bound, defineCalculator } from '../define';
import { num, qty } from '../latex';
import { moistAir } from '../moist-air';
import { findStandard, STANDARD_CONDITIONS } from '../standard-conditions';
import { absolutePressure, airTemperature, relativeHumidity } from './common-inputs';
import { densityStep, warnOutsideCipm } from './moist-air-steps';

export const standardFlow = defineCalculator({
  id: 'standard-flow',
  title: 'Actual and standard flow',
  topic: 'Air density',
  summary:
    'Corrects a flow measured in today\'s air to a named standard condition (or back), so tests on different days compare. Offers both corrections a shop meets: the standard flow (the same mass at standard density, what SCFM means in compressed-air and metering work), and a pressure-drop bench reading corrected to standard density (the corrected bench flow).',
  inputs: {
    flow: {
      label: 'Flow',
      symbol: 'Q',
      kind: 'volumeFlow',
      min: bound(0, 'm^3/s', false),
      example: { value: 250, unit: 'cfm' },
      exampleSi: { value: 120, unit: 'L/s' },
      help: 'The flow to correct: the actual flow read today, or a standard flow when converting back.',
    },
    temperature: {
      ...airTemperature('Test air temperature', 'T', { value: 77, unit: 'degF' }, 'Temperature of the air the bench or engine drew in during the test.'),
      exampleSi: { value: 25, unit: 'degC' },
    },
    pressure: {
      ...absolutePressure('Barometric pressure (absolute)', 'p', { value: 29.1, unit: 'inHg' }, 'Station pressure during the test, from a barometer.'),
      // A shop a few hundred metres up, like the 29.1 inHg of the US example.
      exampleSi: { value: 980, unit: 'hPa' },
    },
    relativeHumidity: { ...relativeHumidity({ value: 40, unit: '%' }), optional: true, default: 0 },
    standard: {
      label: 'Standard condition',
      symbol: '',
      kind: 'option',
      options: STANDARD_CONDITIONS.map((s) => ({ value: s.value, label: s.label, help: s.definition })),
      example: 'us-standard-air',
      help: 'The reference air the corrected figure is quoted in. Always write it beside the figure. "Standard air" has more than one definition (the US one here is ASME\'s: 68 °F, 14.696 psia, 36 % RH).',
    },
    correction: {
      label: 'Correction',
      symbol: '',
      kind: 'option',
      options: [
        { value: 'mass-equivalent', label: 'Standard flow, same mass at standard density: Q·ρ/ρ_std', help: 'The volume the same mass of air would take at the standard condition: what "standard flow" and SCFM mean for compressors, meters and engines. Use for engines, fuelling and mass-flow meters.' },
        { value: 'bench-reading', label: 'Corrected bench flow at standard density: Q·√(ρ/ρ_std)', help: 'The flow a fixed restriction would pass at the same pressure drop in standard air. Use for flow-bench figures at a test pressure. It is not an SCFM figure: do not compare it with a meter or a compressor rating.' },
      ],
      example: 'bench-reading',
      help: 'The standard flow keeps the mass of air; the corrected bench flow keeps the pressure drop across the same part. They are different numbers: write which one beside the figure.',
    },
    direction: {
      label: 'Direction',
      symbol: '',
      kind: 'option',
      optional: true,
      default: 'to-standard',
      options: [
        { value: 'to-standard', label: 'Actual → standard' },
        { value: 'to-actual', label: 'Standard → actual' },
      ],
      example: 'to-standard',
      help: 'Whether the flow given is the actual flow (usual) or a standard flow to turn back into today\'s air.',
    },
  },
  outputs: {
    standardFlow: { label: 'Corrected flow at standard density', symbol: 'Q_{std}', kind: 'volumeFlow', us: 'cfm',
      help: 'With the bench-reading correction: the corrected bench flow (at standard density). With the mass-equivalent correction: the standard flow, the same mass of air at standard density (SCFM-style).' },
    actualFlow: { label: 'Actual flow', symbol: 'Q_{act}', kind: 'volumeFlow', us: 'cfm' },
    density: { label: 'Test air density', symbol: '\\rho', kind: 'density', us: 'lb/ft^3' },
    standardDensity: { label: 'Standard air density', symbol: '\\rho_{std}', kind: 'density', us: 'lb/ft^3' },
  },
  compute(ctx) {
    const T = ctx.value('temperature');
    const p = ctx.value('pressure');
    const std = findStandard(ctx.option('standard'));
    if (std === undefined) return ctx.fail('standard', 'Unknown standard condition.');
    warnOutsideCipm(ctx, T, p, 'temperature', 'pressure');
    const actual = moistAir(T, p, { relativeHumidity: ctx.value('relativeHumidity') });
    densityStep(ctx, 'Density of the test air (CIPM-2007)', actual);
    const standard = moistAir(std.temperatureK, std.pressurePa, { relativeHumidity: std.relativeHumidity });
    densityStep(ctx, `Density of the standard air: ${std.label}`, standard, '\\rho_{std}');
    const rho = actual.densityCipm;
    const rhoStd = standard.densityCipm;
    const bench = ctx.option('correction') === 'bench-reading';
    const factor = bench ? Math.sqrt(rho / rhoStd) : rho / rhoStd;
    const toStandard = ctx.option('direction') !== 'to-actual';
    const q = ctx.value('flow');
    const qStd = toStandard ? q * factor : q;
    const qAct = toStandard ? q : q / factor;
    const ratio = bench ? '\\sqrt{\\frac{\\rho}{\\rho_{std}}}' : '\\frac{\\rho}{\\rho_{std}}';
    const ratioNum = bench
      ? `\\sqrt{\\frac{${qty(rho, 'kg/m^3')}}{${qty(rhoStd, 'kg/m^3')}}}`
      : `\\frac{${qty(rho, 'kg/m^3')}}{${qty(rhoStd, 'kg/m^3')}}`;
    const title = bench
      ? 'Corrected bench flow: the bench reading at standard density (same pressure drop, same part)'
      : 'Standard flow: the same mass of air expressed at standard density';
    if (toStandard) {
      ctx.step(title, `Q_{std} = Q_{act}\\,${ratio}`, `Q_{std} = ${qty(qAct, 'm^3/s')} \\times ${ratioNum} = ${qty(qAct, 'm^3/s')} \\times ${num(factor, 6)}`, `Q_{std} = ${qty(qStd, 'm^3/s')}`);
    } else {
      ctx.step(title, `Q_{act} = Q_{std} \\Big/ ${ratio}`, `Q_{act} = ${qty(qStd, 'm^3/s')} \\Big/ ${ratioNum} = ${qty(qStd, 'm^3/s')} \\div ${num(factor, 6)}`, `Q_{act} = ${qty(qAct, 'm^3/s')}`);
    }
    ctx.note(bench
      ? `The figure at standard density is a corrected bench flow, ${std.label}. It is not a standard flow (SCFM) in the compressed-air or metering sense, which keeps the mass of air: do not compare it with a meter, a compressor or a compressor map.`
      : `The figure at standard density is a standard flow, ${std.label}: the volume the same mass of air takes in standard air (SCFM-style). Do not compare it with a corrected bench flow at a test pressure.`);
    return { standardFlow: qStd, actualFlow: qAct, density: rho, standardDensity: rhoStd };
  },
});
