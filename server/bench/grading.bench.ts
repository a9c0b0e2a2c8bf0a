/**
 * `npm run bench:grading` (started by `grading.bench.mjs`, which opens the checkout's PostgreSQL and
 * a fresh `flowlore_bench_grading` database and passes it in DATABASE_URL, the cluster's admin URL
 * in TEST_ADMIN_DATABASE_URL). Prints figures beside the goals; a benchmark, not a test.
 * Run it on a quiet machine.
 *
 * Parts, in this order: the submits per second beside pgbench's TPS (`submits.bench.ts`; it runs
 * before the gradebook's data is generated), then the gradebook (`gradebook.bench.ts`).
 * BENCH_GRADING_PARTS picks them (default `submits,gradebook`; `submits` or `gradebook` runs one
 * alone); BENCH_SUBMIT_SECONDS is the submits window and pgbench's run (default 20).
 */
import { createDataSource } from '../database/data-source';
import { gradebookBench } from './gradebook.bench';
import { submitsBench } from './submits.bench';

const PARTS = ['submits', 'gradebook'] as const;
type Part = (typeof PARTS)[number];

function readParts(value: string): Set<Part> {
  const names = value.split(',').map((name) => name.trim()).filter((name) => name !== '');
  const unknown = names.filter((name) => !(PARTS as readonly string[]).includes(name));
  if (unknown.length > 0 || names.length === 0) throw new Error(`BENCH_GRADING_PARTS: "${value}" — give ${PARTS.join(', ')} (comma-separated).`);
  return new Set(names as Part[]);
}

async function main(): Promise<void> {
  const url = process.env['DATABASE_URL'];
  if (!url) throw new Error('DATABASE_URL is not set: run `npm run bench:grading`.');
  const parts = readParts(process.env['BENCH_GRADING_PARTS'] ?? PARTS.join(','));
  const seconds = Number(process.env['BENCH_SUBMIT_SECONDS'] ?? 20);
  if (!(Number.isInteger(seconds) && seconds > 0)) throw new Error(`BENCH_SUBMIT_SECONDS: "${process.env['BENCH_SUBMIT_SECONDS']}" is not a whole number of seconds.`);
  const adminUrl = process.env['TEST_ADMIN_DATABASE_URL'];
  if (parts.has('submits') && !adminUrl) throw new Error('TEST_ADMIN_DATABASE_URL is not set (pgbench needs it): run `npm run bench:grading`.');

  const dataSource = createDataSource({ url, poolSize: 4, applicationName: 'flowlore-bench-grading' });
  await dataSource.initialize();
  try {
    await dataSource.runMigrations({ transaction: 'each' });
    if (parts.has('submits')) {
      // The app's default pool size, as production runs it: the figure is the app's, not a tuned bench's.
      const app = createDataSource({ url, applicationName: 'flowlore-bench-submits' });
      await app.initialize();
      try {
        await submitsBench(app, { seconds, clients: 32, adminUrl: adminUrl! });
      } finally {
        await app.destroy();
      }
    }
    if (parts.has('gradebook')) await gradebookBench(dataSource);
  } finally {
    await dataSource.destroy();
  }
}

main().catch((err: unknown) => {
  console.error(err);
  process.exit(1);
});
