import AxeBuilder from '@axe-core/playwright';
import { expect, test, type Page } from '@playwright/test';
import { watchErrors } from './page-errors';

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

test('the home page arrives in under 250 KB over the wire, scripts and styles compressed', async ({ page }) => {
  // What the browser received, from its own network log: headers plus the body as encoded on the
  // wire (Brotli or gzip), for every request of a first visit with an empty cache.
  const received: Array<{ url: string; type: string; bytes: number; body: number; encoding: string | undefined }> = [];
  const pending: Promise<void>[] = [];
  page.on('requestfinished', (request) => {
    pending.push(
      (async () => {
        const [sizes, response] = await Promise.all([request.sizes(), request.response()]);
        const encoding = (await response?.allHeaders())?.['content-encoding'];
        received.push({ url: request.url(), type: request.resourceType(), bytes: sizes.responseHeadersSize + sizes.responseBodySize, body: sizes.responseBodySize, encoding });
      })(),
    );
  });
  await page.goto('/', { waitUntil: 'networkidle' });
  await Promise.all(pending);
  const total = received.reduce((sum, entry) => sum + entry.bytes, 0);
  const byType = new Map<string, number>();
  for (const entry of received) byType.set(entry.type, (byType.get(entry.type) ?? 0) + entry.bytes);
  const parts = [...byType].map(([type, bytes]) => `${type} ${(bytes / 1000).toFixed(1)} KB`);
  console.log(`home page over the wire: ${(total / 1000).toFixed(1)} KB in ${received.length} requests (${parts.join(', ')})`);
  expect(total).toBeLessThan(250_000);
  // The build compresses every text file over 1 KB; a smaller one is not worth a second copy.
  const uncompressed = received.filter((entry) => (entry.type === 'script' || entry.type === 'stylesheet') && entry.body > 1024 && entry.encoding !== 'br');
  expect(uncompressed.map((entry) => entry.url)).toEqual([]);
});

test('the API health check answers through the same server', async ({ request }) => {
  const res = await request.get('/api/health');
  expect(res.status()).toBe(200);
  expect(await res.json()).toMatchObject({ status: 'ok', database: 'up' });
});
