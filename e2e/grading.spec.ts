import { readFileSync } from 'node:fs';

import AxeBuilder from '@axe-core/playwright';
import { expect, test, type APIRequestContext, type Browser, type BrowserContext, type Page } from '@playwright/test';

import { authFile, createUserByCli, E2E_PASSWORD, type CreatedUser } from './accounts-cli';
import { watchErrors } from './page-errors';

// Mail is read from the catcher `npm test` starts (maildev's REST API), never from a mocked transport.
const maildevApiUrl = process.env['MAILDEV_API_URL'];

interface CaughtMail {
  subject: string;
  text: string;
  to: Array<{ address: string }>;
}

/** An axe scan (WCAG 2.2 AA tags) of the whole page: no serious or critical violation. */
async function expectNoSeriousViolations(page: Page): Promise<void> {
  const results = await new AxeBuilder({ page }).withTags(['wcag2a', 'wcag2aa', 'wcag21a', 'wcag21aa', 'wcag22aa']).analyze();
  const blocking = results.violations.filter((v) => v.impact === 'serious' || v.impact === 'critical');
  expect(blocking.map((v) => `${v.id}: ${v.help} (${v.nodes.length})`)).toEqual([]);
}

/** A context with the project's options (new contexts do not take them from the config by themselves). */
async function contextFor(browser: Browser, storageState?: string): Promise<BrowserContext> {
  return browser.newContext({ baseURL: test.info().project.use.baseURL, serviceWorkers: 'block', storageState });
}

/** A change through the API with the CSRF header Angular would send (the token is asked for first). */
async function send(request: APIRequestContext, method: 'post' | 'put', path: string, data?: object): Promise<unknown> {
  const { token } = (await (await request.get('/api/auth/csrf')).json()) as { token: string };
  const res = await request.fetch(path, { method: method.toUpperCase(), data, headers: { 'X-XSRF-TOKEN': token } });
  expect(res.ok(), `${method.toUpperCase()} ${path}: ${res.status()} ${await res.text()}`).toBe(true);
  return res.json();
}

async function signIn(page: Page, user: CreatedUser): Promise<void> {
  await page.goto('/account/sign-in');
  await page.getByLabel('E-mail address').fill(user.email);
  await page.getByLabel('Password', { exact: true }).fill(E2E_PASSWORD);
  await page.getByRole('button', { name: 'Sign in', exact: true }).click();
  await expect(page.getByRole('button', { name: `Account: ${user.displayName}` })).toBeVisible();
}

/** Waits for a message to the address whose subject matches, and returns it. */
async function mailTo(address: string, subject: RegExp): Promise<CaughtMail> {
  let found: CaughtMail | undefined;
  await expect
    .poll(async () => {
      const res = await fetch(`${maildevApiUrl}/api/email`);
      const all = (await res.json()) as CaughtMail[];
      found = all.find((mail) => subject.test(mail.subject) && mail.to.some((to) => to.address.toLowerCase() === address.toLowerCase()));
      return found !== undefined;
    }, { message: `a message to ${address} with subject ${subject}`, timeout: 15_000 })
    .toBe(true);
  return found!;
}

const QUIZ = { slug: 'pressure', title: 'Pressure — absolute, gauge and differential', written: 'why-differential' };

/**
 * The owner's shop, a new apprentice in it (CLI), the instructor's new cohort with the apprentice
 * (API), and a submitted attempt at the quiz with its written answer (the quiz page itself is the
 * other spec's journey), the apprentice signed in on `student`.
 */
async function writtenAnswerInCohort(teacher: Page, boss: Page, student: Page): Promise<{ apprentice: CreatedUser; cohort: { id: string }; attempt: { id: string } }> {
  const shop = (await (await boss.request.get('/api/shops/mine')).json()) as { name: string };
  const apprentice = createUserByCli('apprentice', { shop: shop.name });
  const cohort = (await send(teacher.request, 'post', '/api/cohorts', { name: `E2E grading ${apprentice.id.slice(0, 8)}` })) as { id: string };
  await send(teacher.request, 'post', `/api/cohorts/${cohort.id}/members`, { email: apprentice.email });
  await signIn(student, apprentice);
  const attempt = (await send(student.request, 'post', `/api/quizzes/${QUIZ.slug}/attempts`)) as { id: string };
  await send(student.request, 'put', `/api/attempts/${attempt.id}/answers/${QUIZ.written}`, {
    answer: { text: 'One leg is on the plenum and one is open to the room, so it reads the difference: the push through the head.' },
  });
  await send(student.request, 'post', `/api/attempts/${attempt.id}/submit`);
  return { apprentice, cohort, attempt };
}

