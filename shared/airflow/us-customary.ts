/*
 * Which of the engine's units are US customary. Kept apart from units.ts (which builds the mathjs
 * instance) so the browser's unit-system code can ask without loading mathjs.
 */

// The US customary units among the engine's unit lists (NIST SP 811 calls them "inch-pound").
// Everything else (Pa, bar, °C, L/s, atm, mmHg…) counts as SI or metric: the US/SI switch and
// the SI examples go by this list.
const US_CUSTOMARY_UNITS: ReadonlySet<string> = new Set([
  'psi', 'inHg', 'inHg_60F', 'inH2O', 'inH2O_39F', 'inH2O_60F',
  'degF', 'degR',
  'in', 'ft', 'in^2', 'ft^2', 'in^3', 'ft^3', 'gal',
  'cfm', 'ft^3/s', 'gal/min',
  'lb/s', 'lb/min', 'lb/h', 'lb/ft^3', 'lb/in^3',
  'ft/s', 'ft/min',
  'hp', 'lb/(hp h)',
]);

/** Whether a unit is US customary (psi, inH2O, °F, cfm, lb/min…) rather than SI or metric. */
export function isUsCustomary(unit: string): boolean {
  return US_CUSTOMARY_UNITS.has(unit);
}
