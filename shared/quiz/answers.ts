/*
 * What an apprentice submits per question, and the check an answer passes before it is saved:
 * a choice that exists, a finite number with a unit of the same quantity as the key, some text.
 * Pure TypeScript, no Node built-ins.
 */
import { UNITS_BY_KIND } from '../airflow';
import { parseUnit } from '../airflow/units';
import type { QuantityKind } from '../airflow';
import type { QuestionDefinition } from './definition';

/** single | multiple | numeric and fresh | written. */
export type ResponseValue = { choiceId: string } | { choiceIds: string[] } | { value: number; unit: string } | { text: string };

/** Longest written answer kept (characters); about four pages of prose. */
export const MAX_WRITTEN_LENGTH = 10_000;
const MAX_UNIT_LENGTH = 40;
const DECIMAL = /^[-+]?(?:\d+(?:\.\d*)?|\.\d+)(?:[eE][-+]?\d+)?$/;

const isRecord = (x: unknown): x is Record<string, unknown> => typeof x === 'object' && x !== null && !Array.isArray(x);

/** The unit a numeric or fresh question's key is stated in. */
export function keyUnitOf(question: QuestionDefinition): string | undefined {
  if (question.kind === 'numeric') return question.key.unit;
  if (question.kind === 'fresh') return question.answerUnit;
  return undefined;
}

/** What a unit measures, for messages ("volume flow"); undefined for an unknown unit. */
export function kindOfUnit(unit: string): QuantityKind | undefined {
  const parsed = parseUnit(unit);
  if (parsed === undefined) return undefined;
  const kinds = Object.keys(UNITS_BY_KIND) as QuantityKind[];
  return kinds.find((kind) => kind !== 'temperatureDifference' && UNITS_BY_KIND[kind].some((u) => parseUnit(u)?.dimensions === parsed.dimensions));
}

/** The units an apprentice may pick for an answer in `keyUnit`'s quantity (the pickers' list). */
export function answerUnits(keyUnit: string): string[] {
  const kind = kindOfUnit(keyUnit);
  const listed = kind === undefined ? [] : UNITS_BY_KIND[kind].filter((u) => u !== '' || keyUnit === '');
  return listed.includes(keyUnit) ? [...listed] : [keyUnit, ...listed];
}

/** Whether `unit` measures the same quantity as `keyUnit` (any compatible unit is accepted). */
export function isCompatibleUnit(unit: string, keyUnit: string): boolean {
  const a = parseUnit(unit);
  const b = parseUnit(keyUnit);
  return a !== undefined && b !== undefined && a.dimensions === b.dimensions;
}

function readNumber(raw: unknown): number | undefined {
  if (typeof raw === 'number') return Number.isFinite(raw) ? raw : undefined;
  if (typeof raw === 'string' && DECIMAL.test(raw.trim())) {
    const value = Number(raw.trim());
    return Number.isFinite(value) ? value : undefined;
  }
  return undefined;
}

/**
 * Checks a raw answer (parsed JSON) against its question and returns it in its clean form (only
 * the known fields; a decimal string such as "12.5" read as a number), or a plain message saying
 * what is wrong. The caller names the question. Refused: a choice the question does not have, a
 * value that is not a finite number, a unit that does not measure the key's quantity, an empty or
 * overlong text.
 */
export function validateResponse(question: QuestionDefinition, raw: unknown): ResponseValue | string {
  if (!isRecord(raw)) return 'The answer must be an object.';
  switch (question.kind) {
    case 'single': {
      const id = raw['choiceId'];
      if (typeof id !== 'string') return 'Choose one answer (choiceId).';
      if (!question.choices.some((c) => c.id === id)) return `"${id.slice(0, 40)}" is not one of this question's answers.`;
      return { choiceId: id };
    }
    case 'multiple': {
      const ids = raw['choiceIds'];
      if (!Array.isArray(ids) || !ids.every((id): id is string => typeof id === 'string')) return 'Give the ticked answers as a list (choiceIds).';
      const unknown = ids.find((id) => !question.choices.some((c) => c.id === id));
      if (unknown !== undefined) return `"${unknown.slice(0, 40)}" is not one of this question's answers.`;
      if (new Set(ids).size !== ids.length) return 'An answer is ticked twice.';
      return { choiceIds: [...ids] };
    }
    case 'numeric':
    case 'fresh': {
      const keyUnit = keyUnitOf(question)!;
      const value = readNumber(raw['value']);
      if (value === undefined) return 'The answer must be a number, such as 212 or 12.5 (a point for decimals, no commas or letters).';
      const unit = raw['unit'] ?? '';
      if (typeof unit !== 'string' || unit.length > MAX_UNIT_LENGTH) return 'Pick a unit for the answer.';
      if (!isCompatibleUnit(unit, keyUnit)) {
        const kind = kindOfUnit(keyUnit);
        const what = kind === undefined ? 'the same quantity' : `a ${kind.replace(/[A-Z]/g, (c) => ` ${c.toLowerCase()}`)}`;
        const list = answerUnits(keyUnit).filter((u) => u !== '').slice(0, 8).join(', ');
        return `"${unit.slice(0, MAX_UNIT_LENGTH)}" is not a unit of ${what}. Answer in ${list || 'the unit asked for'}.`;
      }
      return { value, unit };
    }
    case 'written': {
      const text = raw['text'];
      if (typeof text !== 'string') return 'Write the answer as text.';
      if (text.length > MAX_WRITTEN_LENGTH) return `The answer is too long: at most ${MAX_WRITTEN_LENGTH} characters.`;
      return { text };
    }
  }
}

/** Whether a saved answer is empty (nothing ticked, no text): graded as unanswered. */
export function isEmptyResponse(response: ResponseValue | undefined): boolean {
  if (response === undefined) return true;
  if ('choiceIds' in response) return response.choiceIds.length === 0;
  if ('text' in response) return response.text.trim() === '';
  return false;
}
