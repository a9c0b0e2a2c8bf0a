import { expect, test } from '@playwright/test';

import { chooseUnit, expectNoBlockingViolations, numberField, results, resultValue, unitPicker } from './calculator-page';
import { watchErrors } from './page-errors';

// Expected figures are the engine's own (CIPM-2007 moist-air density, shared/airflow), as the
// page must show them; the engine's tests check those against the published references.

// A British browser, so the pages open in SI as the figures below expect (Playwright's default, en-US, opens in US units).
test.use({ locale: 'en-GB' });

const airDensity = 'Air density from temperature, pressure and humidity';
const topics = ['Pressure', 'Flow', 'Air density', 'Mass flow', 'Forced induction', 'Sensors and uncertainty'];

test('a visitor works out air density, copies the link, and the link opens the same calculation', async ({ page, context, baseURL }) => {
  test.slow(); // the list, a calculation in US units, then the shared link in a second page
  await context.grantPermissions(['clipboard-read', 'clipboard-write'], { origin: baseURL });
  const errors = watchErrors(page);
  await page.goto('/calculators');
  for (const topic of topics) {
    await expect(page.getByRole('heading', { level: 2, name: topic, exact: true })).toBeVisible();
  }
  await page.getByRole('link', { name: airDensity }).click();
  await expect(page.getByRole('heading', { level: 1, name: airDensity })).toBeVisible();
  await expect(page).toHaveTitle(`${airDensity} · Flowlore`);

  await numberField(page, 'Air temperature').fill('77');
  await chooseUnit(page, 'Air temperature', '°F');
  await numberField(page, 'Barometric pressure (absolute)').fill('29.5');
  await chooseUnit(page, 'Barometric pressure (absolute)', 'inHg');
  await numberField(page, /^Relative humidity/).fill('40');

  await expect(resultValue(page, 'Air density')).toHaveText('1.162');
  // SI results read in the shop's units: °C, not the engine's kelvin.
  await expect(resultValue(page, 'Dew point')).toHaveText('10.481');
  await expect(page.getByRole('combobox', { name: 'Unit for Dew point (result)' })).toContainText('°C');
  const steps = page.getByRole('region', { name: 'Worked steps' });
  await expect(steps.getByRole('heading', { level: 3, name: 'Density of moist air (CIPM-2007)' })).toBeVisible();
  await expect(steps.getByRole('math').first()).toBeAttached();
  await expect(steps.getByRole('math')).not.toHaveCount(0);

  await page.getByRole('button', { name: 'Copy link' }).click();
  await expect(page.getByText('Link copied').first()).toBeVisible();
  const link = await page.evaluate(() => navigator.clipboard.readText());
  expect(link).toMatch(/\/calculators\/air-density\?.*temperature=77~degF/);

  const opened = await context.newPage();
  const openedErrors = watchErrors(opened);
  await opened.goto(link);
  await expect(opened).toHaveTitle(`${airDensity} · Flowlore`);
  await expect(resultValue(opened, 'Air density')).toHaveText('1.162');
  await expect(resultValue(opened, 'Dew point')).toHaveText('10.481');
  await expect(numberField(opened, 'Air temperature')).toHaveValue('77');
  await expect(unitPicker(opened, 'Air temperature')).toContainText('°F');
  await expect(numberField(opened, 'Barometric pressure (absolute)')).toHaveValue('29.5');
  await expect(unitPicker(opened, 'Barometric pressure (absolute)')).toContainText('inHg');
  await expect(numberField(opened, /^Relative humidity/)).toHaveValue('40');
  await expect(opened.getByRole('radio', { name: 'Relative humidity' })).toBeChecked();
  expect([...errors, ...openedErrors]).toEqual([]);
});

test('an impossible humidity is refused beside the field, and fixing it brings the result back', async ({ page }) => {
  // Opened from a link: the message shows at once, on a field nobody has touched yet.
  await page.goto('/calculators/air-density?temperature=20~degC&pressure=1013.25~hPa&relativeHumidity=150~pct&units=si');
  const humidity = numberField(page, /^Relative humidity/);
  await expect(humidity).toHaveAttribute('aria-invalid', 'true');
  await expect(humidity).toHaveAccessibleDescription(/Relative humidity must be at most 100 %/);
  await expect(results(page)).toContainText('Fix the marked fields');
  await expect(results(page).getByRole('row')).toHaveCount(0);
  await expect(humidity).toHaveValue('150');

  await humidity.fill('50');
  await expect(resultValue(page, 'Air density')).toHaveText('1.1993');
  await expect(humidity).toHaveAttribute('aria-invalid', 'false');

  // Typed: the same message, and what was typed stays as typed.
  await humidity.fill('150');
  await expect(humidity).toHaveAttribute('aria-invalid', 'true');
  await expect(humidity).toHaveAccessibleDescription(/Relative humidity must be at most 100 %/);
  await expect(results(page)).toContainText('Fix the marked fields');
  await expect(humidity).toHaveValue('150');
});

