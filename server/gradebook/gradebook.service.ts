import type { DataSource, QueryRunner } from 'typeorm';

import {
  GRADEBOOK_QUIZ_STATUSES,
  NEEDS_HELP_FAILED_ATTEMPTS,
  NEEDS_HELP_IDLE_DAYS,
  type GradebookCell,
  type GradebookCsvQuery,
  type GradebookPage,
  type GradebookQuery,
  type GradebookQuizColumn,
  type GradebookQuizStatus,
  type GradebookRow,
  type NeedsHelpReason,
  type ShopProgress,
} from '../../shared/api/gradebook';
import type { Cohort } from '../cohorts/cohort.entity';
import { HttpProblem } from '../http/problem';
import type { QuizLibrary } from '../quizzes/quiz-library';

export interface GradebookOptions {
  readonly quizzes: () => QuizLibrary;
  readonly lessonSlugs: () => readonly string[];
  readonly now?: () => Date;
}

/** One row as the SQL returns it. */
interface BookRow {
  user_id: string;
  display_name: string;
  email: string;
  added_at: Date;
  cells: Record<string, { s: GradebookQuizStatus; b: number | null; u: number; f: number }>;
  quizzes_passed: number;
  lessons_finished: number;
  last_activity: Date | null;
  needs_help: boolean;
  total?: number;
}

/** Positional parameters for a query built from whitelisted pieces. */
class Params {
  readonly values: unknown[] = [];
  add(value: unknown, type: string): string {
    this.values.push(value);
    return `$${this.values.length}::${type}`;
  }
}

type Filters = Pick<GradebookQuery, 'sort' | 'dir' | 'status' | 'quiz' | 'q'>;

/**
 * The cohort gradebook and the shop owner's progress view: one SQL query with aggregates per
 * apprentice (best score and status per quiz, lessons finished, quizzes passed, last activity,
 * needs help); sorting, filtering and paging happen in PostgreSQL. The CSV runs the same query
 * through a cursor, a batch at a time, so memory stays flat however big the cohort.
 */
export class GradebookService {
  private readonly now: () => Date;

  constructor(
    private readonly dataSource: DataSource,
    private readonly options: GradebookOptions,
  ) {
    this.now = options.now ?? (() => new Date());
  }

  columns(): GradebookQuizColumn[] {
    return [...this.options.quizzes().quizzes].map(([slug, loaded]) => ({ slug, title: loaded.definition.title, passMark: loaded.definition.passMark }));
  }

  lessonCount(): number {
    return this.options.lessonSlugs().length;
  }

  async page(cohort: Cohort, query: GradebookQuery): Promise<GradebookPage> {
    const columns = this.columns();
    const params = new Params();
    const sql = this.bookSql(this.cohortMembers(cohort.id, params), columns, query, params);
    const limit = params.add(query.pageSize, 'int');
    const offset = params.add((query.page - 1) * query.pageSize, 'int');
    const rows: BookRow[] = await this.dataSource.query(`${sql} LIMIT ${limit} OFFSET ${offset}`, params.values);
    let total = rows[0]?.total ?? 0;
    if (rows.length === 0 && query.page > 1) {
      // Past the last page: count what the filters match (the window count needs a row to ride on).
      const countParams = new Params();
      const countSql = this.bookSql(this.cohortMembers(cohort.id, countParams), columns, query, countParams);
      const [{ n }] = await this.dataSource.query(`SELECT count(*)::int AS n FROM (${countSql}) AS book`, countParams.values);
      total = n;
    }
    return {
      cohort: { id: cohort.id, name: cohort.name },
      quizzes: columns,
      lessonCount: this.lessonCount(),
      rows: rows.map((row) => this.toRow(row, columns)),
      total,
      page: query.page,
      pageSize: query.pageSize,
    };
  }

  /**
   * The whole gradebook (sorted and filtered like the page) in batches from a server-side cursor
   * inside one read-only transaction. `onBatch` may wait (back-pressure); returning false stops.
   */
  async eachBatch(cohort: Cohort, query: GradebookCsvQuery, batchSize: number, onBatch: (rows: GradebookRow[], columns: GradebookQuizColumn[]) => Promise<boolean>): Promise<void> {
    const columns = this.columns();
    const params = new Params();
    const sql = this.bookSql(this.cohortMembers(cohort.id, params), columns, query, params);
    const runner: QueryRunner = this.dataSource.createQueryRunner();
    await runner.connect();
    try {
      await runner.query('BEGIN ISOLATION LEVEL REPEATABLE READ READ ONLY');
      await runner.query(`DECLARE gradebook_csv NO SCROLL CURSOR FOR ${sql}`, params.values);
      for (;;) {
        const rows: BookRow[] = await runner.query(`FETCH ${Math.max(1, Math.floor(batchSize))} FROM gradebook_csv`);
        if (rows.length === 0) break;
        if (!(await onBatch(rows.map((row) => this.toRow(row, columns)), columns))) break;
      }
      await runner.query('COMMIT');
    } catch (error) {
      await runner.query('ROLLBACK').catch(() => undefined);
      throw error;
    } finally {
      await runner.release();
    }
  }

