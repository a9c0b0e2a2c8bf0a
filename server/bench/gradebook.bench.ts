/**
 * The gradebook part of `npm run bench:grading`. Generates cohorts of 1 000 and 10 000 apprentices
 * (30 attempts each: 10 quizzes × 3, some open, some waiting for grading; 10 lessons each) straight
 * in SQL (the standing tables refreshed once per apprentice and quiz), then times a 50-row page sorted by a quiz column and filtered by status (p50 and p95), and
 * streams each cohort's CSV, sampling the process's RSS. Prints its figures beside the issue's
 * goals: p95 ≤ 100 ms at 10 000; p95 at 10 000 within 2× the p95 at 1 000 (cost grows with the
 * page, not the cohort); the 10 000-row CSV with flat memory.
 */
import { performance } from 'node:perf_hooks';
import { Writable } from 'node:stream';

import type { DataSource } from 'typeorm';

import type { GradebookQuery } from '../../shared/api/gradebook';
import type { Cohort } from '../cohorts/cohort.entity';
import { CSV_BOM, gradebookCsvHeader, gradebookCsvRow } from '../gradebook/gradebook-csv';
import { GradebookService } from '../gradebook/gradebook.service';
import type { LoadedQuiz, QuizLibrary } from '../quizzes/quiz-library';

const QUIZZES = Array.from({ length: 10 }, (_, i) => `bench-quiz-${i + 1}`);
const LESSONS = Array.from({ length: 10 }, (_, i) => `bench-lesson-${i + 1}`);
const WARM_UP = 10;
const RUNS = Number(process.env['BENCH_GRADEBOOK_RUNS'] ?? 100);
const SIZES = (process.env['BENCH_GRADEBOOK_SIZES'] ?? '1000,10000').split(',').map(Number);

/** Only slugs, titles and pass marks matter to the gradebook. */
function benchLibrary(): QuizLibrary {
  const quizzes = new Map<string, LoadedQuiz>();
  QUIZZES.forEach((slug, i) => quizzes.set(slug, { definition: { lesson: slug, title: `Bench quiz ${i + 1}`, passMark: 80 } } as unknown as LoadedQuiz));
  return { quizzes, errors: [], missing: [] };
}

