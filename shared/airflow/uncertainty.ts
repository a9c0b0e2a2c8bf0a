/*
 * First-order uncertainty propagation of the GUM (JCGM 100:2008, §5.1): for y = f(x1…xn) with
 * uncorrelated inputs, u_c(y)² = Σ (c_i u(x_i))², c_i = ∂f/∂x_i, here by central differences.
 * Expanded uncertainty U = k u_c with k = 2 (about 95 % coverage for a near-normal result) when
 * every term is Type B with many degrees of freedom; with a Type A term from n repeat readings
 * (s/√n, ν = n − 1, GUM §4.2) k is Student's t at ν_eff (Welch–Satterthwaite, GUM Annex G.4).
 * A sensor accuracy "±a" read as a rectangular distribution gives u = a/√3 (GUM §4.3.7).
 */

export const COVERAGE_FACTOR = 2;

export interface UncertainInput {
  /** LaTeX symbol for the steps. */
  symbol: string;
  value: number;
  standardUncertainty: number;
  /** Step used for the central difference (in the same unit as value). */
  step: number;
}

export interface Budget {
  value: number;
  sensitivities: number[];
  contributions: number[];
  combined: number;
  expanded: number;
}

/** Standard uncertainty from a ±a accuracy limit with a rectangular distribution. */
export function rectangularToStandard(halfWidth: number): number {
  return halfWidth / Math.sqrt(3);
}

/** GUM law of propagation of uncertainty for uncorrelated inputs. */
export function propagate(f: (x: readonly number[]) => number, inputs: readonly UncertainInput[]): Budget {
  const x = inputs.map((i) => i.value);
  const value = f(x);
  const sensitivities = inputs.map((input, i) => {
    const up = [...x];
    const down = [...x];
    up[i] = input.value + input.step;
    down[i] = input.value - input.step;
    return (f(up) - f(down)) / (2 * input.step);
  });
  const contributions = inputs.map((input, i) => Math.abs((sensitivities[i] ?? 0) * input.standardUncertainty));
  const combined = Math.sqrt(contributions.reduce((sum, c) => sum + c * c, 0));
  return { value, sensitivities, contributions, combined, expanded: COVERAGE_FACTOR * combined };
}

/** The arithmetic mean of repeat readings (GUM 4.2.1, eq. 3). */
export function mean(readings: readonly number[]): number {
  return readings.reduce((sum, x) => sum + x, 0) / readings.length;
}

/** The experimental (sample) standard deviation s, with n − 1 (GUM 4.2.2, eq. 4); n ≥ 2. */
export function sampleStandardDeviation(readings: readonly number[]): number {
  const m = mean(readings);
  const squares = readings.reduce((sum, x) => sum + (x - m) ** 2, 0);
  return Math.sqrt(squares / (readings.length - 1));
}

/** One term of a budget: its contribution c_i·u(x_i) and degrees of freedom (∞ for Type B). */
export interface BudgetTerm {
  contribution: number;
  degreesOfFreedom: number;
}

/**
 * Effective degrees of freedom by the Welch–Satterthwaite formula (GUM G.4.2, eq. G.2b):
 * ν_eff = u_c⁴ / Σ (c_i u_i)⁴/ν_i, worked as 1 / Σ (c_i u_i / u_c)⁴/ν_i so that no fourth power
 * of a tiny or huge SI figure underflows or overflows. Terms with ν = ∞ (Type B) add nothing to
 * the sum; with no finite term, or a zero sum, ν_eff = ∞.
 */
export function welchSatterthwaite(terms: readonly BudgetTerm[]): number {
  const combined = Math.sqrt(terms.reduce((sum, t) => sum + t.contribution ** 2, 0));
  const denominator = terms.reduce(
    (sum, t) => (Number.isFinite(t.degreesOfFreedom) ? sum + (t.contribution / combined) ** 4 / t.degreesOfFreedom : sum),
    0,
  );
  return denominator > 0 ? 1 / denominator : Number.POSITIVE_INFINITY;
}