test('the US/SI switch converts what was typed and keeps the physical result', async ({ page }) => {
  test.slow(); // two visits and four conversions, each waiting for the result
  // The SI example: 20 °C, 1013 hPa, 50 % (its own round figures).
  await page.goto('/calculators/air-density');
  await expect(numberField(page, 'Air temperature')).toHaveValue('20');
  await expect(numberField(page, 'Barometric pressure (absolute)')).toHaveValue('1013');
  await expect(resultValue(page, 'Air density')).toHaveText('1.199');

  await page.getByRole('radio', { name: 'US customary' }).click();
  await expect(numberField(page, 'Air temperature')).toHaveValue('68');
  await expect(unitPicker(page, 'Air temperature')).toContainText('°F');
  await expect(numberField(page, 'Barometric pressure (absolute)')).toHaveValue('29.9139');
  await expect(unitPicker(page, 'Barometric pressure (absolute)')).toContainText('inHg');
  // 1.1990 kg/m³ is 0.074852 lb/ft³.
  await expect(resultValue(page, 'Air density')).toHaveText('0.074852');
  await expect(page.getByRole('combobox', { name: 'Unit for Air density (result)' })).toContainText('lb/ft³');

  await page.getByRole('radio', { name: 'SI', exact: true }).click();
  await expect(numberField(page, 'Air temperature')).toHaveValue('20');
  await expect(numberField(page, 'Barometric pressure (absolute)')).toHaveValue('1013');
  await expect(resultValue(page, 'Air density')).toHaveText('1.199');

  // The choice is remembered: a fresh visit opens in the system picked last.
  await page.getByRole('radio', { name: 'US customary' }).click();
  await expect(numberField(page, 'Air temperature')).toHaveValue('68');
  await page.goto('/calculators/air-density');
  await expect(numberField(page, 'Air temperature')).toHaveValue('68');
  await expect(page.getByRole('radio', { name: 'US customary' })).toBeChecked();
});

test('reset to example fills the worked example back in and shows its result', async ({ page }) => {
  await page.goto('/calculators/air-density');
  await numberField(page, 'Air temperature').fill('');
  await numberField(page, 'Barometric pressure (absolute)').fill('abc');
  await page.getByRole('radio', { name: 'Dew point' }).click();
  await expect(results(page)).toContainText('Fix the marked fields');

  await page.getByRole('button', { name: 'Reset to example' }).click();
  await expect(numberField(page, 'Air temperature')).toHaveValue('20');
  await expect(numberField(page, 'Barometric pressure (absolute)')).toHaveValue('1013');
  await expect(page.getByRole('radio', { name: 'Relative humidity' })).toBeChecked();
  await expect(numberField(page, /^Relative humidity/)).toHaveValue('50');
  await expect(resultValue(page, 'Air density')).toHaveText('1.199');
});

for (const theme of ['Light', 'Dark']) {
  test(`a calculator page has no serious or critical accessibility violations, ${theme.toLowerCase()} theme`, async ({ page }) => {
    test.slow(); // axe checks every node, the worked steps' KaTeX included
    await page.goto('/calculators/flow-at-test-pressure');
    await expect(page.getByRole('note').filter({ hasText: 'Safety' })).toContainText('local codes');
    await expect(resultValue(page, 'Flow')).not.toBeEmpty();
    await expect(page.getByRole('region', { name: 'Worked steps' }).getByRole('math').first()).toBeAttached();
    await page.getByRole('button', { name: /theme/i }).click();
    await page.getByRole('menuitemradio', { name: theme }).click();
    await expect(page.getByRole('menu')).toBeHidden();
    await expectNoBlockingViolations(page);
  });
}

test('an unknown calculator says so and links back to the list', async ({ page }) => {
  await page.goto('/calculators/no-such-thing');
  await expect(page.getByRole('heading', { level: 1, name: 'No such calculator' })).toBeVisible();
  await page.getByRole('main').getByRole('link', { name: 'See all the calculators' }).click();
  await expect(page).toHaveURL(/\/calculators$/);
});
