/**
 * `npm run bench:grading` (started by `grading.bench.mjs`, which opens the checkout's PostgreSQL and
 * a fresh `flowlore_bench_grading` database and passes it in DATABASE_URL). Prints figures beside
 * the goals; a benchmark, not a test. Run it on a quiet machine.
 *
 * Parts: the gradebook (`gradebook.bench.ts`). The submits-per-second part beside pgbench's TPS
 * belongs here too, before the gradebook's data is generated.
 */
import { createDataSource } from '../database/data-source';
import { gradebookBench } from './gradebook.bench';

async function main(): Promise<void> {
  const url = process.env['DATABASE_URL'];
  if (!url) throw new Error('DATABASE_URL is not set: run `npm run bench:grading`.');
  const dataSource = createDataSource({ url, poolSize: 4, applicationName: 'flowlore-bench-grading' });
  await dataSource.initialize();
  try {
    await dataSource.runMigrations({ transaction: 'each' });
    await gradebookBench(dataSource);
  } finally {
    await dataSource.destroy();
  }
}

main().catch((err: unknown) => {
  console.error(err);
  process.exit(1);
});
