/*
 * First-order uncertainty propagation of the GUM (JCGM 100:2008, §5.1): for y = f(x1…xn) with
 * uncorrelated inputs, u_c(y)² = Σ (c_i u(x_i))², c_i = ∂f/∂x_i, here by central differences.
 * Expanded uncertainty U = k u_c with k = 2 (about 95 % coverage for a near-normal result).
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
