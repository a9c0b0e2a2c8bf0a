import type { DataSource } from 'typeorm';

import type { LearningRecordsPage, LessonEvent, LessonProgressView, MyProgress } from '../../shared/api/progress';
import type { User } from '../accounts/user.entity';
import { HttpProblem } from '../http/problem';
import type { AttemptsService } from '../quizzes/attempts.service';

/** Lessons opened and finished, an apprentice's own progress, and the xAPI learning records. */
export class ProgressService {
  constructor(
    private readonly dataSource: DataSource,
    private readonly attempts: AttemptsService,
    private readonly lessonSlugs: () => readonly string[],
    private readonly now: () => Date = () => new Date(),
  ) {}

  /** Records a lesson opened (first time kept) or finished (first time kept); the last activity moves on. */
  async recordLesson(user: User, slug: string, { event }: LessonEvent): Promise<LessonProgressView> {
    if (!this.lessonSlugs().includes(slug)) throw HttpProblem.notFound(`There is no lesson "${slug}".`);
    const at = this.now();
    const rows: ProgressRow[] = await this.dataSource.query(
      `INSERT INTO lesson_progress (user_id, lesson_slug, opened_at, finished_at, last_activity_at)
       VALUES ($1, $2, $3, CASE WHEN $4 THEN $3::timestamptz END, $3)
       ON CONFLICT (user_id, lesson_slug) DO UPDATE SET
         finished_at = coalesce(lesson_progress.finished_at, EXCLUDED.finished_at),
         last_activity_at = greatest(lesson_progress.last_activity_at, EXCLUDED.last_activity_at)
       RETURNING lesson_slug, opened_at, finished_at, last_activity_at`,
      [user.id, slug, at, event === 'finished'],
    );
    return toView(rows[0]!);
  }

  async mine(user: User): Promise<MyProgress> {
    const quizzes = await this.attempts.list(user);
    const rows: ProgressRow[] = await this.dataSource.query(
      'SELECT lesson_slug, opened_at, finished_at, last_activity_at FROM lesson_progress WHERE user_id = $1 ORDER BY opened_at, lesson_slug',
      [user.id],
    );
    const [{ last }] = await this.dataSource.query(
      `SELECT greatest(
          (SELECT max(last_activity_at) FROM lesson_progress WHERE user_id = $1),
          (SELECT max(greatest(started_at, submitted_at)) FROM quiz_attempt WHERE user_id = $1),
          (SELECT max(r.answered_at) FROM quiz_response r JOIN quiz_attempt a ON a.id = r.attempt_id WHERE a.user_id = $1)
        ) AS last`,
      [user.id],
    );
    return { lessons: rows.map(toView), quizzes, lastActivity: last ? new Date(last).toISOString() : null };
  }

  /**
   * xAPI statements, newest first: an apprentice's own, an instructor's cohorts' apprentices', an
   * admin's all. Shop owners get none of them (answers and scores are between apprentice and instructor).
   */
  async learningRecords(viewer: User, query: { limit: number; before?: string }, selfUrl: string): Promise<LearningRecordsPage> {
    if (viewer.role === 'shop_owner') throw HttpProblem.forbidden('Learning records are for apprentices, their instructors and admins.');
    const scope =
      viewer.role === 'admin'
        ? '$1::uuid IS NOT NULL'
        : viewer.role === 'instructor'
          ? 'r.user_id IN (SELECT m.user_id FROM cohort_member m JOIN cohort c ON c.id = m.cohort_id WHERE c.instructor_id = $1)'
          : 'r.user_id = $1';
    const [beforeTime, beforeId] = query.before ? query.before.split(',') : [null, null];
    const rows: Array<{ id: string; statement: Record<string, unknown>; stored_at: Date }> = await this.dataSource.query(
      `SELECT r.id, r.statement, r.stored_at FROM learning_record r
        WHERE ${scope} AND ($2::timestamptz IS NULL OR (r.stored_at, r.id) < ($2::timestamptz, $3::uuid))
        ORDER BY r.stored_at DESC, r.id DESC LIMIT $4`,
      [viewer.id, beforeTime, beforeId, query.limit + 1],
    );
    const page = rows.slice(0, query.limit);
    const last = page.at(-1);
    const more = rows.length > query.limit && last ? `${selfUrl}?limit=${query.limit}&before=${encodeURIComponent(`${new Date(last.stored_at).toISOString()},${last.id}`)}` : '';
    return { statements: page.map((r) => ({ ...r.statement, stored: new Date(r.stored_at).toISOString() })), more };
  }
}

interface ProgressRow {
  lesson_slug: string;
  opened_at: Date;
  finished_at: Date | null;
  last_activity_at: Date;
}

function toView(row: ProgressRow): LessonProgressView {
  return {
    slug: row.lesson_slug,
    openedAt: new Date(row.opened_at).toISOString(),
    finishedAt: row.finished_at ? new Date(row.finished_at).toISOString() : null,
    lastActivityAt: new Date(row.last_activity_at).toISOString(),
  };
}
