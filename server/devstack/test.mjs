// `npm test`: the same set-up as `npm start` into a separate, freshly made test database, then
// every test: jest (shared + server, against real PostgreSQL) and Playwright (Debian Chromium).
import { existsSync } from 'node:fs';

import { aptInstall, log, run } from './process.mjs';
import { ensureNpmDependencies } from './npm-deps.mjs';
import { root } from './paths.mjs';

const CHROMIUM = '/usr/bin/chromium';

async function test() {
  await ensureNpmDependencies(root);
  if (!existsSync(CHROMIUM)) await aptInstall(['chromium']);

  const { openLocalDatabase } = await import('./local-database.mjs');
  const db = await openLocalDatabase('flowlore_test', { recreate: true });
  const env = {
    ...process.env,
    NODE_ENV: 'test',
    DATABASE_URL: db.url,
    TEST_ADMIN_DATABASE_URL: db.adminUrl,
    PLAYWRIGHT_SKIP_BROWSER_DOWNLOAD: '1',
    LOG_LEVEL: process.env.LOG_LEVEL ?? 'warn',
  };
  const failures = [];
  const step = async (name, command, args) => {
    log(name);
    try {
      await run(command, args, { cwd: root, env });
    } catch (error) {
      failures.push(`${name}: ${error.message}`);
    }
  };
  try {
    await step('building the app', 'npm', ['run', '--silent', 'build']);
    if (failures.length === 0) {
      await step('type-checking the tests too', 'npm', ['run', '--silent', 'typecheck']);
      await step('unit and API tests (jest)', 'npx', ['jest', '--ci']);
      await step('migrating the test database', 'node', ['dist/api/server/cli.js', 'migrate']);
      await step('browser tests (Playwright)', 'npx', ['playwright', 'test', '-c', 'e2e/playwright.config.ts']);
    }
  } finally {
    await db.stop();
  }
  if (failures.length) {
    process.stderr.write(`\n[flowlore] npm test FAILED:\n${failures.map((f) => `  - ${f}`).join('\n')}\n`);
    return 1;
  }
  log('npm test passed');
  return 0;
}

test().then(
  (code) => process.exit(code),
  (error) => {
    process.stderr.write(`[flowlore] npm test failed: ${error.message}\n`);
    process.exit(1);
  },
);
