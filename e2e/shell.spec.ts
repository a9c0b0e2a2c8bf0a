import { gzipSync } from 'node:zlib';

import AxeBuilder from '@axe-core/playwright';
import { expect, test, type Page } from '@playwright/test';

/** Console errors and uncaught page errors, collected for the whole test. */
function watchErrors(page: Page): string[] {
  const errors: string[] = [];
  page.on('console', (message) => {
    if (message.type() === 'error') errors.push(message.text());
  });
  page.on('pageerror', (error) => errors.push(error.message));
  return errors;
}

test('the home page renders the shell with no console errors', async ({ page }) => {
  const errors = watchErrors(page);
  await page.goto('/');
  await expect(page.getByRole('heading', { level: 1 })).toBeVisible();
  await expect(page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Course' })).toBeVisible();
  await expect(page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Calculators' })).toBeVisible();
  await expect(page.getByRole('link', { name: 'Sign in' })).toBeVisible();
  await expect(page.getByRole('contentinfo')).toContainText('local codes');
  await expect(page).toHaveTitle(/Flowlore/);
  expect(errors).toEqual([]);
});

for (const theme of ['Light', 'Dark']) {
  test(`the home page has no serious or critical accessibility violations, ${theme.toLowerCase()} theme`, async ({ page }) => {
    test.slow(); // a whole-page axe scan
    await page.goto('/');
    await expect(page.getByRole('heading', { level: 1 })).toBeVisible();
    await chooseTheme(page, theme);
    const results = await new AxeBuilder({ page }).withTags(['wcag2a', 'wcag2aa', 'wcag21a', 'wcag21aa', 'wcag22aa']).analyze();
    const blocking = results.violations.filter((v) => v.impact === 'serious' || v.impact === 'critical');
    expect(blocking.map((v) => `${v.id}: ${v.help} (${v.nodes.length})`)).toEqual([]);
  });
}

async function chooseTheme(page: Page, label: string): Promise<void> {
  await page.getByRole('button', { name: /theme/i }).click();
  await page.getByRole('menuitemradio', { name: label }).click();
  await expect(page.getByRole('menu')).toBeHidden();
}

async function pageBackground(page: Page): Promise<string> {
  return page.evaluate(() => getComputedStyle(document.body).backgroundColor);
}

test('the theme choice survives a reload', async ({ page }) => {
  await page.emulateMedia({ colorScheme: 'light' });
  await page.goto('/');
  await chooseTheme(page, 'Light');
  const light = await pageBackground(page);

  await chooseTheme(page, 'Dark');
  const dark = await pageBackground(page);
  expect(dark).not.toBe(light);

  await page.reload();
  await expect(page.getByRole('heading', { level: 1 })).toBeVisible();
  expect(await pageBackground(page)).toBe(dark);
  await page.getByRole('button', { name: /theme/i }).click();
  await expect(page.getByRole('menuitemradio', { name: 'Dark' })).toHaveAttribute('aria-checked', 'true');
  await expect(page.getByRole('menuitemradio', { name: 'Light' })).toHaveAttribute('aria-checked', 'false');
});

test('an unknown page shows the not-found page with a way back', async ({ page }) => {
  await page.goto('/no/such/page');
  await expect(page.getByRole('heading', { level: 1, name: /not found/i })).toBeVisible();
  await page.getByRole('main').getByRole('link', { name: /home/i }).first().click();
  await expect(page).toHaveURL(/\/$/);
});

test('on a tablet the navigation opens from the menu button', async ({ page }) => {
  await page.setViewportSize({ width: 800, height: 1100 });
  await page.goto('/');
  await page.getByRole('button', { name: 'Open navigation' }).click();
  const nav = page.getByRole('navigation', { name: 'Main' });
  await nav.getByRole('link', { name: 'Calculators' }).click();
  await expect(page).toHaveURL(/\/calculators$/);
  await expect(page.getByRole('heading', { level: 1 })).toBeVisible();
});

test('the home page downloads under 250 KB of gzipped JavaScript and CSS', async ({ page }) => {
  const sizes: Array<{ url: string; gzip: number }> = [];
  page.on('response', async (response) => {
    const type = response.request().resourceType();
    if (type !== 'script' && type !== 'stylesheet') return;
    const body = await response.body();
    sizes.push({ url: response.url(), gzip: gzipSync(body, { level: 9 }).length });
  });
  await page.goto('/', { waitUntil: 'networkidle' });
  const total = sizes.reduce((sum, entry) => sum + entry.gzip, 0);
  console.log(`home page JS+CSS: ${(total / 1024).toFixed(1)} KiB gzip in ${sizes.length} files`);
  expect(total).toBeLessThan(250 * 1024);
});

test('the API health check answers through the same server', async ({ request }) => {
  const res = await request.get('/api/health');
  expect(res.status()).toBe(200);
  expect(await res.json()).toMatchObject({ status: 'ok', database: 'up' });
});
