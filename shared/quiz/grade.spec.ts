import { convert } from '../airflow';
import type { MultipleChoiceQuestion, NumericQuestion, Quantity, SingleChoiceQuestion, Tolerance, WrittenQuestion } from './definition';
import { gradeResponse, toleranceBand, toleranceText } from './grade';

/*
 * The next and previous representable double of a number, by stepping its IEEE 754 binary64
 * bits (what Java's Math.nextUp/nextDown do). For the grading tests: a value one step outside a
 * tolerance band must fail.
 */
const buffer = new ArrayBuffer(8);
const float = new Float64Array(buffer);
const bits = new BigInt64Array(buffer);

/** The smallest double greater than x. */
function nextUp(x: number): number {
  if (Number.isNaN(x) || x === Infinity) return x;
  if (x === 0) return Number.MIN_VALUE;
  float[0] = x;
  bits[0]! += x > 0 ? 1n : -1n;
  return float[0]!;
}

/** The largest double less than x. */
function nextDown(x: number): number {
  return -nextUp(-x);
}

function numeric(key: Quantity, tolerance: Tolerance, points = 2): NumericQuestion {
  return {
    id: 'q', kind: 'numeric', points, stem: 's', explanation: 'e', key, tolerance,
    check: { calculator: 'pressure-convert', inputs: {}, output: 'pressure' },
  };
}
const grade = (q: NumericQuestion, value: number, unit = q.key.unit) => gradeResponse(q, { value, unit });

describe('float stepping (the helper above)', () => {
  it('steps to the neighbouring doubles', () => {
    expect(nextUp(1)).toBe(1 + Number.EPSILON);
    expect(nextDown(1)).toBe(1 - Number.EPSILON / 2);
    expect(nextUp(-1)).toBe(-1 + Number.EPSILON / 2);
    expect(nextUp(0)).toBe(Number.MIN_VALUE);
    expect(nextDown(nextUp(302.2))).toBe(302.2);
  });
});

describe('numeric grading: both ends of the band pass, one representable step outside fails', () => {
  const cases: { name: string; q: NumericQuestion; low: number; high: number }[] = [
    // Bounds worked by hand: 301.2 ± 1 = 300.2 … 302.2 (decimals that are not exact in binary).
    { name: 'absolute, 301.2 cfm ± 1 cfm', q: numeric({ value: 301.2, unit: 'cfm' }, { kind: 'absolute', amount: { value: 1, unit: 'cfm' } }), low: 300.2, high: 302.2 },
    // 250 ± 2 = 248 … 252 (exact in binary).
    { name: 'absolute, 250 cfm ± 2 cfm', q: numeric({ value: 250, unit: 'cfm' }, { kind: 'absolute', amount: { value: 2, unit: 'cfm' } }), low: 248, high: 252 },
    // A negative key (a depression): −3.5 ± 0.25 = −3.75 … −3.25.
    { name: 'absolute, −3.5 kPa ± 0.25 kPa', q: numeric({ value: -3.5, unit: 'kPa' }, { kind: 'absolute', amount: { value: 0.25, unit: 'kPa' } }), low: -3.75, high: -3.25 },
    // 2 % of 250 is 5: 245 … 255.
    { name: 'relative, 250 cfm ± 2 %', q: numeric({ value: 250, unit: 'cfm' }, { kind: 'relative', percent: 2 }), low: 245, high: 255 },
    // 0.5 % of 40 is 0.2: 39.8 … 40.2.
    { name: 'relative, 40 inH2O ± 0.5 %', q: numeric({ value: 40, unit: 'inH2O' }, { kind: 'relative', percent: 0.5 }), low: 39.8, high: 40.2 },
    // 1 % of 1.184 is 0.01184: 1.17216 … 1.19584.
    { name: 'relative, 1.184 kg/m^3 ± 1 %', q: numeric({ value: 1.184, unit: 'kg/m^3' }, { kind: 'relative', percent: 1 }), low: 1.17216, high: 1.19584 },
    // 1 % of |−12.5| is 0.125: −12.625 … −12.375.
    { name: 'relative, −12.5 degC ± 1 %', q: numeric({ value: -12.5, unit: 'degC' }, { kind: 'relative', percent: 1 }), low: -12.625, high: -12.375 },
  ];

  it.each(cases)('$name', ({ q, low, high }) => {
    expect(toleranceBand(q.key, q.tolerance)).toEqual({ low, high });
    for (const at of [low, high, q.key.value]) expect({ at, ...grade(q, at) }).toMatchObject({ at, status: 'correct', points: 2, withinTolerance: true });
    for (const out of [nextDown(low), nextUp(high)]) expect({ out, ...grade(q, out) }).toMatchObject({ out, status: 'incorrect', points: 0, withinTolerance: false });
  });

  it('converts an absolute tolerance in another unit as a difference (no °F offset)', () => {
    // 1.8 °F is exactly 1 K wide (NIST SP 811 B.9: Δt/°F = 1.8 Δt/K); 20 °C ± 1 K passes 21 °C, not 21.01 °C.
    const q = numeric({ value: 20, unit: 'degC' }, { kind: 'absolute', amount: { value: 1.8, unit: 'degF' } });
    expect(grade(q, 21).status).toBe('correct');
    expect(grade(q, 21.01).status).toBe('incorrect');
    expect(grade(q, convert(20.9, 'degC', 'degF'), 'degF').status).toBe('correct');
  });

  it('states the tolerance for the apprentice', () => {
    expect(toleranceText({ kind: 'relative', percent: 2 })).toBe('within 2 %');
    expect(toleranceText({ kind: 'absolute', amount: { value: 0.5, unit: 'kPa' } })).toBe('within 0.5 kPa');
    expect(toleranceText({ kind: 'absolute', amount: { value: 1, unit: 'degF' } })).toBe('within 1 °F');
  });
});

