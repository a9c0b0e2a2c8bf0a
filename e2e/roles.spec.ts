import AxeBuilder from '@axe-core/playwright';
import { expect, test } from '@playwright/test';

import { authFile, createUserByCli } from './accounts-cli';

// Each journey starts signed in, from the state the setup project saved for its role (auth.setup.ts).

test.describe('as an administrator', () => {
  test.use({ storageState: authFile('admin') });
  // A new account through the CLI (a Node process and a cost-12 hash), and a whole-page axe scan.
  test.slow();

  test('finds a new apprentice, makes them an instructor, and the audit log shows the change', async ({ page }) => {
    const apprentice = createUserByCli('apprentice');
    await page.goto('/');
    await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Admin' }).click();
    await expect(page.getByRole('heading', { level: 1, name: 'Administration' })).toBeVisible();

    await page.getByLabel('Search by name or e-mail').fill(apprentice.email);
    await expect(page.getByRole('status').filter({ hasText: '1 user matches.' })).toBeAttached();
    const users = page.getByRole('table', { name: 'Users' });
    await expect(users.getByRole('row', { name: new RegExp(apprentice.email) })).toBeVisible();

    const role = users.getByRole('combobox', { name: `Role of ${apprentice.displayName}` });
    await expect(role).toHaveText('Apprentice');
    await role.click();
    await page.getByRole('option', { name: 'Instructor' }).click();
    await expect(role).toHaveText('Instructor');

    await page.getByRole('tab', { name: 'Audit log' }).click();
    const change = page
      .getByRole('table', { name: 'Audit log' })
      .getByRole('row', { name: new RegExp(`Role changed.*Avery Admin-E2E.*${apprentice.displayName}`) });
    await expect(change).toContainText('Apprentice → Instructor');
  });

  test('the users page has no serious or critical accessibility violations', async ({ page }) => {
    await page.goto('/admin/users');
    await expect(page.getByRole('heading', { level: 1, name: 'Administration' })).toBeVisible();
    await expect(page.getByRole('table', { name: 'Users' }).getByRole('combobox').first()).toBeVisible();
    const results = await new AxeBuilder({ page }).withTags(['wcag2a', 'wcag2aa', 'wcag21a', 'wcag21aa', 'wcag22aa']).analyze();
    const blocking = results.violations.filter((v) => v.impact === 'serious' || v.impact === 'critical');
    expect(blocking.map((v) => `${v.id}: ${v.help} (${v.nodes.length})`)).toEqual([]);
  });
});

test.describe('as an instructor', () => {
  test.use({ storageState: authFile('instructor') });
  test.slow(); // a new account through the CLI, then a cohort made, filled and emptied

  test('creates a cohort, adds an apprentice by e-mail, sees them listed and removes them', async ({ page }) => {
    const apprentice = createUserByCli('apprentice');
    const cohortName = `E2E cohort ${apprentice.id.slice(0, 8)}`;
    await page.goto('/');
    await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Cohorts' }).click();
    await expect(page.getByRole('heading', { level: 1, name: 'Your cohorts' })).toBeVisible();

    await page.getByLabel('Cohort name').fill(cohortName);
    await page.getByRole('button', { name: 'Create cohort' }).click();
    await expect(page.getByRole('heading', { level: 1, name: cohortName })).toBeVisible();

    await page.getByLabel('Apprentice’s e-mail address').fill(apprentice.email);
    await page.getByRole('button', { name: 'Add to cohort' }).click();
    await expect(page.getByRole('status').filter({ hasText: `${apprentice.email} is in the cohort.` })).toBeVisible();
    const members = page.getByRole('table', { name: 'Apprentices' });
    await expect(members.getByRole('row', { name: new RegExp(apprentice.displayName) })).toBeVisible();

    await members.getByRole('button', { name: `Remove ${apprentice.displayName}` }).click();
    await page.getByRole('alertdialog', { name: `Remove ${apprentice.displayName}?` }).getByRole('button', { name: 'Remove from cohort' }).click();
    await expect(members.getByRole('row', { name: new RegExp(apprentice.displayName) })).toHaveCount(0);
    await expect(members.getByRole('cell', { name: 'No apprentices yet. Add one above.' })).toBeVisible();
  });
});

test.describe('as a shop owner', () => {
  test.use({ storageState: authFile('shop_owner') });

  test('opens My shop and sees the shop by name', async ({ page }) => {
    await page.goto('/');
    await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'My shop' }).click();
    await expect(page.getByRole('heading', { level: 1, name: /^E2E Flow Works [0-9a-f]{8}$/ })).toBeVisible();
    await expect(page.getByText('Owner: Sasha Owner-E2E')).toBeVisible();
  });
});
