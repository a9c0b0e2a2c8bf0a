import type { DataSource } from 'typeorm';

import type { User } from '../accounts/user.entity';

/**
 * The one place that decides who may take a quiz and who may see an apprentice's attempts.
 * Today every signed-in apprentice may take every quiz; the seat rule (a later issue) goes here.
 */
export function mayTakeQuiz(user: User, _quizSlug: string): boolean {
  return user.role === 'apprentice' && user.disabledAt === null;
}

/**
 * May `viewer` see the attempts (answers, results) of apprentice `ownerId`? The apprentice
 * themself, an instructor of a cohort the apprentice is in, an admin. Shop owners never see answers.
 */
export async function mayViewAttemptsOf(dataSource: DataSource, viewer: User, ownerId: string): Promise<boolean> {
  if (viewer.id === ownerId || viewer.role === 'admin') return true;
  if (viewer.role !== 'instructor') return false;
  const rows: unknown[] = await dataSource.query(
    `SELECT 1 FROM cohort c JOIN cohort_member m ON m.cohort_id = c.id WHERE c.instructor_id = $1 AND m.user_id = $2 LIMIT 1`,
    [viewer.id, ownerId],
  );
  return rows.length > 0;
}

/**
 * May `viewer` grade, override and regrade the answers of apprentice `ownerId`? An instructor of a
 * cohort the apprentice is in, or an admin. Never the apprentice themself, never a shop owner.
 */
export async function mayGradeAttemptsOf(dataSource: DataSource, viewer: User, ownerId: string): Promise<boolean> {
  if (viewer.role === 'admin') return true;
  if (viewer.role !== 'instructor' || viewer.id === ownerId) return false;
  return mayViewAttemptsOf(dataSource, viewer, ownerId);
}

/**
 * The same rule as a SQL condition for lists (the grading queue, regrades): `userIdColumn` is an
 * apprentice the viewer may grade. `$n` is the viewer's id, or null for an admin (everyone).
 */
export function gradableApprentices(viewer: User, userIdColumn: string, n: number): { sql: string; param: string | null } {
  return {
    sql: `($${n}::uuid IS NULL OR EXISTS (SELECT 1 FROM cohort gc JOIN cohort_member gm ON gm.cohort_id = gc.id
            WHERE gc.instructor_id = $${n}::uuid AND gm.user_id = ${userIdColumn}))`,
    param: viewer.role === 'admin' ? null : viewer.id,
  };
}