describe('numeric grading: any compatible unit grades the same', () => {
  it('a pressure answered in psi, kPa and inH2O', () => {
    const q = numeric({ value: 2.5, unit: 'kPa' }, { kind: 'relative', percent: 2 });
    for (const psi of [0.36, 0.37, 0.35, 0.3555]) {
      const results = ['psi', 'kPa', 'inH2O'].map((unit) => grade(q, convert(psi, 'psi', unit), unit));
      expect(new Set(results.map((r) => r.status)).size).toBe(1);
      for (const r of results) expect(r.answerInKeyUnit).toBeCloseTo(convert(psi, 'psi', 'kPa'), 12);
    }
    // 0.36 psi = 2.482 kPa (−0.7 %): correct; 0.35 psi = 2.413 kPa (−3.5 %): not.
    expect(grade(q, 0.36, 'psi').status).toBe('correct');
    expect(grade(q, 0.35, 'psi').status).toBe('incorrect');
  });

  it('a flow answered in cfm, L/s and m^3/h', () => {
    const q = numeric({ value: 100, unit: 'L/s' }, { kind: 'absolute', amount: { value: 1, unit: 'L/s' } });
    for (const cfm of [212, 210, 213, 209]) {
      const results = ['cfm', 'L/s', 'm^3/h'].map((unit) => grade(q, convert(cfm, 'cfm', unit), unit));
      expect(new Set(results.map((r) => r.status)).size).toBe(1);
      for (const r of results) expect(r.answerInKeyUnit).toBeCloseTo(convert(cfm, 'cfm', 'L/s'), 10);
    }
    // 212 cfm = 100.05 L/s (NIST SP 811 B.8: 1 cfm = 4.719 474 E−04 m³/s): inside; 209 cfm = 98.64 L/s: outside.
    expect(grade(q, 212, 'cfm').status).toBe('correct');
    expect(grade(q, 209, 'cfm').status).toBe('incorrect');
  });

  it('grades an unanswered question as 0 and an incompatible unit as incorrect', () => {
    const q = numeric({ value: 100, unit: 'L/s' }, { kind: 'relative', percent: 1 });
    expect(gradeResponse(q, undefined)).toEqual({ points: 0, maxPoints: 2, status: 'unanswered', key: q.key });
    expect(grade(q, 100, 'psi')).toMatchObject({ status: 'incorrect', points: 0, withinTolerance: false });
    expect(grade(q, Number.NaN)).toMatchObject({ status: 'incorrect', points: 0 });
  });

  it('grades a fresh question against the key of its drawn numbers, and a corrected key over the definition', () => {
    const q = numeric({ value: 100, unit: 'L/s' }, { kind: 'relative', percent: 1 });
    expect(gradeResponse(q, { value: 110, unit: 'L/s' }, { key: { value: 110, unit: 'L/s' } }).status).toBe('correct');
    const fresh = { id: 'f', kind: 'fresh', points: 3, stem: '', explanation: '', calculator: 'mass-flow', output: 'massFlow', answerUnit: 'g/s', inputs: {}, tolerance: { kind: 'relative', percent: 1 } } as const;
    expect(() => gradeResponse(fresh, { value: 1, unit: 'g/s' })).toThrow(/context.key/);
    expect(gradeResponse(fresh, { value: 0.25, unit: 'kg/s' }, { key: { value: 250, unit: 'g/s' } })).toMatchObject({ status: 'correct', points: 3, answerInKeyUnit: 250 });
  });
});

