import type { FreshNumbersQuestion, MultipleChoiceQuestion, NumericQuestion, SingleChoiceQuestion, WrittenQuestion } from './definition';
import { answerUnits, kindOfUnit, MAX_WRITTEN_LENGTH, validateResponse } from './answers';

const base = { points: 1, stem: '', explanation: '' };
const choices = [{ id: 'a', text: 'A', correct: true }, { id: 'b', text: 'B', correct: false }];
const single: SingleChoiceQuestion = { ...base, id: 's', kind: 'single', choices };
const multiple: MultipleChoiceQuestion = { ...base, id: 'm', kind: 'multiple', choices, partialCredit: 'per-choice' };
const numeric: NumericQuestion = {
  ...base, id: 'n', kind: 'numeric', key: { value: 2.5, unit: 'kPa' }, tolerance: { kind: 'relative', percent: 2 },
  check: { calculator: 'pressure-convert', inputs: {}, output: 'pressure' },
};
const fresh: FreshNumbersQuestion = {
  ...base, id: 'f', kind: 'fresh', calculator: 'flow-at-test-pressure', output: 'flow', answerUnit: 'cfm', inputs: {}, tolerance: { kind: 'relative', percent: 1 },
};
const written: WrittenQuestion = { ...base, id: 'w', kind: 'written', rubric: [{ criterion: 'x', points: 1 }] };

describe('validateResponse', () => {
  it('accepts a choice the question has, and refuses others', () => {
    expect(validateResponse(single, { choiceId: 'a', extra: 1 })).toEqual({ choiceId: 'a' });
    expect(validateResponse(single, { choiceId: 'z' })).toMatch(/not one of this question's answers/);
    expect(validateResponse(single, { choiceIds: ['a'] })).toMatch(/Choose one/);
    expect(validateResponse(multiple, { choiceIds: ['b', 'a'] })).toEqual({ choiceIds: ['b', 'a'] });
    expect(validateResponse(multiple, { choiceIds: [] })).toEqual({ choiceIds: [] });
    expect(validateResponse(multiple, { choiceIds: ['a', 'a'] })).toMatch(/twice/);
    expect(validateResponse(multiple, { choiceIds: ['a', 'x'] })).toMatch(/"x" is not one/);
    expect(validateResponse(multiple, { choiceIds: 'a' })).toMatch(/list/);
  });

  it('accepts a finite number in any compatible unit (a decimal string too)', () => {
    expect(validateResponse(numeric, { value: 0.36, unit: 'psi' })).toEqual({ value: 0.36, unit: 'psi' });
    expect(validateResponse(numeric, { value: '10.05', unit: 'inH2O' })).toEqual({ value: 10.05, unit: 'inH2O' });
    expect(validateResponse(numeric, { value: -2.5e-1, unit: 'bar' })).toEqual({ value: -0.25, unit: 'bar' });
    expect(validateResponse(fresh, { value: 100, unit: 'L/s' })).toEqual({ value: 100, unit: 'L/s' });
    expect(validateResponse(fresh, { value: 360, unit: 'm^3/h' })).toEqual({ value: 360, unit: 'm^3/h' });
  });

  it('refuses non-numbers and incompatible or unknown units with a clear message', () => {
    for (const value of ['12,5', 'abc', '', null, Number.NaN, Infinity, '1e999', [1], { v: 1 }, true]) {
      expect(validateResponse(numeric, { value, unit: 'kPa' })).toMatch(/must be a number/);
    }
    expect(validateResponse(numeric, { value: 1, unit: 'cfm' })).toBe('"cfm" is not a unit of a pressure. Answer in Pa, hPa, kPa, MPa, mbar, bar, psi, inHg.');
    expect(validateResponse(fresh, { value: 1, unit: 'psi' })).toMatch(/^"psi" is not a unit of a volume flow\. Answer in m\^3\/s, .*cfm/);
    expect(validateResponse(fresh, { value: 1, unit: 'furlongs' })).toMatch(/not a unit of a volume flow/);
    expect(validateResponse(fresh, { value: 1, unit: 5 })).toMatch(/Pick a unit/);
    expect(validateResponse(fresh, { value: 1, unit: 'x'.repeat(200) })).toMatch(/Pick a unit/);
    expect(validateResponse(fresh, { value: 1 })).toMatch(/not a unit of a volume flow/);
  });

  it('accepts text up to the limit for a written answer', () => {
    expect(validateResponse(written, { text: 'Same bench, same day.' })).toEqual({ text: 'Same bench, same day.' });
    expect(validateResponse(written, { text: 'x'.repeat(MAX_WRITTEN_LENGTH + 1) })).toMatch(/too long/);
    expect(validateResponse(written, { text: 3 })).toMatch(/as text/);
  });

  it('refuses what is not an object', () => {
    for (const raw of [undefined, null, 3, 'a', ['a']]) expect(validateResponse(single, raw)).toMatch(/must be an object/);
  });
});

describe('units for answers', () => {
  it('names the quantity of a unit and offers its units, the key unit first when it is not listed', () => {
    expect(kindOfUnit('inH2O')).toBe('pressure');
    expect(kindOfUnit('lb/min')).toBe('massFlow');
    expect(kindOfUnit('nonsense')).toBeUndefined();
    expect(answerUnits('cfm')).toContain('L/s');
    expect(answerUnits('ft^3/min')[0]).toBe('ft^3/min');
  });
});
