/*
 * Moist air by the CIPM-2007 formula: A. Picard, R. S. Davis, M. Gläser, K. Fujii, "Revised
 * formula for the density of moist air (CIPM-2007)", Metrologia 45 (2008) 149–155.
 *
 * Conventions:
 * - Saturation vapour pressure is the CIPM-2007 (Davis 1992) formula, over LIQUID water at every
 *   temperature, also at 0 °C and below (supercooled water, the WMO convention for relative
 *   humidity). A dew point below 0 °C is therefore a dew point over supercooled water, not a
 *   frost point; no over-ice formula is offered.
 * - Dew point inverts the same p_sv with the enhancement factor f(p, t_d) by Newton iteration.
 * - Dry air: x_CO2 = 0.0004, so M_a = 28.965 46 g/mol; the "ideal gas, dry air" teaching method
 *   uses R_d = R/M_a = 287.048 J/(kg·K), derived from the same CIPM constants.
 */

/** Molar gas constant used by CIPM-2007, J/(mol·K). */
export const R_MOLAR = 8.314472;
/** Molar mass of dry air at x_CO2 = 0.0004, kg/mol (CIPM-2007: [28.965 46 + 12.011(x_CO2 − 0.0004)]·10⁻³). */
export const M_DRY_AIR = 28.96546e-3;
/** Molar mass of water, kg/mol (CIPM-2007). */
export const M_WATER = 18.01528e-3;
/** Specific gas constant of dry air from the CIPM constants: R/M_a ≈ 287.048 J/(kg·K). */
export const R_DRY_AIR = R_MOLAR / M_DRY_AIR;
/** CIPM-2007 validity: 600–1100 hPa, 15–27 °C. */
export const CIPM_RANGE = { pMinPa: 60000, pMaxPa: 110000, tMinK: 288.15, tMaxK: 300.15 } as const;
/** CIPM-2007 states a relative standard uncertainty of the formula itself of 22·10⁻⁶. */
export const CIPM_RELATIVE_UNCERTAINTY = 22e-6;

// CIPM-2007 (Davis 1992) saturation vapour pressure coefficients.
const A = 1.2378847e-5; // K⁻²
const B = -1.9121316e-2; // K⁻¹
const C = 33.93711047;
const D = -6.3431645e3; // K
// CIPM-2007 enhancement factor coefficients.
const ALPHA = 1.00062;
const BETA = 3.14e-8; // Pa⁻¹
const GAMMA = 5.6e-7; // K⁻²
// CIPM-2007 compressibility coefficients.
const A0 = 1.58123e-6; // K·Pa⁻¹
const A1 = -2.9331e-8; // Pa⁻¹
const A2 = 1.1043e-10; // K⁻¹·Pa⁻¹
const B0 = 5.707e-6; // K·Pa⁻¹
const B1 = -2.051e-8; // Pa⁻¹
const C0 = 1.9898e-4; // K·Pa⁻¹
const C1 = -2.376e-6; // Pa⁻¹
const D0 = 1.83e-11; // K²·Pa⁻²
const E0 = -0.765e-8; // K²·Pa⁻²

const celsius = (temperatureK: number) => temperatureK - 273.15;

/** Saturation vapour pressure over liquid water, Pa: p_sv = exp(A T² + B T + C + D/T). */
export function saturationVaporPressure(temperatureK: number): number {
  const t = temperatureK;
  return Math.exp(A * t * t + B * t + C + D / t);
}

/** Enhancement factor f = α + β p + γ t² (t in °C). */
export function enhancementFactor(pressurePa: number, temperatureK: number): number {
  const t = celsius(temperatureK);
  return ALPHA + BETA * pressurePa + GAMMA * t * t;
}

/** The two bracketed terms of Z: Z = 1 − (p/T)·first + (p²/T²)·second. */
export function compressibilityTerms(temperatureK: number, moleFractionVapor: number): { first: number; second: number } {
  const t = celsius(temperatureK);
  const xv = moleFractionVapor;
  return {
    first: A0 + A1 * t + A2 * t * t + (B0 + B1 * t) * xv + (C0 + C1 * t) * xv * xv,
    second: D0 + E0 * xv * xv,
  };
}

/** Compressibility factor Z of moist air. */
export function compressibility(pressurePa: number, temperatureK: number, moleFractionVapor: number): number {
  const { first, second } = compressibilityTerms(temperatureK, moleFractionVapor);
  const pT = pressurePa / temperatureK;
  return 1 - pT * first + pT * pT * second;
}

