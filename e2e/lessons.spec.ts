import AxeBuilder from '@axe-core/playwright';
import { expect, test, type Locator, type Page } from '@playwright/test';
import { watchErrors } from './page-errors';

// Lesson 1 and 2 as content/lessons/ has them; expected figures are the engine's own
// (shared/airflow), as the embedded calculator must show them.

// A British browser, so the pages open in SI as the figures below expect (Playwright's default, en-US, opens in US units).
test.use({ locale: 'en-GB' });

const pressureLesson = 'Pressure — absolute, gauge and differential';
const pressureCalculator = 'Pressure: units, absolute and gauge';

/** The figure in an output's results row (its first data cell). */
function resultValue(panel: Locator, output: string): Locator {
  return panel
    .getByRole('region', { name: 'Results' })
    .getByRole('row', { name: new RegExp(`^${output}\\b`) })
    .getByRole('cell')
    .first();
}

async function chooseTheme(page: Page, label: string): Promise<void> {
  await page.getByRole('button', { name: /theme/i }).click();
  await page.getByRole('menuitemradio', { name: label }).click();
  await expect(page.getByRole('menu')).toBeHidden();
}

async function openLesson(page: Page, slug: string, title: string): Promise<void> {
  await page.goto(`/course/${slug}`);
  await expect(page.getByRole('heading', { level: 1, name: title })).toBeVisible();
}

test('a visitor reads the free lesson, works its calculator, and moves on to the next lesson', async ({ page }) => {
  test.slow(); // two lessons and a worked calculator
  const errors = watchErrors(page);
  await page.goto('/course');
  await expect(page.getByRole('heading', { level: 1, name: 'The course' })).toBeVisible();
  await expect(page.getByRole('listitem').filter({ hasText: pressureLesson })).toContainText('Free to read');
  await page.getByRole('link', { name: pressureLesson }).click();

  await expect(page.getByRole('heading', { level: 1, name: pressureLesson })).toBeVisible();
  await expect(page).toHaveTitle(`${pressureLesson} · Flowlore`);
  await expect(page.getByRole('note', { name: 'Caution' }).first()).toContainText('local codes');

  const calculator = page.getByRole('region', { name: pressureCalculator });
  await calculator.scrollIntoViewIfNeeded();
  // The lesson's preset: −28 inH2O gauge with the barometer at 1003 hPa.
  await expect(calculator.getByRole('textbox', { name: 'Pressure', exact: true })).toHaveValue('-28');
  await expect(resultValue(calculator, 'Absolute pressure')).toHaveText('93.326');
  await calculator.getByText('Worked steps', { exact: true }).click();
  await expect(calculator.getByRole('heading', { level: 4, name: 'Absolute pressure is gauge pressure plus ambient' })).toBeVisible();

  await calculator.getByRole('textbox', { name: 'Pressure', exact: true }).fill('-10');
  await expect(resultValue(calculator, 'Absolute pressure')).toHaveText('97.809');
  await expect(resultValue(calculator, 'Gauge pressure')).toHaveText('−2.4909');
  // −10 inH2O is −2490.9 Pa in the steps (NIST SP 811: 1 inH2O = 249.0889 Pa).
  await expect(calculator.getByRole('heading', { level: 4, name: 'Convert the inputs to SI units' })).toBeVisible();
  await expect(calculator).toContainText('2490.9');
  await expect(calculator.getByRole('link', { name: 'Open in the calculator' })).toHaveAttribute('href', /pressure=-10~inH2O/);

  await page.getByRole('navigation', { name: 'Previous and next lesson' }).getByRole('link', { name: /^Next/ }).click();
  await expect(page.getByRole('heading', { level: 1, name: 'Pressure drop and restriction' })).toBeVisible();
  await expect(page).toHaveTitle('Pressure drop and restriction · Flowlore');
  expect(errors).toEqual([]);
});

test('a worked example links to the calculator with its numbers, and the calculator agrees', async ({ page }) => {
  await openLesson(page, 'pressure', pressureLesson);
  const example = page.getByRole('region', { name: 'Worked example' }).first();
  await expect(example).toContainText('Absolute pressure = 104.5 psi');
  await example.getByRole('link', { name: 'Check these numbers in the calculator' }).first().click();
  await expect(page.getByRole('heading', { level: 1, name: pressureCalculator })).toBeVisible();
  await expect(resultValue(page.getByRole('main'), 'Absolute pressure')).toHaveText('104.55');
});

