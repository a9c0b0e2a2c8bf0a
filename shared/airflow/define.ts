/*
 * The declarative shape of a calculator: inputs, outputs, one-of groups and a compute function
 * that works in SI and records its worked steps. `evaluate.ts` runs a definition; `toSummary`
 * turns it into the JSON catalogue entry the UI builds its form from.
 */
import type {
  Bound,
  CalculatorSummary,
  InputGroup,
  InputKind,
  InputValue,
  OptionChoice,
  QuantityKind,
  Topic,
  UnitPair,
} from './types';
import { DEFAULT_UNITS, SI_UNIT, UNITS_BY_KIND } from './units';

export interface InputSpec {
  label: string;
  /** LaTeX symbol used in the steps, e.g. `\Delta p`. */
  symbol: string;
  kind: InputKind;
  help: string;
  /** Override of the kind's unit list for pickers. */
  units?: readonly string[];
  /** Override of the kind's form default units. */
  defaultUnit?: UnitPair;
  /** Limits of the value; for a list input, of each reading. */
  min?: Bound;
  max?: Bound;
  /**
   * The input takes a list of readings of one quantity in one unit (`{ values, unit }`), at
   * least `min` and at most `max` of them. Read it with `ctx.values(name)`.
   */
  list?: { min: number; max: number };
  /** The worked example, mostly in US units; lessons, the API and the US form use it. */
  example?: InputValue;
  /**
   * The worked example for a form in SI units, a round figure of its own rather than `example`
   * converted. Leave it out when `example` is unit-neutral or already reads well in SI.
   */
  exampleSi?: InputValue;
  /** Used when the input is optional and left empty. */
  default?: InputValue;
  options?: readonly OptionChoice[];
  optional?: boolean;
  group?: string;
}

export interface OutputSpec {
  label: string;
  symbol: string;
  kind: QuantityKind;
  help?: string;
  /** US customary display unit (the SI default is the kind's SI unit). */
  us: string;
}

/** What a compute function sees: SI numbers, option strings, and a step/warning recorder. */
export interface ComputeContext<I extends string> {
  /** The SI value (a percent as a fraction), or the input's default when it was left empty. */
  value(name: I): number;
  /** The readings of a list input in SI (a fresh array), or its default when it was left empty. */
  values(name: I): number[];
  /** The chosen option (or its default). */
  option(name: I): string;
  /** Whether the user supplied the input. */
  has(name: I): boolean;
  /** The input as the user gave it, as LaTeX (`2\,\mathrm{in}`). */
  given(name: I): string;
  /** The unit the user gave the input in, as sent (`cfm`); '' when it was left empty. */
  unit(name: I): string;
  step(title: string, formula: string, substituted: string, result: string): void;
  warn(field: string, message: string): void;
  /** Adds a plain-language conclusion or caveat (plain text, no LaTeX) to the result's notes. */
  note(text: string): void;
  /** Refuses the request with an error naming the field (stops the computation). */
  fail(field: string, message: string): never;
}

export interface CalculatorDefinition<I extends string = string, O extends string = string> {
  id: string;
  title: string;
  topic: Topic;
  summary: string;
  hazard?: string;
  inputs: { readonly [K in I]: InputSpec };
  groups?: readonly (InputGroup & { inputs: NoInfer<I>[] })[];
  outputs: { readonly [K in O]: OutputSpec };
  /** Works in SI; returns the outputs it could compute (an output may be left out). */
  compute(ctx: ComputeContext<I>): Partial<Record<O, number>>;
}

/** Identity helper that gives a definition its input/output name types. */
export function defineCalculator<I extends string, O extends string>(
  definition: CalculatorDefinition<I, O>,
): CalculatorDefinition<I, O> {
  return definition;
}

/** The SI default unit an output is returned in: `%` for percent outputs. */
export function outputSIUnit(kind: QuantityKind): string {
  return kind === 'percent' ? '%' : SI_UNIT[kind];
}

/** A bound in an input's default SI unit. */
export function bound(value: number, unit: string, inclusive = true): Bound {
  return { value, unit, inclusive };
}

/** The bound most inputs of each kind share: absolute pressure and temperature above zero. */
export const ABOVE_ZERO_PA = bound(0, 'Pa', false);
export const ABOVE_ZERO_K = bound(0, 'K', false);

/** The JSON-serialisable catalogue entry of a definition. */
export function toSummary(def: CalculatorDefinition): CalculatorSummary {
  const inputs = Object.entries<InputSpec>(def.inputs).map(([name, spec]) => {
    const numeric = spec.kind !== 'option';
    return {
      name,
      label: spec.label,
      symbol: spec.symbol,
      kind: spec.kind,
      help: spec.help,
      optional: spec.optional === true || spec.group !== undefined,
      ...(spec.group === undefined ? {} : { group: spec.group }),
      ...(numeric ? { units: [...(spec.units ?? UNITS_BY_KIND[spec.kind as QuantityKind])] } : {}),
      ...(numeric ? { defaultUnit: spec.defaultUnit ?? DEFAULT_UNITS[spec.kind as QuantityKind] } : {}),
      ...(spec.min === undefined ? {} : { min: spec.min }),
      ...(spec.max === undefined ? {} : { max: spec.max }),
      ...(spec.list === undefined ? {} : { list: { ...spec.list } }),
      ...(spec.example === undefined ? {} : { example: spec.example }),
      ...(spec.exampleSi === undefined ? {} : { exampleSi: spec.exampleSi }),
      ...(spec.default === undefined ? {} : { default: spec.default }),
      ...(spec.options === undefined ? {} : { options: spec.options.map((o) => ({ ...o })) }),
    };
  });
  const outputs = Object.entries<OutputSpec>(def.outputs).map(([name, spec]) => ({
    name,
    label: spec.label,
    symbol: spec.symbol,
    kind: spec.kind,
    defaultUnit: { si: outputSIUnit(spec.kind), us: spec.us },
    units: [...UNITS_BY_KIND[spec.kind]],
    ...(spec.help === undefined ? {} : { help: spec.help }),
  }));
  return {
    id: def.id,
    title: def.title,
    topic: def.topic,
    summary: def.summary,
    ...(def.hazard === undefined ? {} : { hazard: def.hazard }),
    inputs,
    groups: (def.groups ?? []).map((g) => ({ ...g, inputs: [...g.inputs] })),
    outputs,
  };
}

/**
 * The example request: every `example` (never `exampleSi`, so lessons' result lines and the API
 * keep their figures), one member per one-of group.
 */
export function exampleInputs(def: CalculatorDefinition): Record<string, InputValue> {
  const inputs: Record<string, InputValue> = {};
  const groupsUsed = new Set<string>();
  for (const [name, spec] of Object.entries<InputSpec>(def.inputs)) {
    if (spec.example === undefined) continue;
    if (spec.group !== undefined) {
      if (groupsUsed.has(spec.group)) continue;
      groupsUsed.add(spec.group);
    }
    inputs[name] = spec.example;
  }
  return inputs;
}
