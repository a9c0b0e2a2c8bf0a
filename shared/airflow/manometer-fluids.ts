/*
 * Densities of manometer fluids at a stated temperature.
 * - Water: Tanaka, Girard, Davis, Peuto, Bignell, "Recommended table for the density of water
 *   between 0 °C and 40 °C based on recent experimental reports", Metrologia 38 (2001) 301–309
 *   (air-free standard mean ocean water at 101 325 Pa; valid 0–40 °C).
 * - Mercury: 13 595.1 kg/m³ at 0 °C (the conventional value behind inHg and mmHg) with a mean
 *   cubical expansion of 1.818·10⁻⁴ K⁻¹, the coefficient of the usual barometer temperature
 *   correction (WMO Guide to Instruments and Methods of Observation; value from memory).
 */

const TANAKA = { a1: -3.983035, a2: 301.797, a3: 522528.9, a4: 69.34881, a5: 999.97495 } as const;

/** Water density, kg/m³ (Tanaka et al. 2001), t in °C. */
export function waterDensity(celsius: number): number {
  const { a1, a2, a3, a4, a5 } = TANAKA;
  return a5 * (1 - ((celsius + a1) ** 2 * (celsius + a2)) / (a3 * (celsius + a4)));
}

export const MERCURY_DENSITY_0C = 13595.1;
export const MERCURY_EXPANSION_PER_K = 1.818e-4;

/** Mercury density, kg/m³: ρ = 13 595.1 / (1 + β t), t in °C. */
export function mercuryDensity(celsius: number): number {
  return MERCURY_DENSITY_0C / (1 + MERCURY_EXPANSION_PER_K * celsius);
}

/** Where each density formula is trusted (warning outside) and where the calculator stops (water freezes at 0 °C, mercury at −38.83 °C). */
export const FLUID_RANGES = {
  water: { validMinC: 0, validMaxC: 40, hardMinC: 0, hardMaxC: 100 },
  mercury: { validMinC: 0, validMaxC: 40, hardMinC: -38.83, hardMaxC: 100 },
} as const;
