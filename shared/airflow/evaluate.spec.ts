import * as fc from 'fast-check';
import { describeCalculator, evaluate, exampleRequest, listCalculators, withExampleDefaults } from './index';
import type { CalculationOutcome, CalculationRequest, FieldError, InputValue } from './index';
import { isUnitOf, parseUnit } from './units';

const errorsOf = (outcome: CalculationOutcome): FieldError[] => (outcome.ok ? [] : outcome.errors);
const fieldsOf = (outcome: CalculationOutcome) => errorsOf(outcome).map((e) => e.field);

const airDensityExample = (): Record<string, InputValue> => ({
  temperature: { value: 20, unit: 'degC' },
  pressure: { value: 101.325, unit: 'kPa' },
  relativeHumidity: { value: 50, unit: '%' },
});
const withInput = (name: string, value: unknown): CalculationRequest =>
  ({ inputs: { ...airDensityExample(), [name]: value } }) as CalculationRequest;

describe('catalogue', () => {
  const contract: Record<string, { inputs: string[]; outputs: string[] }> = {
    'pressure-convert': { inputs: ['pressure', 'kind', 'ambient'], outputs: ['absolute', 'gauge'] },
    manometer: { inputs: ['height', 'pressure', 'fluid', 'fluidTemperature'], outputs: ['pressure', 'height'] },
    'flow-at-test-pressure': { inputs: ['flow', 'fromPressureDrop', 'toPressureDrop'], outputs: ['flow'] },
    'orifice-flow': { inputs: ['diameter', 'dischargeCoefficient', 'pressureDrop', 'density', 'solveFor'], outputs: ['volumeFlow', 'massFlow', 'velocity'] },
    'air-density': { inputs: ['temperature', 'pressure', 'relativeHumidity', 'dewPoint', 'method'], outputs: ['density', 'vaporPressure', 'dewPoint', 'humidityRatio'] },
    'altitude-pressure': { inputs: ['altitude'], outputs: ['pressure', 'temperature', 'density'] },
    'standard-flow': { inputs: ['flow', 'temperature', 'pressure', 'relativeHumidity', 'standard', 'correction'], outputs: ['standardFlow', 'density', 'standardDensity'] },
    'mass-flow': { inputs: ['volumeFlow', 'massFlow', 'density'], outputs: ['massFlow', 'volumeFlow'] },
    'engine-demand': { inputs: ['displacement', 'speed', 'volumetricEfficiency', 'cycle', 'density'], outputs: ['volumeFlow', 'massFlow'] },
    boost: { inputs: ['boostPressure', 'ambientPressure', 'inletTemperature', 'compressorEfficiency', 'intercoolerEffectiveness', 'coolantTemperature'], outputs: ['pressureRatio', 'compressorOutletTemperature', 'intercoolerOutletTemperature', 'densityRatio', 'massFlowGain'] },
    'fuel-flow': { inputs: ['airMassFlow', 'airFuelRatio', 'lambda', 'stoichiometricRatio'], outputs: ['fuelMassFlow'] },
    'gas-compression': { inputs: ['pressure1', 'volume1', 'temperature1', 'pressure2', 'temperature2'], outputs: ['volume2'] },
    'sensor-correction': { inputs: [], outputs: [] },
    uncertainty: { inputs: ['repeatCount', 'repeatScatter'], outputs: ['coverageFactor'] },
    'compare-tests': {
      inputs: ['readingsA', 'readingsB', 'setup', 'ambientUncertainty', 'calibrationUncertainty'],
      outputs: ['meanA', 'meanB', 'stdDevA', 'stdDevB', 'difference', 'differenceStandardUncertainty', 'effectiveDegreesOfFreedom', 'coverageFactor', 'differenceExpandedUncertainty'],
    },
    'port-velocity': { inputs: ['testPressure', 'density', 'flow', 'sectionArea', 'velocityPressure', 'peakFlow', 'targetVelocity'], outputs: ['idealVelocity', 'meanVelocity', 'velocityRatio', 'effectiveArea', 'probeVelocity', 'minimumArea'] },
    'discharge-coefficient': { inputs: ['flow', 'testPressure', 'density', 'referenceArea', 'valveDiameter', 'lift', 'throatDiameter'], outputs: ['area', 'idealVelocity', 'dischargeCoefficient', 'liftOverDiameter', 'effectiveArea'] },
    'power-potential': { inputs: ['airMassFlow', 'airFuelRatio', 'bsfc', 'headFlow', 'cylinders', 'headFlowTestPressure'], outputs: ['power', 'headFlowPower'] },
    'speed-density': { inputs: ['manifoldPressure', 'intakeAirTemperature', 'volumetricEfficiency', 'displacement', 'engineSpeed', 'benchFlow', 'benchDensity', 'sensorReading'], outputs: ['manifoldDensity', 'massFlow', 'benchMassFlow', 'sensorDifference'] },
  };

  it('lists exactly the nineteen calculators of the brief and issue 9, with the contract names', () => {
    const list = listCalculators();
    expect(list.map((c) => c.id).sort()).toEqual(Object.keys(contract).sort());
    for (const c of list) {
      const names = c.inputs.map((i) => i.name);
      const outs = c.outputs.map((o) => o.name);
      for (const n of contract[c.id]?.inputs ?? []) expect([c.id, names]).toEqual([c.id, expect.arrayContaining([n])]);
      for (const n of contract[c.id]?.outputs ?? []) expect([c.id, outs]).toEqual([c.id, expect.arrayContaining([n])]);
    }
  });

  it('is plain JSON and rich enough for a form', () => {
    const list = listCalculators();
    expect(JSON.parse(JSON.stringify(list))).toEqual(list);
    for (const c of list) {
      expect(c.title && c.summary && c.topic).toBeTruthy();
      for (const input of c.inputs) {
        expect(input.label.length * input.help.length).toBeGreaterThan(0);
        if (input.kind === 'option') {
          expect(input.options?.length).toBeGreaterThan(1);
          continue;
        }
        expect(input.units?.length).toBeGreaterThan(0);
        expect(isUnitOf(input.defaultUnit?.si ?? 'x', input.kind)).toBe(true);
        expect(isUnitOf(input.defaultUnit?.us ?? 'x', input.kind)).toBe(true);
        for (const b of [input.min, input.max]) if (b) expect(parseUnit(b.unit)).toBeDefined();
      }
      for (const output of c.outputs) {
        expect(isUnitOf(output.defaultUnit.si, output.kind)).toBe(true);
        expect(isUnitOf(output.defaultUnit.us, output.kind)).toBe(true);
      }
      for (const group of c.groups) for (const name of group.inputs) expect(c.inputs.find((i) => i.name === name)?.group).toBe(group.id);
    }
  });

  it('gives a hazard note where the topic can hurt someone', () => {
    for (const id of ['pressure-convert', 'gas-compression', 'orifice-flow', 'flow-at-test-pressure', 'boost', 'fuel-flow']) {
      expect(describeCalculator(id)?.hazard).toMatch(/instructions|codes|licensed/);
    }
    expect(describeCalculator('nope')).toBeUndefined();
  });
});