describe('choice grading', () => {
  const choices = [
    { id: 'a', text: 'A', correct: true },
    { id: 'b', text: 'B', correct: false },
    { id: 'c', text: 'C', correct: true },
    { id: 'd', text: 'D', correct: false },
  ];
  const single: SingleChoiceQuestion = { id: 's', kind: 'single', points: 1, stem: '', explanation: '', choices: choices.map((c) => ({ ...c, correct: c.id === 'a' })) };
  const perChoice: MultipleChoiceQuestion = { id: 'm', kind: 'multiple', points: 2, stem: '', explanation: '', choices, partialCredit: 'per-choice' };
  const allOrNothing: MultipleChoiceQuestion = { ...perChoice, partialCredit: 'all-or-nothing' };

  it('single: the correct choice earns the points, any other none', () => {
    expect(gradeResponse(single, { choiceId: 'a' })).toEqual({ points: 1, maxPoints: 1, status: 'correct' });
    expect(gradeResponse(single, { choiceId: 'b' })).toEqual({ points: 0, maxPoints: 1, status: 'incorrect' });
    expect(gradeResponse(single, undefined)).toEqual({ points: 0, maxPoints: 1, status: 'unanswered' });
  });

  it('multiple, per-choice: each choice judged right earns points / choices', () => {
    expect(gradeResponse(perChoice, { choiceIds: ['a', 'c'] })).toEqual({ points: 2, maxPoints: 2, status: 'correct' });
    // One misjudged of four (c left out): 3/4 of 2 points.
    expect(gradeResponse(perChoice, { choiceIds: ['a'] })).toEqual({ points: 1.5, maxPoints: 2, status: 'partial' });
    // Two misjudged (c left, b ticked): 2/4.
    expect(gradeResponse(perChoice, { choiceIds: ['a', 'b'] })).toEqual({ points: 1, maxPoints: 2, status: 'partial' });
    // Everything ticked: a and c right, b and d wrong.
    expect(gradeResponse(perChoice, { choiceIds: ['a', 'b', 'c', 'd'] })).toEqual({ points: 1, maxPoints: 2, status: 'partial' });
    // Every choice misjudged.
    expect(gradeResponse(perChoice, { choiceIds: ['b', 'd'] })).toEqual({ points: 0, maxPoints: 2, status: 'incorrect' });
    // Nothing ticked is no answer, not "two choices rightly left".
    expect(gradeResponse(perChoice, { choiceIds: [] })).toEqual({ points: 0, maxPoints: 2, status: 'unanswered' });
  });

  it('multiple, per-choice: thirds round to two decimals', () => {
    const three: MultipleChoiceQuestion = { ...perChoice, points: 1, choices: choices.slice(0, 3) };
    expect(gradeResponse(three, { choiceIds: ['a'] }).points).toBe(0.67);
  });

  it('multiple, all-or-nothing: only the exact set', () => {
    expect(gradeResponse(allOrNothing, { choiceIds: ['c', 'a'] })).toEqual({ points: 2, maxPoints: 2, status: 'correct' });
    expect(gradeResponse(allOrNothing, { choiceIds: ['a'] })).toEqual({ points: 0, maxPoints: 2, status: 'incorrect' });
    expect(gradeResponse(allOrNothing, { choiceIds: ['a', 'b', 'c'] })).toEqual({ points: 0, maxPoints: 2, status: 'incorrect' });
  });

  it('a response of the wrong shape is incorrect', () => {
    expect(gradeResponse(single, { choiceIds: ['a'] }).status).toBe('incorrect');
    expect(gradeResponse(perChoice, { choiceId: 'a' }).status).toBe('incorrect');
  });
});

describe('written answers', () => {
  const written: WrittenQuestion = { id: 'w', kind: 'written', points: 3, stem: '', explanation: '', rubric: [{ criterion: 'x', points: 1 }, { criterion: 'y', points: 2 }] };
  it('wait for an instructor with 0 points; blank is unanswered', () => {
    expect(gradeResponse(written, { text: 'The bands overlap, but…' })).toEqual({ points: 0, maxPoints: 3, status: 'pending' });
    expect(gradeResponse(written, { text: '  \n' })).toEqual({ points: 0, maxPoints: 3, status: 'unanswered' });
    expect(gradeResponse(written, undefined).status).toBe('unanswered');
  });
});
