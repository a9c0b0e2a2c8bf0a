import type { DataSource } from 'typeorm';

import type { AttemptView, QuizSummary } from '../../shared/api/quizzes';
import { Cohort } from '../cohorts/cohort.entity';
import { CohortMember } from '../cohorts/cohort-member.entity';
import { createUser, migratedTestDataSource, signedIn, type Browser } from '../testing/accounts';
import { AttemptsService, rescoreAttempt } from './attempts.service';
import type { QuizLibrary } from './quiz-library';
import { fixtureLibrary, fixtureQuiz, quizTestApp, uniqueSlug } from './test-quizzes/fixture-quiz';

/**
 * The attempt API against real PostgreSQL: start, autosave, submit, results, who may see what,
 * the attempt limit and the server's deadline. (No-leak and concurrency: their own spec files.)
 */
describe('quiz attempts API', () => {
  let dataSource: DataSource;
  let clock: Date;
  const slug = uniqueSlug('fixture-flow');
  const timedSlug = uniqueSlug('fixture-timed');
  let t: ReturnType<typeof quizTestApp>;
  let library: QuizLibrary;

  beforeAll(async () => {
    dataSource = await migratedTestDataSource();
    clock = new Date();
    library = fixtureLibrary(fixtureQuiz({ lesson: slug }), fixtureQuiz({ lesson: timedSlug, title: 'Timed fixture', timeLimitMinutes: 20 }));
    t = quizTestApp(dataSource, library, { now: () => clock });
  });

  afterAll(async () => {
    await t.mailer.idle();
    await dataSource.destroy();
  });

  async function apprentice(): Promise<{ browser: Browser; id: string }> {
    const user = await createUser(dataSource, { role: 'apprentice' });
    return { browser: await signedIn(t.app, user), id: user.id };
  }

  async function start(browser: Browser, quiz = slug): Promise<AttemptView> {
    const res = await browser.send('post', `/api/quizzes/${quiz}/attempts`);
    expect(res.status).toBe(201);
    return res.body as AttemptView;
  }

  it('starts an attempt with the questions to answer, fresh numbers in the stem and choices shuffled per attempt', async () => {
    const { browser } = await apprentice();
    const res = await browser.send('post', `/api/quizzes/${slug}/attempts`);
    expect(res.status).toBe(201);
    expect(res.headers['cache-control']).toBe('private, no-store');
    expect(res.headers['location']).toBe(`/api/attempts/${res.body.id}`);
    const view = res.body as AttemptView;
    expect(view).toMatchObject({ number: 1, attemptLimit: 3, status: 'open', deadline: null, submittedAt: null });
    expect(view.questions.map((q) => q.id)).toEqual(['why-test-pressure', 'which-are-differential', 'convert-reading', 'fresh-conversion', 'explain-overlap']);
    const fresh = view.questions.find((q) => q.id === 'fresh-conversion')!;
    expect(fresh.stemHtml).toMatch(/A port flows \d{3} cfm at \d+(\.\d)? inH2O\. What does it flow at 28 inH2O\?/);
    expect(fresh).toMatchObject({ tolerance: 'within 1 %', answerUnit: 'cfm' });
    expect(fresh.units).toEqual(expect.arrayContaining(['cfm', 'L/s']));
    expect(view.questions.find((q) => q.id === 'which-are-differential')!.choices!.map((c) => c.id).sort()).toEqual(['a', 'b', 'c', 'd']);
    expect(view.score).toBeUndefined();
  });

  it('refuses a start of a quiz that does not exist (404) and by anyone but an apprentice (403)', async () => {
    const { browser } = await apprentice();
    expect((await browser.send('post', '/api/quizzes/no-such-quiz/attempts')).status).toBe(404);
    const instructor = await signedIn(t.app, await createUser(dataSource, { role: 'instructor' }));
    const res = await instructor.send('post', `/api/quizzes/${slug}/attempts`);
    expect(res.status).toBe(403);
    expect(res.headers['content-type']).toMatch(/^application\/problem\+json/);
  });

  it('autosaves per question; an incompatible unit or a non-number is a 400 naming the question and the draft stays', async () => {
    const { browser } = await apprentice();
    const view = await start(browser);
    const save = (questionId: string, answer: unknown) => browser.send('put', `/api/attempts/${view.id}/answers/${questionId}`, { answer });

    const ok = await save('convert-reading', { value: 142.1, unit: 'L/s' });
    expect(ok.status).toBe(200);
    expect(ok.body).toMatchObject({ questionId: 'convert-reading', answer: { value: 142.1, unit: 'L/s' } });

    const badUnit = await save('convert-reading', { value: 300, unit: 'kPa' });
    expect(badUnit.status).toBe(400);
    expect(badUnit.headers['content-type']).toMatch(/^application\/problem\+json/);
    expect(badUnit.body.detail).toContain('convert-reading');
    expect(badUnit.body.errors).toEqual([{ field: 'answers.convert-reading', message: expect.stringContaining('kPa') }]);

    const notANumber = await save('convert-reading', { value: 'three hundred', unit: 'cfm' });
    expect(notANumber.status).toBe(400);
    expect(notANumber.body.detail).toContain('convert-reading');

    expect((await save('why-test-pressure', { choiceId: 'zz' })).status).toBe(400);
    expect((await save('no-such-question', { choiceId: 'a' })).status).toBe(404);

    const again = (await browser.get(`/api/attempts/${view.id}`)).body as AttemptView;
    expect(again.questions.find((q) => q.id === 'convert-reading')!.answer).toEqual({ value: 142.1, unit: 'L/s' });

    // Cleared with null.
    expect((await save('convert-reading', null)).body.answer).toBeNull();
  });

  it('grades on submit: score, pass mark, keys, tolerance, explanations and worked steps with the numbers given; written pending', async () => {
    const { browser, id } = await apprentice();
    const view = await start(browser);
    const [{ key }] = await dataSource.query(`SELECT key FROM quiz_response WHERE attempt_id = $1 AND question_id = 'fresh-conversion'`, [view.id]);
    const save = (questionId: string, answer: unknown) => browser.send('put', `/api/attempts/${view.id}/answers/${questionId}`, { answer });
    await save('why-test-pressure', { choiceId: 'a' });
    await save('which-are-differential', { choiceIds: ['a'] }); // 3 of 4 choices judged right: 1.5 of 2 points
    // 301.2 cfm is 142.15 L/s (1 cfm = 0.471947 L/s, NIST SP 811): the same quantity in another unit.
    await save('convert-reading', { value: 142.15, unit: 'L/s' });
    await save('fresh-conversion', { value: key.value, unit: key.unit });
    await save('explain-overlap', { text: 'Overlapping bands do not settle it; compare the difference with its own uncertainty.' });

    const res = await browser.send('post', `/api/attempts/${view.id}/submit`);
    expect(res.status).toBe(200);
    const result = res.body as AttemptView;
    expect(result.status).toBe('submitted');
    // 1 + 1.5 + 2 + 3 of 11 points (the written 3 wait for an instructor).
    expect(result.score).toEqual({ points: 7.5, maxPoints: 11, percent: (100 * 7.5) / 11, passMark: 80, passed: false, provisional: true, pendingCount: 1 });
    const q = (qid: string) => result.questions.find((x) => x.id === qid)!.result!;
    expect(q('why-test-pressure')).toMatchObject({ status: 'correct', points: 1, correctChoices: ['a'], explanationHtml: expect.stringContaining('square root') });
    expect(q('which-are-differential')).toMatchObject({ status: 'partial', points: 1.5, correctChoices: ['a', 'c'] });
    expect(q('convert-reading')).toMatchObject({ status: 'correct', withinTolerance: true, key: { value: 301.2, unit: 'cfm' } });
    expect(q('convert-reading').steps!.length).toBeGreaterThan(0);
    const fresh = q('fresh-conversion');
    expect(fresh).toMatchObject({ status: 'correct', withinTolerance: true, key });
    const stem = result.questions.find((x) => x.id === 'fresh-conversion')!.stemHtml;
    const givenFlow = /flows (\d+) cfm/.exec(stem)![1]!;
    // The worked steps use the numbers the stem showed this apprentice.
    expect(JSON.stringify(fresh.steps)).toContain(givenFlow);
    expect(q('explain-overlap')).toMatchObject({ status: 'pending', points: null });
    expect(q('explain-overlap').rubric).toBeUndefined();

    // The list shows the best attempt and the status.
    const list = (await browser.get('/api/quizzes')).body as QuizSummary[];
    expect(list.find((s) => s.slug === slug)).toMatchObject({ attemptsUsed: 1, status: 'not-yet-passed', best: { attemptId: view.id, passed: false, provisional: true }, openAttempt: null });

    // Final: no more answers.
    expect((await save('why-test-pressure', { choiceId: 'b' })).status).toBe(409);
    // Idempotent: the same result again, graded once.
    const repeat = await browser.send('post', `/api/attempts/${view.id}/submit`);
    expect(repeat.body).toEqual(res.body);
    const [{ n }] = await dataSource.query(`SELECT count(*)::int AS n FROM learning_record WHERE attempt_id = $1 AND verb = 'completed'`, [view.id]);
    expect(n).toBe(1);

    // An instructor's rubric marks (the grading queue's part) and a rescore: the final score.
    await dataSource.transaction(async (manager) => {
      await manager.query(
        `UPDATE quiz_response SET points = 3, status = 'correct', rubric_marks = $2, grader_comment = 'Well put.', graded_by = $3
          WHERE attempt_id = $1 AND question_id = 'explain-overlap'`,
        [view.id, JSON.stringify([{ criterion: 'Says overlap of intervals is not the test', points: 1, maxPoints: 1 }, { criterion: 'Names what cancels on the same bench and day', points: 2, maxPoints: 2 }]), null],
      );
      await rescoreAttempt(manager, view.id);
    });
    const final = (await browser.get(`/api/attempts/${view.id}`)).body as AttemptView;
    expect(final.score).toMatchObject({ points: 10.5, passed: true, provisional: false, pendingCount: 0 });
    expect(final.questions.find((x) => x.id === 'explain-overlap')!.result).toMatchObject({
      points: 3,
      comment: 'Well put.',
      rubric: [
        { criterion: 'Says overlap of intervals is not the test', points: 1, maxPoints: 1 },
        { criterion: 'Names what cancels on the same bench and day', points: 2, maxPoints: 2 },
      ],
    });
    const list2 = (await browser.get('/api/quizzes')).body as QuizSummary[];
    expect(list2.find((s) => s.slug === slug)).toMatchObject({ status: 'passed', best: { attemptId: view.id, passed: true, provisional: false } });
    expect(id).toBeDefined();
  });

  it('lets the apprentice, an instructor of their cohort and an admin see an attempt; no one else', async () => {
    const { browser, id } = await apprentice();
    const view = await start(browser);
    const instructor = await createUser(dataSource, { role: 'instructor' });
    const cohort = await dataSource.getRepository(Cohort).save({ name: 'Quiz cohort', instructorId: instructor.id });
    await dataSource.getRepository(CohortMember).save({ cohortId: cohort.id, userId: id });
    const status = async (role: 'apprentice' | 'instructor' | 'admin' | 'shop_owner') => (await (await signedIn(t.app, await createUser(dataSource, { role }))).get(`/api/attempts/${view.id}`)).status;

    expect((await (await signedIn(t.app, instructor)).get(`/api/attempts/${view.id}`)).status).toBe(200);
    expect(await status('admin')).toBe(200);
    expect(await status('apprentice')).toBe(403);
    expect(await status('instructor')).toBe(403);
    expect(await status('shop_owner')).toBe(403);
    // Only the apprentice answers and submits.
    expect((await (await signedIn(t.app, instructor)).send('post', `/api/attempts/${view.id}/submit`)).status).toBe(403);
    expect((await browser.get('/api/attempts/not-a-uuid')).status).toBe(404);
  });

  it('allows attemptLimit attempts, then 409; the best attempt counts', async () => {
    const { browser } = await apprentice();
    const first = await start(browser);
    await browser.send('put', `/api/attempts/${first.id}/answers/why-test-pressure`, { answer: { choiceId: 'a' } });
    await browser.send('post', `/api/attempts/${first.id}/submit`);
    const second = await start(browser);
    await browser.send('post', `/api/attempts/${second.id}/submit`);
    const third = await start(browser);
    expect(third.number).toBe(3);
    const refused = await browser.send('post', `/api/quizzes/${slug}/attempts`);
    expect(refused.status).toBe(409);
    expect(refused.body.detail).toMatch(/all 3 attempts/);
    const summary = ((await browser.get('/api/quizzes')).body as QuizSummary[]).find((s) => s.slug === slug)!;
    expect(summary).toMatchObject({ attemptsUsed: 3, best: { attemptId: first.id }, openAttempt: { id: third.id } });
  });

  it('enforces the time limit on the server: what was saved by the deadline is graded', async () => {
    const { browser } = await apprentice();
    const view = await start(browser, timedSlug);
    expect(new Date(view.deadline!).getTime() - new Date(view.startedAt).getTime()).toBe(20 * 60_000);
    await browser.send('put', `/api/attempts/${view.id}/answers/why-test-pressure`, { answer: { choiceId: 'a' } });
    const started = clock;
    try {
      clock = new Date(started.getTime() + 20 * 60_000 + 1000);
      const late = await browser.send('put', `/api/attempts/${view.id}/answers/convert-reading`, { answer: { value: 301.2, unit: 'cfm' } });
      expect(late.status).toBe(409);
      const result = (await browser.get(`/api/attempts/${view.id}`)).body as AttemptView;
      expect(result.status).toBe('submitted');
      expect(result.submittedAt).toBe(view.deadline);
      expect(result.questions.find((q) => q.id === 'why-test-pressure')!.result!.status).toBe('correct');
      expect(result.questions.find((q) => q.id === 'convert-reading')!.result!.status).toBe('unanswered');
      expect(result.score!.points).toBe(1);
    } finally {
      clock = started;
    }
  });

  it("grades an attempt past its deadline that nobody opens again (the server's sweep), once", async () => {
    const { browser, id } = await apprentice();
    const view = await start(browser, timedSlug);
    await browser.send('put', `/api/attempts/${view.id}/answers/why-test-pressure`, { answer: { choiceId: 'a' } });
    const sweeper = new AttemptsService(dataSource, { quizzes: () => library, now: () => clock, appBaseUrl: 'http://127.0.0.1' });
    expect(await sweeper.gradeExpired({ userId: id })).toBe(0); // before the deadline: left open
    const started = clock;
    try {
      clock = new Date(started.getTime() + 21 * 60_000);
      await sweeper.gradeExpired();
      const [row] = await dataSource.query('SELECT status, submitted_at, points FROM quiz_attempt WHERE id = $1', [view.id]);
      expect(row).toMatchObject({ status: 'submitted', points: 1 });
      expect(new Date(row.submitted_at).toISOString()).toBe(view.deadline);
      // The gradebook's standing follows (its triggers): not "in progress" any more. (The written
      // question was left unanswered, so nothing waits for an instructor: 1 of 11 is not a pass.)
      const [standing] = await dataSource.query('SELECT status FROM quiz_standing WHERE user_id = $1 AND quiz_slug = $2', [id, timedSlug]);
      expect(standing.status).toBe('not-yet-passed');
      expect(await sweeper.gradeExpired({ userId: id })).toBe(0);
    } finally {
      clock = started;
    }
  });
});
