/* A calculator page as the journeys read it: its fields and results by role and label, and its accessibility scan. */
import AxeBuilder from '@axe-core/playwright';
import { expect, type Locator, type Page } from '@playwright/test';

/** Text as a regular expression source that matches it literally. */
export function literal(text: string): string {
  return text.replace(/[.*+?^${}()|[\]\\]/g, '\\$&');
}

/** A label by its start: "Bench flow" finds "Bench flow (optional)" too. */
export function labelStart(text: string): RegExp {
  return new RegExp(`^${literal(text)}`);
}

/** A number field by its whole label, or by a pattern. */
export function numberField(page: Page, label: string | RegExp): Locator {
  return page.getByRole('textbox', { name: label, exact: typeof label === 'string' });
}

export function unitPicker(page: Page, label: string): Locator {
  return page.getByRole('combobox', { name: `Unit for ${label}`, exact: true });
}

export async function chooseUnit(page: Page, label: string, unit: string): Promise<void> {
  await unitPicker(page, label).click();
  await page.getByRole('option', { name: unit, exact: true }).click();
  await expect(unitPicker(page, label)).toContainText(unit);
}

export function results(page: Page): Locator {
  return page.getByRole('region', { name: 'Results' });
}

/** The figure in the results row of an output (its first data cell). */
export function resultValue(page: Page, output: string): Locator {
  return results(page)
    .getByRole('row', { name: new RegExp(`^${literal(output)}(\\s|$)`) })
    .getByRole('cell')
    .first();
}

/** The calculator's own notes above the figures: its verdict and caveats. */
export function resultNotes(page: Page): Locator {
  return results(page).getByRole('note', { name: 'What the results show' });
}

/** Every text field of the form, as it reads now. */
export async function typedInputs(page: Page): Promise<string[]> {
  const values: string[] = [];
  for (const field of await page.getByRole('region', { name: 'Inputs' }).getByRole('textbox').all()) values.push(await field.inputValue());
  return values;
}

/** The page's address once it holds the share link for what is on screen (it follows each settled change). */
export async function shareLink(page: Page, ...params: string[]): Promise<string> {
  for (const param of params) await expect(page).toHaveURL(new RegExp(`[?&]${literal(param)}(&|$)`));
  return page.url();
}

/** An axe scan (WCAG 2.2 AA tags) of the whole page with no serious or critical violation. */
export async function expectNoBlockingViolations(page: Page): Promise<void> {
  // The scan covers the worked steps' KaTeX too: they come when scrolled to (or 6 s after the first
  // paint), so scroll to them rather than wait.
  const steps = page.getByRole('region', { name: 'Worked steps' });
  await steps.scrollIntoViewIfNeeded();
  await expect(steps.getByRole('math').first()).toBeAttached();
  const scan = await new AxeBuilder({ page }).withTags(['wcag2a', 'wcag2aa', 'wcag21a', 'wcag21aa', 'wcag22aa']).analyze();
  const blocking = scan.violations.filter((v) => v.impact === 'serious' || v.impact === 'critical');
  expect(blocking.map((v) => `${v.id}: ${v.help} (${v.nodes.map((n) => n.target.join(' ')).join(', ')})`)).toEqual([]);
}
