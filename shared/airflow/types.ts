/* The engine's public shapes: requests, results and the JSON catalogue the UI builds forms from. */

/** What a numeric input measures; the kind fixes the compatible units. */
export type QuantityKind =
  | 'pressure'
  | 'temperature'
  /** A temperature interval (an uncertainty, a rise): 1 degC = 1 K, no 273.15 offset. */
  | 'temperatureDifference'
  | 'length'
  | 'volume'
  | 'volumeFlow'
  | 'massFlow'
  | 'density'
  | 'velocity'
  /** Rotational speed (engine speed), rpm. */
  | 'speed'
  /** A cross-section or flow area, m^2. */
  | 'area'
  /** Engine power, W. */
  | 'power'
  /** Brake specific fuel consumption: fuel mass per unit of work, kg/J. */
  | 'specificFuelConsumption'
  | 'ratio'
  | 'percent';

export type InputKind = QuantityKind | 'option';

export type Topic =
  | 'Pressure'
  | 'Flow'
  | 'Air density'
  | 'Mass flow'
  | 'Forced induction'
  | 'Sensors and uncertainty';

/** Readings of one quantity in one unit, for an input that takes a list (e.g. repeat runs). */
export interface ListValue {
  values: number[];
  unit: string;
}

/**
 * An input as sent: `{ value, unit }` for a quantity; `{ values, unit }` for an input that takes
 * a list of readings (`InputSummary.list`); a bare number only for dimensionless inputs (kinds
 * 'ratio' and 'percent'), read in the input's default unit (`%` for percent inputs, a plain
 * number for ratios); a string only for option inputs.
 */
export type InputValue = { value: number; unit: string } | ListValue | number | string;

export interface CalculationRequest {
  inputs: Record<string, InputValue>;
  /** Per output name, the unit wanted; outputs default to SI (Pa, K, kg/m^3, m^3/s, kg/s…). */
  outputUnits?: Record<string, string>;
}

export interface QuantityOut {
  value: number;
  unit: string;
}

/** One worked step; all three strings are LaTeX (KaTeX subset). */
export interface Step {
  title: string;
  formula: string;
  substituted: string;
  result: string;
}

/** `field` names the input (or `outputUnits.<name>`, or `id`); '' means the whole calculation. */
export interface FieldError {
  field: string;
  message: string;
}

export interface CalculationResult {
  id: string;
  outputs: Record<string, QuantityOut>;
  steps: Step[];
  warnings: FieldError[];
  /**
   * Plain-language conclusions and caveats shown with the outputs, e.g. "A gain of 4.0 ± 2.7 cfm
   * is shown (95 % confidence)." Plain text, no LaTeX; always present, often empty.
   */
  notes: string[];
}

export type CalculationOutcome =
  | { ok: true; result: CalculationResult }
  | { ok: false; errors: FieldError[] };

export interface UnitPair {
  si: string;
  us: string;
}

/** A range limit with its unit; `inclusive: false` means the limit itself is refused. */
export interface Bound {
  value: number;
  unit: string;
  inclusive: boolean;
}

export interface OptionChoice {
  value: string;
  label: string;
  help?: string;
}

export interface InputSummary {
  name: string;
  label: string;
  /** LaTeX symbol used in the worked steps. */
  symbol: string;
  kind: InputKind;
  help: string;
  optional: boolean;
  /** Id of the one-of group this input belongs to, if any. */
  group?: string;
  units?: string[];
  defaultUnit?: UnitPair;
  min?: Bound;
  max?: Bound;
  /**
   * Present when the input takes a list of readings (`{ values, unit }`): how many it needs.
   * `min`/`max` then bound each reading.
   */
  list?: { min: number; max: number };
  /** Value for "reset to example", and what lessons and the API's example request use. */
  example?: InputValue;
  /**
   * The example in SI for a form in SI units: a round figure of its own (70 kPa, not 10 psi
   * converted to 68.9476 kPa). Absent when `example` already reads well in SI.
   */
  exampleSi?: InputValue;
  /** Value used when an optional input is left empty. */
  default?: InputValue;
  options?: OptionChoice[];
}

/** Inputs of which at most one may be given (exactly one when `required`). */
export interface InputGroup {
  id: string;
  label: string;
  inputs: string[];
  required: boolean;
}

export interface OutputSummary {
  name: string;
  label: string;
  symbol: string;
  kind: QuantityKind;
  /** `si` is the unit `evaluate` returns when no output unit is asked for. */
  defaultUnit: UnitPair;
  units: string[];
  help?: string;
}

export interface CalculatorSummary {
  id: string;
  title: string;
  topic: Topic;
  summary: string;
  hazard?: string;
  inputs: InputSummary[];
  groups: InputGroup[];
  outputs: OutputSummary[];
}
