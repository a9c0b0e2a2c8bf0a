import { randomUUID } from 'node:crypto';

import { expect, test as setup } from '@playwright/test';

import { authFile, createUserByCli, E2E_PASSWORD } from './accounts-cli';

/**
 * One signed-in state per role, as an operator would set the accounts up: each account is created with
 * the built CLI, then signs in through the sign-in page; the tests of that role start from the saved state.
 */
const people = [
  { role: 'admin', displayName: 'Avery Admin-E2E' },
  { role: 'instructor', displayName: 'Indra Instructor-E2E' },
  // A shop name of this run's own: apprentices join a shop by its name (cli.js create-user --shop).
  { role: 'shop_owner', displayName: 'Sasha Owner-E2E', shop: `E2E Flow Works ${randomUUID().slice(0, 8)}` },
] as const;

for (const person of people) {
  setup(`sign in as ${person.role.replace('_', ' ')}`, async ({ page }) => {
    const user = createUserByCli(person.role, { displayName: person.displayName, shop: 'shop' in person ? person.shop : undefined });
    await page.goto('/account/sign-in');
    await page.getByLabel('E-mail address').fill(user.email);
    await page.getByLabel('Password', { exact: true }).fill(E2E_PASSWORD);
    await page.getByRole('button', { name: 'Sign in', exact: true }).click();
    await expect(page.getByRole('button', { name: `Account: ${person.displayName}` })).toBeVisible();
    await page.context().storageState({ path: authFile(person.role) });
  });
}
