/*
 * An apprentice's answers as the quiz form holds them (what was typed or ticked) and as the API
 * takes them (`AnswerValue`), both ways; and the countdown's text. No Angular: tested on its own.
 */
import type { AnswerValue, AttemptQuestion, QuestionKind } from '../../../shared/api/quizzes';
import { formatTyped, parseTyped, typingProblem } from '../calculators/typed-numbers';

/** What one question's form holds, by kind. */
export type AnswerDraft =
  | { kind: 'single'; choiceId: string | null }
  | { kind: 'multiple'; choiceIds: string[] }
  | { kind: 'number'; text: string; unit: string }
  | { kind: 'written'; text: string };

/** The answer to send (null clears the draft), or why it cannot be sent yet. */
export type Serialised = { ok: true; answer: AnswerValue | null } | { ok: false; message: string };

/** The form's starting state for a question: its saved draft, else empty (a number in the question's own unit). */
export function draftOf(question: Pick<AttemptQuestion, 'kind' | 'answer' | 'answerUnit' | 'units'>): AnswerDraft {
  const saved = question.answer;
  switch (question.kind) {
    case 'single':
      return { kind: 'single', choiceId: saved && 'choiceId' in saved ? saved.choiceId : null };
    case 'multiple':
      return { kind: 'multiple', choiceIds: saved && 'choiceIds' in saved ? [...saved.choiceIds] : [] };
    case 'numeric':
    case 'fresh':
      if (saved && 'value' in saved) return { kind: 'number', text: formatTyped(saved.value), unit: saved.unit };
      return { kind: 'number', text: '', unit: question.answerUnit ?? question.units?.[0] ?? '' };
    case 'written':
      return { kind: 'written', text: saved && 'text' in saved ? saved.text : '' };
  }
}

/**
 * The draft as the API takes it. An empty field clears the saved answer; a number field that does
 * not hold a number is not sent (the message says why), so the last good draft stays saved.
 */
export function serialiseAnswer(draft: AnswerDraft): Serialised {
  switch (draft.kind) {
    case 'single':
      return { ok: true, answer: draft.choiceId === null ? null : { choiceId: draft.choiceId } };
    case 'multiple':
      // Nothing ticked is an answer too ("none of these"), once the apprentice has touched the list.
      return { ok: true, answer: { choiceIds: [...draft.choiceIds] } };
    case 'number': {
      if (draft.text.trim() === '') return { ok: true, answer: null };
      const value = parseTyped(draft.text);
      if (value === undefined) return { ok: false, message: typingProblem('The answer', draft.text) };
      return { ok: true, answer: { value, unit: draft.unit } };
    }
    case 'written':
      return { ok: true, answer: draft.text.trim() === '' ? null : { text: draft.text } };
  }
}

/** Which kind of field a question is answered with. */
export function draftKindOf(kind: QuestionKind): AnswerDraft['kind'] {
  return kind === 'numeric' || kind === 'fresh' ? 'number' : kind;
}

/** The countdown as a clock: "9:05", "1:02:03"; never below "0:00". */
export function formatRemaining(ms: number): string {
  const total = Math.max(0, Math.ceil(ms / 1000));
  const hours = Math.floor(total / 3600);
  const minutes = Math.floor((total % 3600) / 60);
  const seconds = total % 60;
  const ss = String(seconds).padStart(2, '0');
  return hours > 0 ? `${hours}:${String(minutes).padStart(2, '0')}:${ss}` : `${minutes}:${ss}`;
}

/** The countdown in words, for screen readers at a few moments: "10 minutes left", "1 minute left", "30 seconds left". */
export function remainingInWords(ms: number): string {
  const total = Math.max(0, Math.ceil(ms / 1000));
  if (total === 0) return 'Time is up.';
  if (total < 60) return total === 1 ? '1 second left' : `${total} seconds left`;
  const minutes = Math.ceil(total / 60);
  return minutes === 1 ? '1 minute left' : `${minutes} minutes left`;
}

/** The moments (whole minutes left) the countdown is announced, not every second. */
export function isAnnouncedMoment(ms: number): boolean {
  const total = Math.max(0, Math.ceil(ms / 1000));
  return [600, 300, 120, 60, 30, 0].includes(total);
}
