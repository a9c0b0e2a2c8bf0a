import { randomUUID } from 'node:crypto';
import { resolve } from 'node:path';

import type { DataSource } from 'typeorm';

import type { GradebookPage, ShopProgress } from '../../shared/api/gradebook';
import type { User } from '../accounts/user.entity';
import { CohortMember } from '../cohorts/cohort-member.entity';
import { Cohort } from '../cohorts/cohort.entity';
import { fixtureLibrary, fixtureQuiz, quizTestApp, uniqueSlug } from '../quizzes/test-quizzes/fixture-quiz';
import { Browser, createShopOwner, createUser, migratedTestDataSource, signedIn } from '../testing/accounts';
import { csvField, neutralise } from './gradebook-csv';

const DAY = 86_400_000;

/** RFC 4180 records (quoted fields may hold commas, quotes and line breaks); the test's own reader. */
function parseCsv(text: string): string[][] {
  const records: string[][] = [];
  let field = '';
  let record: string[] = [];
  let quoted = false;
  for (let i = 0; i < text.length; i++) {
    const c = text[i]!;
    if (quoted) {
      if (c === '"' && text[i + 1] === '"') (field += '"'), i++;
      else if (c === '"') quoted = false;
      else field += c;
    } else if (c === '"') quoted = true;
    else if (c === ',') record.push(field), (field = '');
    else if (c === '\r' && text[i + 1] === '\n') {
      record.push(field), records.push(record), (field = ''), (record = []), i++;
    } else field += c;
  }
  if (field !== '' || record.length) throw new Error('The last record is not CRLF-terminated.');
  return records;
}

/**
 * The gradebook and the shop owner's progress against real PostgreSQL: sorting, filtering and
 * paging in SQL, the needs-help rule both ways, the CSV's format and who may see what.
 */
