/*
 * Standard atmosphere of ISO 2533:1975 (identical to the US Standard Atmosphere 1976 below
 * 32 km) for the two lowest layers, by GEOPOTENTIAL altitude H:
 *   troposphere        H ≤ 11 000 m: T = T0 + L·H, L = −6.5 K/km, p = p0 (T/T0)^(−g0/(L R))
 *   lower stratosphere 11–20 km:     T = 216.65 K,  p = p11 exp(−g0 (H − 11 000)/(R T11))
 * ISO 2533 tabulates the troposphere down to −2000 m; outside −2000…20 000 m the formulas
 * are extrapolated (the caller warns).
 */

/** ISO 2533 constants. */
export const ISA = {
  g0: 9.80665, // m/s², standard gravity
  R: 287.05287, // J/(kg·K), specific gas constant of air in ISO 2533
  T0: 288.15, // K
  p0: 101325, // Pa
  lapse: -0.0065, // K/m, troposphere
  tropopause: 11000, // m, geopotential
  top: 20000, // m, top of the isothermal layer modelled here
  bottom: -2000, // m, lowest tabulated altitude
} as const;

/** Exponent −g0/(L R) of the troposphere pressure law (≈ 5.255 88). */
export const TROPOSPHERE_EXPONENT = -ISA.g0 / (ISA.lapse * ISA.R);
const T11 = ISA.T0 + ISA.lapse * ISA.tropopause;
const P11 = ISA.p0 * Math.pow(T11 / ISA.T0, TROPOSPHERE_EXPONENT);

export interface AtmosphereState {
  temperatureK: number;
  pressurePa: number;
  densityKgM3: number;
  layer: 'troposphere' | 'stratosphere';
}

/** The standard atmosphere at a geopotential altitude in metres. */
export function standardAtmosphere(altitudeM: number): AtmosphereState {
  if (altitudeM <= ISA.tropopause) {
    const T = ISA.T0 + ISA.lapse * altitudeM;
    const p = ISA.p0 * Math.pow(T / ISA.T0, TROPOSPHERE_EXPONENT);
    return { temperatureK: T, pressurePa: p, densityKgM3: p / (ISA.R * T), layer: 'troposphere' };
  }
  const p = P11 * Math.exp((-ISA.g0 * (altitudeM - ISA.tropopause)) / (ISA.R * T11));
  return { temperatureK: T11, pressurePa: p, densityKgM3: p / (ISA.R * T11), layer: 'stratosphere' };
}

/** Tropopause values, for the worked steps. */
export const TROPOPAUSE = { temperatureK: T11, pressurePa: P11 } as const;
