import * as fc from 'fast-check';
import katex from 'katex';
import { describeCalculator, evaluate, exampleRequest } from '../index';
import type { CalculationOutcome, InputValue } from '../index';
import { out, run } from './run-calculator.spec-support';

const list = (values: number[], unit = 'cfm') => ({ values, unit });
const CFM = {
  meanA: 'cfm', meanB: 'cfm', stdDevA: 'cfm', stdDevB: 'cfm', difference: 'cfm',
  differenceStandardUncertainty: 'cfm', differenceExpandedUncertainty: 'cfm',
};
const compare = (inputs: Record<string, InputValue>) => run('compare-tests', inputs, CFM);
const errorsOf = (outcome: CalculationOutcome) => (outcome.ok ? [] : outcome.errors);

// Course review 1, E1: n = 3 refits per configuration, s = 1.2 cfm, means 4 cfm apart.
const STOCK = [248.8, 250.0, 251.2];
const PORTED = [252.8, 254.0, 255.2];

describe('compare-tests', () => {
  it('shows a 4 cfm gain on the same bench and day (course review 1, E1)', () => {
    const r = compare({ readingsA: list(STOCK), readingsB: list(PORTED), setup: 'same-day' });
    // course review 1 E1: s = 1.2 cfm for each set, Δ = 4 cfm
    expect(out(r, 'stdDevA')).toBeCloseTo(1.2, 10);
    expect(out(r, 'difference')).toBeCloseTo(4, 10);
    // course review 1 E1 with GUM §5.2 (shared terms cancel): u(Δ) = 1.2·√(2/3) = 0.98 cfm
    expect(out(r, 'differenceStandardUncertainty')).toBeCloseTo(1.2 * Math.sqrt(2 / 3), 10);
    expect(out(r, 'differenceStandardUncertainty')).toBeCloseTo(0.98, 2);
    // course review 1 E1: ν = 4 (Welch–Satterthwaite with two equal Type A terms, ν = 2 each)
    expect(out(r, 'effectiveDegreesOfFreedom')).toBeCloseTo(4, 10);
    // GUM Table G.2, p = 95 %, ν = 4: t = 2.78
    expect(out(r, 'coverageFactor')).toBeCloseTo(2.78, 2);
    // course review 1 E1: U₉₅ = 2.78 × 0.98 = 2.7 cfm
    expect(out(r, 'differenceExpandedUncertainty')).toBeCloseTo(2.72, 2);
    expect(r.notes[0]).toBe('A gain of 4.0 ± 2.7 cfm is shown (95 % confidence).');
    expect(r.warnings).toEqual([]);
  });

  it('adds each day’s ambient correction on different days: a larger U', () => {
    const sameDay = compare({ readingsA: list(STOCK), readingsB: list(PORTED), setup: 'same-day' });
    const days = compare({ readingsA: list(STOCK), readingsB: list(PORTED), setup: 'different-days' });
    // lesson 9's density budget (comparing-tests) (u(ρ)/ρ = 0.00163/1.1837), halved for the √ correction: 0.07 % of each mean
    const uAmbA = 0.0007 * 250;
    const uAmbB = 0.0007 * 254;
    const u = Math.sqrt(2 * (1.2 ** 2 / 3) + uAmbA ** 2 + uAmbB ** 2);
    expect(out(days, 'differenceStandardUncertainty')).toBeCloseTo(u, 9);
    // GUM G.4.2 by hand: ν_eff = u⁴ / (2 × 0.48²/2) = 4.53 → 4 (Type B terms have ν = ∞)
    expect(out(days, 'effectiveDegreesOfFreedom')).toBeCloseTo(u ** 4 / (2 * (0.48 ** 2 / 2)), 9);
    expect(out(days, 'differenceExpandedUncertainty')).toBeCloseTo(out(sameDay, 'coverageFactor') * u, 9);
    expect(out(days, 'differenceExpandedUncertainty')).toBeGreaterThan(out(sameDay, 'differenceExpandedUncertainty'));
    expect(days.notes[0]).toMatch(/^A gain of 4\.0 ± 2\.8 cfm is shown/);
  });

  it('adds both calibrations on different benches: a 4 cfm gain is then not shown', () => {
    const r = compare({ readingsA: list(STOCK), readingsB: list(PORTED), setup: 'different-benches' });
    // lesson 9 (comparing-tests): a ±2 % calibration read as rectangular, 2 %/√3 = 1.15 % of each mean; 0.07 % ambient
    const u = Math.sqrt(2 * (1.2 ** 2 / 3) + (0.0007 * 250) ** 2 + (0.0007 * 254) ** 2 + (0.0115 * 250) ** 2 + (0.0115 * 254) ** 2);
    expect(out(r, 'differenceStandardUncertainty')).toBeCloseTo(u, 9);
    expect(r.notes[0]).toMatch(/^A difference of 4\.0 ± \d\.\d cfm is not shown: it is no larger than its uncertainty\.$/);
  });

  it('uses the relative uncertainties given instead of lesson 9’s', () => {
    const r = compare({ readingsA: list(STOCK), readingsB: list(PORTED), setup: 'different-days', ambientUncertainty: { value: 1, unit: '%' } });
    // by hand: 1 % of each mean added in quadrature
    expect(out(r, 'differenceStandardUncertainty')).toBeCloseTo(Math.sqrt(0.96 + 2.5 ** 2 + 2.54 ** 2), 9);
  });

  it('Welch–Satterthwaite by hand on unequal n and s (GUM G.4.2, eq. G.2b)', () => {
    const r = compare({ readingsA: list([100, 102, 104]), readingsB: list([110, 110.5, 111, 110, 110.5, 111]) });
    // by hand: s_A = 2 (n = 3), s_B² = 1.0/5 = 0.2 (n = 6); u_A² = 4/3, u_B² = 0.2/6
    const uA2 = 4 / 3;
    const uB2 = 0.2 / 6;
    expect(out(r, 'stdDevB')).toBeCloseTo(Math.sqrt(0.2), 10);
    expect(out(r, 'differenceStandardUncertainty')).toBeCloseTo(Math.sqrt(uA2 + uB2), 10);
    // GUM eq. G.2b: ν_eff = (u_A² + u_B²)² / (u_A⁴/2 + u_B⁴/5) = 2.1007 → 2
    const nu = (uA2 + uB2) ** 2 / (uA2 ** 2 / 2 + uB2 ** 2 / 5);
    expect(nu).toBeCloseTo(2.1007, 4);
    expect(out(r, 'effectiveDegreesOfFreedom')).toBeCloseTo(nu, 10);
    // GUM Table G.2, p = 95 %, ν = 2 (ν_eff truncated, G.4.1): t = 4.30
    expect(out(r, 'coverageFactor')).toBeCloseTo(4.3, 2);
    expect(out(r, 'differenceExpandedUncertainty')).toBeCloseTo(out(r, 'coverageFactor') * Math.sqrt(uA2 + uB2), 10);
  });

  it('mean and sample standard deviation by hand (GUM 4.2.1 and 4.2.2)', () => {
    const r = compare({ readingsA: list([10, 12, 17]), readingsB: list([20, 21]) });
    // by hand: mean (10 + 12 + 17)/3 = 13; squares 9 + 1 + 16 = 26, s² = 26/2 = 13
    expect(out(r, 'meanA')).toBeCloseTo(13, 10);
    expect(out(r, 'stdDevA')).toBeCloseTo(Math.sqrt(13), 10);
    // by hand: mean 20.5; squares 0.25 + 0.25, s² = 0.5/1
    expect(out(r, 'meanB')).toBeCloseTo(20.5, 10);
    expect(out(r, 'stdDevB')).toBeCloseTo(Math.sqrt(0.5), 10);
    expect(r.notes).toContain('With only two runs of a set, the t factor is large. Three or more runs of each make the uncertainty much smaller.');
  });

  it('words a loss, and a difference that is not shown', () => {
    const loss = compare({ readingsA: list(PORTED), readingsB: list(STOCK) });
    expect(loss.notes[0]).toBe('A loss of 4.0 ± 2.7 cfm is shown (95 % confidence).');
    const small = compare({ readingsA: list(STOCK), readingsB: list([249.8, 251.0, 252.2]) });
    expect(small.notes[0]).toBe('A difference of 1.0 ± 2.7 cfm is not shown: it is no larger than its uncertainty.');
    const smallLoss = compare({ readingsA: list(STOCK), readingsB: list([247.8, 249.0, 250.2]) });
    expect(smallLoss.notes[0]).toBe('A difference of −1.0 ± 2.7 cfm is not shown: it is no larger than its uncertainty.');
  });

  it('states the verdict in the unit of the readings', () => {
    const r = run('compare-tests', { readingsA: list([117, 118, 119], 'L/s'), readingsB: list([120, 121, 122], 'L/s') });
    // by hand: Δ = 3 L/s, u = 1·√(2/3) = 0.816 L/s, U = 2.776 × 0.816 = 2.27 L/s
    expect(r.notes[0]).toBe('A gain of 3.0 ± 2.3 L/s is shown (95 % confidence).');
    expect(r.outputs['difference']?.unit).toBe('m^3/s');
    const m3h = run('compare-tests', { readingsA: list([423, 425, 427], 'm^3/h'), readingsB: list([430, 432, 434], 'm^3/h') });
    expect(m3h.notes[0]).toBe('A gain of 7.0 ± 4.5 m³/h is shown (95 % confidence).');
  });

  it('warns when a set does not scatter at all, and still computes', () => {
    const r = compare({ readingsA: list([250, 250, 250]), readingsB: list(PORTED) });
    expect(r.warnings.map((w) => w.field)).toEqual(['readingsA']);
    const flat = compare({ readingsA: list([250, 250]), readingsB: list([254, 254]) });
    expect(flat.outputs['effectiveDegreesOfFreedom']).toBeUndefined();
    expect(out(flat, 'differenceExpandedUncertainty')).toBe(0);
    expect(flat.notes[0]).toBe('A gain of 4.0 ± 0.0 cfm is shown (95 % confidence).');
  });

  it('shows the steps: means, s, s/√n, what cancels, u(Δ), ν_eff, t, U and the verdict', () => {
    const r = compare({ readingsA: list(STOCK), readingsB: list(PORTED) });
    expect(r.steps.map((s) => s.title)).toEqual([
      'Convert the inputs to SI units',
      'Mean of each set of readings',
      'Scatter of each set: the sample standard deviation',
      'Standard uncertainty of each mean (Type A, GUM 4.2)',
      'Difference of the means',
      'Which components cancel (GUM 5.2, correlated inputs)',
      'Standard uncertainty of the difference',
      'Effective degrees of freedom (Welch–Satterthwaite, GUM G.4.2)',
      'Coverage factor for 95 %: Student t (GUM Table G.2)',
      'Expanded uncertainty of the difference (95 %)',
      'Is the change shown?',
      'Express the results in the units asked for',
    ]);
    expect(r.steps[0]?.substituted).toContain('x_{A} = (248.8,\\ 250,\\ 251.2) \\times');
    expect(r.steps[5]?.substituted).toMatch(/cancel/);
    expect(r.steps[10]?.result).toBe('\\text{a gain is shown}');
  });

  it('gives the same degrees of freedom whatever the scale of the readings, and refuses absurd ones by name', () => {
    // E1's readings give ν_eff = 4 (two sets of three, equal s); u⁴ of 1e90 overflows, of 1e-90 underflows.
    for (const scale of [1e-90, 1, 1e90]) {
      const r = run('compare-tests', { readingsA: list(STOCK.map((v) => v * scale), 'm^3/s'), readingsB: list(PORTED.map((v) => v * scale), 'm^3/s') });
      expect(out(r, 'effectiveDegreesOfFreedom')).toBeCloseTo(4, 9);
    }
    const outcome = evaluate('compare-tests', { inputs: { readingsA: list([1e300, 1.5e300], 'm^3/s'), readingsB: list(PORTED) } });
    expect(errorsOf(outcome)).toEqual([{ field: 'readingsA', message: expect.stringMatching(/^Readings A are too large/) }]);
  });

  it('swapping A and B flips the sign of the difference and keeps U (property)', () => {
    fc.assert(
      fc.property(readingSet(), readingSet(), fc.constantFrom('same-day', 'different-days', 'different-benches'), (a, b, setup) => {
        const ab = compare({ readingsA: list(a), readingsB: list(b), setup });
        const ba = compare({ readingsA: list(b), readingsB: list(a), setup });
        expect(out(ba, 'difference')).toBeCloseTo(-out(ab, 'difference'), 9);
        expect(out(ba, 'differenceExpandedUncertainty')).toBeCloseTo(out(ab, 'differenceExpandedUncertainty'), 9);
      }),
      { numRuns: 40 },
    );
  });

  it('U grows when the scatter of both sets grows (property)', () => {
    fc.assert(
      fc.property(readingSet(), readingSet(), fc.double({ min: 1.1, max: 5, noNaN: true }), fc.constantFrom('same-day', 'different-days'), (a, b, factor, setup) => {
        const widen = (x: number[]) => {
          const m = x.reduce((s, v) => s + v, 0) / x.length;
          return x.map((v) => m + factor * (v - m));
        };
        const narrow = compare({ readingsA: list(a), readingsB: list(b), setup });
        const wide = compare({ readingsA: list(widen(a)), readingsB: list(widen(b)), setup });
        expect(out(wide, 'differenceExpandedUncertainty')).toBeGreaterThan(out(narrow, 'differenceExpandedUncertainty'));
      }),
      { numRuns: 40 },
    );
  });

  it('adding a constant to every reading leaves U unchanged on the same day (property)', () => {
    fc.assert(
      fc.property(readingSet(), readingSet(), fc.double({ min: -40, max: 200, noNaN: true }), (a, b, shift) => {
        const base = compare({ readingsA: list(a), readingsB: list(b) });
        const moved = compare({ readingsA: list(a.map((v) => v + shift)), readingsB: list(b.map((v) => v + shift)) });
        expect(out(moved, 'differenceExpandedUncertainty')).toBeCloseTo(out(base, 'differenceExpandedUncertainty'), 6);
        expect(out(moved, 'difference')).toBeCloseTo(out(base, 'difference'), 6);
      }),
      { numRuns: 40 },
    );
  });
});

