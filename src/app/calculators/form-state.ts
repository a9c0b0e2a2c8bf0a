/*
 * A calculator form's state as plain data, and what can be done with it without Angular:
 * fill it from the example, move it to the other unit system, and turn it into an engine request
 * and back into messages per field. The typed FormGroup (calculator-form.ts) holds this shape.
 */
import {
  type CalculationRequest,
  type CalculationResult,
  type CalculatorSummary,
  type FieldError,
  type InputSummary,
  type InputValue,
  type OutputSummary,
  DEFAULT_UNITS,
  convert,
  evaluate,
} from '../../../shared/airflow';
import { formatTyped, parseReadings, parseTyped, readingsProblem, splitReadings, typingProblem } from './typed-numbers';
import { type UnitSystem, isUsCustomary } from './unit-system';

/**
 * A quantity as typed: the text is kept as is, so nothing the reader typed is ever lost. An
 * input that takes a list of readings (`InputSummary.list`) keeps them all in one text.
 */
export interface QuantityEntry {
  text: string;
  unit: string;
}

export interface FormState {
  /** Every numeric input, by name. */
  quantities: Record<string, QuantityEntry>;
  /** Every option input, by name; '' when none is chosen. */
  options: Record<string, string>;
  /** Per one-of group, the member the reader gives. */
  picks: Record<string, string>;
  /** Every output's unit, by name. */
  outputUnits: Record<string, string>;
}

/** What a form state gives: a result, or the messages that stand in its way. */
export interface Evaluation {
  readonly result?: CalculationResult;
  /** Input name (or `outputUnits.<name>`) → the message to show beside it. */
  readonly fieldErrors: ReadonlyMap<string, string>;
  /** Every message, in the engine's order, for the summary in place of the results. */
  readonly messages: readonly string[];
}

/** Whether an input is on screen and sent: a one-of member only when it is the picked one. */
export function isGiven(input: InputSummary, picks: Record<string, string>): boolean {
  return input.group === undefined || picks[input.group] === input.name;
}

/** The unit a quantity input starts in for a unit system. */
export function defaultUnitOf(input: InputSummary, system: UnitSystem): string {
  return input.defaultUnit?.[system] ?? input.units?.[0] ?? '';
}

/**
 * The unit an output is shown in for a unit system. In SI that is the shop's unit for the kind
 * (°C, kPa, L/s, g/s), not the engine's base unit (K, Pa, m³/s, kg/s) it computes in.
 */
export function outputUnitOf(output: OutputSummary, system: UnitSystem): string {
  return system === 'si' ? DEFAULT_UNITS[output.kind].si : output.defaultUnit.us;
}

/** Everything empty, units from the system, options at their defaults. */
export function blankState(summary: CalculatorSummary, system: UnitSystem): FormState {
  const state: FormState = { quantities: {}, options: {}, picks: {}, outputUnits: {} };
  for (const input of summary.inputs) {
    if (input.kind === 'option') {
      state.options[input.name] = typeof input.default === 'string' ? input.default : '';
    } else {
      state.quantities[input.name] = { text: '', unit: defaultUnitOf(input, system) };
    }
  }
  for (const group of summary.groups) state.picks[group.id] = group.inputs[0] ?? '';
  for (const output of summary.outputs) state.outputUnits[output.name] = outputUnitOf(output, system);
  return state;
}

/**
 * The calculator's worked example. In SI an input's own SI example comes first (70 kPa, as
 * written); otherwise values keep the units the example was written in when those belong to the
 * chosen system (a barometer read in inHg stays 29.92 inHg in US units), and a value in the other
 * system's units is converted to the input's default unit.
 */
