/*
 * Flow through a restriction, incompressible: Q = C_d A √(2 Δp / ρ) (the ISO 5167-1 orifice
 * equation with expansibility ε = 1 and the velocity-of-approach factor folded into C_d), and
 * its consequence, square-root scaling with pressure drop for the same restriction.
 */

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

/** Engine air demand, m³/s: V_d N η_v / (revolutions per cycle); N in rev/s. */
export function engineAirDemand(displacementM3: number, speedRevPerS: number, volumetricEfficiency: number, revolutionsPerCycle: 1 | 2): number {
  return (displacementM3 * speedRevPerS * volumetricEfficiency) / revolutionsPerCycle;
}
