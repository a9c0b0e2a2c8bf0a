import AxeBuilder from '@axe-core/playwright';
import { expect, test, type Page } from '@playwright/test';

import { evaluate, withExampleDefaults } from '../shared/airflow';
import { createUserByCli, E2E_PASSWORD } from './accounts-cli';
import { watchErrors } from './page-errors';

/** An axe scan (WCAG 2.2 AA tags) of the whole page: no serious or critical violation. */
async function expectNoSeriousViolations(page: Page): Promise<void> {
  const results = await new AxeBuilder({ page }).withTags(['wcag2a', 'wcag2aa', 'wcag21a', 'wcag21aa', 'wcag22aa']).analyze();
  const blocking = results.violations.filter((v) => v.impact === 'serious' || v.impact === 'critical');
  expect(blocking.map((v) => `${v.id}: ${v.help} (${v.nodes.length})`)).toEqual([]);
}

/**
 * The flow the engine gives for the stem's numbers, as the server computes the key: the same
 * calculator (`flow-at-test-pressure`, square-root model) over its example, in cfm.
 */
function keyFor(flowCfm: number, fromInH2O: number, toInH2O: number): number {
  const request = withExampleDefaults('flow-at-test-pressure', {
    flow: { value: flowCfm, unit: 'cfm' },
    fromPressureDrop: { value: fromInH2O, unit: 'inH2O' },
    toPressureDrop: { value: toInH2O, unit: 'inH2O' },
    model: 'square-root',
  });
  if (!request) throw new Error('no flow-at-test-pressure calculator');
  const outcome = evaluate('flow-at-test-pressure', { ...request, outputUnits: { flow: 'cfm' } });
  if (!outcome.ok) throw new Error(outcome.errors.map((e) => e.message).join('; '));
  return outcome.result.outputs['flow']!.value;
}

/** A new apprentice (through the CLI) opens a quiz: the guard sends them to sign in and back. */
async function signInForQuiz(page: Page, slug: string): Promise<ReturnType<typeof createUserByCli>> {
  const apprentice = createUserByCli('apprentice');
  await page.goto(`/course/${slug}/quiz`);
  await expect(page).toHaveURL(/\/account\/sign-in\?returnUrl=/);
  await page.getByLabel('E-mail address').fill(apprentice.email);
  await page.getByLabel('Password', { exact: true }).fill(E2E_PASSWORD);
  await page.getByRole('button', { name: 'Sign in', exact: true }).click();
  await expect(page.getByRole('button', { name: `Account: ${apprentice.displayName}` })).toBeVisible();
  return apprentice;
}

