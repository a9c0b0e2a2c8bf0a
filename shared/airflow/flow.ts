/*
 * Flow through a restriction, incompressible: Q = C_d A √(2 Δp / ρ) (the ISO 5167-1 orifice
 * equation with expansibility ε = 1 and the velocity-of-approach factor folded into C_d), and
 * its consequence, square-root scaling with pressure drop for the same restriction; and the
 * ISO 5167 expansibility factors that correct it for a compressible gas (isentropic exponent
 * κ = γ = 1.4 for air).
 */
import { GAMMA_AIR } from './compression';

/**
 * Above this pressure drop the incompressible model (and square-root scaling) starts to drift:
 * our chosen warning limit, 15 kPa ≈ 60 inH2O, about 15 % of an atmosphere.
 */
export const INCOMPRESSIBLE_LIMIT_PA = 15000;

/** Area of a round bore, m². */
export function circleArea(diameterM: number): number {
  return (Math.PI * diameterM * diameterM) / 4;
}

/** Ideal jet velocity √(2 Δp / ρ), m/s. */
export function idealVelocity(pressureDropPa: number, densityKgM3: number): number {
  return Math.sqrt((2 * pressureDropPa) / densityKgM3);
}

/** Volume flow through an orifice, m³/s. */
export function orificeVolumeFlow(dischargeCoefficient: number, areaM2: number, pressureDropPa: number, densityKgM3: number): number {
  return dischargeCoefficient * areaM2 * idealVelocity(pressureDropPa, densityKgM3);
}

/** Square-root scaling: Q2 = Q1 √(Δp2/Δp1), same restriction, same air density. */
export function scaleFlowToPressureDrop(flow: number, fromDropPa: number, toDropPa: number): number {
  return flow * Math.sqrt(toDropPa / fromDropPa);
}

/**
 * Expansibility of an orifice plate, ISO 5167-2:2003 (the Reader-Harris formula; clause from memory):
 * ε = 1 − (0.351 + 0.256β⁴ + 0.93β⁸)[1 − (p₂/p₁)^(1/κ)], valid for p₂/p₁ ≥ 0.75.
 * β is the bore over the pipe diameter; β = 0 for a restriction drawing from open air.
 */
export function orificeExpansibility(pressureRatio: number, beta = 0, kappa = GAMMA_AIR): number {
  return 1 - (0.351 + 0.256 * beta ** 4 + 0.93 * beta ** 8) * (1 - Math.pow(pressureRatio, 1 / kappa));
}

/**
 * Expansibility of a nozzle or venturi, ISO 5167-3:2003 and ISO 5167-4 (the isentropic formula):
 * ε = √[ κτ^(2/κ)/(κ−1) · (1−β⁴)/(1−β⁴τ^(2/κ)) · (1−τ^((κ−1)/κ))/(1−τ) ], τ = p₂/p₁; ε = 1 at τ = 1.
 */
export function nozzleExpansibility(pressureRatio: number, beta = 0, kappa = GAMMA_AIR): number {
  const tau = pressureRatio;
  if (tau >= 1) return 1;
  const t2k = Math.pow(tau, 2 / kappa);
  return Math.sqrt(((kappa * t2k) / (kappa - 1)) * ((1 - beta ** 4) / (1 - beta ** 4 * t2k)) * ((1 - Math.pow(tau, (kappa - 1) / kappa)) / (1 - tau)));
}

/** Engine air demand, m³/s: V_d N η_v / (revolutions per cycle); N in rev/s. */
export function engineAirDemand(displacementM3: number, speedRevPerS: number, volumetricEfficiency: number, revolutionsPerCycle: 1 | 2): number {
  return (displacementM3 * speedRevPerS * volumetricEfficiency) / revolutionsPerCycle;
}
