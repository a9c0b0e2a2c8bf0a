/**
 * The submits part of `npm run bench:grading` (issue 10): submits per second, each a full graded
 * and persisted attempt of a 6-question quiz, under 32 concurrent clients, beside pgbench's TPS
 * (its default TPC-B-like script, same cluster, same run). Goal: submits/s ≥ 0.3 × pgbench TPS.
 *
 * What is timed: `AttemptsService.submit` only (the route's work less HTTP: the owner check, the
 * grading transaction under the row lock with its gradebook triggers and learning records, and the
 * result as the apprentice sees it). Each attempt is started and its 6 answers autosaved through
 * the same service before the window; the window runs `seconds` or until the prepared attempts run
 * out (sized from a warm-up round's rate, 1.5× over), and its figure is submits over elapsed time.
 * The quiz's questions are all graded on submit (single, multiple, numeric, fresh numbers, numeric,
 * single); a written question would only be queued for an instructor, so it is left out.
 *
 * Each client works through its own apprentices, one attempt each (the quiz's real limit of 3
 * stands): one apprentice with hundreds of attempts at one quiz would time the gradebook trigger,
 * which re-reads every attempt of that apprentice and quiz, not a submit as it happens in a class.
 * The data source is the app's default pool, as in production. Every submit in the window is
 * checked afterwards in the database (status, points, graded responses, learning records); a failed
 * or unpersisted submit is reported and fails the run, never counted as done.
 */
import { writeFileSync } from 'node:fs';
import { Session } from 'node:inspector';
import { availableParallelism } from 'node:os';
import { performance } from 'node:perf_hooks';

import type { DataSource } from 'typeorm';

import type { QuizDefinition } from '../../shared/quiz/definition';
import { User } from '../accounts/user.entity';
import { AttemptsService } from '../quizzes/attempts.service';
import { runPgbench } from './pgbench';
import { BENCH_QUIZ_SLUG as SLUG, benchLibrary, benchQuiz, correctAnswer } from './submits-quiz';

export interface SubmitsBenchOptions {
  /** The timed window, and pgbench's `-T`. */
  readonly seconds: number;
  readonly clients: number;
  /** The cluster's admin URL: pgbench gets a database of its own there. */
  readonly adminUrl: string;
}

const GOAL = 0.3;
const WARM_UP_PER_CLIENT = 2;
const PREPARE_MARGIN = 1.5;
const MAX_PREPARED = 40_000;

interface Prepared {
  readonly user: User;
  readonly attemptId: string;
}

/** `count` new apprentices (plain SQL, as the gradebook part makes them), loaded as entities. */
async function newApprentices(dataSource: DataSource, count: number, label: string): Promise<User[]> {
  const tag = `${label}-${Date.now().toString(36)}`;
  const rows: Array<{ id: string }> = await dataSource.query(
    `INSERT INTO user_account (email, display_name, password_hash, role, verified_at)
     SELECT 'bench-submit-' || $1 || '-' || g || '@bench.flowlore.test', 'Apprentice ' || lpad(g::text, 5, '0'), 'not-a-hash', 'apprentice', now()
       FROM generate_series(1, $2::int) AS g
     RETURNING id`,
    [tag, count],
  );
  return dataSource.getRepository(User).createQueryBuilder('u').where('u.id = ANY(:ids)', { ids: rows.map((r) => r.id) }).getMany();
}

/** Runs one loop per client, all at once; client `c` gets every `clients`-th item. */
function perClient<T>(items: readonly T[], clients: number): T[][] {
  return Array.from({ length: clients }, (_, c) => items.filter((_, i) => i % clients === c));
}

/** Each client starts its apprentices' attempts and autosaves all six answers, one after another. */
async function prepare(service: AttemptsService, dataSource: DataSource, quiz: QuizDefinition, users: readonly User[], clients: number): Promise<Prepared[][]> {
  return Promise.all(
    perClient(users, clients).map(async (mine) => {
      const prepared: Prepared[] = [];
      for (const user of mine) {
        const view = await service.start(user, SLUG);
        const [{ key }] = await dataSource.query(`SELECT key FROM quiz_response WHERE attempt_id = $1 AND question_id = 'fresh-conversion'`, [view.id]);
        for (const question of quiz.questions) await service.saveAnswer(user, view.id, question.id, correctAnswer(question, key));
        prepared.push({ user, attemptId: view.id });
      }
      return prepared;
    }),
  );
}