test('an apprentice takes the lesson 2 quiz: fresh numbers, autosave, submit, result with worked steps', async ({ page }) => {
  test.slow(); // an account through the CLI, a whole quiz answered, saved, reloaded and submitted
  const errors = watchErrors(page);
  const apprentice = await signInForQuiz(page, 'pressure-drop');

  // The lesson ends with the way to its quiz.
  await page.goto('/course/pressure-drop');
  await page.getByRole('link', { name: /^Take the quiz/ }).click();
  await expect(page.getByRole('heading', { level: 1, name: 'Pressure drop and restriction: quiz' })).toBeVisible();
  await expect(page.getByText('Pass mark')).toBeVisible();
  await expect(page.getByText('3 of 3')).toBeVisible(); // attempts left
  await page.getByRole('button', { name: 'Start the quiz' }).click();
  await expect(page.getByRole('heading', { level: 3, name: /^Question 1/ })).toBeVisible();

  // Question 1 draws its numbers per attempt: read them from the stem, compute the key as the engine does.
  const stem = await page.getByText(/flows [\d.]+ cfm at [\d.]+ inH2O/).first().innerText();
  const [, flow, from, to] = /flows ([\d.]+) cfm at ([\d.]+) inH2O.*?at ([\d.]+) inH2O/s.exec(stem) ?? [];
  expect([flow, from, to].every(Boolean)).toBe(true);
  const key = keyFor(Number(flow), Number(from), Number(to));
  const first = page.getByLabel('Your answer to question 1');
  await expect(first).toHaveAccessibleDescription(/within 1 %/);
  // As the server gives it back on reload: 323.0 is stored as the number 323.
  const typed = String(Number(key.toFixed(1)));
  await first.fill(typed);
  await expect(first).toHaveAccessibleDescription(/Saved/);

  // A number that is not one is not sent; the message says why and what was typed stays.
  const third = page.getByLabel('Your answer to question 3');
  await third.fill('460,8');
  await expect(third).toHaveAccessibleDescription(/point/);
  await third.fill('460.8');
  await expect(third).toHaveAccessibleDescription(/Saved/);
  await page.getByLabel('Your answer to question 4').fill('318');

  for (const group of await page.getByRole('radiogroup').all()) await group.getByRole('radio').first().check();
  await page.getByRole('checkbox').first().check();
  const written = page.getByRole('textbox', { name: /^Your answer to question \d+$/ }).last();
  await written.fill('Ask the other shop for its test pressure, then put both figures on 28 inH2O with the square-root rule.');
  await expect(written).toHaveAccessibleDescription(/Saved/);
  await expect(page.getByLabel('Your answer to question 4')).toHaveAccessibleDescription(/Saved/);

  // Autosaved: a reload brings every answer back from the server.
  await page.reload();
  await expect(page.getByLabel('Your answer to question 1')).toHaveValue(typed);
  await expect(page.getByRole('textbox', { name: /^Your answer to question \d+$/ }).last()).toHaveValue(/square-root rule/);

  await page.getByRole('button', { name: 'Submit answers' }).click();
  const dialog = page.getByRole('alertdialog', { name: 'Submit your answers?' });
  await expect(dialog).toContainText('You answered 9 of 9 questions.');
  await dialog.getByRole('button', { name: 'Submit answers' }).click();

  await expect(page.getByRole('heading', { level: 2, name: 'Result of attempt 1' })).toBeVisible();
  await expect(page.getByText(/This score is provisional/)).toBeVisible();
  await expect(page.getByRole('heading', { level: 3, name: /^Question 1: Right/ })).toBeVisible();
  await expect(page.getByText('Waiting for your instructor.', { exact: true })).toBeVisible();
  // The worked steps carry the numbers this attempt was given.
  const steps = page.getByRole('region', { name: 'Worked steps of question 1' });
  await expect(steps).toContainText(String(Number(flow)));
  await expect(steps).toContainText(String(Number(from))); // the stem writes the step's decimals (13.0), the steps the number (13)

  // My progress, from the account menu, counts the attempt.
  await page.getByRole('button', { name: `Account: ${apprentice.displayName}` }).click();
  await page.getByRole('menuitem', { name: 'My progress' }).click();
  const row = page.getByRole('table', { name: 'Lessons and quizzes' }).getByRole('row', { name: /Pressure drop and restriction/ });
  await expect(row).toContainText('1 of 3');
  await expect(row).toContainText(/Opened|Read to the end/);

  expect(errors).toEqual([]);
});

test('the quiz page has no serious accessibility violations', async ({ page }) => {
  test.slow(); // an account through the CLI and a whole-page scan of nine questions
  const errors = watchErrors(page);
  await signInForQuiz(page, 'pressure');
  await page.getByRole('button', { name: 'Start the quiz' }).click();
  await expect(page.getByRole('heading', { level: 3, name: /^Question 1/ })).toBeVisible();
  await page.getByRole('radiogroup').first().getByRole('radio').first().check();
  await expectNoSeriousViolations(page);
  expect(errors).toEqual([]);
});

test('the result page has no serious accessibility violations', async ({ page }) => {
  test.slow(); // an account through the CLI, a submitted attempt and a whole-page scan
  const errors = watchErrors(page);
  await signInForQuiz(page, 'pressure');
  await page.getByRole('button', { name: 'Start the quiz' }).click();
  await expect(page.getByRole('heading', { level: 3, name: /^Question 1/ })).toBeVisible();
  await page.getByRole('radiogroup').first().getByRole('radio').first().check();
  await page.getByRole('button', { name: 'Submit answers' }).click();
  await page.getByRole('alertdialog', { name: 'Submit your answers?' }).getByRole('button', { name: 'Submit answers' }).click();
  await expect(page.getByRole('heading', { level: 2, name: 'Result of attempt 1' })).toBeVisible();
  await expectNoSeriousViolations(page);
  expect(errors).toEqual([]);
});
