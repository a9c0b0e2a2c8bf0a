import { defineConfig, devices } from '@playwright/test';

const port = Number(process.env['E2E_PORT'] ?? 4310);
const baseURL = `http://127.0.0.1:${port}`;

/** The named variables that are set in this environment (an unset one keeps the server's default). */
function passThrough(names: readonly string[]): Record<string, string> {
  return Object.fromEntries(names.flatMap((name) => (process.env[name] ? [[name, process.env[name] as string]] : [])));
}

/**
 * Browser tests drive Debian's Chromium (never a downloaded browser) against the built app,
 * served by the built server on its own port with the test database from `npm test`.
 */
export default defineConfig({
  testDir: '.',
  outputDir: './artifacts',
  fullyParallel: true,
  forbidOnly: !!process.env['CI'],
  retries: 0,
  workers: 2,
  // Playwright's default, written out: the slowest-tests table shows each test against it. Whole-page
  // accessibility scans and multi-page journeys call test.slow() (three times this).
  timeout: 30_000,
  // An assertion waits up to 10 s (Playwright's default is 5 s): on a busy 2-core CI machine a lazy
  // page or a lesson's calculators can take longer than 5 s to arrive, which is not a failure.
  expect: { timeout: 10_000 },
  // json: per-test durations and limits, for the slowest-tests table `npm test` prints (server/devstack/slowest-tests.mjs).
  reporter: [['list'], ['html', { outputFolder: './report', open: 'never' }], ['json', { outputFile: '../test-results/playwright.json' }]],
  use: {
    baseURL,
    trace: 'retain-on-failure',
    screenshot: 'only-on-failure',
    // The production build registers a service worker that copies the whole app for offline use;
    // in every test that would be ~70 extra downloads and a cache between the test and the server.
    // The offline journeys (e2e/offline.spec.ts) allow it.
    serviceWorkers: 'block',
    launchOptions: {
      executablePath: '/usr/bin/chromium',
      // Keep the browser off the network: this machine reaches nothing but loopback.
      args: [
        '--no-sandbox',
        '--disable-gpu',
        '--disable-background-networking',
        '--disable-component-update',
        '--disable-sync',
        '--no-first-run',
        '--disable-quic',
      ],
    },
  },
  projects: [
    // One signed-in state per role (admin, instructor, shop owner), saved to e2e/.auth/ for the tests that need it.
    { name: 'setup', testMatch: /.*\.setup\.ts/, use: { ...devices['Desktop Chrome'] } },
    { name: 'desktop', use: { ...devices['Desktop Chrome'], viewport: { width: 1280, height: 800 } }, dependencies: ['setup'] },
  ],
  webServer: {
    command: 'node dist/api/server/main.js',
    cwd: '..',
    url: `${baseURL}/api/health`,
    reuseExistingServer: false,
    timeout: 60_000,
    // Started only when our own server says so: a health answer alone could come from another
    // checkout's server that took the port between npm test's check and this start.
    wait: { stdout: /Flowlore is running at/ },
    stdout: 'pipe',
    stderr: 'pipe',
    // Only what the server needs, passed through from `npm test` (server/devstack/test.mjs), which
    // starts a mail catcher and sets SMTP_HOST/SMTP_PORT for it; the tests read that catcher's mail
    // over MAILDEV_API_URL. E-mail links must point at this server, hence APP_BASE_URL.
    env: {
      PORT: String(port),
      HOST: '127.0.0.1',
      NODE_ENV: 'test',
      LOG_LEVEL: 'warn',
      DATABASE_URL: process.env['DATABASE_URL'] ?? '',
      APP_BASE_URL: baseURL,
      ...passThrough(['SMTP_HOST', 'SMTP_PORT', 'SMTP_SECURE', 'MAIL_FROM', 'SESSION_SECRET', 'DEMO_MODE', 'STRIPE_SECRET_KEY', 'STRIPE_WEBHOOK_SECRET', 'PAYMENT_PROVIDER_URL']),
    },
  },
});
