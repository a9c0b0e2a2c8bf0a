/*
 * Units: the one configured mathjs instance, the trade's units mathjs lacks, and fast cached
 * conversions. Unit strings follow mathjs syntax (`kPa`, `m^3/s`, `lb/min`, `degF`), plus `%`.
 *
 * Conventions (every factor from NIST SP 811, 2008 edition, Appendix B.8/B.9):
 * - `inH2O` is the CONVENTIONAL inch of water: a 1000 kg/m³ column, 1 in high, under standard
 *   gravity 9.806 65 m/s² = 249.088 91 Pa. The 39.2 °F and 60 °F inches of water are the extra
 *   units `inH2O_39F` and `inH2O_60F`.
 * - `inHg` is the conventional inch of mercury: 13 595.1 kg/m³ (mercury at 0 °C / 32 °F), 1 in,
 *   standard gravity = 3386.389 Pa; `inHg_60F` is mercury at 60 °F.
 * - mathjs rounds `mmHg` and `torr` to 133.322 Pa; both are redefined here to NIST's values.
 * - `rpm` is rev/min taken as 1/min (a revolution counts as 1, not 2π rad) for flow arithmetic.
 * - `%` is read as the registered unit `percent` (0.01); `''` or `'1'` is a plain number.
 * - `scfm` is deliberately NOT a unit: a standard flow is a flow at a stated condition
 *   (see the standard-flow calculator).
 */
import { create, createUnitDependencies, unitDependencies } from 'mathjs';
import type { QuantityKind, UnitPair } from './types';

export { isUsCustomary } from './us-customary';

/** Standard acceleration of gravity, m/s² (NIST SP 811 B.8: g_n = 9.806 65 m/s², exact). */
export const STANDARD_GRAVITY = 9.80665;
const INCH_M = 0.0254; // NIST SP 811 B.8: inch → metre 2.54 E−02 (exact)
const WATER_CONVENTIONAL_KG_M3 = 1000; // conventional water column density, NIST SP 811 footnote
const MERCURY_CONVENTIONAL_KG_M3 = 13595.1; // conventional mercury density (0 °C), NIST SP 811 footnote

/** The single mathjs instance of the engine: only the Unit machinery, no expression parser. */
export const math = create({ unitDependencies, createUnitDependencies });

// Allow '_' inside unit names so the NIST variants read inH2O_39F, inH2O_60F, inHg_60F.
const baseIsValidAlpha = math.Unit.isValidAlpha;
math.Unit.isValidAlpha = (c: string) => baseIsValidAlpha(c) || c === '_';

const TRADE_UNITS: Record<string, string> = {
  // NIST SP 811 B.8: inch of water, conventional (inH2O) → Pa 2.490 889 E+02
  inH2O: `${WATER_CONVENTIONAL_KG_M3 * STANDARD_GRAVITY * INCH_M} Pa`,
  // NIST SP 811 B.8: inch of water (39.2 °F) → Pa 2.490 82 E+02
  inH2O_39F: '249.082 Pa',
  // NIST SP 811 B.8: inch of water (60 °F) → Pa 2.4884 E+02
  inH2O_60F: '248.84 Pa',
  // NIST SP 811 B.8: inch of mercury, conventional (inHg) → Pa 3.386 389 E+03 (32 °F row: 3.386 38 E+03)
  inHg: `${MERCURY_CONVENTIONAL_KG_M3 * STANDARD_GRAVITY * INCH_M} Pa`,
  // NIST SP 811 B.8: inch of mercury (60 °F) → Pa 3.376 85 E+03
  inHg_60F: '3376.85 Pa',
  // NIST SP 811 B.8: millimeter of mercury, conventional (mmHg) → Pa 1.333 224 E+02
  mmHg: `${MERCURY_CONVENTIONAL_KG_M3 * STANDARD_GRAVITY * 0.001} Pa`,
  // NIST SP 811 B.8: torr (Torr) → Pa 1.333 224 E+02 (defined as 101 325/760 Pa)
  torr: `${101325 / 760} Pa`,
  // NIST SP 811 B.8: cubic foot per minute (ft³/min) → m³/s 4.719 474 E−04
  cfm: `${0.028316846592 / 60} m^3/s`,
  // NIST SP 811 B.8: revolution per minute (rpm); one revolution counted as 1 for flow maths
  rpm: '1/min',
  // percent: 1 % = 0.01 (SI Brochure; NIST SP 811 §7.10.2)
  percent: '0.01',
};
const REDEFINED = new Set(['mmHg', 'torr']);
for (const [name, definition] of Object.entries(TRADE_UNITS)) {
  math.createUnit(name, { definition }, { override: REDEFINED.has(name) });
}