/** A cohort of `size` new apprentices with their attempts and lessons; answers the cohort. */
async function generateCohort(dataSource: DataSource, size: number): Promise<Cohort> {
  const tag = `${size}-${Date.now().toString(36)}`;
  const [instructor] = await dataSource.query(
    `INSERT INTO user_account (email, display_name, password_hash, role, verified_at) VALUES ($1, 'Bench instructor', 'not-a-hash', 'instructor', now()) RETURNING id`,
    [`bench-instructor-${tag}@bench.flowlore.test`],
  );
  const [cohort] = await dataSource.query(`INSERT INTO cohort (name, instructor_id) VALUES ($1, $2) RETURNING id, name, instructor_id AS "instructorId"`, [`Bench cohort ${tag}`, instructor.id]);
  await dataSource.query(
    `WITH users AS (
       INSERT INTO user_account (email, display_name, password_hash, role, verified_at, created_at)
       SELECT 'bench-' || $1 || '-' || g || '@bench.flowlore.test', 'Apprentice ' || lpad(g::text, 5, '0'), 'not-a-hash', 'apprentice', now(), now() - interval '60 days'
         FROM generate_series(1, $2::int) AS g
       RETURNING id)
     INSERT INTO cohort_member (cohort_id, user_id, added_at) SELECT $3, id, now() - interval '60 days' FROM users`,
    [tag, size, cohort.id],
  );
  // Bulk rows without the per-row triggers; the standing is refreshed once per apprentice and quiz below.
  await dataSource.query('ALTER TABLE quiz_attempt DISABLE TRIGGER quiz_attempt_gradebook');
  await dataSource.query('ALTER TABLE lesson_progress DISABLE TRIGGER lesson_progress_gradebook');
  // 10 quizzes × 3 attempts. Scores spread 20–100 %; 1 in 50 last attempts open, 1 in 20 waiting for grading.
  await dataSource.query(
    `INSERT INTO quiz_attempt (user_id, quiz_slug, number, seed, status, pass_mark, started_at, submitted_at, points, max_points, score_percent, passed, pending_count)
     SELECT user_id, slug, n, 1,
            CASE WHEN open THEN 'open'::quiz_attempt_status ELSE 'submitted' END, 80,
            at, CASE WHEN open THEN NULL ELSE at + interval '20 minutes' END,
            CASE WHEN open THEN NULL ELSE score END, 100,
            CASE WHEN open THEN NULL ELSE score END,
            CASE WHEN open THEN NULL ELSE score >= 80 END,
            CASE WHEN NOT open AND pending THEN 1 ELSE 0 END
       FROM (
         -- random() in the select list: drawn per row (a LATERAL on n alone would be memoised per n).
         SELECT m.user_id, q.slug, n, n = 3 AND random() < 0.02 AS open, random() < 0.05 AS pending,
                round((20 + random() * 80)::numeric, 1)::float8 AS score, now() - random() * interval '40 days' AS at
           FROM cohort_member m CROSS JOIN unnest($2::text[]) AS q(slug) CROSS JOIN generate_series(1, 3) AS n
          WHERE m.cohort_id = $1) AS drawn`,
    [cohort.id, QUIZZES],
  );
  await dataSource.query(
    `INSERT INTO lesson_progress (user_id, lesson_slug, opened_at, finished_at, last_activity_at)
     SELECT user_id, slug, at, CASE WHEN finished THEN at END, at
       FROM (SELECT m.user_id, l.slug, random() < 0.7 AS finished, now() - random() * interval '40 days' AS at
               FROM cohort_member m CROSS JOIN unnest($2::text[]) AS l(slug) WHERE m.cohort_id = $1) AS drawn`,
    [cohort.id, LESSONS],
  );
  await dataSource.query('ALTER TABLE quiz_attempt ENABLE TRIGGER quiz_attempt_gradebook');
  await dataSource.query('ALTER TABLE lesson_progress ENABLE TRIGGER lesson_progress_gradebook');
  await dataSource.query(
    `SELECT gradebook_refresh_quiz(m.user_id, q.slug) FROM cohort_member m CROSS JOIN unnest($2::text[]) AS q(slug) WHERE m.cohort_id = $1`,
    [cohort.id, QUIZZES],
  );
  // What autovacuum does to a table in use: statistics, and the visibility map that lets the
  // count of a page's matches read the standing index alone (a bulk load leaves it unset).
  await dataSource.query('VACUUM (ANALYZE) user_account, cohort_member, quiz_attempt, lesson_progress, quiz_standing, learner_standing');
  return cohort as Cohort;
}

function percentile(sorted: number[], p: number): number {
  return sorted[Math.min(sorted.length - 1, Math.ceil((p / 100) * sorted.length) - 1)]!;
}

async function timePages(gradebook: GradebookService, cohort: Cohort): Promise<{ p50: number; p95: number; total: number }> {
  const query = (i: number): GradebookQuery => ({ sort: 'quiz:bench-quiz-3', dir: 'desc', status: 'not-yet-passed', page: 1 + (i % 5), pageSize: 50 });
  for (let i = 0; i < WARM_UP; i++) await gradebook.page(cohort, query(i));
  const times: number[] = [];
  let total = 0;
  for (let i = 0; i < RUNS; i++) {
    const start = performance.now();
    const page = await gradebook.page(cohort, query(i));
    times.push(performance.now() - start);
    total = page.total;
    if (page.rows.length !== 50) throw new Error(`page ${query(i).page} had ${page.rows.length} rows, not 50`);
  }
  times.sort((a, b) => a - b);
  return { p50: percentile(times, 50), p95: percentile(times, 95), total };
}

