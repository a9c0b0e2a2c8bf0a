import { expect, test } from '@playwright/test';

import {
  expectNoBlockingViolations,
  labelStart,
  numberField,
  results,
  resultNotes,
  resultValue,
  shareLink,
  typedInputs,
  unitPicker,
} from './calculator-page';
import { watchErrors } from './page-errors';

// The calculators added for course-review-1 (G1–G4, G6). Expected figures are the engine's own
// (shared/airflow), as the page must show them; the engine's tests check those against their
// references. The SI examples are the calculators' own round figures.

// A British browser, so the pages open in SI as the figures below expect (Playwright's default, en-US, opens in US units).
test.use({ locale: 'en-GB' });

const compareTitle = 'Comparing two tests: is the change real?';
const readingsA = 'Readings A (before, or stock)';
const readingsB = 'Readings B (after, or ported)';

test('comparing two tests: the review’s porting gain is shown, and the link opens the same readings', async ({ page, context }) => {
  test.slow(); // calculations, the US switch and the link in a second page
  const errors = watchErrors(page);
  await page.goto('/calculators/compare-tests');
  await expect(page.getByRole('heading', { level: 1, name: compareTitle })).toBeVisible();
  await expect(page).toHaveTitle(`${compareTitle} · Flowlore`);

  // The SI example: 117 118 119 L/s against 120 121 122 L/s, one field each, spaces between readings.
  await expect(numberField(page, readingsA)).toHaveValue('117 118 119');
  await expect(numberField(page, readingsA)).toHaveAccessibleDescription(/Type 2 to 30 readings with a space between them\..*3 readings/);
  await expect(unitPicker(page, readingsA)).toContainText('L/s');
  await expect(resultValue(page, 'Difference B − A')).toHaveText('3');
  await expect(resultValue(page, 'Expanded uncertainty of the difference (95 %)')).toHaveText('2.267');
  await expect(resultNotes(page)).toContainText('A gain of 3.0 ± 2.3 L/s is shown');

  // The switch converts every reading, as it does a single value (1 L/s = 2.118 88 cfm).
  await page.getByRole('radio', { name: 'US customary' }).click();
  await expect(numberField(page, readingsA)).toHaveValue('247.909 250.028 252.147');
  await expect(unitPicker(page, readingsA)).toContainText('cfm');

  // course-review-1 E1's worked example: n = 3 refits each, s = 1.2 cfm, same day: U95 = 2.78 × 0.98 = 2.7 cfm.
  await numberField(page, readingsA).fill('248.8 250.0 251.2');
  await numberField(page, readingsB).fill('252.8 254.0 255.2');
  await expect(page.getByRole('radio', { name: 'Same bench, orifice and day' })).toBeChecked();
  await expect(resultValue(page, 'Mean of A')).toHaveText('250');
  await expect(resultValue(page, 'Standard deviation of A (scatter of the runs)')).toHaveText('1.2');
  await expect(resultValue(page, 'Difference B − A')).toHaveText('4');
  await expect(resultValue(page, 'Expanded uncertainty of the difference (95 %)')).toHaveText('2.7203');
  await expect(resultNotes(page)).toContainText('is shown');
  await expect(resultNotes(page)).toContainText('A gain of 4.0 ± 2.7 cfm is shown');

  const link = await shareLink(page, 'readingsA=248.8_250.0_251.2~cfm', 'readingsB=252.8_254.0_255.2~cfm', 'units=us');
  const typed = await typedInputs(page);
  const opened = await context.newPage();
  const openedErrors = watchErrors(opened);
  await opened.goto(link);
  await expect(opened.getByRole('heading', { level: 1, name: compareTitle })).toBeVisible();
  await expect(numberField(opened, readingsA)).toHaveValue('248.8 250.0 251.2');
  await expect(numberField(opened, readingsB)).toHaveValue('252.8 254.0 255.2');
  expect(await typedInputs(opened)).toEqual(typed);
  await expect(unitPicker(opened, readingsB)).toContainText('cfm');
  await expect(opened.getByRole('radio', { name: 'US customary' })).toBeChecked();
  await expect(resultValue(opened, 'Expanded uncertainty of the difference (95 %)')).toHaveText('2.7203');
  await expect(resultNotes(opened)).toContainText('A gain of 4.0 ± 2.7 cfm is shown');
  expect([...errors, ...openedErrors]).toEqual([]);
});

test('comparing two tests with readings and a verdict has no serious accessibility violations', async ({ page }) => {
  test.slow(); // a whole-page scan, worked steps included
  const errors = watchErrors(page);
  await page.goto('/calculators/compare-tests?readingsA=248.8_250.0_251.2~cfm&readingsB=252.8_254.0_255.2~cfm&units=us');
  await expect(resultNotes(page)).toContainText('A gain of 4.0 ± 2.7 cfm is shown');
  await expectNoBlockingViolations(page);
  expect(errors).toEqual([]);
});

