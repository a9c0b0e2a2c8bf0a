/* Reading one raw input: shape, number, unit, dimension. Every refusal is a message naming the input. */
import type { InputSpec } from './define';
import { qty } from './latex';
import type { QuantityKind } from './types';
import { dimensionsOf, type LinearUnit, parseUnit, SI_UNIT, toSI, UNITS_BY_KIND } from './units';

export interface Given {
  /** SI number, or the option string. */
  value: number | string;
  tex: string;
  /** Present when a conversion to SI took place. */
  conversion?: { unit: LinearUnit; raw: number };
}

export const isRecord = (x: unknown): x is Record<string, unknown> =>
  typeof x === 'object' && x !== null && !Array.isArray(x);

/** Reads one raw input; returns an error message string or the SI value. */
export function readInput(spec: InputSpec, raw: unknown): Given | string {
  if (spec.kind === 'option') {
    const choices = (spec.options ?? []).map((o) => o.value);
    if (typeof raw !== 'string' || !choices.includes(raw)) {
      return `${spec.label}: choose one of ${choices.map((c) => `"${c}"`).join(', ')}.`;
    }
    return { value: raw, tex: `\\text{${raw}}` };
  }
  const kind = spec.kind;
  const dimensionless = kind === 'ratio' || kind === 'percent';
  let value: unknown;
  let unitText: unknown;
  if (typeof raw === 'number') {
    if (!dimensionless) {
      return `${spec.label} needs a unit, e.g. { "value": ${raw}, "unit": "${(spec.defaultUnit ?? { si: SI_UNIT[kind] }).si}" }.`;
    }
    value = raw;
    unitText = kind === 'percent' ? '%' : '';
  } else if (isRecord(raw)) {
    value = raw['value'];
    unitText = raw['unit'] ?? (dimensionless ? (kind === 'percent' ? '%' : '') : undefined);
  } else {
    return `${spec.label} must be a number with a unit, e.g. { "value": 1, "unit": "${SI_UNIT[kind] || '%'}" }.`;
  }
  if (typeof value !== 'number' || !Number.isFinite(value)) return `${spec.label} must be a finite number.`;
  if (typeof unitText !== 'string') return `${spec.label} needs a unit (one of ${unitList(kind)}).`;
  const unit = parseUnit(unitText);
  if (unit === undefined) return `${spec.label}: unknown unit "${unitText}"${unitHint(unitText)}. Use one of ${unitList(kind)}.`;
  if (unit.dimensions !== dimensionsOf(kind)) {
    return `${spec.label}: "${unitText}" is not a unit of ${kindName(kind)}. Use one of ${unitList(kind)}.`;
  }
  const si = toSI(value, unit, kind);
  if (!Number.isFinite(si)) return `${spec.label} must be a finite number.`;
  const tex = qty(value, unitText, 8);
  const isSI = unit.offset === 0 && unit.scale === 1;
  return isSI ? { value: si, tex } : { value: si, tex, conversion: { unit, raw: value } };
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

