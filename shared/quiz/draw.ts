/*
 * Fresh numbers: each drawn input of a question is a whole number of steps from its `from`,
 * drawn by a seeded generator (pure-rand's xoroshiro128+), rounded to the digits the stem shows,
 * and only then handed to the engine. So the numbers the apprentice reads and the numbers the key
 * is computed from are the same. The key and the worked steps come from `shared/airflow`
 * `evaluate`: no formula is written again here.
 *
 * Pure TypeScript, no Node built-ins: the server grades with it; nothing here reads a file.
 */
import { uniformInt } from 'pure-rand/distribution/uniformInt';
import { xoroshiro128plus } from 'pure-rand/generator/xoroshiro128plus';

import { describeCalculator, evaluate, type FieldError, type InputValue, type Step, withExampleDefaults } from '../airflow';
import type { Choice, DrawnInput, FreshNumbersQuestion, NumericQuestion, Quantity } from './definition';

export interface FreshDraw {
  /** What the engine was given for the question's inputs: drawn values (rounded) and fixed ones. */
  inputs: Record<string, InputValue>;
  /** Each `{name}` of the stem as text: value and unit, e.g. `12.5 inH2O`, `68 °F`. */
  shown: Record<string, string>;
  /** The engine's output for exactly `inputs`, in the question's `answerUnit`. */
  key: Quantity;
  /** The engine's worked steps for those numbers (LaTeX, as the calculators show them). */
  steps: Step[];
  /** The engine's warnings (an input outside a formula's stated range); the content tests require none. */
  warnings: FieldError[];
}

/** Whether a fresh question's input is drawn (`{ from, to, step, unit }`) rather than fixed. */
export function isDrawnInput(input: DrawnInput | InputValue): input is DrawnInput {
  return typeof input === 'object' && input !== null && 'from' in input && 'step' in input;
}

/** Digits after the decimal point of a number as JavaScript writes it (1e-7 → 7, 2.5e-3 → 4). */
export function decimalsOf(x: number): number {
  const [mantissa = '', exponent] = String(Math.abs(x)).split('e');
  const fraction = mantissa.split('.')[1]?.length ?? 0;
  return Math.max(0, fraction - Number(exponent ?? 0));
}

/** How many whole steps fit in [from, to] (a hair of slack for 0.1-style steps). */
export function stepCount(input: DrawnInput): number {
  return Math.floor((input.to - input.from) / input.step + 1e-9);
}

/** The k-th value of a drawn input, rounded to the digits of `from` and `step`. */
export function drawnValue(input: DrawnInput, k: number): { value: number; text: string } {
  const digits = Math.min(20, Math.max(decimalsOf(input.from), decimalsOf(input.step)));
  const text = (input.from + k * input.step).toFixed(digits);
  return { value: Number(text), text: text === `-${(0).toFixed(digits)}` ? text.slice(1) : text };
}

const UNIT_DISPLAY: Record<string, string> = { degC: '°C', degF: '°F', degR: '°R', percent: '%', '%': '%' };

/** A unit as an apprentice reads it in a stem: `degF` → `°F`, `m^3/s` → `m³/s`. */
export function displayUnit(unit: string): string {
  return unit
    .split(/(\s*\/\s*|\s+|\*)/)
    .map((part) => UNIT_DISPLAY[part] ?? part.replace(/\^2\b/g, '²').replace(/\^3\b/g, '³'))
    .join('');
}

function withUnit(text: string, unit: string): string {
  const shown = displayUnit(unit);
  return shown === '' ? text : `${text} ${shown}`;
}

/** A fixed input as the stem shows it: its value as written, and its unit. */
function fixedText(calculator: string, name: string, value: InputValue): string {
  if (typeof value === 'string') return value;
  if (typeof value === 'number') {
    const kind = describeCalculator(calculator)?.inputs.find((i) => i.name === name)?.kind;
    return kind === 'percent' ? `${value} %` : String(value);
  }
  if ('values' in value) return withUnit(value.values.join(', '), value.unit);
  return withUnit(String(value.value), value.unit);
}

