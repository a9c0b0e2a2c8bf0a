/*
 * Share links: a calculator's whole form in a readable query string.
 *
 *   /calculators/air-density?temperature=20~degC&pressure=1013.25~hPa&relativeHumidity=50~pct&method=cipm2007&units=si
 *
 *   name=text~unit   a quantity input: the text as typed, "~", the unit token
 *   name=text        a quantity with no unit (a ratio, a fraction); in a hand-written link, a
 *                    quantity that needs a unit takes the input's default for the link's system
 *   name=a_b_c~unit  an input that takes a list of readings: the readings as typed, joined by
 *                    "_" (readingsA=248.8_250_251.2~cfm); a hand-written link may separate
 *                    them with commas or spaces too
 *   name=choice      an option input
 *   pick.group=name  the chosen member of a one-of group, written only when the values do not
 *                    already show it (the first member given, else the group's first member)
 *   units=si|us      the unit system of the switch
 *   out.name=unit    an output's unit, written only where it differs from the system's default
 *                    (outputUnitOf: the shop's unit in SI, e.g. °C rather than K)
 *
 * Unit tokens are the engine's unit names with "^" and brackets dropped, "/" written "_per_", "%"
 * written "pct" and a space (a product) written ".", so a link needs no percent-encoding:
 * m^3/s → m3_per_s, kg/m^3 → kg_per_m3, % → pct, g/(kW h) → g_per_kW.h.
 * Empty inputs and the hidden members of one-of groups are left out. Reserved names ("units" and
 * names with a dot) cannot clash with the engine's input names, which are plain identifiers.
 */
import type { CalculatorSummary } from '../../../shared/airflow';
import { type FormState, blankState, defaultUnitOf, isGiven, outputUnitOf } from './form-state';
import { splitReadings } from './typed-numbers';
import { type UnitSystem, isUnitSystem } from './unit-system';

export type ShareParams = Record<string, string>;

/** Between the readings of a list input in a link. */
const readingsSeparator = '_';

export function unitToken(unit: string): string {
  return unit.replace(/%/g, 'pct').replace(/\^/g, '').replace(/\//g, '_per_').replace(/[()]/g, '').replace(/ /g, '.');
}

/** A token back to one of the units offered (a raw engine unit name is accepted too). */
function unitFromToken(token: string, units: readonly string[]): string {
  return units.find((unit) => unitToken(unit) === token) ?? units.find((unit) => unit === token) ?? token;
}

export function encodeShareLink(summary: CalculatorSummary, state: FormState, system: UnitSystem): ShareParams {
  const params: ShareParams = {};
  for (const input of summary.inputs) {
    if (!isGiven(input, state.picks)) continue;
    if (input.kind === 'option') {
      const choice = state.options[input.name] ?? '';
      if (choice !== '') params[input.name] = choice;
      continue;
    }
    const entry = state.quantities[input.name];
    const typed = entry?.text.trim() ?? '';
    if (entry === undefined || typed === '') continue;
    // "_" needs no percent-encoding, where a space would be written "%20" or "+".
    const text = input.list === undefined ? typed : splitReadings(typed).join(readingsSeparator);
    params[input.name] = entry.unit === '' ? text : `${text}~${unitToken(entry.unit)}`;
  }
  for (const group of summary.groups) {
    const picked = state.picks[group.id];
    if (picked !== undefined && picked !== impliedPick(group.inputs, params)) params[`pick.${group.id}`] = picked;
  }
  params['units'] = system;
  for (const output of summary.outputs) {
    const unit = state.outputUnits[output.name];
    if (unit !== undefined && unit !== outputUnitOf(output, system)) params[`out.${output.name}`] = unitToken(unit);
  }
  return params;
}

/** The member a link shows without a pick: the first one with a value, else the first of the group. */
function impliedPick(members: readonly string[], params: Readonly<Record<string, unknown>>): string | undefined {
  return members.find((name) => params[name] !== undefined) ?? members[0];
}

export interface OpenedLink {
  readonly state: FormState;
  readonly system: UnitSystem;
}

/**
 * The form a link describes, starting from an empty form; undefined when the query says nothing
 * about this calculator (then the page opens on the example).
 */
export function decodeShareLink(
  summary: CalculatorSummary,
  query: Readonly<Record<string, unknown>>,
  fallbackSystem: UnitSystem,
): OpenedLink | undefined {
  const params: Record<string, string> = {};
  for (const [key, value] of Object.entries(query)) {
    const first = Array.isArray(value) ? value[0] : value;
    if (typeof first === 'string') params[key] = first;
  }
  const systemParam = params['units'];
  const system = isUnitSystem(systemParam) ? systemParam : fallbackSystem;
  const state = blankState(summary, system);
  let recognised = systemParam !== undefined;

  for (const input of summary.inputs) {
    const raw = params[input.name];
    if (raw === undefined) continue;
    recognised = true;
    if (input.kind === 'option') {
      state.options[input.name] = raw;
      continue;
    }
    const units = input.units ?? [];
    const cut = raw.lastIndexOf('~');
    const typed = (cut < 0 ? raw : raw.slice(0, cut)).trim();
    const text = input.list === undefined ? typed : typed.split(readingsSeparator).join(' ').trim();
    const unit = cut < 0 ? (units.includes('') ? '' : defaultUnitOf(input, system)) : unitFromToken(raw.slice(cut + 1), units);
    state.quantities[input.name] = { text, unit };
  }
  for (const group of summary.groups) {
    const picked = params[`pick.${group.id}`];
    if (picked !== undefined) recognised = true;
    const chosen = picked !== undefined && group.inputs.includes(picked) ? picked : impliedPick(group.inputs, params);
    if (chosen !== undefined) state.picks[group.id] = chosen;
  }
  for (const output of summary.outputs) {
    const token = params[`out.${output.name}`];
    if (token === undefined) continue;
    recognised = true;
    state.outputUnits[output.name] = unitFromToken(token, output.units);
  }
  return recognised ? { state, system } : undefined;
}