test.describe('grading a written answer', () => {
  test.skip(!maildevApiUrl, 'MAILDEV_API_URL is not set: run with `npm test`, which starts the mail catcher');

  test('queue → rubric marks → the apprentice is told by e-mail and in the app → gradebook CSV → the owner sees progress', async ({ browser }) => {
    // Three people in three browsers, an account through the CLI, an e-mail and a download: about 30 s
    // alone, 45 s beside another browser test on two cores; four times Playwright's default leaves room.
    test.setTimeout(120_000);

    const instructor = await contextFor(browser, authFile('instructor'));
    const owner = await contextFor(browser, authFile('shop_owner'));
    const learner = await contextFor(browser);
    const teacher = await instructor.newPage();
    const boss = await owner.newPage();
    const student = await learner.newPage();
    const errors = [teacher, boss, student].map((page) => watchErrors(page));

    const { apprentice, cohort, attempt } = await writtenAnswerInCohort(teacher, boss, student);

    // The instructor finds it in the grading queue, oldest first, and marks the rubric.
    await teacher.goto('/');
    await teacher.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Grading' }).click();
    await expect(teacher.getByRole('heading', { level: 1, name: 'Grading' })).toBeVisible();
    const entry = teacher.getByRole('button', { name: new RegExp(`^${apprentice.displayName} ${QUIZ.title} · question \\d+`) });
    await expect(entry).toBeVisible();
    await entry.click();
    await expect(teacher.getByRole('heading', { level: 2, name: `${apprentice.displayName} · ${QUIZ.title}` })).toBeVisible();
    const points = teacher.getByRole('spinbutton', { name: /^Points \(0 to 1\)/ });
    await expect(points).toHaveCount(4);
    for (const [i, value] of ['1', '1', '0', '0'].entries()) await points.nth(i).fill(value);
    await expect(teacher.getByText('Total: 2 of 4 points')).toBeVisible();
    await teacher.getByLabel('Comment for the apprentice').fill('Right about the two legs. Now say why the barometer does not change the 28 inches.');
    await teacher.getByRole('button', { name: 'Save grade' }).click();
    await expect(teacher.getByRole('status').filter({ hasText: `Saved: 2 of 4 points for ${apprentice.displayName}.` })).toBeVisible();
    await expect(teacher.getByRole('status').filter({ hasText: 'They get an e-mail' })).toBeVisible();
    await expect(entry).toHaveCount(0);

    // The apprentice gets the e-mail (from the catcher) with a link to the result …
    const mail = await mailTo(apprentice.email, /is graded/);
    expect(mail.text).toContain('2 of 4 points');
    const link = /https?:\/\/\S+\/course\/pressure\/quiz\?attempt=[0-9a-f-]+/.exec(mail.text)?.[0];
    expect(link).toBeTruthy();

    // … and the bell in the top bar, which leads to the same result.
    await student.goto('/');
    const bell = student.getByRole('link', { name: 'Notifications: 1 unread' });
    await expect(bell).toBeVisible();
    await bell.click();
    await expect(student.getByRole('heading', { level: 1, name: 'Notifications' })).toBeVisible();
    await expect(student.getByRole('list', { name: 'Your notifications' })).toContainText('New');
    await student.getByRole('link', { name: `Your written answer is graded: ${QUIZ.title}` }).click();
    await expect(student).toHaveURL(new URL(link!).pathname + new URL(link!).search);
    await expect(student.getByRole('link', { name: 'Notifications', exact: true })).toBeVisible(); // read now: no count
    await expect(student.getByRole('heading', { level: 2, name: 'Result of attempt 1' })).toBeVisible();
    await expect(student.getByText(/This score is provisional/)).toHaveCount(0);
    await expect(student.getByText('Right about the two legs.', { exact: false })).toBeVisible();
    await expect(student.getByRole('table', { name: 'Your instructor’s marks' })).toBeVisible();
    const view = (await (await student.request.get(`/api/attempts/${attempt.id}`)).json()) as { score: { percent: number; provisional: boolean } };
    expect(view.score.provisional).toBe(false);

    // The instructor's gradebook shows the final score in words; its CSV holds the apprentice's row.
    await teacher.goto(`/cohorts/${cohort.id}`);
    const gradebook = teacher.getByRole('table', { name: 'Gradebook' });
    const row = gradebook.getByRole('row', { name: new RegExp(apprentice.displayName) });
    await expect(row).toContainText('Not yet passed');
    await expect(row).toContainText(`${Math.round(view.score.percent)} %`);
    const [download] = await Promise.all([teacher.waitForEvent('download'), teacher.getByRole('link', { name: /^Download CSV/ }).click()]);
    const csv = readFileSync((await download.path())!, 'utf8');
    expect(csv.charCodeAt(0)).toBe(0xfeff); // UTF-8 with BOM, for spreadsheets
    const [header, ...lines] = csv.slice(1).split('\r\n');
    expect(header).toContain(`"${QUIZ.title}: best score (%)"`);
    const line = lines.find((l) => l.includes(apprentice.email));
    // Nothing in this row needs quoting (RFC 4180): the cells are the comma-separated fields.
    const cells = line!.split(',');
    expect(cells.slice(0, 4)).toEqual([apprentice.displayName, apprentice.email, view.score.percent.toFixed(1), 'Not yet passed']);
    expect(cells.slice(4, 22)).toEqual(new Array(9).fill(['', 'Not started']).flat());
    expect(cells.slice(22, 24)).toEqual(['0', '0']); // lessons finished, quizzes passed
    expect(cells[24]).toMatch(/^\d{4}-\d\d-\d\dT[\d:.]+Z$/); // last activity: the submit
    expect(cells.slice(25)).toEqual(['No']);

    // The shop owner sees how far the apprentice got, and nothing of the answers.
    await boss.goto('/shop');
    const progress = boss.getByRole('table', { name: 'Progress' }).getByRole('row', { name: new RegExp(apprentice.displayName) });
    await expect(progress).toContainText(/0 of 10/);
    await expect(progress).not.toContainText('None yet');
    await expect(boss.getByText('Right about the two legs.')).toHaveCount(0);

    expect(errors.flat()).toEqual([]);
    await Promise.all([instructor.close(), owner.close(), learner.close()]);
  });

  test('the grading queue, the grading form, the gradebook and the notifications page have no serious accessibility violations', async ({ browser }) => {
    // Three browsers, an account through the CLI and four whole-page scans (timed like the journey above).
    test.setTimeout(120_000);
    const instructor = await contextFor(browser, authFile('instructor'));
    const owner = await contextFor(browser, authFile('shop_owner'));
    const learner = await contextFor(browser);
    const [teacher, boss, student] = await Promise.all([instructor.newPage(), owner.newPage(), learner.newPage()]);
    const { apprentice, cohort, attempt } = await writtenAnswerInCohort(teacher, boss, student);

    await teacher.goto('/grading');
    const entry = teacher.getByRole('button', { name: new RegExp(`^${apprentice.displayName} `) });
    await expect(entry).toBeVisible();
    await expectNoSeriousViolations(teacher);
    await entry.click();
    await expect(teacher.getByRole('button', { name: 'Save grade' })).toBeVisible();
    await expectNoSeriousViolations(teacher);

    await teacher.goto(`/cohorts/${cohort.id}`);
    await expect(teacher.getByRole('table', { name: 'Gradebook' }).getByRole('row', { name: new RegExp(apprentice.displayName) })).toContainText('Waiting for grading');
    await expectNoSeriousViolations(teacher);

    // Graded through the API: the apprentice's notifications page then lists it as new.
    const queue = (await (await teacher.request.get('/api/grading/queue?limit=200')).json()) as {
      items: Array<{ responseId: string; attemptId: string; rubric: Array<{ criterion: string }> }>;
    };
    const item = queue.items.find((i) => i.attemptId === attempt.id)!;
    await send(teacher.request, 'put', `/api/grading/responses/${item.responseId}`, { marks: item.rubric.map((c) => ({ criterion: c.criterion, points: 1 })), comment: '' });
    await student.goto('/notifications');
    await expect(student.getByRole('list', { name: 'Your notifications' })).toContainText('New');
    await expectNoSeriousViolations(student);
    await Promise.all([instructor.close(), owner.close(), learner.close()]);
  });
});