/** The SI unit each kind is computed in (percent is computed as a fraction, shown as %). */
export const SI_UNIT: Readonly<Record<QuantityKind, string>> = {
  pressure: 'Pa',
  temperature: 'K',
  temperatureDifference: 'K',
  length: 'm',
  volume: 'm^3',
  volumeFlow: 'm^3/s',
  massFlow: 'kg/s',
  density: 'kg/m^3',
  velocity: 'm/s',
  speed: '1/s',
  area: 'm^2',
  power: 'W',
  specificFuelConsumption: 'kg/J',
  ratio: '',
  percent: '',
};

/** Units offered in unit pickers, per kind (any other compatible mathjs unit is accepted too). */
export const UNITS_BY_KIND: Readonly<Record<QuantityKind, readonly string[]>> = {
  pressure: ['Pa', 'hPa', 'kPa', 'MPa', 'mbar', 'bar', 'psi', 'inHg', 'inHg_60F', 'inH2O',
    'inH2O_39F', 'inH2O_60F', 'mmHg', 'mmH2O', 'cmH2O', 'atm', 'torr'],
  temperature: ['K', 'degC', 'degF', 'degR'],
  temperatureDifference: ['K', 'degC', 'degF', 'degR'],
  length: ['m', 'km', 'cm', 'mm', 'in', 'ft'],
  volume: ['m^3', 'L', 'cm^3', 'in^3', 'ft^3', 'gal'],
  volumeFlow: ['m^3/s', 'm^3/min', 'm^3/h', 'L/s', 'L/min', 'L/h', 'cc/min', 'cfm', 'ft^3/s', 'gal/min'],
  massFlow: ['kg/s', 'kg/min', 'kg/h', 'g/s', 'lb/s', 'lb/min', 'lb/h'],
  // kg/L for liquid fuel (gasoline about 0.745 kg/L); the rest for air.
  density: ['kg/m^3', 'g/L', 'kg/L', 'g/cm^3', 'lb/ft^3', 'lb/in^3'],
  velocity: ['m/s', 'km/h', 'ft/s', 'ft/min'],
  speed: ['rpm', '1/s', 'Hz'],
  area: ['m^2', 'cm^2', 'mm^2', 'in^2', 'ft^2'],
  // hp is the mechanical horsepower, 550 ft·lbf/s (NIST SP 811 B.8: 7.456 999 E+02 W).
  power: ['W', 'kW', 'hp'],
  // Written with a space for the product: g/(kW h) is grams per kilowatt-hour.
  specificFuelConsumption: ['g/(kW h)', 'lb/(hp h)'],
  ratio: ['', '%'],
  percent: ['%', ''],
};

/** Form defaults per kind; a calculator may override them per input. */
export const DEFAULT_UNITS: Readonly<Record<QuantityKind, UnitPair>> = {
  pressure: { si: 'kPa', us: 'psi' },
  temperature: { si: 'degC', us: 'degF' },
  temperatureDifference: { si: 'K', us: 'degF' },
  length: { si: 'mm', us: 'in' },
  volume: { si: 'L', us: 'in^3' },
  volumeFlow: { si: 'L/s', us: 'cfm' },
  massFlow: { si: 'g/s', us: 'lb/min' },
  density: { si: 'kg/m^3', us: 'lb/ft^3' },
  velocity: { si: 'm/s', us: 'ft/s' },
  speed: { si: 'rpm', us: 'rpm' },
  area: { si: 'cm^2', us: 'in^2' },
  power: { si: 'kW', us: 'hp' },
  specificFuelConsumption: { si: 'g/(kW h)', us: 'lb/(hp h)' },
  ratio: { si: '', us: '' },
  percent: { si: '%', us: '%' },
};