/** Mole fraction of water vapour from relative humidity h (0–1): x_v = h f p_sv / p. */
export function moleFractionFromRelativeHumidity(h: number, pressurePa: number, temperatureK: number): number {
  return (h * enhancementFactor(pressurePa, temperatureK) * saturationVaporPressure(temperatureK)) / pressurePa;
}

/** Mole fraction of water vapour from the dew point: x_v = f(p, t_d) p_sv(T_d) / p. */
export function moleFractionFromDewPoint(dewPointK: number, pressurePa: number): number {
  return (enhancementFactor(pressurePa, dewPointK) * saturationVaporPressure(dewPointK)) / pressurePa;
}

/** Density of moist air, kg/m³: ρ = p M_a / (Z R T) · [1 − x_v (1 − M_v/M_a)]. */
export function densityCipm(pressurePa: number, temperatureK: number, moleFractionVapor: number): number {
  const z = compressibility(pressurePa, temperatureK, moleFractionVapor);
  return (
    ((pressurePa * M_DRY_AIR) / (z * R_MOLAR * temperatureK)) *
    (1 - moleFractionVapor * (1 - M_WATER / M_DRY_AIR))
  );
}

/** Ideal-gas density of dry air, kg/m³: ρ = p / (R_d T). */
export function densityIdealDry(pressurePa: number, temperatureK: number): number {
  return pressurePa / (R_DRY_AIR * temperatureK);
}

/**
 * Dew point, K, for a partial pressure of water vapour p_v in air at total pressure p: solves
 * f(p, t_d)·p_sv(T_d) = p_v by Newton iteration on the logarithm. Returns NaN for p_v ≤ 0.
 */
export function dewPointFromVaporPressure(vaporPressurePa: number, pressurePa: number): number {
  if (!(vaporPressurePa > 0)) return Number.NaN;
  const target = Math.log(vaporPressurePa);
  // Start from the Magnus-type inverse of a constant-slope fit; Newton does the rest.
  const ratio = Math.log(vaporPressurePa / 611.2);
  let T = 273.15 + (243.12 * ratio) / (17.62 - ratio);
  if (!(T > 100)) T = 200;
  for (let i = 0; i < 50; i++) {
    const t = celsius(T);
    const f = ALPHA + BETA * pressurePa + GAMMA * t * t;
    const g = Math.log(f) + A * T * T + B * T + C + D / T - target;
    const slope = (2 * GAMMA * t) / f + 2 * A * T + B - D / (T * T);
    const next = T - g / slope;
    if (Math.abs(next - T) < 1e-10) return next;
    T = next > 50 ? next : (T + 50) / 2;
  }
  return T;
}

/** Humidity ratio (mixing ratio), kg water per kg dry air: W = (M_v/M_a) x_v / (1 − x_v). */
export function humidityRatio(moleFractionVapor: number): number {
  return ((M_WATER / M_DRY_AIR) * moleFractionVapor) / (1 - moleFractionVapor);
}

export type Humidity = { relativeHumidity: number } | { dewPointK: number };

export interface MoistAirState {
  temperatureK: number;
  pressurePa: number;
  saturationVaporPressurePa: number;
  enhancementFactor: number;
  moleFractionVapor: number;
  vaporPressurePa: number;
  relativeHumidity: number;
  /** NaN for perfectly dry air. */
  dewPointK: number;
  humidityRatio: number;
  compressibility: number;
  densityCipm: number;
}

/** Every moist-air property of one sample, from T, p and either relative humidity or dew point. */
export function moistAir(temperatureK: number, pressurePa: number, humidity: Humidity): MoistAirState {
  const psv = saturationVaporPressure(temperatureK);
  const f = enhancementFactor(pressurePa, temperatureK);
  let xv: number;
  let dewPointK: number;
  if ('relativeHumidity' in humidity) {
    xv = (humidity.relativeHumidity * f * psv) / pressurePa;
    dewPointK = dewPointFromVaporPressure(xv * pressurePa, pressurePa);
  } else {
    dewPointK = humidity.dewPointK;
    xv = moleFractionFromDewPoint(dewPointK, pressurePa);
  }
  const z = compressibility(pressurePa, temperatureK, xv);
  return {
    temperatureK,
    pressurePa,
    saturationVaporPressurePa: psv,
    enhancementFactor: f,
    moleFractionVapor: xv,
    vaporPressurePa: xv * pressurePa,
    relativeHumidity: (xv * pressurePa) / (f * psv),
    dewPointK,
    humidityRatio: humidityRatio(xv),
    compressibility: z,
    densityCipm: densityCipm(pressurePa, temperatureK, xv),
  };
}