export function exampleState(summary: CalculatorSummary, system: UnitSystem): FormState {
  const state = blankState(summary, system);
  for (const input of summary.inputs) {
    const example = exampleFor(input, system);
    if (example === undefined) continue;
    if (input.kind === 'option') {
      if (typeof example === 'string') state.options[input.name] = example;
      continue;
    }
    const given = exampleQuantity(input, example);
    if (given !== undefined) state.quantities[input.name] = inSystem(input, given, system);
  }
  for (const group of summary.groups) {
    const first = group.inputs.find((name) => summary.inputs.some((i) => i.name === name && exampleFor(i, system) !== undefined));
    if (first !== undefined) state.picks[group.id] = first;
  }
  return state;
}

/** The example an input shows in a unit system: its SI example in SI, where it has one. */
function exampleFor(input: InputSummary, system: UnitSystem): InputValue | undefined {
  return system === 'si' ? (input.exampleSi ?? input.example) : input.example;
}

/**
 * A lesson's preset (the example with the author's values over it) as a form: every value in the
 * unit the author wrote it in, since the lesson's text talks about those very figures; outputs in
 * the reader's unit system.
 */
export function presetState(summary: CalculatorSummary, inputs: Readonly<Record<string, InputValue>>, system: UnitSystem): FormState {
  const state = blankState(summary, system);
  for (const input of summary.inputs) {
    const given = inputs[input.name];
    if (given === undefined) continue;
    if (input.kind === 'option') {
      if (typeof given === 'string') state.options[input.name] = given;
      continue;
    }
    const quantity = exampleQuantity(input, given);
    if (quantity !== undefined) state.quantities[input.name] = { text: quantity.values.map(String).join(' '), unit: quantity.unit };
  }
  for (const group of summary.groups) {
    const first = group.inputs.find((name) => inputs[name] !== undefined);
    if (first !== undefined) state.picks[group.id] = first;
  }
  return state;
}

/** An example or preset as readings in one unit: a single value is a list of one. */
function exampleQuantity(input: InputSummary, example: InputValue): { values: number[]; unit: string } | undefined {
  if (typeof example === 'number') return { values: [example], unit: input.kind === 'percent' ? '%' : '' };
  if (typeof example !== 'object') return undefined;
  return 'values' in example ? example : { values: [example.value], unit: example.unit };
}

function inSystem(input: InputSummary, given: { values: number[]; unit: string }, system: UnitSystem): QuantityEntry {
  const target = defaultUnitOf(input, system);
  const otherSystem = system === 'si' ? isUsCustomary(given.unit) : !isUsCustomary(given.unit);
  const neutral = input.defaultUnit === undefined || input.defaultUnit.si === input.defaultUnit.us;
  const asWritten = { text: given.values.map(String).join(' '), unit: given.unit };
  if (neutral || !otherSystem || given.unit === target) return asWritten;
  const converted = given.values.map((value) => convertQuantity(input, value, given.unit, target));
  return converted.some((value) => value === undefined)
    ? asWritten
    : { text: converted.map((value) => formatTyped(value!)).join(' '), unit: target };
}

/**
 * The US/SI switch: every quantity moves to its default unit for the system with its value
 * converted, so the physical quantity stays the same; every output moves to the system's unit.
 * Text that is not a number keeps its characters.
 */
export function convertToSystem(summary: CalculatorSummary, state: FormState, system: UnitSystem): FormState {
  const quantities: Record<string, QuantityEntry> = {};
  for (const input of summary.inputs) {
    const entry = state.quantities[input.name];
    if (entry === undefined) continue;
    const target = defaultUnitOf(input, system);
    if (input.list !== undefined) {
      quantities[input.name] = readingsToUnit(input, entry, target);
      continue;
    }
    const value = parseTyped(entry.text);
    if (value === undefined || entry.unit === target) {
      quantities[input.name] = value === undefined ? { text: entry.text, unit: target } : entry;
      continue;
    }
    const converted = convertQuantity(input, value, entry.unit, target);
    quantities[input.name] = converted === undefined ? entry : { text: formatTyped(converted), unit: target };
  }
  const outputUnits: Record<string, string> = {};
  for (const output of summary.outputs) outputUnits[output.name] = outputUnitOf(output, system);
  return { ...state, quantities, outputUnits };
}