test('a list of readings that cannot be read is refused beside its field and kept as typed', async ({ page }) => {
  await page.goto('/calculators/compare-tests');
  const field = numberField(page, readingsB);
  await expect(resultValue(page, 'Difference B − A')).toHaveText('3');

  await field.fill('120 12I 122');
  await expect(field).toHaveAttribute('aria-invalid', 'true');
  await expect(field).toHaveAccessibleDescription(/“12I” is not a number/);
  await expect(results(page)).toContainText('Fix the marked fields');
  await expect(field).toHaveValue('120 12I 122');

  // "120,5" could be a decimal comma: never read as two readings.
  await field.fill('120,5 121,5 122,5');
  await expect(field).toHaveAccessibleDescription(/write decimals with a point/);
  await expect(field).toHaveValue('120,5 121,5 122,5');

  // Commas after decimal points separate readings.
  await field.fill('120.0,121.0,122.0');
  await expect(field).toHaveAttribute('aria-invalid', 'false');
  await expect(resultValue(page, 'Difference B − A')).toHaveText('3');
});

interface Case {
  readonly id: string;
  readonly title: string;
  /** Outputs of the SI example: label → figure as shown. */
  readonly example: Readonly<Record<string, string>>;
  /** Part of a note the example shows, if it shows one. */
  readonly note?: string;
  /** One input changed: its label, the example's value, the new one, the link's parameter. */
  readonly change: { readonly label: string; readonly from: string; readonly to: string; readonly param: string };
  /** An output after the change. */
  readonly changed: readonly [output: string, figure: string];
}

const cases: readonly Case[] = [
  {
    id: 'port-velocity',
    title: 'Port velocity, effective area and pitot probe',
    example: {
      'Ideal velocity at the test pressure': '108.01',
      'Mean velocity through the section': '89.286',
      'Velocity at the probe': '86.603',
      'Minimum section area for the target speed': '9.375',
    },
    note: 'starting figure for a port, not a design',
    change: { label: 'Bench flow', from: '75', to: '80', param: 'flow=80~L_per_s' },
    changed: ['Mean velocity through the section', '95.238'],
  },
  {
    id: 'discharge-coefficient',
    title: 'Discharge coefficient of a valve and port',
    example: { 'Reference area': '11.341', 'Discharge coefficient': '0.61225', 'Lift over diameter': '0.25', 'Effective area': '6.9437' },
    change: { label: 'Bench flow', from: '75', to: '80', param: 'flow=80~L_per_s' },
    changed: ['Discharge coefficient', '0.65307'],
  },
  {
    id: 'power-potential',
    title: 'Power potential from air flow',
    example: { 'Power potential (mass route)': '120', 'Power potential (head-flow rule of thumb)': '121.82' },
    note: 'a potential, not a prediction',
    change: { label: 'Air mass flow', from: '125', to: '150', param: 'airMassFlow=150~g_per_s' },
    changed: ['Power potential (mass route)', '144'],
  },
  {
    id: 'speed-density',
    title: 'Speed-density air mass and a mass-air sensor check',
    example: { 'Manifold air density': '2.2238', 'Air mass flow (speed-density)': '200.14', 'Sensor difference': '−2.5683' },
    note: 'only as good as its VE figure',
    change: { label: 'Engine speed', from: '6000', to: '3000', param: 'engineSpeed=3000~rpm' },
    changed: ['Air mass flow (speed-density)', '100.07'],
  },
];

for (const c of cases) {
  test(`${c.id}: the example's results, a changed input, the link in a fresh page, no serious accessibility violations`, async ({
    page,
    context,
  }) => {
    test.slow(); // a calculation, the link in a second page and an axe scan
    const errors = watchErrors(page);
    await page.goto(`/calculators/${c.id}`);
    await expect(page.getByRole('heading', { level: 1, name: c.title })).toBeVisible();
    await expect(page).toHaveTitle(`${c.title} · Flowlore`);
    for (const [output, figure] of Object.entries(c.example)) await expect(resultValue(page, output)).toHaveText(figure);
    if (c.note !== undefined) await expect(resultNotes(page)).toContainText(c.note);

    const [output, figure] = c.changed;
    await expect(numberField(page, labelStart(c.change.label))).toHaveValue(c.change.from);
    await numberField(page, labelStart(c.change.label)).fill(c.change.to);
    await expect(resultValue(page, output)).toHaveText(figure);

    const link = await shareLink(page, c.change.param, 'units=si');
    const typed = await typedInputs(page);
    const opened = await context.newPage();
    const openedErrors = watchErrors(opened);
    await opened.goto(link);
    await expect(opened.getByRole('heading', { level: 1, name: c.title })).toBeVisible();
    await expect(numberField(opened, labelStart(c.change.label))).toHaveValue(c.change.to);
    expect(await typedInputs(opened)).toEqual(typed);
    await expect(resultValue(opened, output)).toHaveText(figure);
    await expectNoBlockingViolations(opened);
    expect([...errors, ...openedErrors]).toEqual([]);
  });
}