/** 2–30 readings that scatter by up to ±10 cfm about a flow between 100 and 400 cfm. */
function readingSet() {
  return fc
    .tuple(fc.double({ min: 100, max: 400, noNaN: true }), fc.array(fc.double({ min: -10, max: 10, noNaN: true }), { minLength: 2, maxLength: 30 }))
    .map(([centre, deviations]) => deviations.map((d) => centre + d))
    .filter((x) => Math.max(...x) - Math.min(...x) > 0.01);
}

describe('list inputs', () => {
  const example = () => exampleRequest('compare-tests')!.inputs;
  const refusal = (name: string, value: unknown) => {
    const outcome = evaluate('compare-tests', { inputs: { ...example(), [name]: value as InputValue } });
    return errorsOf(outcome);
  };

  it('describe how many readings they take', () => {
    const input = describeCalculator('compare-tests')!.inputs.find((i) => i.name === 'readingsA')!;
    expect(input.list).toEqual({ min: 2, max: 30 });
    expect(input.example).toEqual({ values: [248.8, 250, 251.2], unit: 'cfm' });
    expect(describeCalculator('uncertainty')!.inputs.every((i) => i.list === undefined)).toBe(true);
  });

  it.each([
    ['too few readings', { values: [250], unit: 'cfm' }, /2 to 30 readings; 1 was given/],
    ['too many readings', { values: Array.from({ length: 31 }, (_, i) => 240 + i), unit: 'cfm' }, /2 to 30 readings; 31 were given/],
    ['a reading that is not a number', { values: [250, '251', 252], unit: 'cfm' }, /reading 2 is not a finite number/],
    ['a NaN reading', { values: [250, 251, Number.NaN], unit: 'cfm' }, /reading 3 is not a finite number/],
    ['a reading at or below zero', { values: [250, -1, 252], unit: 'cfm' }, /reading 2 must be above 0/],
    ['one value given to a list input', { value: 250, unit: 'cfm' }, /takes a list of 2 to 30 readings/],
    ['a bare array', [250, 251], /takes a list/],
    ['a list in a unit of another kind', { values: [250, 251], unit: 'kPa' }, /not a unit of volume flow/],
    ['a list without a unit', { values: [250, 251] }, /needs a unit/],
  ])('refuse %s, naming the input and the reading', (_what, value, message) => {
    const errors = refusal('readingsA', value);
    expect(errors.map((e) => e.field)).toEqual(['readingsA']);
    expect(errors[0]?.message).toMatch(/^Readings A/);
    expect(errors[0]?.message).toMatch(message);
  });

  it('refuse a list given to a one-value input', () => {
    const errors = errorsOf(evaluate('mass-flow', { inputs: { volumeFlow: list([250, 251]), density: { value: 1.2, unit: 'kg/m^3' } } }));
    expect(errors).toEqual([{ field: 'volumeFlow', message: 'Volume flow takes one value, not a list of readings.' }]);
  });

  it('wrap a long list in the conversion step', () => {
    const r = compare({ readingsA: list([248, 249, 250, 251, 252, 250, 249, 251]), readingsB: list(PORTED) });
    expect(r.steps[0]?.substituted).toContain('x_{A} = (248,\\ 249,\\ 250,\\ 251,\\ 252,\\ 250, \\\\ &\\quad 249,\\ 251) \\times');
    for (const step of r.steps) for (const tex of [step.formula, step.substituted, step.result]) expect(() => katex.renderToString(tex, { throwOnError: true })).not.toThrow();
  });
});
