/*
 * The instructor's side of quizzes (`/api/grading/*`): the queue of written answers waiting for a
 * grade, rubric marks with a comment, overrides of auto-graded answers with a reason, and
 * regrades after a question's key was corrected. Only instructors (their cohorts' apprentices)
 * and admins (everyone) call these; the rubric appears here and never in an apprentice's answer
 * before grading.
 */
import { z } from 'zod';

/** One written answer waiting for a grade (`GET /api/grading/queue`, oldest submitted first). */
export interface GradingQueueItem {
  responseId: string;
  attemptId: string;
  attemptNumber: number;
  apprentice: { id: string; displayName: string };
  quiz: { slug: string; title: string };
  questionId: string;
  /** The question's place in the quiz, from 1. */
  questionNumber: number;
  /** The question's version the apprentice was given. */
  questionVersion: number;
  submittedAt: string;
  /** Sanitised HTML of the question as asked. */
  stemHtml: string;
  /** The apprentice's answer, plain text (show it as text, never as HTML). */
  answerText: string;
  rubric: Array<{ criterion: string; points: number }>;
  maxPoints: number;
}

export interface GradingQueue {
  items: GradingQueueItem[];
  /** Answers waiting in all (the list holds at most `limit`). */
  total: number;
}

export const gradingQueueQuerySchema = z
  .object({ limit: z.coerce.number().int().min(1).max(200).default(50) })
  .strict();

const MAX_COMMENT = 4000;
const MAX_REASON = 2000;

/** `PUT /api/grading/responses/:id`: points for every rubric criterion, and a comment (may be empty). */
export const gradeResponseSchema = z
  .object({
    marks: z
      .array(z.object({ criterion: z.string().min(1).max(500), points: z.number().finite().min(0, 'Points cannot be negative.') }).strict())
      .min(1)
      .max(50),
    comment: z.string().trim().max(MAX_COMMENT, `Keep the comment under ${MAX_COMMENT} characters.`).default(''),
  })
  .strict();
export type GradeResponseRequest = z.input<typeof gradeResponseSchema>;

/** `POST /api/grading/responses/:id/override`: the points the answer earns instead, and why. */
export const overrideResponseSchema = z
  .object({
    points: z.number().finite().min(0, 'Points cannot be negative.'),
    reason: z.string().trim().min(3, 'Say why, in a sentence the apprentice will read.').max(MAX_REASON, `Keep the reason under ${MAX_REASON} characters.`),
  })
  .strict();
export type OverrideResponseRequest = z.input<typeof overrideResponseSchema>;

/** `POST /api/grading/regrade`: one question of one quiz. */
export const regradeSchema = z.object({ quizSlug: z.string().min(1).max(80), questionId: z.string().min(1).max(80) }).strict();
export type RegradeRequest = z.input<typeof regradeSchema>;

/** The attempt's score after a change. */
export interface AttemptScore {
  points: number;
  maxPoints: number;
  percent: number;
  passed: boolean;
  /** Written answers still waiting for an instructor. */
  pendingCount: number;
}

/** The answer of a grade or an override, as now stored, and the attempt's new score. */
export interface GradedResponse {
  responseId: string;
  attemptId: string;
  questionId: string;
  status: 'correct' | 'partial' | 'incorrect' | 'unanswered' | 'pending';
  /** What the answer counts for (an override wins over the automatic points). */
  points: number;
  maxPoints: number;
  rubric?: Array<{ criterion: string; points: number; maxPoints: number }>;
  comment?: string | null;
  gradedAt: string | null;
  override?: { points: number; reason: string; at: string } | null;
  attempt: AttemptScore;
}

/** An instructor's view of one submitted attempt, to override auto-graded answers (`GET /api/grading/attempts/:id`). */
export interface GradingAttempt {
  id: string;
  number: number;
  apprentice: { id: string; displayName: string };
  quiz: { slug: string; title: string };
  submittedAt: string | null;
  score: AttemptScore | null;
  responses: Array<{
    responseId: string;
    questionId: string;
    kind: 'single' | 'multiple' | 'numeric' | 'fresh' | 'written';
    stemHtml: string;
    /** The answer in words ("142.15 L/s", "b, c", the written text); null when unanswered. */
    answerText: string | null;
    /** The key in words, for numeric, fresh and choice questions. */
    keyText: string | null;
    status: 'correct' | 'partial' | 'incorrect' | 'unanswered' | 'pending' | null;
    /** Automatic points (or rubric points for written answers). */
    points: number | null;
    maxPoints: number;
    override: { points: number; reason: string; at: string } | null;
    /** Only auto-graded answers take an override; written answers are graded from the queue. */
    overridable: boolean;
  }>;
}

/** One apprentice's attempt whose score a regrade changed. */
export interface RegradeChange {
  apprentice: { id: string; displayName: string };
  attemptId: string;
  attemptNumber: number;
  old: { percent: number; passed: boolean };
  new: { percent: number; passed: boolean };
}

export interface RegradeResult {
  quizSlug: string;
  questionId: string;
  /** The version graded against (the question as it is now). */
  currentVersion: number;
  /** Responses of earlier versions graded again. */
  responsesRegraded: number;
  /** Attempts whose score changed, old → new. */
  changed: RegradeChange[];
}

/**
 * `GET /api/grading/corrections`: auto-graded questions whose key or numbers were corrected since
 * some of the caller's apprentices answered them (their stored answers belong to an earlier
 * version), each with how many such answers there are. A regrade grades them against the current
 * version; running it again changes nothing.
 */
export interface CorrectedQuestion {
  quiz: { slug: string; title: string };
  questionId: string;
  /** The question's place in the quiz as it is now, from 1. */
  questionNumber: number;
  currentVersion: number;
  /** Submitted answers to earlier versions, from the caller's apprentices. */
  earlierAnswers: number;
  /** The last regrade of this question against its current version (by anyone), or null. */
  lastRegradedAt: string | null;
}
