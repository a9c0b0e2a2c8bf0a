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
    const sql = this.bookSql(this.cohortMembers(cohort.id, params), columns, query, params, { limit: query.pageSize, offset: (query.page - 1) * query.pageSize });
    // The count on its own: it reads only the ids (and names when searching) of the matching rows,
    // while the page walks the sort's index and stops at its last row.
    const countParams = new Params();
    const countSql = this.bookSql(this.cohortMembers(cohort.id, countParams, query.q !== undefined && query.q !== ''), columns, query, countParams, 'count');
    const rows: BookRow[] = await this.dataSource.query(sql, params.values);
    const [{ n: total }] = await this.dataSource.query(countSql, countParams.values);
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

  /** The cohort's apprentices; without `names`, only ids and when they joined (enough to count). */
  private cohortMembers(cohortId: string, params: Params, names = true): string {
    return names
      ? `SELECT m.user_id, u.display_name, u.email, m.added_at FROM cohort_member m JOIN user_account u ON u.id = m.user_id
             WHERE m.cohort_id = ${params.add(cohortId, 'uuid')}`
      : `SELECT m.user_id, m.added_at FROM cohort_member m WHERE m.cohort_id = ${params.add(cohortId, 'uuid')}`;
  }

  /**
   * The gradebook's query over the apprentices `members` selects (user_id, display_name, email,
   * added_at). It reads the standing the triggers keep (migration 1796400000000): one learner row
   * per apprentice, plus the sorted or filtered quiz's row, to sort, filter and count; then the
   * per-quiz cells only for the rows of the page. Only whitelisted pieces are spliced in; every
   * value is a parameter.
   */
  private bookSql(members: string, columns: GradebookQuizColumn[], filters: Filters, params: Params, paging?: { limit: number; offset: number } | 'count'): string {
    // Parameters are numbered when first used: the count leaves out pieces the page has.
    const once = (add: () => string) => {
      let placeholder: string | undefined;
      return () => (placeholder ??= add());
    };
    const quizSlugs = once(() => params.add(columns.map((c) => c.slug), 'text[]'));
    const now = once(() => params.add(this.now(), 'timestamptz'));
    const idleDays = once(() => params.add(NEEDS_HELP_IDLE_DAYS, 'int'));
    const failedLimit = once(() => params.add(NEEDS_HELP_FAILED_ATTEMPTS, 'int'));

    const sortQuiz = filters.sort.startsWith('quiz:') ? filters.sort.slice('quiz:'.length) : undefined;
    if (sortQuiz !== undefined && !columns.some((c) => c.slug === sortQuiz)) {
      throw HttpProblem.badRequest('The query is not valid.', [{ field: 'sort', message: `There is no quiz "${sortQuiz}".` }]);
    }
    if (filters.quiz !== undefined && !columns.some((c) => c.slug === filters.quiz)) {
      throw HttpProblem.badRequest('The query is not valid.', [{ field: 'quiz', message: `There is no quiz "${filters.quiz}".` }]);
    }
    const statusQuiz = filters.quiz ?? sortQuiz;

    const joins: string[] = [];
    const extra: string[] = [];
    // Sorted by the quiz whose status filters: the filter's own row carries the score (no second join).
    const sortsByFilterRow =
      sortQuiz !== undefined && statusQuiz === sortQuiz && filters.status !== undefined && filters.status !== 'not-started' && (GRADEBOOK_QUIZ_STATUSES as readonly string[]).includes(filters.status);
    if (sortQuiz !== undefined && !sortsByFilterRow) {
      joins.push(`LEFT JOIN quiz_standing sq ON sq.user_id = m.user_id AND sq.quiz_slug = ${params.add(sortQuiz, 'text')}`);
      extra.push('sq.best_percent AS sort_best');
    }
    if (sortsByFilterRow) extra.push('fq.best_percent AS sort_best');
    const where: string[] = [];
    if (filters.q) {
      const pattern = params.add(`%${filters.q.replace(/[\\%_]/g, (c) => `\\${c}`)}%`, 'text');
      where.push(`(b.display_name ILIKE ${pattern} OR b.email ILIKE ${pattern})`);
    }
    if (filters.status === 'needs-help') {
      where.push('b.needs_help');
    } else if (filters.status && (GRADEBOOK_QUIZ_STATUSES as readonly string[]).includes(filters.status)) {
      const status = () => params.add(filters.status, 'text');
      if (statusQuiz !== undefined && filters.status === 'not-started') {
        where.push(`NOT EXISTS (SELECT 1 FROM quiz_standing fq WHERE fq.user_id = b.user_id AND fq.quiz_slug = ${params.add(statusQuiz, 'text')})`);
      } else if (statusQuiz !== undefined) {
        // An inner join on (quiz, status): the index gives just the matching rows.
        joins.push(`JOIN quiz_standing fq ON fq.user_id = m.user_id AND fq.quiz_slug = ${params.add(statusQuiz, 'text')} AND fq.status = ${status()}`);
      } else if (filters.status === 'not-started') {
        where.push(`(SELECT count(*) FROM quiz_standing qs WHERE qs.user_id = b.user_id AND qs.quiz_slug = ANY(${quizSlugs()})) < cardinality(${quizSlugs()})`);
      } else {
        where.push(`EXISTS (SELECT 1 FROM quiz_standing qs WHERE qs.user_id = b.user_id AND qs.quiz_slug = ANY(${quizSlugs()}) AND qs.status = ${status()})`);
      }
    }

    const dir = filters.dir === 'desc' ? 'DESC' : 'ASC';
    // Nothing yet (no score, no activity) counts as the lowest value either way.
    const nulls = dir === 'ASC' ? 'NULLS FIRST' : 'NULLS LAST';
    const sortKey =
      sortQuiz !== undefined
        ? `b.sort_best ${dir} ${nulls}`
        : {
            name: `lower(b.display_name) ${dir}`,
            lessons: `b.lessons_finished ${dir}, b.quizzes_passed ${dir}`,
            quizzesPassed: `b.quizzes_passed ${dir}, b.lessons_finished ${dir}`,
            lastActivity: `b.last_activity ${dir} ${nulls}`,
            needsHelp: `b.needs_help ${dir}`,
          }[filters.sort as 'name'];
    if (!sortKey) throw HttpProblem.badRequest('The query is not valid.', [{ field: 'sort', message: 'Not a column of the gradebook.' }]);
    const order = `${sortKey}, lower(b.display_name), b.user_id`;
    const page = paging && paging !== 'count' ? `LIMIT ${params.add(paging.limit, 'int')} OFFSET ${params.add(paging.offset, 'int')}` : '';

    // The learner's standing is read for every member only when a filter or the sort needs it;
    // otherwise just for the rows of the page (the cost then grows with the page, not the cohort).
    const learnerColumns = (ls: string, added: string) => `
               coalesce(${ls}.lessons_finished, 0) AS lessons_finished,
               coalesce(${ls}.quizzes_passed, 0) AS quizzes_passed,
               ${ls}.last_activity_at AS last_activity,
               (coalesce(${ls}.max_failed_attempts, 0) >= ${failedLimit()}
                 OR coalesce(${ls}.last_activity_at, ${added}) < ${now()} - make_interval(days => ${idleDays()})) AS needs_help`;
    const learnerFirst = filters.status === 'needs-help' || (sortQuiz === undefined && filters.sort !== 'name');

    const book = (names: boolean) => `
      WITH members AS (${members}),
      book AS (
        SELECT m.user_id, m.added_at${names ? ', m.display_name, m.email' : ''}
               ${learnerFirst ? `, ${learnerColumns('ls', 'm.added_at')}` : ''}
               ${extra.map((e) => `, ${e}`).join('')}
          FROM members m
          ${learnerFirst ? 'LEFT JOIN learner_standing ls ON ls.user_id = m.user_id' : ''}
          ${joins.join('\n          ')}
      )`;
    if (paging === 'count') {
      return `${book(filters.q !== undefined && filters.q !== '')}
      SELECT count(*)::int AS n FROM book b ${where.length ? `WHERE ${where.join(' AND ')}` : ''}`;
    }

    return `${book(true)},
      page AS (
        SELECT b.*
          FROM book b
         ${where.length ? `WHERE ${where.join(' AND ')}` : ''}
         ORDER BY ${order}
         ${page}
      )
      SELECT b.user_id, b.display_name, b.email, b.added_at,
             ${learnerColumns('pl', 'b.added_at')},
             coalesce((SELECT jsonb_object_agg(qs.quiz_slug, jsonb_build_object('s', qs.status, 'b', qs.best_percent, 'u', qs.attempts_used, 'f', qs.failed_attempts))
                         FROM quiz_standing qs WHERE qs.user_id = b.user_id AND qs.quiz_slug = ANY(${quizSlugs()})), '{}'::jsonb) AS cells
        FROM page b
        LEFT JOIN learner_standing pl ON pl.user_id = b.user_id
       ORDER BY ${order}`;
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
