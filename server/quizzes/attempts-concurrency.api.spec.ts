import type { DataSource } from 'typeorm';

import type { AttemptView } from '../../shared/api/quizzes';
import { createUser, migratedTestDataSource, signedIn } from '../testing/accounts';
import { fixtureLibrary, fixtureQuiz, quizTestApp, uniqueSlug } from './test-quizzes/fixture-quiz';

/** Submit is graded once and the attempt limit holds when requests race. */
describe('quiz attempts under concurrency', () => {
  let dataSource: DataSource;
  const slug = uniqueSlug('fixture-race');
  let t: ReturnType<typeof quizTestApp>;

  beforeAll(async () => {
    dataSource = await migratedTestDataSource();
    t = quizTestApp(dataSource, fixtureLibrary(fixtureQuiz({ lesson: slug })));
  });

  afterAll(async () => {
    await t.mailer.idle();
    await dataSource.destroy();
  });

  it('10 concurrent submits of one attempt: one grading, 10 identical answers', async () => {
    const browser = await signedIn(t.app, await createUser(dataSource));
    await browser.fetchCsrf();
    const view = (await browser.send('post', `/api/quizzes/${slug}/attempts`)).body as AttemptView;
    await browser.send('put', `/api/attempts/${view.id}/answers/why-test-pressure`, { answer: { choiceId: 'a' } });
    await browser.send('put', `/api/attempts/${view.id}/answers/convert-reading`, { answer: { value: 301, unit: 'cfm' } });

    const results = await Promise.all(Array.from({ length: 10 }, () => browser.send('post', `/api/attempts/${view.id}/submit`)));
    expect(results.map((r) => r.status)).toEqual(Array(10).fill(200));
    for (const r of results) expect(r.body).toEqual(results[0]!.body);
    expect(results[0]!.body.score).toMatchObject({ points: 3 });

    // Graded once: one set of statements, one grading time for every response.
    const verbs: Array<{ verb: string; n: number }> = await dataSource.query(
      `SELECT verb, count(*)::int AS n FROM learning_record WHERE attempt_id = $1 GROUP BY verb ORDER BY verb`,
      [view.id],
    );
    expect(verbs).toEqual([
      { verb: 'answered', n: 5 },
      { verb: 'attempted', n: 1 },
      { verb: 'completed', n: 1 },
      { verb: 'failed', n: 1 },
    ]);
    const [{ times }] = await dataSource.query(`SELECT count(DISTINCT graded_at)::int AS times FROM quiz_response WHERE attempt_id = $1`, [view.id]);
    expect(times).toBe(1);
  });

  it('saves racing a submit: the grade is always that of the answer stored, and a save after the submit is refused', async () => {
    // 301.2 cfm is right (the fixture's key), 150 cfm wrong: whichever the attempt holds when it is
    // graded must be the one graded, whether the save landed just before the submit or not at all.
    const browser = await signedIn(t.app, await createUser(dataSource));
    await browser.fetchCsrf();
    for (let round = 0; round < 3; round++) {
      // One race per attempt the quiz allows.
      const view = (await browser.send('post', `/api/quizzes/${slug}/attempts`)).body as AttemptView;
      await browser.send('put', `/api/attempts/${view.id}/answers/convert-reading`, { answer: { value: 150, unit: 'cfm' } });
      const [save, submit] = await Promise.all([
        browser.send('put', `/api/attempts/${view.id}/answers/convert-reading`, { answer: { value: 301.2, unit: 'cfm' } }),
        browser.send('post', `/api/attempts/${view.id}/submit`),
      ]);
      expect(submit.status).toBe(200);
      expect([200, 409]).toContain(save.status);
      const [stored] = await dataSource.query(`SELECT answer, status FROM quiz_response WHERE attempt_id = $1 AND question_id = 'convert-reading'`, [view.id]);
      expect(stored.status).toBe(stored.answer.value === 301.2 ? 'correct' : 'incorrect');
      // A refused save left the earlier answer; an accepted one was graded.
      expect(stored.answer.value).toBe(save.status === 200 ? 301.2 : 150);
    }
  });

  it('10 concurrent starts with 3 attempts left: exactly 3 attempts', async () => {
    const user = await createUser(dataSource);
    const browser = await signedIn(t.app, user);
    await browser.fetchCsrf();
    const results = await Promise.all(Array.from({ length: 10 }, () => browser.send('post', `/api/quizzes/${slug}/attempts`)));
    expect(results.map((r) => r.status).sort()).toEqual([201, 201, 201, 409, 409, 409, 409, 409, 409, 409]);
    expect(results.filter((r) => r.status === 201).map((r) => r.body.number).sort()).toEqual([1, 2, 3]);
    const [{ n }] = await dataSource.query('SELECT count(*)::int AS n FROM quiz_attempt WHERE user_id = $1 AND quiz_slug = $2', [user.id, slug]);
    expect(n).toBe(3);
  });
});
