import AxeBuilder from '@axe-core/playwright';
import { expect, test, type Page } from '@playwright/test';

import { authFile } from './accounts-cli';
import { watchErrors } from './page-errors';

/** An axe scan (WCAG 2.2 AA tags) of the whole page: no serious or critical violation. */
async function expectNoSeriousViolations(page: Page): Promise<void> {
  const results = await new AxeBuilder({ page }).withTags(['wcag2a', 'wcag2aa', 'wcag21a', 'wcag21aa', 'wcag22aa']).analyze();
  const blocking = results.violations.filter((v) => v.impact === 'serious' || v.impact === 'critical');
  expect(blocking.map((v) => `${v.id}: ${v.help} (${v.nodes.length})`)).toEqual([]);
}

/** The seats the shop has paid for, as the balance line says. */
async function paidFor(page: Page): Promise<number> {
  const line = await page.getByText(/\d+ paid for/).innerText();
  return Number(/(\d+) paid for/.exec(line)?.[1]);
}

async function payWith(page: Page, card: string): Promise<void> {
  await page.getByLabel('Card number').fill(card);
  await page.getByLabel('Expiry date (MM / YY)').fill('12 / 34');
  await page.getByLabel('Security code (CVC)').fill('123');
  await page.getByRole('button', { name: /^Pay / }).click();
}

// The provider's local fake runs beside the app (npm test starts it: server/devstack/provider-fake.mjs).
test.skip(!process.env['PAYMENT_PROVIDER_URL'], 'PAYMENT_PROVIDER_URL is not set: run with `npm test`, which starts the provider fake');
test.use({ storageState: authFile('shop_owner') });

test('the owner buys seats: a declined card, then one that pays, then one that asks for authentication', async ({ page }) => {
  test.slow(); // two purchases through the provider's pages, each confirmed by its event, and three scans
  const errors = watchErrors(page);
  await page.goto('/shop');
  await expect(page.getByRole('heading', { level: 2, name: 'Seats' })).toBeVisible();
  const before = await paidFor(page);

  // 5 seats at the 1-seat tier: 5 × $49.00.
  await page.getByLabel('Seats to buy').fill('5');
  await expect(page.getByText('5 × $49.00 = $245.00', { exact: false })).toBeVisible();
  await page.getByRole('button', { name: 'Buy $245.00' }).click();
  await expect(page.getByRole('heading', { level: 1, name: 'Pay Flowlore' })).toBeVisible();
  await expect(page.getByText('Local test payment page — no real money moves.')).toBeVisible();
  await expectNoSeriousViolations(page);

  await payWith(page, '4000 0000 0000 0002');
  await expect(page.getByRole('alert')).toContainText('Your card was declined.');
  await payWith(page, '4242 4242 4242 4242');
  await expect(page.getByRole('status').filter({ hasText: 'Payment received: 5 seats were added' })).toBeVisible();
  await expect.poll(() => paidFor(page)).toBe(before + 5);
  await expectNoSeriousViolations(page);

  // The order is listed as paid, with its printable receipt.
  const orders = page.getByRole('table', { name: 'Orders' });
  await expect(orders.getByRole('row').nth(1)).toContainText('$245.00');
  await expect(orders.getByRole('row').nth(1)).toContainText('Paid');
  await orders.getByRole('link', { name: /^Receipt of order/ }).first().click();
  await expect(page.getByRole('heading', { level: 1, name: /^Receipt for order \d+$/ })).toBeVisible();
  await expect(page.getByText('5 × $49.00')).toBeVisible();
  await expect(page.getByText('ending in 4242')).toBeVisible();
  await expectNoSeriousViolations(page);
  await page.getByRole('link', { name: '← My shop' }).click();

  // One more, with the card that asks the bank to confirm.
  await page.getByLabel('Seats to buy').fill('1');
  await page.getByRole('button', { name: 'Buy $49.00' }).click();
  await payWith(page, '4000 0027 6000 3184');
  await expect(page.getByRole('heading', { level: 1, name: 'Authentication step (test)' })).toBeVisible();
  await page.getByRole('button', { name: 'Approve the payment' }).click();
  await expect(page.getByRole('status').filter({ hasText: 'Payment received: 1 seat was added' })).toBeVisible();
  await expect.poll(() => paidFor(page)).toBe(before + 6);
  expect(errors).toEqual([]);
});