/**
 * Readings moved to another unit one by one, like single values; a piece that is not a number
 * stays as typed between them. Text with no number at all keeps its characters and takes the
 * new unit, as a single value does.
 */
function readingsToUnit(input: InputSummary, entry: QuantityEntry, target: string): QuantityEntry {
  if (entry.unit === target) return entry;
  const pieces = splitReadings(entry.text);
  const values = pieces.map(parseTyped);
  if (values.every((value) => value === undefined)) return { text: entry.text, unit: target };
  const moved: string[] = [];
  for (const [i, piece] of pieces.entries()) {
    const value = values[i];
    const converted = value === undefined ? undefined : convertQuantity(input, value, entry.unit, target);
    if (value !== undefined && converted === undefined) return entry;
    moved.push(converted === undefined ? piece : formatTyped(converted));
  }
  return { text: moved.join(' '), unit: target };
}

/** The engine's `convert`, read as an interval for temperature differences (1 K = 1.8 °F, no offset). */
function convertQuantity(input: InputSummary, value: number, from: string, to: string): number | undefined {
  try {
    return input.kind === 'temperatureDifference'
      ? convert(value, from, to) - convert(0, from, to)
      : convert(value, from, to);
  } catch {
    return undefined;
  }
}

/**
 * The engine request for a state: every given input, and the output units that differ from the
 * engine's own (so no needless "express in the units asked for" step). Text that is not a number
 * is left out of the request and reported against its field instead.
 */
export function toRequest(summary: CalculatorSummary, state: FormState): { request: CalculationRequest; errors: FieldError[] } {
  const inputs: Record<string, InputValue> = {};
  const errors: FieldError[] = [];
  for (const input of summary.inputs) {
    if (!isGiven(input, state.picks)) continue;
    if (input.kind === 'option') {
      const choice = state.options[input.name] ?? '';
      if (choice !== '') inputs[input.name] = choice;
      continue;
    }
    const entry = state.quantities[input.name];
    if (entry === undefined || entry.text.trim() === '') continue;
    if (input.list !== undefined) {
      const values = parseReadings(entry.text);
      if (values === undefined) errors.push({ field: input.name, message: readingsProblem(input.label, entry.text) });
      else inputs[input.name] = { values, unit: entry.unit };
      continue;
    }
    const value = parseTyped(entry.text);
    if (value === undefined) errors.push({ field: input.name, message: typingProblem(input.label, entry.text) });
    else inputs[input.name] = { value, unit: entry.unit };
  }
  const outputUnits: Record<string, string> = {};
  for (const output of summary.outputs) {
    const unit = state.outputUnits[output.name];
    if (unit !== undefined && unit !== output.defaultUnit.si) outputUnits[output.name] = unit;
  }
  return { request: { inputs, outputUnits }, errors };
}

/** Runs the engine in the browser and files every message under the field it names. */
export function calculate(summary: CalculatorSummary, state: FormState): Evaluation {
  const { request, errors } = toRequest(summary, state);
  const outcome = evaluate(summary.id, request);
  const all = outcome.ok ? errors : [...errors, ...outcome.errors];
  if (outcome.ok && all.length === 0) return { result: outcome.result, fieldErrors: new Map(), messages: [] };
  const fieldErrors = new Map<string, string>();
  const messages: string[] = [];
  for (const error of all) {
    const field = fieldShowing(summary, state, error.field);
    if (field !== undefined && fieldErrors.has(field)) continue;
    if (field !== undefined) fieldErrors.set(field, error.message);
    if (!messages.includes(error.message)) messages.push(error.message);
  }
  return { fieldErrors, messages };
}

/** Where a message goes: its input, or the picked member when it names a hidden one of a group. */
function fieldShowing(summary: CalculatorSummary, state: FormState, field: string): string | undefined {
  if (field.startsWith('outputUnits.')) return field;
  const input = summary.inputs.find((i) => i.name === field);
  if (input === undefined) return undefined;
  return isGiven(input, state.picks) || input.group === undefined ? input.name : state.picks[input.group];
}
