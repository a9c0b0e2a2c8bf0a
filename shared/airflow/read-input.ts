/* Reading one raw input: shape, number, unit, dimension. Every refusal is a message naming the input. */
import type { InputSpec } from './define';
import { listTex, qty } from './latex';
import type { InputValue, ListValue, QuantityKind } from './types';
import { dimensionsOf, type LinearUnit, parseUnit, SI_UNIT, toSI, UNITS_BY_KIND } from './units';

export interface Given {
  /** SI number, the SI readings of a list input, or the option string. */
  value: number | string | readonly number[];
  tex: string;
  /** The unit as sent ('' for a bare number or an option). */
  unit: string;
  /** Present when a conversion to SI took place. */
  conversion?: { unit: LinearUnit; raw: number | readonly number[] };
}

export const isRecord = (x: unknown): x is Record<string, unknown> =>
  typeof x === 'object' && x !== null && !Array.isArray(x);

/** Whether an input value is a list of readings (`{ values, unit }`). */
export function isListValue(value: InputValue | undefined): value is ListValue {
  return typeof value === 'object' && value !== null && Array.isArray((value as { values?: unknown }).values);
}

/** Reads one raw input; returns an error message string or the SI value. */
export function readInput(spec: InputSpec, raw: unknown): Given | string {
  if (spec.kind === 'option') {
    const choices = (spec.options ?? []).map((o) => o.value);
    if (typeof raw !== 'string' || !choices.includes(raw)) {
      return `${spec.label}: choose one of ${choices.map((c) => `"${c}"`).join(', ')}.`;
    }
    return { value: raw, tex: `\\text{${raw}}`, unit: '' };
  }
  if (spec.list !== undefined) return readList(spec, spec.kind, spec.list, raw);
  const kind = spec.kind;
  const dimensionless = kind === 'ratio' || kind === 'percent';
  let value: unknown;
  let unitText: unknown;
  if (typeof raw === 'number') {
    if (!dimensionless) {
      return `${spec.label} needs a unit, e.g. { "value": ${raw}, "unit": "${(spec.defaultUnit ?? { si: SI_UNIT[kind] }).si}" }.`;
    }
    value = raw;
    unitText = defaultUnitText(kind);
  } else if (isRecord(raw)) {
    if (raw['values'] !== undefined) return `${spec.label} takes one value, not a list of readings.`;
    value = raw['value'];
    unitText = raw['unit'] ?? (dimensionless ? defaultUnitText(kind) : undefined);
  } else {
    return `${spec.label} must be a number with a unit, e.g. { "value": 1, "unit": "${SI_UNIT[kind] || '%'}" }.`;
  }
  if (typeof value !== 'number' || !Number.isFinite(value)) return `${spec.label} must be a finite number.`;
  const unit = readUnit(spec.label, kind, unitText);
  if (typeof unit === 'string') return unit;
  const si = toSI(value, unit, kind);
  if (!Number.isFinite(si)) return `${spec.label} must be a finite number.`;
  const tex = qty(value, unitText as string, 8);
  const isSI = unit.offset === 0 && unit.scale === 1;
  const given = { value: si, tex, unit: unitText as string };
  return isSI ? given : { ...given, conversion: { unit, raw: value } };
}

/** A list input: `{ values: [...], unit }`, a count within the limits, every reading finite. */
function readList(spec: InputSpec, kind: QuantityKind, count: { min: number; max: number }, raw: unknown): Given | string {
  const dimensionless = kind === 'ratio' || kind === 'percent';
  const example = `{ "values": [1, 2, 3], "unit": "${(spec.defaultUnit ?? { si: SI_UNIT[kind] }).si}" }`;
  if (!isRecord(raw) || !Array.isArray(raw['values'])) {
    return `${spec.label} takes a list of ${count.min} to ${count.max} readings in one unit, e.g. ${example}.`;
  }
  const values: unknown[] = raw['values'];
  if (values.length < count.min || values.length > count.max) {
    return `${spec.label} needs ${count.min} to ${count.max} readings; ${values.length} ${values.length === 1 ? 'was' : 'were'} given.`;
  }
  const bad = values.findIndex((v) => typeof v !== 'number' || !Number.isFinite(v));
  if (bad >= 0) return `${spec.label}: reading ${bad + 1} is not a finite number.`;
  const readings = values as number[];
  const unitText = raw['unit'] ?? (dimensionless ? defaultUnitText(kind) : undefined);
  const unit = readUnit(spec.label, kind, unitText);
  if (typeof unit === 'string') return unit;
  const si = readings.map((v) => toSI(v, unit, kind));
  const tooLarge = si.findIndex((v) => !Number.isFinite(v));
  if (tooLarge >= 0) return `${spec.label}: reading ${tooLarge + 1} is not a finite number.`;
  const tex = listTex(readings, unitText as string, 8);
  const isSI = unit.offset === 0 && unit.scale === 1;
  const given = { value: si, tex, unit: unitText as string };
  return isSI ? given : { ...given, conversion: { unit, raw: [...readings] } };
}

function defaultUnitText(kind: QuantityKind): string {
  return kind === 'percent' ? '%' : '';
}

function readUnit(label: string, kind: QuantityKind, unitText: unknown): LinearUnit | string {
  if (typeof unitText !== 'string') return `${label} needs a unit (one of ${unitList(kind)}).`;
  const unit = parseUnit(unitText);
  if (unit === undefined) return `${label}: unknown unit "${unitText}"${unitHint(unitText)}. Use one of ${unitList(kind)}.`;
  if (unit.dimensions !== dimensionsOf(kind)) {
    return `${label}: "${unitText}" is not a unit of ${kindName(kind)}. Use one of ${unitList(kind)}.`;
  }
  return unit;
}

export function unitList(kind: QuantityKind): string {
  return UNITS_BY_KIND[kind].map((u) => (u === '' ? '(none)' : u)).join(', ');
}

function unitHint(unit: string): string {
  const u = unit.trim().toLowerCase();
  if (/^(psi|bar|kpa|inh2o|inhg)[ag]$/.test(u) || u === 'barg' || u === 'bara') {
    return ' (give the plain unit; say gauge or absolute where the calculator asks)';
  }
  if (u === 'scfm') return ' (a standard flow is a flow at a stated condition: use the standard-flow calculator)';
  return '';
}

export function kindName(kind: QuantityKind): string {
  return kind.replace(/[A-Z]/g, (c) => ` ${c.toLowerCase()}`);
}