test('a returning reader is offered the heading they reached', async ({ page }) => {
  test.slow(); // the lesson is opened twice
  await openLesson(page, 'pressure', pressureLesson);
  const contents = page.getByRole('navigation', { name: 'On this page' });
  await contents.getByRole('link', { name: 'The water-column manometer' }).click();
  await expect(page).toHaveURL(/#the-water-column-manometer$/);
  await expect(contents.getByRole('link', { name: 'The water-column manometer' })).toHaveAttribute('aria-current', 'location');

  await openLesson(page, 'pressure', pressureLesson);
  await page.getByRole('link', { name: 'Continue where you left off: The water-column manometer' }).click();
  await expect(page.getByRole('heading', { level: 2, name: 'The water-column manometer' })).toBeInViewport();
});

test('a lesson prints without the site around it, answers open', async ({ page }) => {
  await openLesson(page, 'pressure', pressureLesson);
  const main = page.getByRole('navigation', { name: 'Main' });
  const contents = page.getByRole('navigation', { name: 'On this page' });
  const theme = page.getByRole('button', { name: /theme/i });
  await expect(main).toBeVisible();
  await expect(contents).toBeVisible();
  await expect(theme).toBeVisible();
  await expect(page.getByText('About 24.5 psi absolute')).toBeHidden();

  await page.emulateMedia({ media: 'print' });
  await expect(main).toBeHidden();
  await expect(theme).toBeHidden();
  await expect(contents).toBeHidden();
  await expect(page.getByRole('navigation', { name: 'Previous and next lesson' })).toBeHidden();
  await expect(page.getByRole('heading', { level: 1, name: pressureLesson })).toBeVisible();
  await expect(page.getByText('Air is made of molecules flying about')).toBeVisible();
  // A check-yourself answer, folded on screen, is on paper.
  await expect(page.getByText('About 24.5 psi absolute')).toBeVisible();
});

for (const [device, width, height] of [['desktop', 1280, 800], ['tablet', 800, 1100]] as const) {
  test(`screenshots of a lesson in light and dark, ${device}`, async ({ page }, testInfo) => {
    test.slow(); // a long lesson page, rendered and captured in two themes
    await page.setViewportSize({ width, height });
    await openLesson(page, 'pressure', pressureLesson);
    for (const theme of ['Light', 'Dark']) {
      await chooseTheme(page, theme);
      await testInfo.attach(`lesson-${device}-${theme.toLowerCase()}`, {
        body: await page.screenshot({ fullPage: false }),
        contentType: 'image/png',
      });
    }
  });
}

for (const theme of ['Light', 'Dark']) {
  test(`a lesson page has no serious or critical accessibility violations, ${theme.toLowerCase()} theme`, async ({ page }) => {
    test.slow(); // axe checks every node of a long page with KaTeX and a calculator
    await openLesson(page, 'pressure', pressureLesson);
    await expect(resultValue(page.getByRole('region', { name: pressureCalculator }), 'Absolute pressure')).not.toBeEmpty();
    await chooseTheme(page, theme);
    const scan = await new AxeBuilder({ page }).withTags(['wcag2a', 'wcag2aa', 'wcag21a', 'wcag21aa', 'wcag22aa']).analyze();
    const blocking = scan.violations.filter((v) => v.impact === 'serious' || v.impact === 'critical');
    expect(blocking.map((v) => `${v.id}: ${v.help} (${v.nodes.map((n) => n.target.join(' ')).join(', ')})`)).toEqual([]);
  });
}

test('the glossary lists a term and leads to the lesson that defines it', async ({ page }) => {
  test.slow(); // course, glossary, then a lesson
  await page.goto('/course');
  await page.getByRole('link', { name: /glossary/i }).first().click();
  await expect(page.getByRole('heading', { level: 1, name: 'Glossary' })).toBeVisible();
  await page.getByRole('navigation', { name: 'Letters' }).getByRole('link', { name: 'T', exact: true }).click();
  await expect(page.getByRole('heading', { level: 2, name: 'T', exact: true })).toBeInViewport();
  await expect(page.getByRole('term').filter({ hasText: /^Test pressure$/ })).toBeVisible();
  const definition = page.getByRole('definition').filter({ hasText: 'The pressure drop across the part' });
  await definition.getByRole('link', { name: 'Pressure drop and restriction' }).click();
  await expect(page.getByRole('heading', { level: 1, name: 'Pressure drop and restriction' })).toBeVisible();
});

test('KaTeX\'s stylesheet and fonts come with a lesson, not with the home page', async ({ page }) => {
  test.slow(); // home page to network idle, course, then a lesson
  const loaded: string[] = [];
  page.on('request', (request) => loaded.push(request.url()));
  await page.goto('/', { waitUntil: 'networkidle' });
  expect(loaded.filter((url) => /katex/i.test(url))).toEqual([]);

  await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Course' }).click();
  await page.getByRole('link', { name: pressureLesson }).click();
  await expect(page.getByRole('heading', { level: 1, name: pressureLesson })).toBeVisible();
  await expect.poll(() => loaded.some((url) => /katex\.css/.test(url))).toBe(true);
});

test('an unknown lesson says so and links back to the course', async ({ page }) => {
  await page.goto('/course/no-such-lesson');
  await expect(page.getByRole('heading', { level: 1, name: 'No such lesson' })).toBeVisible();
  await expect(page).toHaveTitle('No such lesson · Flowlore');
  await page.getByRole('main').getByRole('link', { name: 'See the course' }).click();
  await expect(page.getByRole('heading', { level: 1, name: 'The course' })).toBeVisible();
});
