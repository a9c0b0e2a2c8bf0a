import { expect, test, type Page } from '@playwright/test';

import { createUserByCli, E2E_PASSWORD } from './accounts-cli';

// The first visit's units follow the browser's language region; a signed-in user's switch is saved
// with the account and follows them to another browser.

const boostTitle = 'Boost, compressor outlet temperature and intercooling';
const boostField = 'Boost pressure (gauge, at the manifold)';

function boostUnit(page: Page) {
  return page.getByRole('combobox', { name: `Unit for ${boostField}`, exact: true });
}

async function expectUnits(page: Page, system: 'SI' | 'US customary', unit: string): Promise<void> {
  await expect(page.getByRole('radio', { name: system, exact: true })).toBeChecked();
  await expect(boostUnit(page)).toContainText(unit);
}

async function signIn(page: Page, email: string, displayName: string): Promise<void> {
  await page.getByLabel('E-mail address').fill(email);
  await page.getByLabel('Password', { exact: true }).fill(E2E_PASSWORD);
  await page.getByRole('button', { name: 'Sign in', exact: true }).click();
  await expect(page.getByRole('button', { name: `Account: ${displayName}` })).toBeVisible();
}

test.describe('a first visit from the United States', () => {
  test.use({ locale: 'en-US' });

  test('opens the calculators in US customary units', async ({ page }) => {
    await page.goto('/calculators/boost');
    await expect(page.getByRole('heading', { level: 1, name: boostTitle })).toBeVisible();
    await expectUnits(page, 'US customary', 'psi');
  });
});

test.describe('a first visit from the United Kingdom', () => {
  test.use({ locale: 'en-GB' });

  test('opens the calculators in SI units', async ({ page }) => {
    await page.goto('/calculators/boost');
    await expect(page.getByRole('heading', { level: 1, name: boostTitle })).toBeVisible();
    await expectUnits(page, 'SI', 'kPa');
  });
});

test('a signed-in apprentice’s switch to US units follows them to a fresh browser', async ({ browser }) => {
  test.slow(); // a new account through the CLI, then two browsers, each signing in
  const apprentice = createUserByCli('apprentice');

  const first = await browser.newContext({ locale: 'en-GB' });
  try {
    const page = await first.newPage();
    await page.goto('/account/sign-in');
    await signIn(page, apprentice.email, apprentice.displayName);
    await page.goto('/calculators/boost');
    await expectUnits(page, 'SI', 'kPa');
    // Saved in the background: wait for the account's answer, not for time.
    const saved = page.waitForResponse((res) => res.url().endsWith('/api/account/preferences') && res.request().method() === 'PATCH');
    await page.getByRole('radio', { name: 'US customary' }).click();
    await expectUnits(page, 'US customary', 'psi');
    expect((await saved).status()).toBe(200);
  } finally {
    await first.close();
  }

  const second = await browser.newContext({ locale: 'en-GB' });
  try {
    const page = await second.newPage();
    // Before signing in, this browser's own guess: SI.
    await page.goto('/calculators/boost');
    await expectUnits(page, 'SI', 'kPa');
    await page.getByRole('link', { name: 'Sign in' }).click();
    await signIn(page, apprentice.email, apprentice.displayName);
    await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Calculators' }).click();
    await page.getByRole('link', { name: boostTitle }).click();
    await expect(page.getByRole('heading', { level: 1, name: boostTitle })).toBeVisible();
    await expectUnits(page, 'US customary', 'psi');
  } finally {
    await second.close();
  }
});
