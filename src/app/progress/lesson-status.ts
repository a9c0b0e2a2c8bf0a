/*
 * An apprentice's progress in words (never colour alone): per lesson in the course outline, and
 * the rows of "My progress". No Angular: tested on its own.
 */
import type { LessonOutline } from '../../../shared/api/lessons';
import type { LessonProgressView, MyProgress } from '../../../shared/api/progress';
import type { QuizStatus, QuizSummary } from '../../../shared/api/quizzes';

export type LessonTone = 'not-started' | 'reading' | 'read' | 'quiz-started' | 'not-yet-passed' | 'passed';

export interface LessonStatus {
  readonly tone: LessonTone;
  /** What the outline shows: "Not started", "Reading", "Quiz passed, best 92 %". */
  readonly text: string;
}

/** A score as the pages show it: whole numbers bare, else one decimal ("87.5 %"). */
export function formatPercent(percent: number): string {
  return `${Number(percent.toFixed(1))} %`;
}

function bestText(quiz: QuizSummary): string {
  if (!quiz.best) return '';
  return `, best ${formatPercent(quiz.best.scorePercent)}${quiz.best.provisional ? ' so far' : ''}`;
}

/** One lesson's status: the quiz decides once started, else the reading. */
export function lessonStatus(lesson: LessonProgressView | undefined, quiz: QuizSummary | undefined): LessonStatus {
  if (quiz?.status === 'passed') return { tone: 'passed', text: `Quiz passed${bestText(quiz)}` };
  if (quiz?.status === 'not-yet-passed') return { tone: 'not-yet-passed', text: `Quiz not yet passed${bestText(quiz)}` };
  if (quiz?.status === 'in-progress') return { tone: 'quiz-started', text: 'Quiz started' };
  if (lesson?.finishedAt) return { tone: 'read', text: 'Read to the end' };
  if (lesson) return { tone: 'reading', text: 'Reading' };
  return { tone: 'not-started', text: 'Not started' };
}

const QUIZ_WORDS: Record<QuizStatus, string> = {
  'not-started': 'Not started',
  'in-progress': 'Started, not submitted',
  passed: 'Passed',
  'not-yet-passed': 'Not yet passed',
};

export interface ProgressRow {
  readonly slug: string;
  readonly order: number;
  readonly title: string;
  readonly reading: string;
  readonly quiz: string;
  readonly quizTone: QuizStatus;
  /** "92 %", or "—" before a graded attempt; "(waiting for grading)" while written answers wait. */
  readonly best: string;
  /** "1 of 3". */
  readonly attempts: string;
  /** ISO time of the latest visit, answer or submit for this lesson, or null. */
  readonly lastActivity: string | null;
}

/** "My progress": one row per lesson in course order, whatever the apprentice has done. */
export function progressRows(outline: readonly LessonOutline[], progress: MyProgress): ProgressRow[] {
  return [...outline]
    .sort((a, b) => a.order - b.order)
    .map((lesson) => {
      const read = progress.lessons.find((l) => l.slug === lesson.slug);
      const quiz = progress.quizzes.find((q) => q.slug === lesson.slug);
      const best = quiz?.best;
      return {
        slug: lesson.slug,
        order: lesson.order,
        title: lesson.title,
        reading: read?.finishedAt ? 'Read to the end' : read ? 'Opened' : 'Not opened',
        quiz: quiz ? QUIZ_WORDS[quiz.status] : 'No quiz',
        quizTone: quiz?.status ?? 'not-started',
        best: best ? `${formatPercent(best.scorePercent)}${best.provisional ? ' (waiting for grading)' : ''}` : '—',
        attempts: quiz ? `${quiz.attemptsUsed} of ${quiz.attemptLimit}` : '—',
        lastActivity: latest(read?.lastActivityAt ?? null, quiz?.lastActivityAt ?? null),
      };
    });
}

/** The later of two ISO times, either of which may be missing. */
function latest(a: string | null, b: string | null): string | null {
  if (a === null || b === null) return a ?? b;
  return Date.parse(a) >= Date.parse(b) ? a : b;
}