  /** A shop's apprentices: lessons finished, quizzes passed, last activity. Nothing per question. */
  async shopProgress(shopId: string): Promise<ShopProgress> {
    const shops: Array<{ id: string; name: string }> = await this.dataSource.query('SELECT id, name FROM shop WHERE id = $1', [shopId]);
    const shop = shops[0];
    if (!shop) throw HttpProblem.notFound('Your shop was not found.');
    const columns = this.columns();
    const params = new Params();
    const members = `SELECT u.id AS user_id, u.display_name, u.email, u.created_at AS added_at FROM user_account u
                      WHERE u.shop_id = ${params.add(shopId, 'uuid')} AND u.role = 'apprentice' AND u.disabled_at IS NULL`;
    const rows: BookRow[] = await this.dataSource.query(this.bookSql(members, columns, { sort: 'name', dir: 'asc' }, params), params.values);
    return {
      shop,
      lessonCount: this.lessonCount(),
      quizCount: columns.length,
      apprentices: rows.map((row) => ({
        userId: row.user_id,
        displayName: row.display_name,
        lessonsFinished: row.lessons_finished,
        quizzesPassed: row.quizzes_passed,
        lastActivity: row.last_activity ? new Date(row.last_activity).toISOString() : null,
      })),
    };
  }

  private cohortMembers(cohortId: string, params: Params): string {
    return `SELECT m.user_id, u.display_name, u.email, m.added_at FROM cohort_member m JOIN user_account u ON u.id = m.user_id
             WHERE m.cohort_id = ${params.add(cohortId, 'uuid')}`;
  }

