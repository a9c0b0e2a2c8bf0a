import { calculator, readingsCalculator } from './calculator-summaries.spec-support';
import { blankState, calculate, convertToSystem, exampleState, outputUnitOf, presetState, toRequest } from './form-state';

describe('form state', () => {
  it('converts typed values with the US/SI switch and back', () => {
    const summary = calculator('air-density');
    const us = convertToSystem(summary, exampleState(summary, 'si'), 'us');
    expect(us.quantities['temperature']).toEqual({ text: '68', unit: 'degF' });
    expect(us.quantities['pressure']).toEqual({ text: '29.9139', unit: 'inHg' });
    expect(us.outputUnits['density']).toBe('lb/ft^3');
    const si = convertToSystem(summary, us, 'si');
    expect(si.quantities['temperature']).toEqual({ text: '20', unit: 'degC' });
    expect(si.quantities['pressure']).toEqual({ text: '1013', unit: 'hPa' });
  });

  it('converts a temperature difference without the °C/°F offset', () => {
    const summary = calculator('uncertainty');
    const us = convertToSystem(summary, exampleState(summary, 'si'), 'us');
    // 0.5 K is 0.9 °F as an interval (NIST SP 811: 1 K = 1.8 °F for differences).
    expect(us.quantities['temperatureUncertainty']).toEqual({ text: '0.9', unit: 'degF' });
  });

  it('files engine messages under the field on screen, and refuses text that is no number', () => {
    const summary = calculator('mass-flow');
    const state = blankState(summary, 'si');
    state.quantities['density'] = { text: '1,2', unit: 'kg/m^3' };
    const evaluation = calculate(summary, state);
    expect(evaluation.result).toBeUndefined();
    expect(evaluation.fieldErrors.get('density')).toMatch(/decimals with a point/);
    expect(evaluation.fieldErrors.get('volumeFlow')).toBe('Give Volume flow or Mass flow.');

    state.picks['flow'] = 'massFlow';
    expect(calculate(summary, state).fieldErrors.get('massFlow')).toBe('Give Volume flow or Mass flow.');
  });

  it('gives the example result with no messages', () => {
    const summary = calculator('air-density');
    const evaluation = calculate(summary, exampleState(summary, 'si'));
    expect(evaluation.messages).toEqual([]);
    // The engine's CIPM-2007 figure for the SI example: 20 °C, 1013 hPa, 50 % RH.
    expect(evaluation.result?.outputs['density']?.value).toBeCloseTo(1.1990, 4);
  });
});

describe('the worked example in each unit system', () => {
  it('opens in SI in round figures of its own, not the US example converted', () => {
    const summary = calculator('boost');
    const si = exampleState(summary, 'si');
    expect(si.quantities['boostPressure']).toEqual({ text: '70', unit: 'kPa' });
    expect(si.quantities['ambientPressure']).toEqual({ text: '1013', unit: 'hPa' });
    expect(si.quantities['inletTemperature']).toEqual({ text: '25', unit: 'degC' });
    expect(calculate(summary, si).messages).toEqual([]);
  });

  it('opens in US units as the example is written', () => {
    const summary = calculator('boost');
    const us = exampleState(summary, 'us');
    expect(us.quantities['boostPressure']).toEqual({ text: '10', unit: 'psi' });
    expect(us.quantities['ambientPressure']).toEqual({ text: '14.7', unit: 'psi' });
    expect(us.quantities['inletTemperature']).toEqual({ text: '77', unit: 'degF' });
  });

  it('picks the one-of member that has an SI example', () => {
    const summary = calculator('manometer');
    const si = exampleState(summary, 'si');
    expect(si.picks['column']).toBe('height');
    expect(si.quantities['height']).toEqual({ text: '250', unit: 'mm' });
  });

  it('falls back to the converted example where an input has no SI example', () => {
    const summary = calculator('boost');
    const boostPressure = summary.inputs.find((input) => input.name === 'boostPressure')!;
    delete boostPressure.exampleSi;
    // 10 psi is 68.9476 kPa (NIST SP 811: 1 psi = 6.894 757 kPa).
    expect(exampleState(summary, 'si').quantities['boostPressure']).toEqual({ text: '68.9476', unit: 'kPa' });
  });
});

describe('shop units and lesson presets', () => {
  it('shows SI results in the shop units for their kind, not the engine base units', () => {
    const summary = calculator('air-density');
    const dewPoint = summary.outputs.find((output) => output.name === 'dewPoint')!;
    expect(dewPoint.defaultUnit.si).toBe('K');
    expect(outputUnitOf(dewPoint, 'si')).toBe('degC');
    expect(outputUnitOf(dewPoint, 'us')).toBe('degF');
    expect(blankState(summary, 'si').outputUnits['vaporPressure']).toBe('kPa');
    const evaluation = calculate(summary, exampleState(summary, 'si'));
    expect(evaluation.result?.outputs['dewPoint']?.unit).toBe('degC');
  });

  it('opens a lesson preset in the units the author wrote, with the picked group member', () => {
    const summary = calculator('manometer');
    const state = presetState(summary, { pressure: { value: 7, unit: 'kPa' }, fluid: 'water' }, 'us');
    expect(state.quantities['pressure']).toEqual({ text: '7', unit: 'kPa' });
    expect(state.options['fluid']).toBe('water');
    expect(state.picks[summary.groups[0]!.id]).toBe('pressure');
    expect(state.outputUnits['height']).toBe(summary.outputs.find((o) => o.name === 'height')?.defaultUnit.us);
  });
});


