/*
 * The instructor's gradebook of a cohort and the shop owner's progress view. The gradebook shows
 * best scores and statuses, never answers; the shop view shows completion only.
 */
import { z } from 'zod';

/** A quiz's status in the gradebook, for one apprentice. */
export const GRADEBOOK_QUIZ_STATUSES = ['not-started', 'in-progress', 'passed', 'not-yet-passed', 'waiting-for-grading'] as const;
export type GradebookQuizStatus = (typeof GRADEBOOK_QUIZ_STATUSES)[number];

/** The words shown for each status (the colour is only ever beside them). */
export const GRADEBOOK_STATUS_WORDS: Record<GradebookQuizStatus, string> = {
  'not-started': 'Not started',
  'in-progress': 'In progress',
  passed: 'Passed',
  'not-yet-passed': 'Not yet passed',
  'waiting-for-grading': 'Waiting for grading',
};

/** No activity for this many days, or this many failed attempts at one quiz, and an apprentice needs help. */
export const NEEDS_HELP_IDLE_DAYS = 14;
export const NEEDS_HELP_FAILED_ATTEMPTS = 2;

/** Columns the gradebook sorts by: fixed ones, or `quiz:<slug>` (best score). */
export const GRADEBOOK_FIXED_SORTS = ['name', 'lessons', 'quizzesPassed', 'lastActivity', 'needsHelp'] as const;
export type GradebookFixedSort = (typeof GRADEBOOK_FIXED_SORTS)[number];

export const gradebookQuerySchema = z
  .object({
    sort: z
      .string()
      .regex(/^(name|lessons|quizzesPassed|lastActivity|needsHelp|quiz:[a-z0-9-]{1,80})$/, 'A column: name, lessons, quizzesPassed, lastActivity, needsHelp or quiz:<slug>.')
      .default('name'),
    dir: z.enum(['asc', 'desc']).default('asc'),
    /** A quiz status (of `quiz`, else of the sorted quiz column, else of any quiz), or `needs-help`. */
    status: z.enum([...GRADEBOOK_QUIZ_STATUSES, 'needs-help']).optional(),
    /** The quiz the status filter looks at. */
    quiz: z
      .string()
      .regex(/^[a-z0-9-]{1,80}$/)
      .optional(),
    /** Part of a name or e-mail address. */
    q: z.string().trim().max(120).optional(),
    page: z.coerce.number().int().min(1).max(100_000).default(1),
    pageSize: z.coerce.number().int().min(1).max(200).default(50),
  })
  .strict();
export type GradebookQuery = z.infer<typeof gradebookQuerySchema>;

/** The CSV takes the same sort and filters, and no paging. */
export const gradebookCsvQuerySchema = gradebookQuerySchema.omit({ page: true, pageSize: true });
export type GradebookCsvQuery = z.infer<typeof gradebookCsvQuerySchema>;

export interface GradebookQuizColumn {
  slug: string;
  title: string;
  passMark: number;
}

export interface GradebookCell {
  status: GradebookQuizStatus;
  /** The best graded attempt's score, in percent (null before any graded attempt). */
  bestPercent: number | null;
  attemptsUsed: number;
  /** Graded attempts that did not pass (none waiting for grading). */
  failedAttempts: number;
}

export type NeedsHelpReason = { kind: 'failed-attempts'; quiz: string; count: number } | { kind: 'inactive'; days: number };

export interface GradebookRow {
  userId: string;
  displayName: string;
  email: string;
  /** By quiz slug; every column has a cell. */
  quizzes: Record<string, GradebookCell>;
  lessonsFinished: number;
  quizzesPassed: number;
  lastActivity: string | null;
  needsHelp: boolean;
  needsHelpReasons: NeedsHelpReason[];
}

/** `GET /api/cohorts/:id/gradebook`. */
export interface GradebookPage {
  cohort: { id: string; name: string };
  quizzes: GradebookQuizColumn[];
  lessonCount: number;
  rows: GradebookRow[];
  /** Rows matching the filters, on every page. */
  total: number;
  page: number;
  pageSize: number;
}

/** One apprentice in `GET /api/shop/progress`: completion only (no answers, comments or scores per question). */
export interface ShopApprenticeProgress {
  userId: string;
  displayName: string;
  lessonsFinished: number;
  quizzesPassed: number;
  lastActivity: string | null;
}

export interface ShopProgress {
  shop: { id: string; name: string };
  lessonCount: number;
  quizCount: number;
  apprentices: ShopApprenticeProgress[];
}

/** The words of a needs-help reason ("2 failed attempts at Pressure", "No activity for 14 days"). */
export function needsHelpWords(reason: NeedsHelpReason, quizTitle: (slug: string) => string): string {
  return reason.kind === 'failed-attempts' ? `${reason.count} failed attempts at ${quizTitle(reason.quiz)}` : `No activity for ${reason.days} days`;
}
