import { randomUUID } from 'node:crypto';

import AxeBuilder from '@axe-core/playwright';
import { expect, test, type APIRequestContext, type Page } from '@playwright/test';

// Mail is read from the catcher `npm test` starts (maildev's REST API), never from a mocked transport.
const maildevApiUrl = process.env['MAILDEV_API_URL'];

interface CaughtMail {
  subject: string;
  text: string;
  to: Array<{ address: string }>;
}

/** A fresh address per test and run, so tests never see each other's mail or accounts. */
function uniqueEmail(label: string): string {
  return `e2e-${label}-${randomUUID().slice(0, 8)}@example.test`;
}

async function mailTo(address: string): Promise<CaughtMail[]> {
  const res = await fetch(`${maildevApiUrl}/api/email`);
  if (!res.ok) throw new Error(`maildev answered ${res.status}`);
  const all = (await res.json()) as CaughtMail[];
  return all.filter((mail) => mail.to.some((to) => to.address.toLowerCase() === address.toLowerCase()));
}

/** Waits for a message to the address with a link to `path`, and returns that link. */
async function linkInMail(address: string, path: string): Promise<string> {
  const pattern = new RegExp(`https?://\\S+${path.replace(/[/?]/g, '\\$&')}\\?token=[A-Za-z0-9_-]+`);
  let link = '';
  await expect
    .poll(async () => {
      link = (await mailTo(address)).map((mail) => pattern.exec(mail.text)?.[0]).find((found) => !!found) ?? '';
      return link;
    }, { message: `a message to ${address} with a ${path} link`, timeout: 15_000 })
    .not.toBe('');
  return link;
}

/** Creates an apprentice through the public API, with the CSRF header Angular would send. */
async function signUpByApi(request: APIRequestContext, email: string, password: string, displayName: string): Promise<void> {
  const csrf = await request.get('/api/auth/csrf');
  expect(csrf.status()).toBe(200);
  const { token } = (await csrf.json()) as { token: string };
  const res = await request.post('/api/auth/sign-up', {
    data: { accountType: 'apprentice', email, password, displayName },
    headers: { 'X-XSRF-TOKEN': token },
  });
  expect(res.status()).toBe(202);
}

async function signIn(page: Page, email: string, password: string): Promise<void> {
  await page.getByLabel('E-mail address').fill(email);
  await page.getByLabel('Password', { exact: true }).fill(password);
  await page.getByRole('button', { name: 'Sign in', exact: true }).click();
}

function accountMenu(page: Page, displayName: string) {
  return page.getByRole('button', { name: `Account: ${displayName}` });
}

