/* SI or US customary: which of an input's two default units the form uses. */

export type UnitSystem = 'si' | 'us';

export function isUnitSystem(value: unknown): value is UnitSystem {
  return value === 'si' || value === 'us';
}

// The US customary units among the engine's unit lists (NIST SP 811 names them "inch-pound").
// Everything else (Pa, bar, °C, L/s, atm, mmHg…) counts as SI or metric for the switch.
const usCustomaryUnits: ReadonlySet<string> = new Set([
  'psi', 'inHg', 'inHg_60F', 'inH2O', 'inH2O_39F', 'inH2O_60F',
  'degF', 'degR',
  'in', 'ft', 'in^3', 'ft^3', 'gal',
  'cfm', 'ft^3/s', 'gal/min',
  'lb/s', 'lb/min', 'lb/h', 'lb/ft^3', 'lb/in^3',
  'ft/s', 'ft/min',
]);

export function isUsCustomary(unit: string): boolean {
  return usCustomaryUnits.has(unit);
}