describe('gradebook API', () => {
  let dataSource: DataSource;
  const clock = new Date();
  const quizA = uniqueSlug('gb-a');
  const quizB = uniqueSlug('gb-b');
  let t: ReturnType<typeof quizTestApp>;
  let instructor: Browser;
  let cohortId: string;
  const ids: Record<string, string> = {};

  const ago = (days: number) => new Date(clock.getTime() - days * DAY);

  async function attempt(userId: string, quiz: string, number: number, a: { score?: number; passed?: boolean; pending?: number; open?: boolean; at: Date }) {
    await dataSource.query(
      `INSERT INTO quiz_attempt (user_id, quiz_slug, number, seed, status, pass_mark, started_at, submitted_at, points, max_points, score_percent, passed, pending_count)
       VALUES ($1, $2, $3, 1, $4, 80, $5, $6, $7, 100, $7, $8, $9)`,
      [userId, quiz, number, a.open ? 'open' : 'submitted', a.at, a.open ? null : a.at, a.open ? null : a.score, a.open ? null : (a.passed ?? (a.score ?? 0) >= 80), a.pending ?? 0],
    );
  }

  async function member(cohort: string, name: string, addedDaysAgo = 1, shopId: string | null = null): Promise<User> {
    const user = await createUser(dataSource, { role: 'apprentice', displayName: name, shopId });
    await dataSource.getRepository(CohortMember).save({ cohortId: cohort, userId: user.id, addedAt: ago(addedDaysAgo) });
    return user;
  }

  async function lesson(userId: string, slug: string, finished: boolean, at: Date) {
    await dataSource.query(`INSERT INTO lesson_progress (user_id, lesson_slug, opened_at, finished_at, last_activity_at) VALUES ($1, $2, $3, $4, $3)`, [userId, slug, at, finished ? at : null]);
  }

  beforeAll(async () => {
    dataSource = await migratedTestDataSource();
    const library = fixtureLibrary(fixtureQuiz({ lesson: quizA, title: 'Flow at test pressure' }), fixtureQuiz({ lesson: quizB, title: 'Mass flow' }));
    t = quizTestApp(dataSource, library, { now: () => clock, lessonsDir: resolve('content/lessons') });
    const owner = await createUser(dataSource, { role: 'instructor' });
    instructor = await signedIn(t.app, owner);
    cohortId = (await dataSource.getRepository(Cohort).save({ name: 'Larkfield spring, "A" group', instructorId: owner.id })).id;

    // Ada passed A at 92 % and finished two lessons yesterday.
    ids['ada'] = (await member(cohortId, 'Ada Quill', 40)).id;
    await attempt(ids['ada']!, quizA, 1, { score: 92, at: ago(1) });
    await lesson(ids['ada']!, 'pressure', true, ago(1));
    await lesson(ids['ada']!, 'pressure-drop', true, ago(2));
    await lesson(ids['ada']!, 'volume-flow', false, ago(1));
    // Ben failed A twice (40 %, 55 %), recently: needs help.
    ids['ben'] = (await member(cohortId, 'Ben Ashdown', 40)).id;
    await attempt(ids['ben']!, quizA, 1, { score: 40, at: ago(3) });
    await attempt(ids['ben']!, quizA, 2, { score: 55, at: ago(2) });
    // Cy failed A once; his second attempt (60 % so far) waits for a written answer's grade: one failure is not two.
    ids['cy'] = (await member(cohortId, 'Cy Brandt', 40)).id;
    await attempt(ids['cy']!, quizA, 1, { score: 50, at: ago(5) });
    await attempt(ids['cy']!, quizA, 2, { score: 60, pending: 1, at: ago(4) });
    // Di joined 20 days ago and has done nothing: needs help.
    ids['di'] = (await member(cohortId, 'Di Fenwick', 20)).id;
    // Ed has an attempt at B open, last touched 13 days ago: not yet idle for 14.
    ids['ed'] = (await member(cohortId, 'Ed Holm', 30)).id;
    await attempt(ids['ed']!, quizB, 1, { open: true, at: ago(13) });
    // Fay opened a lesson 15 days ago and nothing since: needs help.
    ids['fay'] = (await member(cohortId, 'Fay Orme', 30)).id;
    await lesson(ids['fay']!, 'pressure', false, ago(15));
    // Names a spreadsheet would misread: a formula, and commas, quotes and a line break.
    ids['gus'] = (await member(cohortId, '=HYPERLINK("http://x.test","Gus")', 1)).id;
    ids['hal'] = (await member(cohortId, 'Hal "Bench", Jr.\nNight class', 1)).id;
    // Someone else's cohort: never in this gradebook.
    const other = await dataSource.getRepository(Cohort).save({ name: 'Other', instructorId: (await createUser(dataSource, { role: 'instructor' })).id });
    await member(other.id, 'Ada Elsewhere', 1);
  });

  afterAll(async () => {
    await t.mailer.idle();
    await dataSource.destroy();
  });

  const book = async (query: string, browser = instructor) => {
    const res = await browser.get(`/api/cohorts/${cohortId}/gradebook${query}`);
    expect(res.status).toBe(200);
    return res.body as GradebookPage;
  };
  const names = (page: GradebookPage) => page.rows.map((r) => r.displayName.split(' ')[0]);

  it('lists the cohort with a cell per quiz, completion, last activity and the needs-help flag', async () => {
    const page = await book('');
    expect(page.quizzes.map((q) => q.slug)).toEqual([quizA, quizB]);
    expect(page.lessonCount).toBe(10);
    expect(page.total).toBe(8);
    const ada = page.rows.find((r) => r.userId === ids['ada'])!;
    expect(ada).toMatchObject({ lessonsFinished: 2, quizzesPassed: 1, lastActivity: ago(1).toISOString(), needsHelp: false, needsHelpReasons: [] });
    expect(ada.quizzes[quizA]).toEqual({ status: 'passed', bestPercent: 92, attemptsUsed: 1, failedAttempts: 0 });
    expect(ada.quizzes[quizB]).toEqual({ status: 'not-started', bestPercent: null, attemptsUsed: 0, failedAttempts: 0 });
    const cy = page.rows.find((r) => r.userId === ids['cy'])!;
    expect(cy.quizzes[quizA]).toEqual({ status: 'waiting-for-grading', bestPercent: 60, attemptsUsed: 2, failedAttempts: 1 });
    expect(page.rows.find((r) => r.userId === ids['ed'])!.quizzes[quizB]!.status).toBe('in-progress');
    expect(page.rows.find((r) => r.userId === ids['ben'])!.quizzes[quizA]!.status).toBe('not-yet-passed');
  });

  it('flags needs help for 2+ failed attempts at one quiz or 14 days without activity, and not otherwise', async () => {
    const page = await book('?pageSize=200');
    const row = (who: string) => page.rows.find((r) => r.userId === ids[who])!;
    expect(row('ben')).toMatchObject({ needsHelp: true, needsHelpReasons: [{ kind: 'failed-attempts', quiz: quizA, count: 2 }] });
    expect(row('di')).toMatchObject({ needsHelp: true, needsHelpReasons: [{ kind: 'inactive', days: 20 }] });
    expect(row('fay')).toMatchObject({ needsHelp: true, needsHelpReasons: [{ kind: 'inactive', days: 15 }], lastActivity: ago(15).toISOString() });
    // One failure (the other attempt waits for grading), 13 idle days, a newcomer: no flag.
    for (const who of ['ada', 'cy', 'ed', 'gus', 'hal']) expect({ who, flag: row(who).needsHelp }).toEqual({ who, flag: false });
    expect(row('ed').lastActivity).toBe(ago(13).toISOString());

    const flagged = await book('?status=needs-help');
    expect(names(flagged)).toEqual(['Ben', 'Di', 'Fay']);
    expect(flagged.total).toBe(3);
  });

  it('sorts by a quiz column (no score lowest), by completion and by last activity, either way', async () => {
    expect(names(await book(`?sort=quiz:${quizA}&dir=desc`))).toEqual(['Ada', 'Cy', 'Ben', '=HYPERLINK("http://x.test","Gus")', 'Di', 'Ed', 'Fay', 'Hal']);
    expect(names(await book(`?sort=quiz:${quizA}&dir=asc`)).slice(-3)).toEqual(['Ben', 'Cy', 'Ada']);
    expect(names(await book('?sort=lessons&dir=desc')).slice(0, 1)).toEqual(['Ada']);
    // No activity at all counts as the oldest: last when newest come first.
    expect(names(await book('?sort=lastActivity&dir=desc'))).toEqual(['Ada', 'Ben', 'Cy', 'Ed', 'Fay', '=HYPERLINK("http://x.test","Gus")', 'Di', 'Hal']);
    expect(names(await book('?sort=name'))).toEqual(['=HYPERLINK("http://x.test","Gus")', 'Ada', 'Ben', 'Cy', 'Di', 'Ed', 'Fay', 'Hal']);
    expect(names(await book('?sort=name&dir=desc'))[0]).toBe('Hal');
  });

  it('filters by status of a quiz, of the sorted quiz or of any quiz, and by name; pages with the total', async () => {
    expect(names(await book(`?status=not-yet-passed&quiz=${quizA}`))).toEqual(['Ben']);
    expect(names(await book(`?sort=quiz:${quizA}&status=waiting-for-grading`))).toEqual(['Cy']);
    expect(names(await book('?status=in-progress'))).toEqual(['Ed']);
    expect(names(await book('?status=passed'))).toEqual(['Ada']);
    expect((await book(`?status=not-started&quiz=${quizA}`)).total).toBe(5);
    expect(names(await book('?q=ada'))).toEqual(['Ada']);
    // A LIKE wildcard in the search is a plain character.
    expect((await book('?q=%25')).total).toBe(0);

    const second = await book('?sort=name&pageSize=3&page=2');
    expect(names(second)).toEqual(['Cy', 'Di', 'Ed']);
    expect(second).toMatchObject({ total: 8, page: 2, pageSize: 3 });
    const past = await book('?sort=name&pageSize=3&page=9');
    expect(past).toMatchObject({ rows: [], total: 8 });
  });

  it('refuses a bad query (400 naming the parameter) and an unknown quiz column', async () => {
    for (const query of ['?sort=password', '?dir=up', '?status=great', '?pageSize=1000', '?sort=quiz:no-such-quiz', '?extra=1']) {
      const res = await instructor.get(`/api/cohorts/${cohortId}/gradebook${query}`);
      expect({ query, status: res.status }).toEqual({ query, status: 400 });
      expect(res.headers['content-type']).toMatch(/^application\/problem\+json/);
    }
  });

  it('exports the CSV: streamed, UTF-8 with BOM, RFC 4180 quoting, formulas neutralised, an attachment', async () => {
    const res = await instructor.get(`/api/cohorts/${cohortId}/gradebook.csv?sort=name`).buffer(true).parse((r, done) => {
      const chunks: Buffer[] = [];
      r.on('data', (c: Buffer) => chunks.push(c));
      r.on('end', () => done(null, Buffer.concat(chunks)));
    });
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toMatch(/^text\/csv; charset=utf-8/);
    expect(res.headers['content-disposition']).toMatch(/^attachment; filename="gradebook-larkfield-spring-a-group\.csv"; filename\*=UTF-8''/);
    expect(res.headers['cache-control']).toBe('private, no-store');
    const bytes = res.body as Buffer;
    expect([...bytes.subarray(0, 3)]).toEqual([0xef, 0xbb, 0xbf]);
    const text = bytes.toString('utf8').slice(1);
    expect(text.endsWith('\r\n')).toBe(true);
    const records = parseCsv(text);
    expect(records[0]).toEqual([
      'Apprentice',
      'E-mail',
      'Flow at test pressure: best score (%)',
      'Flow at test pressure: status',
      'Mass flow: best score (%)',
      'Mass flow: status',
      'Lessons finished (of 10)',
      'Quizzes passed (of 2)',
      'Last activity (UTC)',
      'Needs help',
    ]);
    expect(records).toHaveLength(9);
    expect(records.slice(1).every((r) => r.length === 10)).toBe(true);
    // The formula is shown as text: a leading apostrophe.
    expect(records[1]![0]).toBe(`'=HYPERLINK("http://x.test","Gus")`);
    expect(records[2]!.slice(2)).toEqual(['92.0', 'Passed', '', 'Not started', '2', '1', ago(1).toISOString(), 'No']);
    expect(records[3]![9]).toBe('Yes: 2 failed attempts at Flow at test pressure');
    expect(records[4]![3]).toBe('Waiting for grading');
    expect(records[5]![9]).toBe('Yes: No activity for 20 days');
    expect(records[8]![0]).toBe('Hal "Bench", Jr.\nNight class');
    // On the wire: quoted, quotes doubled, the line break inside the quotes.
    expect(text).toContain('"Hal ""Bench"", Jr.\nNight class"');
    expect(text).toContain(`"'=HYPERLINK(""http://x.test"",""Gus"")"`);
  });

  it('writes fields as RFC 4180 and neutralises every cell a spreadsheet would run', () => {
    for (const lead of ['=', '+', '-', '@', '\t', '\r']) expect(neutralise(`${lead}1+1`)).toBe(`'${lead}1+1`);
    expect(neutralise('Ada')).toBe('Ada');
    expect(csvField('plain')).toBe('plain');
    expect(csvField('a,b')).toBe('"a,b"');
    expect(csvField('say "hi"')).toBe('"say ""hi"""');
    expect(csvField('two\nlines')).toBe('"two\nlines"');
    expect(csvField('-2+3')).toBe("'-2+3");
    expect(csvField('\r=1')).toBe(`"'\r=1"`);
    expect(csvField(null)).toBe('');
  });

  it('is for the cohort’s instructor and admins: another instructor 403, apprentice and shop owner 403, visitor 401', async () => {
    const admin = await signedIn(t.app, await createUser(dataSource, { role: 'admin' }));
    expect((await book('?pageSize=1', admin)).total).toBe(8);
    expect((await admin.get(`/api/cohorts/${cohortId}/gradebook.csv`)).status).toBe(200);
    const outsider = await signedIn(t.app, await createUser(dataSource, { role: 'instructor' }));
    const apprentice = await signedIn(t.app, await createUser(dataSource, { role: 'apprentice' }));
    const { owner } = await createShopOwner(dataSource);
    const shopOwner = await signedIn(t.app, owner);
    for (const path of [`/api/cohorts/${cohortId}/gradebook`, `/api/cohorts/${cohortId}/gradebook.csv`]) {
      for (const [who, browser] of [['outsider', outsider], ['apprentice', apprentice], ['owner', shopOwner]] as const) {
        const res = await browser.get(path);
        expect({ who, path, status: res.status }).toEqual({ who, path, status: 403 });
        expect(res.headers['content-type']).toMatch(/^application\/problem\+json/);
      }
      expect((await instructor.get(path.replace(cohortId, randomUUID()))).status).toBe(404);
    }
    expect((await new Browser(t.app).get(`/api/cohorts/${cohortId}/gradebook.csv`)).status).toBe(401);
  });

  it('follows the real attempt flow: start, autosave and submit move the standing the triggers keep', async () => {
    const user = await member(cohortId, 'Zed Live', 1);
    const browser = await signedIn(t.app, user);
    const row = async () => (await book('?q=Zed%20Live')).rows[0]!;
    const start = await browser.send('post', `/api/quizzes/${quizB}/attempts`);
    expect(start.status).toBe(201);
    expect((await row()).quizzes[quizB]).toEqual({ status: 'in-progress', bestPercent: null, attemptsUsed: 1, failedAttempts: 0 });
    expect((await row()).lastActivity).toBe(clock.toISOString());
    const started = clock.getTime();
    try {
      clock.setTime(started + 60_000);
      const saved = await browser.send('put', `/api/attempts/${start.body.id}/answers/why-test-pressure`, { answer: { choiceId: 'b' } });
      expect(saved.status).toBe(200);
      const written = await browser.send('put', `/api/attempts/${start.body.id}/answers/explain-overlap`, { answer: { text: 'Compare the difference with its own uncertainty.' } });
      expect(written.status).toBe(200);
      expect((await row()).lastActivity).toBe(new Date(started + 60_000).toISOString());
      clock.setTime(started + 120_000);
      expect((await browser.send('post', `/api/attempts/${start.body.id}/submit`)).status).toBe(200);
      const after = await row();
      // The written answer waits for an instructor.
      expect(after.quizzes[quizB]).toMatchObject({ status: 'waiting-for-grading', attemptsUsed: 1, failedAttempts: 0 });
      expect(after.lastActivity).toBe(new Date(started + 120_000).toISOString());
    } finally {
      clock.setTime(started);
    }
  });

  it('shows a shop owner their own shop’s apprentices: completion, quizzes passed, last activity and nothing more', async () => {
    const { owner, shop } = await createShopOwner(dataSource, 'Larkfield Flow Lab');
    const { shop: otherShop } = await createShopOwner(dataSource, 'Another shop');
    const mine = await member(cohortId, 'Ivy Shopworth', 2, shop.id);
    await attempt(mine.id, quizA, 1, { score: 88, at: ago(2) });
    await attempt(mine.id, quizB, 1, { score: 30, at: ago(1) });
    await lesson(mine.id, 'pressure', true, ago(3));
    const idle = await createUser(dataSource, { role: 'apprentice', displayName: 'Jo Newstart', shopId: shop.id });
    await createUser(dataSource, { role: 'apprentice', displayName: 'Kit Elsewhere', shopId: otherShop.id });
    await createUser(dataSource, { role: 'apprentice', displayName: 'Lee Gone', shopId: shop.id }).then((u) => dataSource.query('UPDATE user_account SET disabled_at = now() WHERE id = $1', [u.id]));

    const res = await (await signedIn(t.app, owner)).get('/api/shop/progress');
    expect(res.status).toBe(200);
    expect(res.headers['cache-control']).toBe('private, no-store');
    const body = res.body as ShopProgress;
    expect(body).toEqual({
      shop: { id: shop.id, name: 'Larkfield Flow Lab' },
      lessonCount: 10,
      quizCount: 2,
      apprentices: [
        { userId: mine.id, displayName: 'Ivy Shopworth', lessonsFinished: 1, quizzesPassed: 1, lastActivity: ago(1).toISOString() },
        { userId: idle.id, displayName: 'Jo Newstart', lessonsFinished: 0, quizzesPassed: 0, lastActivity: null },
      ],
    });
    // No scores, answers or comments anywhere in it (the exact shape above says so too).
    expect(JSON.stringify(body)).not.toMatch(/score|percent|answer|comment|rubric/i);

    const instructorView = await instructor.get('/api/shop/progress');
    expect(instructorView.status).toBe(403);
  });
});
