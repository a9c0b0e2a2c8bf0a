/*
 * Compression of air: isentropic compression with a compressor efficiency, intercooler
 * effectiveness, the combined gas law for a fixed mass (textbook thermodynamics, e.g.
 * Çengel & Boles, "Thermodynamics: An Engineering Approach", ideal-gas isentropic relations), and
 * the corrected mass flow a compressor map is drawn against.
 */

/** Ratio of specific heats of air used for compressor sums (cold-air standard). */
export const GAMMA_AIR = 1.4;

/** Isentropic outlet temperature: T2s = T1 · PR^((γ−1)/γ). */
export function isentropicOutletTemperature(inletK: number, pressureRatio: number, gamma = GAMMA_AIR): number {
  return inletK * Math.pow(pressureRatio, (gamma - 1) / gamma);
}

/** Actual outlet temperature with efficiency η_c: T2 = T1 (1 + (PR^((γ−1)/γ) − 1)/η_c). */
export function compressorOutletTemperature(
  inletK: number,
  pressureRatio: number,
  efficiency: number,
  gamma = GAMMA_AIR,
): number {
  return inletK * (1 + (Math.pow(pressureRatio, (gamma - 1) / gamma) - 1) / efficiency);
}

/** Intercooler outlet: T3 = T2 − ε (T2 − T_coolant). */
export function intercoolerOutletTemperature(inK: number, effectiveness: number, coolantK: number): number {
  return inK - effectiveness * (inK - coolantK);
}

/** Combined gas law for a fixed mass: V2 = V1 (p1/p2)(T2/T1), absolute p and T. */
export function combinedGasLawVolume(p1: number, v1: number, t1: number, p2: number, t2: number): number {
  return (v1 * (p1 / p2) * t2) / t1;
}

/**
 * Corrected (referred) mass flow of a compressor map: ṁ_c = ṁ·√(T₁/T_ref)/(p₁/p_ref), inlet p₁, T₁
 * absolute (standard turbomachinery practice: Dixon & Hall; SAE J1826, from memory).
 */
export function correctedMassFlow(massFlow: number, inletPa: number, inletK: number, referencePa: number, referenceK: number): number {
  return (massFlow * Math.sqrt(inletK / referenceK)) / (inletPa / referencePa);
}
