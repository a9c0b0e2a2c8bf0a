/*
 * Grading of one answer against its question. Choices by the question's own rule; numbers in any
 * compatible unit, converted to the key's unit by the engine's units, within the tolerance with
 * both ends included; written answers wait for an instructor. Pure TypeScript, no Node built-ins.
 */
import { convert } from '../airflow';
import { parseUnit } from '../airflow/units';
import { isEmptyResponse, type ResponseValue } from './answers';
import type { MultipleChoiceQuestion, Quantity, QuestionDefinition, Tolerance } from './definition';

export type GradeStatus = 'correct' | 'partial' | 'incorrect' | 'unanswered' | 'pending';

export interface Graded {
  points: number;
  maxPoints: number;
  /** `pending`: a written answer, 0 points until an instructor grades it. */
  status: GradeStatus;
  /** Numeric and fresh questions with an answer: whether it lies within the tolerance. */
  withinTolerance?: boolean;
  /** Numeric and fresh questions: the key the answer was graded against. */
  key?: Quantity;
  /** The answer converted to the key's unit. */
  answerInKeyUnit?: number;
}

export interface GradeContext {
  /** A fresh question's key for the numbers drawn for this attempt; for a numeric question it overrides the definition's (a corrected key). */
  key?: Quantity;
}

/** Points to two decimals (2 × 3/4 = 1.5; 1 × 2/3 = 0.67). */
function roundPoints(points: number): number {
  return Math.round(points * 100) / 100;
}

/**
 * The tolerance as an amount in the key's unit. Relative: percent·|key|/100. Absolute: its amount
 * converted as a difference (2 °F is 1.11 °C wide, whatever the offset of the scales).
 */
export function toleranceInKeyUnit(tolerance: Tolerance, key: Quantity): number {
  if (tolerance.kind === 'relative') return (tolerance.percent * Math.abs(key.value)) / 100;
  const { value, unit } = tolerance.amount;
  if (unit === key.unit) return Math.abs(value);
  const from = parseUnit(unit);
  const to = parseUnit(key.unit);
  if (from === undefined || to === undefined || from.dimensions !== to.dimensions) {
    throw new Error(`tolerance unit "${unit}" does not measure the same quantity as the key's "${key.unit}"`);
  }
  return Math.abs((value * from.scale) / to.scale);
}

/** A tolerance as the apprentice reads it with the question: "within 2 %", "within 0.5 kPa". */
export function toleranceText(tolerance: Tolerance): string {
  if (tolerance.kind === 'relative') return `within ${tolerance.percent} %`;
  const unit = tolerance.amount.unit.replace(/^degC$/, '°C').replace(/^degF$/, '°F').replace(/\^3\b/g, '³').replace(/\^2\b/g, '²');
  return `within ${tolerance.amount.value}${unit === '' ? '' : ` ${unit}`}`;
}

/** Rounds a band's end to 15 significant figures, so a bound written in decimals (302.2) is met exactly. */
const snap = (x: number): number => Number(x.toPrecision(15));

/**
 * The band of answers that pass, in the key's unit: key ± tolerance, each end rounded to 15
 * significant figures (so key 301.2 cfm ± 1 cfm passes 300.2 and 302.2 as typed, although
 * 302.2 − 301.2 is 1.0000000000000227 in binary floating point).
 */
export function toleranceBand(key: Quantity, tolerance: Tolerance): { low: number; high: number } {
  const amount = toleranceInKeyUnit(tolerance, key);
  return { low: snap(key.value - amount), high: snap(key.value + amount) };
}

/** Whether an answer (in the key's unit) lies in the band, both ends included. */
export function isWithinTolerance(answerInKeyUnit: number, key: Quantity, tolerance: Tolerance): boolean {
  if (!Number.isFinite(answerInKeyUnit) || !Number.isFinite(key.value)) return false;
  const { low, high } = toleranceBand(key, tolerance);
  return low <= answerInKeyUnit && answerInKeyUnit <= high;
}

/** Per-choice: each choice judged right earns points/choices; all-or-nothing: the exact set or 0. */
function gradeMultiple(question: MultipleChoiceQuestion, ticked: readonly string[]): Graded {
  const maxPoints = question.points;
  const set = new Set(ticked);
  const judgedRight = question.choices.filter((c) => set.has(c.id) === c.correct).length;
  const all = judgedRight === question.choices.length;
  if (question.partialCredit === 'all-or-nothing' || all || judgedRight === 0) {
    return { points: all ? maxPoints : 0, maxPoints, status: all ? 'correct' : 'incorrect' };
  }
  return { points: roundPoints((maxPoints * judgedRight) / question.choices.length), maxPoints, status: 'partial' };
}

/**
 * Grades one answer. `response` undefined (or nothing ticked, or blank text) is unanswered and
 * earns 0. A response of the wrong shape for its question counts as incorrect (the API refuses
 * those before saving). A fresh question needs `context.key` (the key of its drawn numbers).
 */
export function gradeResponse(question: QuestionDefinition, response: ResponseValue | undefined, context: GradeContext = {}): Graded {
  const maxPoints = question.points;
  const unanswered = (extra: Partial<Graded> = {}): Graded => ({ points: 0, maxPoints, status: 'unanswered', ...extra });
  const incorrect = (extra: Partial<Graded> = {}): Graded => ({ points: 0, maxPoints, status: 'incorrect', ...extra });
  switch (question.kind) {
    case 'single': {
      if (response === undefined || isEmptyResponse(response)) return unanswered();
      if (!('choiceId' in response)) return incorrect();
      const correct = question.choices.some((c) => c.id === response.choiceId && c.correct);
      return correct ? { points: maxPoints, maxPoints, status: 'correct' } : incorrect();
    }
    case 'multiple': {
      if (response === undefined || isEmptyResponse(response)) return unanswered();
      if (!('choiceIds' in response)) return incorrect();
      return gradeMultiple(question, response.choiceIds);
    }
    case 'numeric':
    case 'fresh': {
      const key = context.key ?? (question.kind === 'numeric' ? question.key : undefined);
      if (key === undefined) throw new Error(`question "${question.id}": a fresh-numbers question is graded against the key of its drawn numbers (context.key)`);
      if (response === undefined || isEmptyResponse(response)) return unanswered({ key });
      if (!('value' in response) || typeof response.value !== 'number') return incorrect({ key, withinTolerance: false });
      let answerInKeyUnit: number;
      try {
        // The same unit is not converted at all, so an answer typed in the key's unit is compared as typed.
        answerInKeyUnit = response.unit === key.unit ? response.value : convert(response.value, response.unit, key.unit);
      } catch {
        return incorrect({ key, withinTolerance: false });
      }
      const withinTolerance = isWithinTolerance(answerInKeyUnit, key, question.tolerance);
      return { points: withinTolerance ? maxPoints : 0, maxPoints, status: withinTolerance ? 'correct' : 'incorrect', withinTolerance, key, answerInKeyUnit };
    }
    case 'written':
      if (response === undefined || isEmptyResponse(response)) return unanswered();
      return { points: 0, maxPoints, status: 'pending' };
  }
}