describe('every worked example', () => {
  it.each(listCalculators().map((c) => c.id))('%s evaluates cleanly with complete steps', (id) => {
    const outcome = evaluate(id, exampleRequest(id) as CalculationRequest);
    expect(errorsOf(outcome)).toEqual([]);
    if (!outcome.ok) return;
    expect(outcome.result.warnings).toEqual([]);
    expect(outcome.result.steps.length).toBeGreaterThan(0);
    for (const step of outcome.result.steps) {
      for (const text of [step.title, step.formula, step.substituted, step.result]) expect(text.trim()).not.toBe('');
    }
    for (const out of Object.values(outcome.result.outputs)) expect(Number.isFinite(out.value)).toBe(true);
  });
});

describe('validation refuses with an error naming the field', () => {
  it.each([
    ['absolute pressure of zero', 'pressure', { value: 0, unit: 'Pa' }],
    ['negative absolute pressure', 'pressure', { value: -5, unit: 'psi' }],
    ['temperature at absolute zero', 'temperature', { value: 0, unit: 'K' }],
    ['temperature below absolute zero', 'temperature', { value: -300, unit: 'degC' }],
    ['humidity above 100 %', 'relativeHumidity', { value: 101, unit: '%' }],
    ['humidity below 0 %', 'relativeHumidity', { value: -1, unit: '%' }],
    ['a NaN', 'temperature', { value: Number.NaN, unit: 'K' }],
    ['an infinity', 'pressure', { value: Number.POSITIVE_INFINITY, unit: 'Pa' }],
    ['an incompatible unit', 'temperature', { value: 20, unit: 'kPa' }],
    ['an unknown unit', 'pressure', { value: 1, unit: 'blarg' }],
    ['a gauge-marked unit', 'pressure', { value: 14.7, unit: 'psig' }],
    ['a bare number for a quantity with dimensions', 'pressure', 101325],
    ['a string for a number', 'pressure', '101 kPa'],
    ['a string value', 'pressure', { value: '101', unit: 'kPa' }],
    ['a missing unit', 'pressure', { value: 101 }],
    ['an unknown option value', 'method', 'magic'],
    ['a number for an option', 'method', 2],
    ['an unknown input name', 'altitude', { value: 1, unit: 'm' }],
  ])('%s', (_what, field, value) => {
    const outcome = evaluate('air-density', withInput(field, value));
    expect(outcome.ok).toBe(false);
    expect(fieldsOf(outcome)).toContain(field);
    for (const e of errorsOf(outcome)) expect(e.message.length).toBeGreaterThan(5);
  });

  it('efficiency outside (0, 100] %', () => {
    const base = exampleRequest('boost') as CalculationRequest;
    for (const bad of [0, -5, 100.5]) {
      const outcome = evaluate('boost', { inputs: { ...base.inputs, compressorEfficiency: { value: bad, unit: '%' } } });
      expect(fieldsOf(outcome)).toEqual(['compressorEfficiency']);
    }
    expect(evaluate('boost', { inputs: { ...base.inputs, compressorEfficiency: 100 } }).ok).toBe(true);
  });

  it('a missing required input', () => {
    const { temperature: _t, ...inputs } = airDensityExample();
    expect(fieldsOf(evaluate('air-density', { inputs }))).toEqual(['temperature']);
  });

  it('both members of a one-of group, or neither when one is required', () => {
    expect(fieldsOf(evaluate('air-density', withInput('dewPoint', { value: 10, unit: 'degC' })))).toEqual(['dewPoint']);
    expect(fieldsOf(evaluate('mass-flow', { inputs: { density: { value: 1.2, unit: 'kg/m^3' } } }))).toEqual(['volumeFlow']);
  });

  it('bad output units name outputUnits.<name>', () => {
    const inputs = airDensityExample();
    expect(fieldsOf(evaluate('air-density', { inputs, outputUnits: { density: 'kPa' } }))).toEqual(['outputUnits.density']);
    expect(fieldsOf(evaluate('air-density', { inputs, outputUnits: { density: 'blarg' } }))).toEqual(['outputUnits.density']);
    expect(fieldsOf(evaluate('air-density', { inputs, outputUnits: { nothing: 'kPa' } }))).toEqual(['outputUnits.nothing']);
  });

  it('output names that are Object.prototype members', () => {
    expect(fieldsOf(evaluate('air-density', { inputs: airDensityExample(), outputUnits: { toString: 'Pa' } }))).toEqual(['outputUnits.toString']);
    expect(fieldsOf(evaluate('toString', { inputs: {} }))).toEqual(['id']);
  });

  it('a malformed request or an unknown calculator', () => {
    expect(fieldsOf(evaluate('air-density', null as unknown as CalculationRequest))).toEqual(['inputs']);
    expect(fieldsOf(evaluate('air-density', { inputs: [] } as unknown as CalculationRequest))).toEqual(['inputs']);
    expect(fieldsOf(evaluate('no-such-thing', { inputs: {} }))).toEqual(['id']);
  });

  it('accepts a bare number for a dimensionless input, read in its default unit', () => {
    const outcome = evaluate('air-density', withInput('relativeHumidity', 50));
    expect(outcome.ok && outcome.result.outputs['relativeHumidity']?.value).toBeCloseTo(50, 10);
  });
});

