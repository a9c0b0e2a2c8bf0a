/*
 * What the browser sees of quizzes. Before submit: stems, choices (in this attempt's order), the
 * stated tolerance and the apprentice's own drafts — never a key, a rubric, a correctness flag or
 * an explanation. After submit: the result, which teaches (keys, explanations, worked steps).
 */
import { z } from 'zod';

import type { Step } from '../airflow';

export type QuestionKind = 'single' | 'multiple' | 'numeric' | 'fresh' | 'written';

/** An apprentice's answer to one question (the same shapes as `shared/quiz/answers.ts`). */
export type AnswerValue = { choiceId: string } | { choiceIds: string[] } | { value: number; unit: string } | { text: string };

/** `PUT /api/attempts/:id/answers/:questionId`: the answer, or null to clear it. Checked per question kind on the server. */
export const saveAnswerSchema = z.object({ answer: z.unknown() }).strict();
export type SaveAnswerRequest = { answer: AnswerValue | null };

/** `PUT …/answers/:questionId` answers with the draft as stored. */
export interface SavedAnswer {
  questionId: string;
  answer: AnswerValue | null;
  savedAt: string;
}

export type QuizStatus = 'not-started' | 'in-progress' | 'passed' | 'not-yet-passed';

/** One row of `GET /api/quizzes`. */
export interface QuizSummary {
  /** The lesson's slug (the quiz's id). */
  slug: string;
  title: string;
  questionCount: number;
  totalPoints: number;
  passMark: number;
  attemptLimit: number;
  timeLimitMinutes: number | null;
  attemptsUsed: number;
  status: QuizStatus;
  /** The best graded attempt (the one that counts). */
  best: { attemptId: string; scorePercent: number; passed: boolean; provisional: boolean } | null;
  /** An attempt started and not yet submitted, to resume. */
  openAttempt: { id: string; deadline: string | null } | null;
  /** The latest start or submit of an attempt at this quiz (ISO time), or null. */
  lastActivityAt: string | null;
}

/** A question as the apprentice answers it. */
export interface AttemptQuestion {
  id: string;
  kind: QuestionKind;
  points: number;
  /** Sanitised HTML; a fresh-numbers stem shows this attempt's numbers. */
  stemHtml: string;
  /** Single and multiple: in this attempt's order. */
  choices?: Array<{ id: string; html: string }>;
  /** Multiple: how partial credit works, in words. */
  partialCredit?: string;
  /** Numeric and fresh: "within 1 %" or "within 2 cfm" (shown with the question). */
  tolerance?: string;
  /** Numeric and fresh: the unit the question states its answer in (any compatible unit is accepted). */
  answerUnit?: string;
  /** Numeric and fresh: the units the answer may be given in. */
  units?: string[];
  /** The saved draft. */
  answer: AnswerValue | null;
}

/** What an answer earned, after submit. */
export interface QuestionResult {
  status: 'correct' | 'partial' | 'incorrect' | 'unanswered' | 'pending';
  points: number | null;
  maxPoints: number;
  /** Numeric and fresh. */
  key?: { value: number; unit: string };
  withinTolerance?: boolean;
  answerInKeyUnit?: number;
  /** Single and multiple: the correct choice ids. */
  correctChoices?: string[];
  explanationHtml: string;
  /** Numeric and fresh: the engine's worked steps for this attempt's numbers. */
  steps?: Step[];
  /** An instructor's change of the points, with the reason (the apprentice sees both). */
  override?: { points: number; reason: string; at: string } | null;
  /** Written: the instructor's marks per criterion and comment, once graded. */
  rubric?: Array<{ criterion: string; points: number | null; maxPoints: number }>;
  comment?: string | null;
  /** Written: when the instructor graded it (null while it waits). */
  gradedAt?: string | null;
}

export interface AttemptView {
  id: string;
  quiz: { slug: string; title: string };
  number: number;
  attemptLimit: number;
  status: 'open' | 'submitted';
  startedAt: string;
  /** When the server stops taking answers (null: no time limit). */
  deadline: string | null;
  submittedAt: string | null;
  questions: Array<AttemptQuestion & { result?: QuestionResult }>;
  /** After submit. `provisional` while written answers wait for an instructor. */
  score?: { points: number; maxPoints: number; percent: number; passMark: number; passed: boolean; provisional: boolean; pendingCount: number };
}
