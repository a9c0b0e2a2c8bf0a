import { expect, test, type Page } from '@playwright/test';

import { createUserByCli, E2E_PASSWORD } from './accounts-cli';

// The installable app and its offline copy: the service worker (src/ngsw-config.json) keeps the
// whole app after one online visit, so the calculators open and compute with no network.

test.use({ serviceWorkers: 'allow', locale: 'en-GB' });

const boostTitle = 'Boost, compressor outlet temperature and intercooling';
const boostField = 'Boost pressure (gauge, at the manifold)';

function pressureRatio(page: Page) {
  return page.getByRole('region', { name: 'Results' }).getByRole('row', { name: /^Pressure ratio\b/ }).getByRole('cell').first();
}

/**
 * Waits until the service worker controls the page and has copied the app. Its own status page
 * (/ngsw/state, part of @angular/service-worker) names the app version as soon as it knows it, but
 * copies the files from an idle-time task queue (after ~5 s without requests, away from
 * localhost): the copy is complete when that queue has run and is empty.
 */
async function waitForOfflineCopy(page: Page): Promise<void> {
  await page.evaluate(() => navigator.serviceWorker.ready.then(() => undefined));
  await expect
    .poll(
      async () =>
        page.evaluate(async () => {
          if (!navigator.serviceWorker.controller) return 'not controlling the page yet';
          const state = await (await fetch('/ngsw/state')).text();
          if (!/Latest manifest hash: [0-9a-f]{6,}/.test(state)) return 'no app version yet';
          if (/Last update run: never/.test(state)) return 'idle tasks not run yet';
          const queue = state.split('Task queue:')[1]?.split('Debug log:')[0]?.trim();
          return queue === '' ? 'copied' : `still queued: ${queue}`;
        }),
      { timeout: 60_000, intervals: [500, 1000] },
    )
    .toBe('copied');
}

test('after one online visit a calculator opens and computes offline', async ({ page, context }) => {
  test.slow(); // an online visit, the worker copying the app, then the same page offline
  // Once the worker controls the page, the app reads the free lesson through it (offline-course.ts).
  const freeLesson = page.waitForResponse((res) => res.url().endsWith('/api/lessons/pressure') && res.ok());
  await page.goto('/calculators/boost');
  await expect(page.getByRole('heading', { level: 1, name: boostTitle })).toBeVisible();
  await waitForOfflineCopy(page);
  await freeLesson;

  await context.setOffline(true);
  await expect(page.getByRole('status').filter({ hasText: 'Offline' })).toBeVisible();
  const response = await page.reload();
  expect(response?.fromServiceWorker()).toBe(true);
  // Really offline: the server cannot be reached from this page (the worker answers a request it
  // cannot pass on with 504; without the worker, fetch itself fails).
  expect(await page.evaluate(() => fetch('/api/health').then((res) => (res.ok ? 'reached' : 'unreachable'), () => 'unreachable'))).toBe('unreachable');

  await expect(page.getByRole('heading', { level: 1, name: boostTitle })).toBeVisible();
  await expect(pressureRatio(page)).toHaveText('1.691'); // (101.3 + 70) kPa / 101.3 kPa, the SI example
  await page.getByRole('textbox', { name: boostField, exact: true }).fill('100');
  await expect(pressureRatio(page)).toHaveText('1.9872'); // (101.3 + 100) kPa / 101.3 kPa

  // The calculator list and the free lesson open offline too, though this visit never opened them.
  await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Calculators' }).click();
  await expect(page.getByRole('heading', { level: 1, name: 'Calculators' })).toBeVisible();
  await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Course' }).click();
  await expect(page.getByRole('link', { name: 'Pressure — absolute, gauge and differential' })).toBeVisible();
  await page.getByRole('link', { name: 'Pressure — absolute, gauge and differential' }).click();
  await expect(page.getByRole('heading', { level: 1, name: 'Pressure — absolute, gauge and differential' })).toBeVisible();
});

test('offline, signing in says it needs a connection; back online, signing in works', async ({ page, context }) => {
  test.slow(); // an online visit, the worker copying the app, offline, then online again
  const apprentice = createUserByCli('apprentice');
  await page.goto('/');
  await expect(page.getByRole('heading', { level: 1 })).toBeVisible();
  await waitForOfflineCopy(page);

  await context.setOffline(true);
  await page.goto('/account/sign-in');
  await expect(page.getByRole('heading', { level: 1, name: 'This page needs a connection' })).toBeVisible();
  await expect(page.getByRole('button', { name: 'Sign in', exact: true })).toBeHidden();

  await context.setOffline(false);
  await expect(page.getByRole('heading', { level: 1, name: 'Sign in' })).toBeVisible();
  await page.getByLabel('E-mail address').fill(apprentice.email);
  await page.getByLabel('Password', { exact: true }).fill(E2E_PASSWORD);
  await page.getByRole('button', { name: 'Sign in', exact: true }).click();
  await expect(page.getByRole('button', { name: `Account: ${apprentice.displayName}` })).toBeVisible();
  await expect(page.getByRole('status').filter({ hasText: 'Offline' })).toBeHidden();
});

test('the manifest is valid and Chromium finds the app installable', async ({ playwright, baseURL }) => {
  test.slow(); // a browser of its own, and the service worker's first copy
  // Chromium never offers to install from an incognito window, which is what Playwright's usual
  // contexts are: a persistent profile (in a fresh temporary folder) is an ordinary window.
  const context = await playwright.chromium.launchPersistentContext('', { ...test.info().project.use.launchOptions, baseURL });
  try {
    const page = context.pages()[0] ?? (await context.newPage());
    await page.goto('/');
    await expect(page.getByRole('heading', { level: 1 })).toBeVisible();
    await waitForOfflineCopy(page);
    const cdp = await context.newCDPSession(page);
    const manifest = await cdp.send('Page.getAppManifest');
    expect(manifest.errors).toEqual([]);
    expect(manifest.url).toMatch(/\/manifest\.webmanifest$/);
    const { installabilityErrors } = await cdp.send('Page.getInstallabilityErrors');
    expect(installabilityErrors).toEqual([]);
  } finally {
    await context.close();
  }
});