/** Streams the whole CSV into a sink that drains slowly enough to push back; samples RSS meanwhile. */
async function streamCsv(gradebook: GradebookService, cohort: Cohort): Promise<{ rows: number; bytes: number; seconds: number; baseMB: number; peakMB: number }> {
  global.gc?.();
  const baseRss = process.memoryUsage().rss;
  let peak = baseRss;
  const sampler = setInterval(() => (peak = Math.max(peak, process.memoryUsage().rss)), 5);
  let bytes = 0;
  let rows = 0;
  const sink = new Writable({
    highWaterMark: 64 * 1024,
    write(chunk: Buffer, _enc, done) {
      bytes += chunk.length;
      setImmediate(done);
    },
  });
  const write = async (text: string) => {
    if (!sink.write(text)) await new Promise((resolve) => sink.once('drain', resolve));
  };
  const start = performance.now();
  let first = true;
  await gradebook.eachBatch(cohort, { sort: 'name', dir: 'asc' }, 500, async (batch, columns) => {
    if (first) await write(CSV_BOM + gradebookCsvHeader(columns, LESSONS.length));
    first = false;
    for (const row of batch) await write(gradebookCsvRow(row, columns));
    rows += batch.length;
    return true;
  });
  await new Promise<void>((resolve) => sink.end(resolve));
  const seconds = (performance.now() - start) / 1000;
  clearInterval(sampler);
  peak = Math.max(peak, process.memoryUsage().rss);
  return { rows, bytes, seconds, baseMB: baseRss / 2 ** 20, peakMB: peak / 2 ** 20 };
}

const verdict = (ok: boolean) => (ok ? 'met' : 'NOT met');

export async function gradebookBench(dataSource: DataSource): Promise<void> {
  const gradebook = new GradebookService(dataSource, { quizzes: benchLibrary, lessonSlugs: () => LESSONS });
  console.log(`\nGradebook: a 50-row page sorted by a quiz column, filtered by status; ${RUNS} runs after ${WARM_UP} warm-up`);
  const results: Array<{ size: number; p50: number; p95: number; csv: Awaited<ReturnType<typeof streamCsv>> }> = [];
  for (const size of SIZES) {
    const started = performance.now();
    const cohort = await generateCohort(dataSource, size);
    console.log(`  ${size} apprentices × 30 attempts generated in ${((performance.now() - started) / 1000).toFixed(1)} s`);
    const pages = await timePages(gradebook, cohort);
    const csv = await streamCsv(gradebook, cohort);
    results.push({ size, ...pages, csv });
    console.log(`  ${String(size).padStart(6)} apprentices (${pages.total} match): p50 ${pages.p50.toFixed(1)} ms, p95 ${pages.p95.toFixed(1)} ms`);
    console.log(
      `         CSV: ${csv.rows} rows, ${(csv.bytes / 2 ** 20).toFixed(1)} MiB in ${csv.seconds.toFixed(2)} s; RSS ${csv.baseMB.toFixed(0)} → peak ${csv.peakMB.toFixed(0)} MiB (+${(csv.peakMB - csv.baseMB).toFixed(1)})`,
    );
  }
  const small = results.find((r) => r.size === 1000);
  const large = results.find((r) => r.size === 10000);
  if (large) console.log(`  p95 at 10 000 ≤ 100 ms: ${large.p95.toFixed(1)} ms — ${verdict(large.p95 <= 100)}`);
  if (small && large) {
    const ratio = large.p95 / small.p95;
    console.log(`  p95 10 000 / 1 000 ≤ 2×: ${ratio.toFixed(2)}× — ${verdict(ratio <= 2)}`);
    const rise = (r: typeof large) => r.csv.peakMB - r.csv.baseMB;
    // Flat: the 10× larger export raises the peak no more than twice as much (or under 32 MiB at all).
    const flat = rise(large) <= Math.max(2 * rise(small), 32);
    console.log(`  CSV memory flat (10 000 rows: +${rise(large).toFixed(1)} MiB vs 1 000: +${rise(small).toFixed(1)} MiB): ${verdict(flat)}`);
  }
}