/** A unit reduced to a linear map onto SI: si = offset + scale·value (offset only for °C, °F). */
export interface LinearUnit {
  readonly unit: string;
  readonly scale: number;
  readonly offset: number;
  /** mathjs base-dimension exponents, joined: equal strings mean compatible units. */
  readonly dimensions: string;
}

const parsed = new Map<string, LinearUnit | null>();
const DIMENSIONLESS = math.unit(1, 'percent').dimensions.join(',');

/** Parses a unit string once and caches it; returns undefined for an unknown unit. */
export function parseUnit(unit: string): LinearUnit | undefined {
  const cached = parsed.get(unit);
  if (cached !== undefined) return cached ?? undefined;
  const result = parseUncached(unit);
  if (parsed.size < 1000) parsed.set(unit, result);
  return result ?? undefined;
}

function parseUncached(unit: string): LinearUnit | null {
  const name = unit.trim();
  if (name === '' || name === '1') return { unit, scale: 1, offset: 0, dimensions: DIMENSIONLESS };
  // mathjs quietly drops a number inside a unit string ('5 m' parses as m): refuse those.
  const skeleton = name.replace(/\^\s*[-+]?[0-9.]+/g, '').replace(/[A-Za-z_][A-Za-z_0-9]*/g, 'u');
  if (/[0-9]/.test(skeleton.replace(/^\s*1\s*\//, ''))) return null;
  try {
    const mathName = name === '%' ? 'percent' : name;
    const atZero = math.unit(0, mathName).toSI().toNumber();
    const atOne = math.unit(1, mathName).toSI().toNumber();
    const dimensions = math.unit(1, mathName).dimensions.join(',');
    if (!Number.isFinite(atZero) || !Number.isFinite(atOne) || atOne === atZero) return null;
    return { unit, scale: atOne - atZero, offset: atZero, dimensions };
  } catch {
    return null;
  }
}

const kindDimensions = new Map<QuantityKind, string>();
/** The dimension string of a kind, e.g. pressure → that of Pa. */
export function dimensionsOf(kind: QuantityKind): string {
  let d = kindDimensions.get(kind);
  if (d === undefined) {
    d = (parseUnit(SI_UNIT[kind]) as LinearUnit).dimensions;
    kindDimensions.set(kind, d);
  }
  return d;
}

/** Whether a unit string parses and measures the given kind. */
export function isUnitOf(unit: string, kind: QuantityKind): boolean {
  const u = parseUnit(unit);
  return u !== undefined && u.dimensions === dimensionsOf(kind);
}

/** A value in `unit` to SI; a temperature difference ignores the °C/°F offset. */
export function toSI(value: number, unit: LinearUnit, kind?: QuantityKind): number {
  const offset = kind === 'temperatureDifference' ? 0 : unit.offset;
  return offset + unit.scale * value;
}

/** An SI value to `unit`; a temperature difference ignores the °C/°F offset. */
export function fromSI(valueSI: number, unit: LinearUnit, kind?: QuantityKind): number {
  const offset = kind === 'temperatureDifference' ? 0 : unit.offset;
  return (valueSI - offset) / unit.scale;
}

/**
 * Converts an absolute quantity (temperatures included, °C/°F offsets applied) between units.
 * Throws an Error with a readable message for an unknown or incompatible unit.
 */
export function convert(value: number, fromUnit: string, toUnit: string): number {
  const from = parseUnit(fromUnit);
  const to = parseUnit(toUnit);
  if (from === undefined) throw new Error(`Unknown unit "${fromUnit}".`);
  if (to === undefined) throw new Error(`Unknown unit "${toUnit}".`);
  if (from.dimensions !== to.dimensions) {
    throw new Error(`Cannot convert "${fromUnit}" to "${toUnit}": they measure different things.`);
  }
  return fromSI(toSI(value, from), to);
}
