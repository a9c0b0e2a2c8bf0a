// `npm test`: the same set-up as `npm start` into a separate, freshly made test database, then
// every test: jest (shared + server, against real PostgreSQL) and Playwright (Debian Chromium), and
// at the end the ten slowest tests of both. Every port it needs falls back to the next free one, so a
// second checkout's run (or `npm start`) on the same machine never stops it.
import { existsSync, mkdirSync, rmSync } from 'node:fs';
import { relative } from 'node:path';

import { startMailCatcher } from './mail-catcher.mjs';
import { startProviderFake } from './provider-fake.mjs';
import { freePort } from './ports.mjs';
import { aptInstall, log, run } from './process.mjs';
import { ensureNpmDependencies } from './npm-deps.mjs';
import { root } from './paths.mjs';
import { jestReport, playwrightReport, printSlowestTests, resultsDir } from './slowest-tests.mjs';

const CHROMIUM = '/usr/bin/chromium';

async function test() {
  await ensureNpmDependencies(root);
  if (!existsSync(CHROMIUM)) await aptInstall(['chromium']);

  const { openLocalDatabase } = await import('./local-database.mjs');
  const db = await openLocalDatabase('flowlore_test', { recreate: true });
  // Its own catcher on other ports than `npm start`'s, so both can run at once; tests read it over its API.
  const mail = await startMailCatcher({
    smtpPort: Number(process.env.TEST_MAILDEV_SMTP_PORT ?? 2025),
    webPort: Number(process.env.TEST_MAILDEV_WEB_PORT ?? 2080),
  }).catch(async (error) => {
    await db.stop();
    throw error;
  });
  // This run's reports only: a stale one would put old timings in the slowest-tests table.
  mkdirSync(resultsDir, { recursive: true });
  for (const file of [jestReport, playwrightReport]) rmSync(file, { force: true });
  const env = {
    ...process.env,
    SMTP_HOST: mail.smtpHost,
    SMTP_PORT: String(mail.smtpPort),
    SMTP_SECURE: 'false',
    MAILDEV_API_URL: mail.apiUrl,
    NODE_ENV: 'test',
    DATABASE_URL: db.url,
    TEST_ADMIN_DATABASE_URL: db.adminUrl,
    PLAYWRIGHT_SKIP_BROWSER_DOWNLOAD: '1',
    LOG_LEVEL: process.env.LOG_LEVEL ?? 'warn',
  };
  const failures = [];
  let stopProvider = async () => {};
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
      await step('unit and API tests (jest)', 'npx', ['jest', '--ci', '--json', `--outputFile=${relative(root, jestReport)}`]);
      await step('migrating the test database', 'node', ['dist/api/server/cli.js', 'migrate']);
      // The app server the browser tests start (e2e/playwright.config.ts reads E2E_PORT), chosen just
      // before it starts so that a port taken meanwhile is not picked.
      env.E2E_PORT = String(await freePort(Number(process.env.E2E_PORT ?? 4310), { holder: "another test run's app server" }));
      // The payment provider's fake, sending its events to that server.
      const provider = await startProviderFake({ port: Number(process.env.TEST_PROVIDER_FAKE_PORT ?? 12211), webhookUrl: `http://127.0.0.1:${env.E2E_PORT}/api/payments/webhook` });
      stopProvider = provider.stop;
      Object.assign(env, { STRIPE_SECRET_KEY: provider.secretKey, STRIPE_WEBHOOK_SECRET: provider.webhookSecret, PAYMENT_PROVIDER_URL: provider.url });
      await step('browser tests (Playwright)', 'npx', ['playwright', 'test', '-c', 'e2e/playwright.config.ts']);
    }
  } finally {
    await stopProvider();
    await mail.stop();
    await db.stop();
    printSlowestTests();
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
