import * as fc from 'fast-check';
import { logGamma, NORMAL_95, regularizedIncompleteBeta, studentTwoSidedTail, tFactor95, wholeDegreesOfFreedom } from './student-t';

describe('tFactor95: Student t at 95 % (two-sided)', () => {
  it.each([
    // GUM (JCGM 100:2008) Table G.2, column p = 95 %, as printed (two decimals)
    [1, 12.71],
    [2, 4.3],
    [3, 3.18],
    [4, 2.78],
    [5, 2.57],
    [10, 2.23],
    [20, 2.09],
    [50, 2.01],
  ])('ν = %d gives %d (GUM Table G.2)', (nu, table) => {
    expect(tFactor95(nu)).toBeCloseTo(table, 2);
  });

  it('ν = ∞ gives 1.960 (GUM Table G.2), the normal 1.959 96', () => {
    // GUM (JCGM 100:2008) Table G.2, p = 95 %, ν = ∞: 1.960
    expect(tFactor95(Number.POSITIVE_INFINITY)).toBeCloseTo(1.96, 3);
    // Abramowitz & Stegun Table 26.5 (normal): z for a two-sided 95 % is 1.959 964
    expect(NORMAL_95).toBeCloseTo(1.959964, 6);
    expect(tFactor95(2e6)).toBe(NORMAL_95);
  });

  it.each([
    // standard statistics tables of t_0.975 (e.g. NIST/SEMATECH e-Handbook, Table 1.3.6.7.2), three decimals
    [1, 12.706],
    [2, 4.303],
    [4, 2.776],
    [9, 2.262],
    [30, 2.042],
    [100, 1.984],
  ])('ν = %d gives t0.975 = %d (statistics table)', (nu, table) => {
    expect(tFactor95(nu)).toBeCloseTo(table, 3);
  });

  it('truncates a non-integer ν_eff to the next lower integer (GUM G.4.1)', () => {
    expect(tFactor95(4.9)).toBe(tFactor95(4));
    expect(tFactor95(1.01)).toBe(tFactor95(1));
    // a rounding error below a whole number is that number, not the one below it
    expect(wholeDegreesOfFreedom(3.9999999999999996)).toBe(4);
    expect(wholeDegreesOfFreedom(4.53)).toBe(4);
    expect(tFactor95(3.9999999999999996)).toBe(tFactor95(4));
    // readings whose scatters differ by a unit conversion's rounding: still 4, no jump to t(3)
    expect(wholeDegreesOfFreedom(3.99999)).toBe(4);
    expect(wholeDegreesOfFreedom(3.98)).toBe(3);
  });

  it('refuses fewer than one degree of freedom', () => {
    expect(() => tFactor95(0.5)).toThrow(RangeError);
    expect(() => tFactor95(Number.NaN)).toThrow(RangeError);
  });

  it('falls as ν grows, towards the normal value (property)', () => {
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 5000 }), (nu) => {
        expect(tFactor95(nu + 1)).toBeLessThan(tFactor95(nu));
        expect(tFactor95(nu)).toBeGreaterThan(NORMAL_95);
      }),
      { numRuns: 50 },
    );
  });
});

describe('the functions behind it', () => {
  it('ln Γ matches known values', () => {
    // Γ(5) = 4! = 24; Γ(1/2) = √π (Abramowitz & Stegun 6.1.8)
    expect(logGamma(5)).toBeCloseTo(Math.log(24), 12);
    expect(logGamma(0.5)).toBeCloseTo(0.5 * Math.log(Math.PI), 12);
  });

  it('I_x(a, b) matches closed forms', () => {
    // I_x(a, 1) = x^a and I_x(1, b) = 1 − (1 − x)^b (Abramowitz & Stegun 26.5.x, by direct integration)
    expect(regularizedIncompleteBeta(0.3, 2.5, 1)).toBeCloseTo(0.3 ** 2.5, 12);
    expect(regularizedIncompleteBeta(0.7, 1, 3)).toBeCloseTo(1 - 0.3 ** 3, 12);
  });

  it('t with one degree of freedom is the Cauchy distribution', () => {
    // Cauchy: P(|T| > t) = 1 − (2/π) arctan t, by direct integration
    for (const t of [0.5, 1, 3, 12.706]) expect(studentTwoSidedTail(t, 1)).toBeCloseTo(1 - (2 / Math.PI) * Math.atan(t), 12);
  });

  it('t with two degrees of freedom has a closed form', () => {
    // ν = 2: P(|T| > t) = 1 − t/√(2 + t²), by direct integration
    for (const t of [0.3, 1, 4.303]) expect(studentTwoSidedTail(t, 2)).toBeCloseTo(1 - t / Math.sqrt(2 + t * t), 12);
  });
});