describe('outputs', () => {
  it('default to SI and convert on request, temperatures as absolute values', () => {
    const si = evaluate('altitude-pressure', { inputs: { altitude: { value: 0, unit: 'm' } } });
    expect(si.ok && si.result.outputs['temperature']).toEqual({ value: 288.15, unit: 'K' });
    const us = evaluate('altitude-pressure', { inputs: { altitude: { value: 0, unit: 'm' } }, outputUnits: { temperature: 'degF', pressure: 'inHg' } });
    if (!us.ok) throw new Error('expected ok');
    // ISO 2533 sea level: 15 °C = 59 °F; 101 325 Pa = 29.92 inHg
    expect(us.result.outputs['temperature']?.value).toBeCloseTo(59, 9);
    expect(us.result.outputs['pressure']?.value).toBeCloseTo(29.92, 2);
    expect(us.result.steps.at(-1)?.title).toMatch(/units asked for/);
  });
});

describe('warnings compute but name the field', () => {
  it('CIPM-2007 outside 15–27 °C and 600–1100 hPa', () => {
    const outcome = evaluate('air-density', { inputs: { ...airDensityExample(), temperature: { value: 35, unit: 'degC' }, pressure: { value: 50, unit: 'kPa' } } });
    expect(outcome.ok && outcome.result.warnings.map((w) => w.field).sort()).toEqual(['pressure', 'temperature']);
  });

  it('the atmosphere outside its layers', () => {
    const outcome = evaluate('altitude-pressure', { inputs: { altitude: { value: 25, unit: 'km' } } });
    expect(outcome.ok && outcome.result.warnings.map((w) => w.field)).toEqual(['altitude']);
  });
});

