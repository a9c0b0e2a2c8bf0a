/*
 * Student's t distribution: the coverage factor for an expanded uncertainty with few degrees of
 * freedom (GUM, JCGM 100:2008, Annex G.3–G.4 and Table G.2).
 *
 * The CDF uses the regularised incomplete beta function,
 *   P(|T| > t) = I_x(ν/2, 1/2) with x = ν/(ν + t²)   (Abramowitz & Stegun 26.7.1 / 26.5.27),
 * evaluated by its continued fraction (modified Lentz method, as in Press et al., Numerical
 * Recipes, §6.4) and inverted by bisection: slow next to a table, but exact to 1e-12 and small.
 */

/** Two-sided 95 % factor of the normal distribution: t for ν = ∞ (GUM Table G.2: 1.960). */
export const NORMAL_95 = 1.959963984540054;

/** ln Γ(x) for x > 0 (Lanczos approximation, g = 7, n = 9; relative error below 1e-15). */
export function logGamma(x: number): number {
  if (x < 0.5) return Math.log(Math.PI / Math.sin(Math.PI * x)) - logGamma(1 - x);
  const c = [0.99999999999980993, 676.5203681218851, -1259.1392167224028, 771.32342877765313, -176.61502916214059,
    12.507343278686905, -0.13857109526572012, 9.9843695780195716e-6, 1.5056327351493116e-7];
  const z = x - 1;
  let sum = c[0] as number;
  for (let i = 1; i < c.length; i++) sum += (c[i] as number) / (z + i);
  const t = z + 7.5;
  return 0.5 * Math.log(2 * Math.PI) + (z + 0.5) * Math.log(t) - t + Math.log(sum);
}

/** Continued fraction of the incomplete beta function (modified Lentz). */
function betaContinuedFraction(x: number, a: number, b: number): number {
  const tiny = 1e-300;
  let c = 1;
  let d = 1 - ((a + b) * x) / (a + 1);
  if (Math.abs(d) < tiny) d = tiny;
  d = 1 / d;
  let h = d;
  for (let m = 1; m <= 10_000; m++) {
    const m2 = 2 * m;
    // even step
    let aa = (m * (b - m) * x) / ((a + m2 - 1) * (a + m2));
    d = 1 + aa * d;
    if (Math.abs(d) < tiny) d = tiny;
    c = 1 + aa / c;
    if (Math.abs(c) < tiny) c = tiny;
    d = 1 / d;
    h *= d * c;
    // odd step
    aa = (-(a + m) * (a + b + m) * x) / ((a + m2) * (a + m2 + 1));
    d = 1 + aa * d;
    if (Math.abs(d) < tiny) d = tiny;
    c = 1 + aa / c;
    if (Math.abs(c) < tiny) c = tiny;
    d = 1 / d;
    const delta = d * c;
    h *= delta;
    if (Math.abs(delta - 1) < 1e-15) return h;
  }
  return h;
}

/** The regularised incomplete beta function I_x(a, b), 0 ≤ x ≤ 1, a, b > 0. */
export function regularizedIncompleteBeta(x: number, a: number, b: number): number {
  if (x <= 0) return 0;
  if (x >= 1) return 1;
  const front = Math.exp(logGamma(a + b) - logGamma(a) - logGamma(b) + a * Math.log(x) + b * Math.log(1 - x));
  // The continued fraction converges fast for x < (a + 1)/(a + b + 2); use the symmetry otherwise.
  if (x < (a + 1) / (a + b + 2)) return (front * betaContinuedFraction(x, a, b)) / a;
  return 1 - (front * betaContinuedFraction(1 - x, b, a)) / b;
}

/** P(|T| > t) for Student's t with ν degrees of freedom (ν > 0, t ≥ 0). */
export function studentTwoSidedTail(t: number, nu: number): number {
  return regularizedIncompleteBeta(nu / (nu + t * t), nu / 2, 0.5);
}

/**
 * The 95 % coverage factor t_95(ν): the t with P(|T| ≤ t) = 0.95. A non-integer ν (a
 * Welch–Satterthwaite ν_eff) is truncated to the next lower integer (GUM G.4.1, note 1);
 * ν = ∞ (or above a million, where the difference is below 3e-6) gives the normal 1.95996.
 */
export function tFactor95(nu: number): number {
  const whole = wholeDegreesOfFreedom(nu);
  if (!(whole >= 1)) throw new RangeError(`degrees of freedom must be at least 1, got ${nu}`);
  if (!Number.isFinite(whole) || whole > 1e6) return NORMAL_95;
  let high = 2;
  while (studentTwoSidedTail(high, whole) > 0.05) high *= 2;
  return bisect((t) => 0.05 - studentTwoSidedTail(t, whole), 0, high);
}

/**
 * ν truncated to the next lower integer (GUM G.4.1), except that a value within 0.01 below a whole
 * number counts as that number. Welch–Satterthwaite gives 3.999 999 999 for an exact 4, and
 * 3.9999 for readings whose scatters differ only by a rounding (the same readings converted to
 * other units); truncating those to 3 would jump t from 2.78 to 3.18. ν_eff is itself only an
 * estimate (GUM G.4.2 note), so 0.01 changes nothing a reading could show.
 */
export function wholeDegreesOfFreedom(nu: number): number {
  const nearest = Math.round(nu);
  return nearest - nu >= 0 && nearest - nu <= 0.01 ? nearest : Math.floor(nu);
}

/** The root of an increasing function on [low, high] by bisection, to about 1e-13 relative. */
function bisect(f: (x: number) => number, low: number, high: number): number {
  let lo = low;
  let hi = high;
  for (let i = 0; i < 200 && hi - lo > 1e-13 * Math.max(1, hi); i++) {
    const mid = (lo + hi) / 2;
    if (f(mid) < 0) lo = mid;
    else hi = mid;
  }
  return (lo + hi) / 2;
}
