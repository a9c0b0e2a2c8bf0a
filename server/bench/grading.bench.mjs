// `npm run bench:grading`: opens the checkout's PostgreSQL (started if it is not running) with a
// fresh `flowlore_bench_grading` database and runs the built benchmark against it
// (dist/api/server/bench/grading.bench.js; figures and goals in server/bench/grading.bench.ts).
import { spawn } from 'node:child_process';

import { openLocalDatabase } from '../devstack/local-database.mjs';
import { root } from '../devstack/paths.mjs';

const db = await openLocalDatabase('flowlore_bench_grading', { recreate: true });
try {
  const code = await new Promise((resolve, reject) => {
    const child = spawn(process.execPath, ['--expose-gc', 'dist/api/server/bench/grading.bench.js'], {
      cwd: root,
      env: { ...process.env, DATABASE_URL: db.url, TEST_ADMIN_DATABASE_URL: db.adminUrl },
      stdio: 'inherit',
    });
    child.on('error', reject);
    child.on('exit', resolve);
  });
  process.exitCode = code ?? 1;
} finally {
  await db.stop();
}