describe('random invalid input (property)', () => {
  const ids = listCalculators().map((c) => c.id);
  const invalid = fc.oneof(
    fc.constant(Number.NaN),
    fc.constant({ value: Number.NaN, unit: 'Pa' }),
    fc.constant({ value: Number.NEGATIVE_INFINITY, unit: 'K' }),
    fc.string(),
    fc.boolean(),
    fc.array(fc.integer()),
    fc.record({ value: fc.string(), unit: fc.string() }),
    fc.record({ value: fc.double({ noNaN: true }), unit: fc.constantFrom('blarg', 'kg^x', 'furlong/fortnight', 'A', 'cd') }),
  );

  it('never throws and always names the bad field', () => {
    fc.assert(
      fc.property(fc.constantFrom(...ids), fc.nat(), invalid, (id, pick, bad) => {
        const summary = describeCalculator(id);
        const request = exampleRequest(id);
        if (summary === undefined || request === undefined) throw new Error('missing calculator');
        const input = summary.inputs[pick % summary.inputs.length];
        if (input === undefined) return;
        if (input.kind === 'option' && typeof bad === 'string' && input.options?.some((o) => o.value === bad)) return;
        if (bad === '') return; // an empty string reads as "left empty"
        const outcome = evaluate(id, { inputs: { ...request.inputs, [input.name]: bad as InputValue } });
        expect(outcome.ok).toBe(false);
        expect(fieldsOf(outcome)).toContain(input.name);
      }),
      { numRuns: 300 },
    );
  });

  it('never throws on arbitrary garbage', () => {
    fc.assert(
      fc.property(fc.constantFrom(...ids, 'x'), fc.anything(), fc.anything(), (id, inputs, outputUnits) => {
        const outcome = evaluate(id, { inputs, outputUnits } as CalculationRequest);
        expect(typeof outcome.ok).toBe('boolean');
        for (const e of errorsOf(outcome)) expect(e.message).not.toMatch(/calculation failed/);
      }),
      { numRuns: 300 },
    );
  });
});

describe('withExampleDefaults', () => {
  it('fills what a preset leaves out from the example', () => {
    const request = withExampleDefaults('flow-at-test-pressure', { flow: { value: 150, unit: 'cfm' } })!;
    expect(request.inputs['flow']).toEqual({ value: 150, unit: 'cfm' });
    expect(request.inputs['toPressureDrop']).toEqual(exampleRequest('flow-at-test-pressure')!.inputs['toPressureDrop']);
  });

  it('drops the other members of a one-of group the preset answers', () => {
    const request = withExampleDefaults('manometer', { pressure: { value: 7, unit: 'kPa' } })!;
    expect(request.inputs['height']).toBeUndefined();
    expect(evaluate('manometer', request).ok).toBe(true);
  });

  it('knows no unknown calculator', () => {
    expect(withExampleDefaults('nope', {})).toBeUndefined();
  });
});
