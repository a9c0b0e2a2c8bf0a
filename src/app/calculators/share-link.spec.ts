import { listCalculators } from '../../../shared/airflow';
import { calculator, readingsCalculator } from './calculator-summaries.spec-support';
import { blankState, exampleState } from './form-state';
import { decodeShareLink, encodeShareLink, unitToken } from './share-link';

describe('share links', () => {
  it('spell units without characters that need percent-encoding', () => {
    expect(unitToken('m^3/s')).toBe('m3_per_s');
    expect(unitToken('kg/m^3')).toBe('kg_per_m3');
    expect(unitToken('%')).toBe('pct');
    expect(unitToken('inH2O_39F')).toBe('inH2O_39F');
    expect(unitToken('g/(kW h)')).toBe('g_per_kW.h');
    expect(unitToken('lb/(hp h)')).toBe('lb_per_hp.h');
    for (const summary of listCalculators()) {
      for (const input of summary.inputs) {
        for (const unit of input.units ?? []) expect(encodeURIComponent(unitToken(unit))).toBe(unitToken(unit));
        // One token per unit offered, so a link reads back the unit it was written with.
        expect(new Set((input.units ?? []).map(unitToken)).size).toBe(input.units?.length ?? 0);
      }
    }
  });

  it('write a readable query for the air-density example', () => {
    const summary = calculator('air-density');
    expect(encodeShareLink(summary, exampleState(summary, 'si'), 'si')).toEqual({
      temperature: '20~degC',
      pressure: '1013~hPa',
      relativeHumidity: '50~pct',
      method: 'cipm2007',
      units: 'si',
    });
  });

  it('restore every calculator example exactly, in both unit systems', () => {
    for (const summary of listCalculators()) {
      for (const system of ['si', 'us'] as const) {
        const state = exampleState(summary, system);
        const params = encodeShareLink(summary, state, system);
        const opened = decodeShareLink(summary, params, system === 'si' ? 'us' : 'si');
        expect(opened?.system).toBe(system);
        // Hidden members of one-of groups are not part of the link: compare what is given.
        const shown = { ...state, quantities: Object.fromEntries(Object.entries(state.quantities).map(([name, entry]) => {
          const input = summary.inputs.find((i) => i.name === name);
          const hidden = input?.group !== undefined && state.picks[input.group] !== name;
          return [name, hidden ? blankState(summary, system).quantities[name] : entry];
        })) };
        expect(opened?.state).toEqual(shown);
      }
    }
  });

  it('name the picked member of a group only when the values do not show it', () => {
    const summary = calculator('air-density');
    const state = blankState(summary, 'si');
    state.quantities['temperature'] = { text: '20', unit: 'degC' };
    state.picks['humidity'] = 'dewPoint';
    const params = encodeShareLink(summary, state, 'si');
    expect(params['pick.humidity']).toBe('dewPoint');
    expect(decodeShareLink(summary, params, 'si')?.state.picks['humidity']).toBe('dewPoint');

    state.quantities['dewPoint'] = { text: '10', unit: 'degC' };
    const withValue = encodeShareLink(summary, state, 'si');
    expect(withValue['pick.humidity']).toBeUndefined();
    expect(withValue['dewPoint']).toBe('10~degC');
    expect(decodeShareLink(summary, withValue, 'si')?.state.picks['humidity']).toBe('dewPoint');
  });

  it('keep output units that differ from the system default', () => {
    const summary = calculator('air-density');
    const state = exampleState(summary, 'us');
    state.outputUnits['density'] = 'kg/m^3';
    const params = encodeShareLink(summary, state, 'us');
    expect(params['out.density']).toBe('kg_per_m3');
    expect(params['out.dewPoint']).toBeUndefined();
    expect(decodeShareLink(summary, params, 'si')?.state.outputUnits).toMatchObject({ density: 'kg/m^3', dewPoint: 'degF' });
  });

  it('read a hand-written link: no unit means the default unit, text is kept as typed', () => {
    const summary = calculator('pressure-convert');
    const opened = decodeShareLink(summary, { pressure: '14.7', kind: 'gauge', ambient: '1,013~hPa' }, 'us');
    expect(opened?.system).toBe('us');
    expect(opened?.state.quantities['pressure']).toEqual({ text: '14.7', unit: 'psi' });
    expect(opened?.state.quantities['ambient']).toEqual({ text: '1,013', unit: 'hPa' });
    expect(opened?.state.options['kind']).toBe('gauge');
  });

  it('open nothing for a query that says nothing about the calculator', () => {
    expect(decodeShareLink(calculator('air-density'), { utm_source: 'mail' }, 'si')).toBeUndefined();
  });

  it('carry a list of readings compactly, with nothing to percent-encode, and restore it', () => {
    const summary = readingsCalculator();
    const state = exampleState(summary, 'us');
    state.quantities['readings'] = { text: '248.8, 250.0;  251.2', unit: 'cfm' };
    const params = encodeShareLink(summary, state, 'us');
    expect(params['readings']).toBe('248.8_250.0_251.2~cfm');
    expect(encodeURIComponent(params['readings']!)).toBe(params['readings']);
    expect(decodeShareLink(summary, params, 'si')?.state.quantities['readings']).toEqual({ text: '248.8 250.0 251.2', unit: 'cfm' });

    const example = exampleState(summary, 'si');
    expect(decodeShareLink(summary, encodeShareLink(summary, example, 'si'), 'us')?.state).toEqual(example);
  });

  it('read a hand-written list with commas or spaces, and keep a typo as typed', () => {
    const summary = readingsCalculator();
    expect(decodeShareLink(summary, { readings: '248.8,250,251.2~cfm' }, 'si')?.state.quantities['readings']).toEqual({
      text: '248.8,250,251.2',
      unit: 'cfm',
    });
    // Angular's router reads "+" in a query as a space; no unit means the system's default.
    expect(decodeShareLink(summary, { readings: '117.4 118.0' }, 'si')?.state.quantities['readings']).toEqual({ text: '117.4 118.0', unit: 'L/s' });
    const typo = blankState(summary, 'us');
    typo.quantities['readings'] = { text: '248.8 25O', unit: 'cfm' };
    expect(decodeShareLink(summary, encodeShareLink(summary, typo, 'us'), 'us')?.state.quantities['readings']).toEqual(typo.quantities['readings']);
  });
});