describe('an input that takes a list of readings', () => {
  it('opens on the example readings, one text with spaces between them', () => {
    const summary = readingsCalculator();
    expect(exampleState(summary, 'us').quantities['readings']).toEqual({ text: '248.8 250 251.2', unit: 'cfm' });
    // Each reading converted like a single value (NIST SP 811: 1 ft³/min = 0.471 947 4 L/s).
    expect(exampleState(summary, 'si').quantities['readings']).toEqual({ text: '117.421 117.987 118.553', unit: 'L/s' });
    expect(presetState(summary, { readings: { values: [1, 2.5], unit: 'L/s' } }, 'us').quantities['readings']).toEqual({
      text: '1 2.5',
      unit: 'L/s',
    });
  });

  it('converts every reading with the US/SI switch, and keeps a piece that is no number as typed', () => {
    const summary = readingsCalculator();
    const si = convertToSystem(summary, exampleState(summary, 'us'), 'si');
    expect(si.quantities['readings']).toEqual({ text: '117.421 117.987 118.553', unit: 'L/s' });
    // Back again from six significant figures, as a single value comes back (117.421 L/s is 248.801 cfm).
    expect(convertToSystem(summary, si, 'us').quantities['readings']).toEqual({ text: '248.801 250 251.2', unit: 'cfm' });

    const typo = { ...si, quantities: { readings: { text: '248.8, 25O; 251.2', unit: 'cfm' } } };
    expect(convertToSystem(summary, typo, 'si').quantities['readings']).toEqual({ text: '117.421 25O 118.553', unit: 'L/s' });
    const nothing = { ...si, quantities: { readings: { text: 'abc', unit: 'cfm' } } };
    expect(convertToSystem(summary, nothing, 'si').quantities['readings']).toEqual({ text: 'abc', unit: 'L/s' });
  });

  it('goes to the engine as a list in one unit, or is refused beside its field with the text kept', () => {
    const summary = readingsCalculator();
    const state = exampleState(summary, 'us');
    state.quantities['readings'] = { text: '248.8; 250.0, 251.2', unit: 'cfm' };
    expect(toRequest(summary, state)).toEqual({
      request: { inputs: { readings: { values: [248.8, 250, 251.2], unit: 'cfm' } }, outputUnits: {} },
      errors: [],
    });

    state.quantities['readings'] = { text: '248,8 250,0', unit: 'cfm' };
    const refused = toRequest(summary, state);
    expect(refused.request.inputs).toEqual({});
    expect(refused.errors).toEqual([
      { field: 'readings', message: 'Readings: write decimals with a point (248.8) and put a space between readings.' },
    ]);
    expect(state.quantities['readings']?.text).toBe('248,8 250,0');
  });
});

describe('the comparison of two tests in the form', () => {
  it('sends both lists and shows the verdict among the notes', () => {
    const summary = calculator('compare-tests');
    const readingsA = summary.inputs.find((input) => input.name === 'readingsA');
    expect(readingsA?.list).toEqual({ min: 2, max: 30 });
    const state = exampleState(summary, 'us');
    state.quantities['readingsA'] = { text: '248.8 250.0 251.2', unit: 'cfm' };
    state.quantities['readingsB'] = { text: '252.8, 254.0, 255.2', unit: 'cfm' };
    const evaluation = calculate(summary, state);
    expect(evaluation.messages).toEqual([]);
    // course-review-1 E1's worked example: n = 3, s = 1.2 cfm, same day: U95 = 2.78 × 0.98 = 2.7 cfm.
    expect(evaluation.result?.outputs['differenceExpandedUncertainty']?.value).toBeCloseTo(2.72, 2);
    expect(evaluation.result?.outputs['differenceExpandedUncertainty']?.unit).toBe('cfm');
    expect(evaluation.result?.notes[0]).toMatch(/4\.0 ± 2\.7 cfm is shown/);
  });

  it('files a list that cannot be read under its field, with the text kept', () => {
    const summary = calculator('compare-tests');
    const state = exampleState(summary, 'us');
    state.quantities['readingsB'] = { text: '252.8 25A.0 255.2', unit: 'cfm' };
    const evaluation = calculate(summary, state);
    expect(evaluation.result).toBeUndefined();
    expect(evaluation.fieldErrors.get('readingsB')).toMatch(/“25A\.0” is not a number/);
    expect(state.quantities['readingsB']?.text).toBe('252.8 25A.0 255.2');
  });
});