/** A 32-bit seed for one question of an attempt: the attempt's seed mixed with the question id. */
export function questionSeed(attemptSeed: number, questionId: string): number {
  let h = 0x811c9dc5; // FNV-1a, 32 bits
  for (let i = 0; i < questionId.length; i++) h = Math.imul(h ^ questionId.charCodeAt(i), 0x01000193);
  h ^= Math.imul(Math.trunc(attemptSeed) | 0, 0x9e3779b1);
  // MurmurHash3's finaliser spreads the bits.
  h = Math.imul(h ^ (h >>> 16), 0x85ebca6b);
  h = Math.imul(h ^ (h >>> 13), 0xc2b2ae35);
  return (h ^ (h >>> 16)) >>> 0;
}

export type EngineRun =
  | { ok: true; key: Quantity; steps: Step[]; warnings: FieldError[] }
  | { ok: false; message: string };

/**
 * One output of a calculator for a question's inputs over the calculator's example (inputs not
 * given take the example's values, as in lessons), in `unit`.
 */
export function runEngine(calculator: string, inputs: Record<string, InputValue>, output: string, unit: string): EngineRun {
  const request = withExampleDefaults(calculator, inputs);
  if (request === undefined) return { ok: false, message: `unknown calculator "${calculator}"` };
  const outcome = evaluate(calculator, { ...request, outputUnits: { [output]: unit } });
  if (!outcome.ok) return { ok: false, message: outcome.errors.map((e) => `${e.field || calculator}: ${e.message}`).join('; ') };
  const value = outcome.result.outputs[output]?.value;
  if (value === undefined || !Number.isFinite(value)) return { ok: false, message: `${calculator} gave no finite "${output}"` };
  return { ok: true, key: { value, unit }, steps: outcome.result.steps, warnings: outcome.result.warnings };
}

/** A numeric question's `check` through the engine, in the key's unit (the content tests compare it with the key). */
export function runCheck(question: NumericQuestion): EngineRun {
  return runEngine(question.check.calculator, question.check.inputs, question.check.output, question.key.unit);
}

/**
 * Draws a fresh-numbers question's inputs for a seed, then asks the engine for the key and the
 * worked steps on exactly those (rounded) numbers. The same seed always gives the same numbers.
 * Inputs are drawn in the order the question lists them. Throws when the engine refuses the
 * drawn numbers (the content tests make sure it never does for a published quiz).
 */
export function drawFresh(question: FreshNumbersQuestion, seed: number): FreshDraw {
  const rng = xoroshiro128plus(seed | 0);
  const inputs: Record<string, InputValue> = {};
  const shown: Record<string, string> = {};
  for (const [name, input] of Object.entries(question.inputs)) {
    if (isDrawnInput(input)) {
      const { value, text } = drawnValue(input, uniformInt(rng, 0, stepCount(input)));
      inputs[name] = { value, unit: input.unit };
      shown[name] = withUnit(text, input.unit);
    } else {
      inputs[name] = input;
      shown[name] = fixedText(question.calculator, name, input);
    }
  }
  const run = runEngine(question.calculator, inputs, question.output, question.answerUnit);
  if (!run.ok) throw new Error(`question "${question.id}", seed ${seed}: ${run.message}`);
  return { inputs, shown, key: run.key, steps: run.steps, warnings: run.warnings };
}

/** The choices' ids in a seeded order (Fisher–Yates); the same seed gives the same order. */
export function choiceOrder(choices: readonly Pick<Choice, 'id'>[], seed: number): string[] {
  const rng = xoroshiro128plus(seed | 0);
  const ids = choices.map((c) => c.id);
  for (let i = ids.length - 1; i > 0; i--) {
    const j = uniformInt(rng, 0, i);
    [ids[i], ids[j]] = [ids[j]!, ids[i]!];
  }
  return ids;
}

const HTML_ESCAPES: Record<string, string> = { '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' };

/**
 * Puts the drawn numbers into a stem: `{flow}` → `212 cfm`. Works on the Markdown or on the
 * rendered HTML (the text is HTML-escaped, which Markdown also reads as the plain character).
 * A `{name}` that is not an input is left as it is.
 */
export function interpolateStem(stem: string, shown: Readonly<Record<string, string>>): string {
  return stem.replace(/\{([A-Za-z][A-Za-z0-9]*)\}/g, (whole, name: string) =>
    Object.hasOwn(shown, name) ? shown[name]!.replace(/[&<>"']/g, (c) => HTML_ESCAPES[c]!) : whole,
  );
}

/** The `{name}` placeholders of a stem, in order of appearance. */
export function stemPlaceholders(stem: string): string[] {
  return [...stem.matchAll(/\{([A-Za-z][A-Za-z0-9]*)\}/g)].map((m) => m[1]!);
}