  /**
   * The gradebook's query over the apprentices `members` selects (user_id, display_name, email,
   * added_at). Only whitelisted pieces are spliced in; every value is a parameter.
   */
  private bookSql(members: string, columns: GradebookQuizColumn[], filters: Filters, params: Params): string {
    const quizSlugs = params.add(columns.map((c) => c.slug), 'text[]');
    const lessonSlugs = params.add([...this.options.lessonSlugs()], 'text[]');
    const now = params.add(this.now(), 'timestamptz');
    const idleDays = params.add(NEEDS_HELP_IDLE_DAYS, 'int');
    const failedLimit = params.add(NEEDS_HELP_FAILED_ATTEMPTS, 'int');

    const where: string[] = [];
    if (filters.q) {
      const pattern = params.add(`%${filters.q.replace(/[\\%_]/g, (c) => `\\${c}`)}%`, 'text');
      where.push(`(b.display_name ILIKE ${pattern} OR b.email ILIKE ${pattern})`);
    }
    const sortQuiz = filters.sort.startsWith('quiz:') ? filters.sort.slice('quiz:'.length) : undefined;
    if (sortQuiz !== undefined && !columns.some((c) => c.slug === sortQuiz)) {
      throw HttpProblem.badRequest('The query is not valid.', [{ field: 'sort', message: `There is no quiz "${sortQuiz}".` }]);
    }
    const statusQuiz = filters.quiz ?? sortQuiz;
    if (filters.quiz !== undefined && !columns.some((c) => c.slug === filters.quiz)) {
      throw HttpProblem.badRequest('The query is not valid.', [{ field: 'quiz', message: `There is no quiz "${filters.quiz}".` }]);
    }
    if (filters.status === 'needs-help') {
      where.push('b.needs_help');
    } else if (filters.status && (GRADEBOOK_QUIZ_STATUSES as readonly string[]).includes(filters.status)) {
      const status = params.add(filters.status, 'text');
      where.push(
        statusQuiz !== undefined
          ? `coalesce(b.cells -> ${params.add(statusQuiz, 'text')} ->> 's', 'not-started') = ${status}`
          : `EXISTS (SELECT 1 FROM unnest(${quizSlugs}) AS s(slug) WHERE coalesce(b.cells -> s.slug ->> 's', 'not-started') = ${status})`,
      );
    }

    const dir = filters.dir === 'desc' ? 'DESC' : 'ASC';
    // Nothing yet (no score, no activity) counts as the lowest value either way.
    const nulls = dir === 'ASC' ? 'NULLS FIRST' : 'NULLS LAST';
    const sortKey =
      sortQuiz !== undefined
        ? `(b.cells -> ${params.add(sortQuiz, 'text')} ->> 'b')::float8 ${dir} ${nulls}`
        : {
            name: `lower(b.display_name) ${dir}`,
            lessons: `b.lessons_finished ${dir}, b.quizzes_passed ${dir}`,
            quizzesPassed: `b.quizzes_passed ${dir}, b.lessons_finished ${dir}`,
            lastActivity: `b.last_activity ${dir} ${nulls}`,
            needsHelp: `b.needs_help ${dir}`,
          }[filters.sort as 'name'];
    if (!sortKey) throw HttpProblem.badRequest('The query is not valid.', [{ field: 'sort', message: 'Not a column of the gradebook.' }]);

    return `
      WITH members AS (${members}),
      attempts AS (
        SELECT a.user_id, a.quiz_slug,
               count(*)::int AS used,
               max(a.score_percent) FILTER (WHERE a.status = 'submitted') AS best,
               coalesce(bool_or(a.passed) FILTER (WHERE a.status = 'submitted'), false) AS passed,
               count(*) FILTER (WHERE a.status = 'submitted')::int AS graded,
               count(*) FILTER (WHERE a.status = 'submitted' AND a.pending_count > 0)::int AS pending,
               count(*) FILTER (WHERE a.status = 'submitted' AND a.pending_count = 0 AND a.passed IS NOT TRUE)::int AS failed,
               max(greatest(a.started_at, a.submitted_at, answered.at)) AS last_at
          FROM members m
          JOIN quiz_attempt a ON a.user_id = m.user_id AND a.quiz_slug = ANY(${quizSlugs})
          -- A submitted attempt's answers are no later than its submit; only open ones need a look.
          LEFT JOIN LATERAL (SELECT max(r.answered_at) AS at FROM quiz_response r WHERE a.status = 'open' AND r.attempt_id = a.id) answered ON true
         GROUP BY a.user_id, a.quiz_slug
      ),
      quiz_rows AS (
        SELECT c.user_id,
               jsonb_object_agg(c.quiz_slug, jsonb_build_object(
                 's', CASE WHEN c.passed THEN 'passed' WHEN c.pending > 0 THEN 'waiting-for-grading' WHEN c.graded > 0 THEN 'not-yet-passed' ELSE 'in-progress' END,
                 'b', c.best, 'u', c.used, 'f', c.failed)) AS cells,
               count(*) FILTER (WHERE c.passed)::int AS passed,
               max(c.failed) AS max_failed,
               max(c.last_at) AS last_at
          FROM attempts c GROUP BY c.user_id
      ),
      lesson_rows AS (
        SELECT lp.user_id,
               count(*) FILTER (WHERE lp.finished_at IS NOT NULL AND lp.lesson_slug = ANY(${lessonSlugs}))::int AS finished,
               max(lp.last_activity_at) AS last_at
          FROM members m JOIN lesson_progress lp ON lp.user_id = m.user_id
         GROUP BY lp.user_id
      ),
      book AS (
        SELECT m.user_id, m.display_name, m.email, m.added_at,
               coalesce(q.cells, '{}'::jsonb) AS cells,
               coalesce(q.passed, 0) AS quizzes_passed,
               coalesce(l.finished, 0) AS lessons_finished,
               greatest(q.last_at, l.last_at) AS last_activity,
               (coalesce(q.max_failed, 0) >= ${failedLimit}
                 OR coalesce(greatest(q.last_at, l.last_at), m.added_at) < ${now} - make_interval(days => ${idleDays})) AS needs_help
          FROM members m
          LEFT JOIN quiz_rows q ON q.user_id = m.user_id
          LEFT JOIN lesson_rows l ON l.user_id = m.user_id
      )
      SELECT b.*, count(*) OVER ()::int AS total
        FROM book b
       ${where.length ? `WHERE ${where.join(' AND ')}` : ''}
       ORDER BY ${sortKey}, lower(b.display_name), b.user_id`;
  }

  private toRow(row: BookRow, columns: GradebookQuizColumn[]): GradebookRow {
    const quizzes: Record<string, GradebookCell> = {};
    const reasons: NeedsHelpReason[] = [];
    for (const { slug } of columns) {
      const cell = row.cells[slug];
      quizzes[slug] = cell
        ? { status: cell.s, bestPercent: cell.b === null ? null : Number(cell.b), attemptsUsed: cell.u, failedAttempts: cell.f }
        : { status: 'not-started', bestPercent: null, attemptsUsed: 0, failedAttempts: 0 };
      if (cell && cell.f >= NEEDS_HELP_FAILED_ATTEMPTS) reasons.push({ kind: 'failed-attempts', quiz: slug, count: cell.f });
    }
    const since = new Date(row.last_activity ?? row.added_at);
    const idle = Math.floor((this.now().getTime() - since.getTime()) / 86_400_000);
    if (row.needs_help && idle >= NEEDS_HELP_IDLE_DAYS) reasons.push({ kind: 'inactive', days: idle });
    return {
      userId: row.user_id,
      displayName: row.display_name,
      email: row.email,
      quizzes,
      lessonsFinished: row.lessons_finished,
      quizzesPassed: row.quizzes_passed,
      lastActivity: row.last_activity ? new Date(row.last_activity).toISOString() : null,
      needsHelp: row.needs_help,
      needsHelpReasons: reasons,
    };
  }
}
