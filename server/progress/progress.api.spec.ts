import { resolve } from 'node:path';

import type { DataSource } from 'typeorm';

import type { AttemptView } from '../../shared/api/quizzes';
import type { LearningRecordsPage, MyProgress } from '../../shared/api/progress';
import { Cohort } from '../cohorts/cohort.entity';
import { CohortMember } from '../cohorts/cohort-member.entity';
import { fixtureLibrary, fixtureQuiz, quizTestApp, uniqueSlug } from '../quizzes/test-quizzes/fixture-quiz';
import { createShopOwner, createUser, migratedTestDataSource, signedIn } from '../testing/accounts';

describe('progress and learning records', () => {
  let dataSource: DataSource;
  const slug = uniqueSlug('fixture-progress');
  let t: ReturnType<typeof quizTestApp>;

  beforeAll(async () => {
    dataSource = await migratedTestDataSource();
    t = quizTestApp(dataSource, fixtureLibrary(fixtureQuiz({ lesson: slug })), { lessonsDir: resolve('content/lessons') });
  });

  afterAll(async () => {
    await t.mailer.idle();
    await dataSource.destroy();
  });

  it('records lessons opened and finished (the first times kept) and shows them in My progress', async () => {
    const browser = await signedIn(t.app, await createUser(dataSource));
    const opened = await browser.send('post', '/api/progress/lessons/pressure', { event: 'opened' });
    expect(opened.status).toBe(200);
    expect(opened.body).toMatchObject({ slug: 'pressure', finishedAt: null });
    const finished = await browser.send('post', '/api/progress/lessons/pressure', { event: 'finished' });
    expect(finished.body.openedAt).toBe(opened.body.openedAt);
    expect(finished.body.finishedAt).not.toBeNull();
    const again = await browser.send('post', '/api/progress/lessons/pressure', { event: 'opened' });
    expect(again.body.finishedAt).toBe(finished.body.finishedAt);
    expect((await browser.send('post', '/api/progress/lessons/no-such-lesson', { event: 'opened' })).status).toBe(404);
    expect((await browser.send('post', '/api/progress/lessons/pressure', { event: 'read' })).status).toBe(400);

    const mine = (await browser.get('/api/progress')).body as MyProgress;
    expect(mine.lessons).toEqual([again.body]);
    expect(mine.quizzes.find((q) => q.slug === slug)).toMatchObject({ status: 'not-started', attemptsUsed: 0 });
    expect(mine.lastActivity).toBe(again.body.lastActivityAt);
  });

  it('makes xAPI statements when an attempt is graded, for the apprentice, their instructor and admins only', async () => {
    const { owner, shop } = await createShopOwner(dataSource);
    const user = await createUser(dataSource, { shopId: shop.id });
    const browser = await signedIn(t.app, user);
    const view = (await browser.send('post', `/api/quizzes/${slug}/attempts`)).body as AttemptView;
    await browser.send('put', `/api/attempts/${view.id}/answers/why-test-pressure`, { answer: { choiceId: 'a' } });
    await browser.send('post', `/api/attempts/${view.id}/submit`);

    const res = await browser.get('/api/learning-records');
    expect(res.status).toBe(200);
    expect(res.headers['x-experience-api-version']).toBe('1.0.3');
    const page = res.body as LearningRecordsPage;
    const verbs = page.statements.map((s) => (s['verb'] as { display: Record<string, string> }).display['en-US']).sort();
    expect(verbs).toEqual(['answered', 'answered', 'answered', 'answered', 'answered', 'attempted', 'completed', 'failed']);
    const completed = page.statements.find((s) => (s['verb'] as { id: string }).id === 'http://adlnet.gov/expapi/verbs/completed')!;
    // 1 point of 11.
    expect(completed).toMatchObject({
      actor: { account: { name: user.id } },
      object: { id: expect.stringMatching(new RegExp(`/quizzes/${slug}$`)) },
      result: { score: { scaled: 0.0909, raw: 1, min: 0, max: 11 }, success: false, completion: true },
      context: { registration: view.id },
    });

    const instructor = await createUser(dataSource, { role: 'instructor' });
    const cohort = await dataSource.getRepository(Cohort).save({ name: 'xAPI cohort', instructorId: instructor.id });
    await dataSource.getRepository(CohortMember).save({ cohortId: cohort.id, userId: user.id });
    const seen = ((await (await signedIn(t.app, instructor)).get('/api/learning-records?limit=500')).body as LearningRecordsPage).statements;
    expect(seen.filter((s) => (s['context'] as { registration: string }).registration === view.id)).toHaveLength(8);
    const other = await signedIn(t.app, await createUser(dataSource, { role: 'instructor' }));
    expect(((await other.get('/api/learning-records')).body as LearningRecordsPage).statements).toEqual([]);
    expect((await (await signedIn(t.app, owner)).get('/api/learning-records')).status).toBe(403);

    // Paging: 3 at a time, with a `more` link to the rest.
    const first = (await browser.get('/api/learning-records?limit=3')).body as LearningRecordsPage;
    expect(first.statements).toHaveLength(3);
    expect(first.more).toMatch(/^\/api\/learning-records\?limit=3&before=/);
    const ids: string[] = [];
    let next = '/api/learning-records?limit=3';
    while (next) {
      const page = (await browser.get(next)).body as LearningRecordsPage;
      ids.push(...page.statements.map((s) => s['id'] as string));
      next = page.more;
    }
    expect(ids).toHaveLength(8);
    expect(new Set(ids).size).toBe(8);
  });
});