interface Window {
  readonly done: string[];
  readonly failures: string[];
  readonly latenciesMs: number[];
  readonly seconds: number;
  readonly ranOut: boolean;
}

/** Each client submits its prepared attempts one after another until the time is up. */
async function submitAll(service: AttemptsService, queues: readonly Prepared[][], seconds: number): Promise<Window> {
  const done: string[] = [];
  const failures: string[] = [];
  const latenciesMs: number[] = [];
  let ranOut = false;
  const start = performance.now();
  const end = start + seconds * 1000;
  await Promise.all(
    queues.map(async (queue) => {
      for (const { user, attemptId } of queue) {
        if (performance.now() >= end) return;
        const sent = performance.now();
        try {
          const result = await service.submit(user, attemptId);
          latenciesMs.push(performance.now() - sent);
          if (result.status === 'submitted' && result.score !== undefined) done.push(attemptId);
          else failures.push(`${attemptId}: answered ${result.status} without a score`);
        } catch (error) {
          failures.push(`${attemptId}: ${(error as Error).message}`);
        }
      }
      // Out of attempts before the time was up: the window closes early and says so.
      ranOut ||= performance.now() < end;
    }),
  );
  return { done, failures, latenciesMs, seconds: (performance.now() - start) / 1000, ranOut };
}

/** What the database holds for the submitted attempts: every one graded, full marks, recorded. */
async function persisted(dataSource: DataSource, ids: readonly string[], since: Date) {
  const [row] = await dataSource.query(
    `SELECT
       (SELECT count(*) FROM quiz_attempt WHERE id = ANY($1::uuid[]) AND status = 'submitted' AND submitted_at IS NOT NULL AND points = max_points AND passed)::int AS graded,
       (SELECT count(*) FROM quiz_response WHERE attempt_id = ANY($1::uuid[]) AND status = 'correct' AND points = max_points AND graded_at IS NOT NULL)::int AS responses,
       (SELECT count(DISTINCT attempt_id) FROM learning_record WHERE attempt_id = ANY($1::uuid[]))::int AS recorded,
       (SELECT count(*) FROM quiz_attempt WHERE quiz_slug = $2 AND status = 'submitted' AND submitted_at >= $3)::int AS "inWindow"`,
    [ids, SLUG, since],
  );
  return row as { graded: number; responses: number; recorded: number; inWindow: number };
}

function percentile(sorted: readonly number[], p: number): number {
  return sorted.length === 0 ? NaN : sorted[Math.min(sorted.length - 1, Math.ceil((p / 100) * sorted.length) - 1)]!;
}

const verdict = (ok: boolean) => (ok ? 'met' : 'NOT met');
const whole = (n: number) => Math.round(n).toLocaleString('en-GB').replace(/,/g, ' ');

