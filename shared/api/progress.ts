import { z } from 'zod';

import type { QuizSummary } from './quizzes';

/** `POST /api/progress/lessons/:slug`: the reader opened a lesson, or reached its end. */
export const lessonEventSchema = z.object({ event: z.enum(['opened', 'finished']) }).strict();
export type LessonEvent = z.infer<typeof lessonEventSchema>;

export interface LessonProgressView {
  slug: string;
  openedAt: string;
  finishedAt: string | null;
  lastActivityAt: string;
}

/** `GET /api/progress`: the signed-in apprentice's own lessons and quizzes. */
export interface MyProgress {
  lessons: LessonProgressView[];
  quizzes: QuizSummary[];
  /** The latest lesson visit, answer or submit. */
  lastActivity: string | null;
}

/** `GET /api/learning-records`: xAPI statements (a StatementResult), newest first. */
export interface LearningRecordsPage {
  statements: Array<Record<string, unknown>>;
  /** Where the next page is ('' when there is none), as xAPI's StatementResult has it. */
  more: string;
}

export const learningRecordsQuerySchema = z
  .object({
    limit: z.coerce.number().int().min(1).max(500).default(100),
    /** The `more` link's cursor: statements after this one in the order (stored time, then id), newest first. */
    before: z
      .string()
      .regex(/^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}:\d{2}\.\d{3}Z,[0-9a-f-]{36}$/i, 'A cursor from a `more` link.')
      .optional(),
  })
  .strict();