test.describe('accounts', () => {
  test.skip(!maildevApiUrl, 'MAILDEV_API_URL is not set: run with `npm test`, which starts the mail catcher');
  // Several pages, an e-mail round trip and real-cost (12) password hashes on the server each.
  test.slow();

  test('sign up, confirm the address from the e-mail, sign in and sign out', async ({ page }) => {
    const email = uniqueEmail('signup');
    const password = 'a long bench passphrase';
    await page.goto('/');
    await page.getByRole('link', { name: 'Sign in' }).click();
    await page.getByRole('link', { name: 'Create an account' }).click();
    await expect(page.getByRole('heading', { level: 1, name: 'Create an account' })).toBeVisible();

    await page.getByLabel('Your name').fill('Rowan Testbench');
    await page.getByLabel('E-mail address').fill(email);
    await page.getByLabel('Password').fill(password);
    await page.getByRole('button', { name: 'Create account' }).click();
    await expect(page.getByText('Check your e-mail.')).toBeVisible();

    await page.goto(await linkInMail(email, '/account/verify'));
    await expect(page.getByText('Your e-mail address is confirmed.')).toBeVisible();
    await page.getByRole('main').getByRole('link', { name: 'sign in' }).click();
    await expect(page.getByRole('heading', { level: 1, name: 'Sign in' })).toBeVisible();

    await signIn(page, email, password);
    await expect(accountMenu(page, 'Rowan Testbench')).toBeVisible();
    await expect(page).toHaveURL(/\/$/);

    await accountMenu(page, 'Rowan Testbench').click();
    await page.getByRole('menuitem', { name: 'Sign out' }).click();
    await expect(page.getByRole('link', { name: 'Sign in' })).toBeVisible();
    await expect(accountMenu(page, 'Rowan Testbench')).toBeHidden();
  });

  test('forgot password: the e-mailed link sets a new password that signs in', async ({ page }) => {
    const email = uniqueEmail('reset');
    await signUpByApi(page.request, email, 'the first passphrase', 'Kit Resetter');
    const newPassword = 'a second, better passphrase';

    await page.goto('/account/sign-in');
    await page.getByRole('link', { name: 'Forgot your password?' }).click();
    await expect(page.getByRole('heading', { level: 1, name: 'Forgotten password' })).toBeVisible();
    await page.getByLabel('E-mail address').fill(email);
    await page.getByRole('button', { name: 'Send the link' }).click();
    await expect(page.getByText('If an account exists for that address, we sent a link')).toBeVisible();

    await page.goto(await linkInMail(email, '/account/reset-password'));
    await expect(page.getByRole('heading', { level: 1, name: 'Choose a new password' })).toBeVisible();
    await page.getByLabel('New password').fill(newPassword);
    await page.getByRole('button', { name: 'Save the new password' }).click();
    await expect(page.getByText('Your password is changed.')).toBeVisible();

    await page.getByRole('link', { name: 'Sign in with the new password' }).click();
    await expect(page.getByRole('heading', { level: 1, name: 'Sign in' })).toBeVisible();
    await signIn(page, email, newPassword);
    await expect(accountMenu(page, 'Kit Resetter')).toBeVisible();
  });

  test('the profile page renames the account and changes the password', async ({ page }) => {
    const email = uniqueEmail('profile');
    await signUpByApi(page.request, email, 'profile passphrase one', 'Sol Profile');
    await page.goto('/account/profile');
    await expect(page.getByRole('heading', { level: 1, name: 'Sign in' })).toBeVisible();
    await signIn(page, email, 'profile passphrase one');
    await expect(page.getByRole('heading', { level: 1, name: 'Your profile' })).toBeVisible();

    await page.getByLabel('Display name').fill('Sol Renamed');
    await page.getByRole('button', { name: 'Save name' }).click();
    await expect(page.getByText('Saved.')).toBeVisible();
    await expect(accountMenu(page, 'Sol Renamed')).toBeVisible();

    await page.getByLabel('Current password').fill('not the password at all');
    await page.getByLabel('New password').fill('profile passphrase two');
    await page.getByRole('button', { name: 'Change password' }).click();
    await expect(page.getByText('This is not your current password.')).toBeVisible();
    await expect(page.getByLabel('Current password')).toBeFocused();

    await page.getByLabel('Current password').fill('profile passphrase one');
    await page.getByRole('button', { name: 'Change password' }).click();
    await expect(page.getByText('Password changed. Other sessions were signed out.')).toBeVisible();
  });

  test('an apprentice can open neither the admin nor the instructor pages, nor their API', async ({ page }) => {
    const email = uniqueEmail('apprentice');
    const password = 'apprentice passphrase';
    await signUpByApi(page.request, email, password, 'Ari Apprentice');
    await page.goto(await linkInMail(email, '/account/verify'));
    await expect(page.getByText('Your e-mail address is confirmed.')).toBeVisible();

    // A visitor asking for /admin is sent to sign in first, and comes back to the refusal.
    await page.goto('/admin');
    await expect(page).toHaveURL(/\/account\/sign-in\?returnUrl=%2Fadmin/);
    await signIn(page, email, password);
    await expect(page.getByRole('heading', { level: 1, name: 'Not allowed' })).toBeVisible();
    await expect(page.getByRole('heading', { name: 'Administration' })).toHaveCount(0);

    await page.goto('/cohorts');
    await expect(page.getByRole('heading', { level: 1, name: 'Not allowed' })).toBeVisible();

    const nav = page.getByRole('navigation', { name: 'Main' });
    await expect(nav.getByRole('link', { name: 'Course' })).toBeVisible();
    await expect(nav.getByRole('link', { name: 'Admin' })).toHaveCount(0);
    await expect(nav.getByRole('link', { name: 'Cohorts' })).toHaveCount(0);

    expect((await page.request.get('/api/admin/users')).status()).toBe(403);
    expect((await page.request.get('/api/cohorts')).status()).toBe(403);
  });
});

async function expectNoBlockingViolations(page: Page, label: string): Promise<void> {
  const results = await new AxeBuilder({ page }).withTags(['wcag2a', 'wcag2aa', 'wcag21a', 'wcag21aa', 'wcag22aa']).analyze();
  const blocking = results.violations.filter((v) => v.impact === 'serious' || v.impact === 'critical');
  expect(blocking.map((v) => `${label}: ${v.id}: ${v.help} (${v.nodes.length})`)).toEqual([]);
}

test('the sign-in page has no serious or critical accessibility violations, with or without errors', async ({ page }) => {
  test.slow(); // two whole-page axe scans
  await page.goto('/account/sign-in');
  await expect(page.getByRole('heading', { level: 1, name: 'Sign in' })).toBeVisible();
  await expectNoBlockingViolations(page, 'sign-in');
  // With the errors showing too: each beside its field.
  await page.getByRole('button', { name: 'Sign in', exact: true }).click();
  await expect(page.getByText('Enter your e-mail address.')).toBeVisible();
  await expect(page.getByLabel('E-mail address')).toBeFocused();
  await expectNoBlockingViolations(page, 'sign-in with errors');
});

test('the sign-up page with its errors has no serious or critical accessibility violations', async ({ page }) => {
  test.slow(); // a whole-page axe scan
  await page.goto('/account/sign-up');
  await expect(page.getByRole('heading', { level: 1, name: 'Create an account' })).toBeVisible();
  await page.getByRole('radio', { name: 'A shop owner' }).check();
  await expect(page.getByLabel('Shop name')).toBeVisible();
  await page.getByRole('button', { name: 'Create account' }).click();
  await expect(page.getByText('Enter the name of your shop.')).toBeVisible();
  await expectNoBlockingViolations(page, 'sign-up with errors');
});

test('the old /sign-in address leads to the sign-in page', async ({ page }) => {
  await page.goto('/sign-in');
  await expect(page).toHaveURL(/\/account\/sign-in$/);
  await expect(page.getByRole('heading', { level: 1, name: 'Sign in' })).toBeVisible();
});