export async function submitsBench(dataSource: DataSource, options: SubmitsBenchOptions): Promise<void> {
  const { seconds, clients } = options;
  const quiz = benchQuiz();
  const library = benchLibrary(quiz);
  const service = new AttemptsService(dataSource, { quizzes: () => library, appBaseUrl: 'http://127.0.0.1:4000' });
  const poolSize = (dataSource.options as { extra?: { max?: number } }).extra?.max;
  console.log(`\nSubmits: ${clients} concurrent clients, each submitting prepared attempts of a ${quiz.questions.length}-question quiz (all graded on submit) for ${seconds} s`);
  console.log(`  machine: ${availableParallelism()} cores; app pool: ${poolSize ?? '?'} connections (createDataSource's default)`);

  // Warm-up: also sizes the preparation from the rate it reaches.
  const warmUsers = await newApprentices(dataSource, clients * WARM_UP_PER_CLIENT, 'warm');
  const warm = await submitAll(service, await prepare(service, dataSource, quiz, warmUsers, clients), Number.POSITIVE_INFINITY);
  if (warm.failures.length > 0) throw new Error(`warm-up submits failed:\n${warm.failures.slice(0, 5).join('\n')}`);
  const warmRate = warm.done.length / warm.seconds;
  const wanted = Math.min(MAX_PREPARED, Math.max(clients * 4, Math.ceil((warmRate * seconds * PREPARE_MARGIN) / clients) * clients));
  console.log(`  warm-up: ${warm.done.length} submits at ${warmRate.toFixed(1)}/s; preparing ${whole(wanted)} attempts (${PREPARE_MARGIN}× that rate × ${seconds} s)`);

  const users = await newApprentices(dataSource, wanted, 'timed');
  const started = performance.now();
  const queues = await prepare(service, dataSource, quiz, users, clients);
  console.log(`  prepared: ${whole(wanted)} attempts started and 6 answers autosaved each (AttemptsService) in ${((performance.now() - started) / 1000).toFixed(1)} s`);

  const since = new Date();
  const profiler = await startProfile();
  const window = await submitAll(service, queues, seconds);
  await profiler?.stop();
  const rate = window.done.length / window.seconds;
  const sorted = [...window.latenciesMs].sort((a, b) => a - b);
  console.log(
    `  window: ${whole(window.done.length)} submits in ${window.seconds.toFixed(1)} s${window.ranOut ? ' (the prepared attempts ran out first)' : ''} → ${rate.toFixed(1)} submits/s; ` +
      `latency (pool wait included) p50 ${percentile(sorted, 50).toFixed(1)} ms, p95 ${percentile(sorted, 95).toFixed(1)} ms; ${window.failures.length} failed`,
  );
  for (const failure of window.failures.slice(0, 5)) console.log(`    failed: ${failure}`);

  const check = await persisted(dataSource, window.done, since);
  const n = window.done.length;
  const complete = window.failures.length === 0 && check.graded === n && check.responses === n * quiz.questions.length && check.recorded === n && check.inWindow === n;
  console.log(
    `  check: ${whole(check.graded)} of ${whole(n)} attempts submitted with full points; ${whole(check.responses)} of ${whole(n * quiz.questions.length)} responses graded correct; ` +
      `${whole(check.recorded)} with learning records; ${whole(check.inWindow)} submitted in the window per the database — ${complete ? 'all graded and persisted' : 'MISMATCH'}`,
  );

  // pgbench's docs (Good Practices): the scale factor should be at least the number of clients,
  // else the clients queue on the few pgbench_branches rows and the figure is update contention.
  // Two threads: the docs suggest a thread per few clients, and these machines have two cores.
  const threads = 2;
  const pg = await runPgbench(dataSource, { adminUrl: options.adminUrl, clients, threads, seconds, scale: clients });
  console.log(
    `  pgbench (PostgreSQL ${pg.version}, TPC-B-like, scale ${clients}, ${clients} clients, ${threads} threads, ${seconds} s; init ${pg.initSeconds.toFixed(1)} s): ` +
      `${pg.tps.toFixed(1)} TPS (${whole(pg.processed)} transactions, ${pg.failed} failed)`,
  );
  const ratio = rate / pg.tps;
  console.log(`  submits/s ≥ ${GOAL} × pgbench TPS: ${rate.toFixed(1)} / ${pg.tps.toFixed(1)} = ${ratio.toFixed(2)}× — ${verdict(complete && ratio >= GOAL)}${complete ? '' : ' (not every submit was graded and persisted)'}`);
  if (!complete) process.exitCode = 1;
}

/**
 * With BENCH_CPU_PROFILE=<file>, the timed window's Node CPU profile (a .cpuprofile file for Chrome's
 * DevTools): where a submit spends its time on this side of the database.
 */
async function startProfile(): Promise<{ stop: () => Promise<void> } | null> {
  const file = process.env['BENCH_CPU_PROFILE'];
  if (!file) return null;
  const session = new Session();
  session.connect();
  const post = (method: string) => new Promise<unknown>((resolve, reject) => session.post(method, (err, result) => (err ? reject(err) : resolve(result))));
  await post('Profiler.enable');
  await post('Profiler.start');
  return {
    stop: async () => {
      const { profile } = (await post('Profiler.stop')) as { profile: object };
      writeFileSync(file, JSON.stringify(profile));
      session.disconnect();
      console.log(`  CPU profile of the window: ${file}`);
    },
  };
}
