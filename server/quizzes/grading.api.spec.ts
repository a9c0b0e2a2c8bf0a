import type { DataSource } from 'typeorm';

import type { CorrectedQuestion, GradedResponse, GradingAttempt, GradingQueue, RegradeResult } from '../../shared/api/grading';
import type { NotificationsPage } from '../../shared/api/notifications';
import type { AttemptView } from '../../shared/api/quizzes';
import type { User } from '../accounts/user.entity';
import { Cohort } from '../cohorts/cohort.entity';
import { CohortMember } from '../cohorts/cohort-member.entity';
import { createUser, migratedTestDataSource, signedIn, type Browser } from '../testing/accounts';
import { fixtureLibrary, fixtureQuiz, loadedQuiz, quizTestApp, uniqueSlug } from './test-quizzes/fixture-quiz';

const RUBRIC = {
  overlap: 'Says overlap of intervals is not the test',
  cancels: 'Names what cancels on the same bench and day',
};

/**
 * The instructor's grading API against real PostgreSQL: the queue (oldest first, only the
 * instructor's cohorts), rubric marks that rescore the attempt and e-mail the apprentice through
 * the outbox, overrides with a reason (audited), and regrades after a key was corrected.
 */
describe('grading API', () => {
  let dataSource: DataSource;
  let clock: Date;
  const slug = uniqueSlug('fixture-grading');
  const regradeSlug = uniqueSlug('fixture-regrade');
  const library = fixtureLibrary(fixtureQuiz({ lesson: slug }), fixtureQuiz({ lesson: regradeSlug, title: 'Regrade fixture' }));
  let t: ReturnType<typeof quizTestApp>;
  let instructor: User;
  let outsider: User;
  let cohort: Cohort;

  beforeAll(async () => {
    dataSource = await migratedTestDataSource();
    clock = new Date('2026-03-02T08:00:00Z');
    t = quizTestApp(dataSource, library, { now: () => clock });
    instructor = await createUser(dataSource, { role: 'instructor' });
    outsider = await createUser(dataSource, { role: 'instructor' });
    cohort = await dataSource.getRepository(Cohort).save({ name: 'Grading cohort', instructorId: instructor.id });
    await dataSource.getRepository(Cohort).save({ name: 'Outsider cohort', instructorId: outsider.id });
  });

  afterAll(async () => {
    await t.mailer.idle();
    await dataSource.destroy();
  });

  async function apprentice(name = 'Test apprentice', inCohort = true): Promise<{ browser: Browser; user: User }> {
    const user = await createUser(dataSource, { role: 'apprentice', displayName: name });
    if (inCohort) await dataSource.getRepository(CohortMember).save({ cohortId: cohort.id, userId: user.id });
    return { browser: await signedIn(t.app, user), user };
  }

  /** Starts, answers (convert-reading right, the written one) and submits an attempt at `submitAt`. */
  async function submitted(browser: Browser, submitAt: Date, quiz = slug): Promise<AttemptView> {
    const start = await browser.send('post', `/api/quizzes/${quiz}/attempts`);
    expect(start.status).toBe(201);
    const id = start.body.id as string;
    const save = async (questionId: string, answer: unknown) => expect((await browser.send('put', `/api/attempts/${id}/answers/${questionId}`, { answer })).status).toBe(200);
    await save('why-test-pressure', { choiceId: 'a' });
    await save('convert-reading', { value: 301.2, unit: 'cfm' });
    await save('explain-overlap', { text: 'Overlap is not the test. <b>Compare</b> the difference with its own uncertainty.' });
    const [{ key }] = await dataSource.query(`SELECT key FROM quiz_response WHERE attempt_id = $1 AND question_id = 'fresh-conversion'`, [id]);
    await save('fresh-conversion', { value: key.value, unit: key.unit });
    const before = clock;
    clock = submitAt;
    try {
      const res = await browser.send('post', `/api/attempts/${id}/submit`);
      expect(res.status).toBe(200);
      return res.body as AttemptView;
    } finally {
      clock = before;
    }
  }

  const responseId = async (attemptId: string, questionId: string): Promise<string> =>
    (await dataSource.query(`SELECT id FROM quiz_response WHERE attempt_id = $1 AND question_id = $2`, [attemptId, questionId]))[0].id;

  it("lists the written answers of the instructor's cohorts oldest first, with stem, answer and rubric; others see none of them", async () => {
    const late = await apprentice('Late Lane');
    const early = await apprentice('Early Eddy');
    const stranger = await apprentice('Not in the cohort', false);
    const lateAttempt = await submitted(late.browser, new Date('2026-03-02T10:00:00Z'));
    const earlyAttempt = await submitted(early.browser, new Date('2026-03-02T09:00:00Z'));
    const strangerAttempt = await submitted(stranger.browser, new Date('2026-03-02T08:30:00Z'));

    const res = await (await signedIn(t.app, instructor)).get('/api/grading/queue');
    expect(res.status).toBe(200);
    expect(res.headers['cache-control']).toBe('private, no-store');
    const queue = res.body as GradingQueue;
    const mine = queue.items.filter((i) => [lateAttempt.id, earlyAttempt.id, strangerAttempt.id].includes(i.attemptId));
    expect(mine.map((i) => i.apprentice.displayName)).toEqual(['Early Eddy', 'Late Lane']);
    expect(mine[0]).toMatchObject({
      attemptId: earlyAttempt.id,
      quiz: { slug, title: 'Fixture: flow at test pressure' },
      questionId: 'explain-overlap',
      questionNumber: 5,
      questionVersion: 1,
      submittedAt: '2026-03-02T09:00:00.000Z',
      answerText: 'Overlap is not the test. <b>Compare</b> the difference with its own uncertainty.',
      rubric: [
        { criterion: RUBRIC.overlap, points: 1 },
        { criterion: RUBRIC.cancels, points: 2 },
      ],
      maxPoints: 3,
    });
    expect(mine[0]!.stemHtml).toContain('bands overlap');
    // Oldest first over the whole list too.
    const times = queue.items.map((i) => i.submittedAt);
    expect([...times].sort()).toEqual(times);

    // Another instructor's queue does not list them, and they may not grade them.
    const other = await signedIn(t.app, outsider);
    const otherQueue = (await other.get('/api/grading/queue')).body as GradingQueue;
    expect(otherQueue.items.filter((i) => [lateAttempt.id, earlyAttempt.id].includes(i.attemptId))).toEqual([]);
    const refused = await other.send('put', `/api/grading/responses/${mine[0]!.responseId}`, { marks: [], comment: '' });
    // The body is checked first (an empty rubric is a 400); a full one is refused for the apprentice.
    expect(refused.status).toBe(400);
    const forbidden = await other.send('put', `/api/grading/responses/${mine[0]!.responseId}`, {
      marks: [
        { criterion: RUBRIC.overlap, points: 1 },
        { criterion: RUBRIC.cancels, points: 2 },
      ],
      comment: '',
    });
    expect(forbidden.status).toBe(403);
    expect(forbidden.headers['content-type']).toMatch(/^application\/problem\+json/);
    expect((await other.get(`/api/grading/attempts/${earlyAttempt.id}`)).status).toBe(403);

    // An admin sees every apprentice's, also one in no cohort; an apprentice is refused.
    const admin = await signedIn(t.app, await createUser(dataSource, { role: 'admin' }));
    const all = (await admin.get('/api/grading/queue?limit=200')).body as GradingQueue;
    expect(all.total).toBeGreaterThanOrEqual(3);
    expect((await early.browser.get('/api/grading/queue')).status).toBe(403);
    expect((await admin.get('/api/grading/queue?limit=0')).status).toBe(400);
  });

  it('grades a written answer by its rubric: the attempt is rescored, the apprentice sees marks and comment and gets an e-mail', async () => {
    const { browser, user } = await apprentice('Graded Gwen');
    const attempt = await submitted(browser, new Date('2026-03-02T11:00:00Z'));
    // 1 + 0 (no choice ticked) + 2 + 3 of 11 while the written 3 wait.
    expect(attempt.score).toMatchObject({ points: 6, provisional: true, pendingCount: 1 });
    const id = await responseId(attempt.id, 'explain-overlap');
    const grader = await signedIn(t.app, instructor);

    const tooMany = await grader.send('put', `/api/grading/responses/${id}`, {
      marks: [
        { criterion: RUBRIC.overlap, points: 2 },
        { criterion: RUBRIC.cancels, points: 2 },
      ],
      comment: '',
    });
    expect(tooMany.status).toBe(400);
    expect(tooMany.body.errors).toEqual([{ field: 'marks.0.points', message: 'At most 1 points for this criterion.' }]);
    const missing = await grader.send('put', `/api/grading/responses/${id}`, { marks: [{ criterion: RUBRIC.overlap, points: 1 }], comment: '' });
    expect(missing.status).toBe(400);
    expect((await grader.send('put', `/api/grading/responses/${id}`, { marks: [{ criterion: RUBRIC.overlap, points: -1 }, { criterion: RUBRIC.cancels, points: 1 }] })).status).toBe(400);

    clock = new Date('2026-03-02T12:00:00Z');
    const res = await grader.send('put', `/api/grading/responses/${id}`, {
      marks: [
        { criterion: RUBRIC.overlap, points: 1 },
        { criterion: RUBRIC.cancels, points: 1.5 },
      ],
      comment: 'Good: now name the bench and day effects that cancel.',
    });
    expect(res.status).toBe(200);
    expect(res.headers['cache-control']).toBe('private, no-store');
    const graded = res.body as GradedResponse;
    expect(graded).toMatchObject({ status: 'partial', points: 2.5, maxPoints: 3, gradedAt: '2026-03-02T12:00:00.000Z', attempt: { points: 8.5, pendingCount: 0, passed: false } });

    // The apprentice's result: final score, marks, comment and when it was graded.
    const result = (await browser.get(`/api/attempts/${attempt.id}`)).body as AttemptView;
    expect(result.score).toMatchObject({ points: 8.5, provisional: false, pendingCount: 0 });
    expect(result.questions.find((q) => q.id === 'explain-overlap')!.result).toMatchObject({
      status: 'partial',
      points: 2.5,
      comment: 'Good: now name the bench and day effects that cancel.',
      gradedAt: '2026-03-02T12:00:00.000Z',
      rubric: [
        { criterion: RUBRIC.overlap, points: 1, maxPoints: 1 },
        { criterion: RUBRIC.cancels, points: 1.5, maxPoints: 2 },
      ],
    });

    // Off the queue.
    const queue = (await grader.get('/api/grading/queue?limit=200')).body as GradingQueue;
    expect(queue.items.some((i) => i.responseId === id)).toBe(false);

    // The e-mail, through the outbox.
    await t.mailer.idle();
    const mails = await dataSource.query(`SELECT to_address, subject, template, text_body, html_body FROM mail_outbox WHERE user_id = $1`, [user.id]);
    expect(mails).toHaveLength(1);
    expect(mails[0]).toMatchObject({ to_address: user.email, template: 'answer-graded', subject: 'Your answer in "Fixture: flow at test pressure" is graded' });
    expect(mails[0].text_body).toContain('2.5 of 3 points');
    expect(mails[0].text_body).toContain(`/course/${slug}/quiz?attempt=${attempt.id}`);

    // And in the app: one unread notification, linking to the result (same transaction as the marks).
    const notices = (await browser.get('/api/notifications')).body as NotificationsPage;
    expect(notices.unread).toBe(1);
    expect(notices.items).toEqual([
      expect.objectContaining({
        kind: 'answer-graded',
        title: 'Your written answer is graded: Fixture: flow at test pressure',
        body: 'Question 5: 2.5 of 3 points. Attempt 1 scores 77.3 % (not passed yet).',
        link: `/course/${slug}/quiz?attempt=${attempt.id}`,
        readAt: null,
      }),
    ]);

    // An xAPI "answered" statement for the graded answer.
    const [{ n }] = await dataSource.query(`SELECT count(*)::int AS n FROM learning_record WHERE attempt_id = $1 AND verb = 'answered' AND statement->'result'->'score'->>'raw' = '2.5'`, [attempt.id]);
    expect(n).toBe(1);

    // Only written answers take rubric marks.
    const choice = await responseId(attempt.id, 'why-test-pressure');
    expect((await grader.send('put', `/api/grading/responses/${choice}`, { marks: [{ criterion: 'x', points: 0 }] })).status).toBe(409);
    clock = new Date('2026-03-02T08:00:00Z');
  });

  it('overrides an auto-graded answer with a reason the apprentice sees, in the audit log', async () => {
    const { browser, user } = await apprentice('Overridden Olu');
    const attempt = await submitted(browser, new Date('2026-03-02T11:30:00Z'));
    const id = await responseId(attempt.id, 'which-are-differential');
    const grader = await signedIn(t.app, instructor);

    expect((await grader.send('post', `/api/grading/responses/${id}/override`, { points: 2 })).status).toBe(400);
    expect((await grader.send('post', `/api/grading/responses/${id}/override`, { points: 3, reason: 'Too many points.' })).status).toBe(400);
    const written = await responseId(attempt.id, 'explain-overlap');
    expect((await grader.send('post', `/api/grading/responses/${written}/override`, { points: 1, reason: 'Not this way.' })).status).toBe(409);
    expect((await browser.send('post', `/api/grading/responses/${id}/override`, { points: 2, reason: 'Please.' })).status).toBe(403);

    const res = await grader.send('post', `/api/grading/responses/${id}/override`, { points: 2, reason: 'Choice d was ambiguous in this version; full marks.' });
    expect(res.status).toBe(200);
    expect(res.body as GradedResponse).toMatchObject({ points: 2, override: { points: 2, reason: 'Choice d was ambiguous in this version; full marks.' }, attempt: { points: 8 } });

    const result = (await browser.get(`/api/attempts/${attempt.id}`)).body as AttemptView;
    expect(result.score).toMatchObject({ points: 8 });
    expect(result.questions.find((q) => q.id === 'which-are-differential')!.result).toMatchObject({
      points: 2,
      override: { points: 2, reason: 'Choice d was ambiguous in this version; full marks.' },
    });

    const notices = (await browser.get('/api/notifications')).body as NotificationsPage;
    expect(notices.items.map((n) => [n.kind, n.body])).toEqual([
      ['answer-overridden', expect.stringContaining('now 2 of 2 points. Reason: Choice d was ambiguous in this version; full marks.')],
    ]);

    const audit = await dataSource.query(`SELECT actor_id, target_id, detail FROM audit_entry WHERE action = 'quiz.answer-overridden' AND detail->>'responseId' = $1`, [id]);
    expect(audit).toHaveLength(1);
    expect(audit[0]).toMatchObject({ actor_id: instructor.id, target_id: user.id, detail: { points: 2, automaticPoints: 0, reason: 'Choice d was ambiguous in this version; full marks.', quiz: slug } });

    // The grader's view of the attempt shows it.
    const view = (await grader.get(`/api/grading/attempts/${attempt.id}`)).body as GradingAttempt;
    expect(view.responses.find((r) => r.responseId === id)).toMatchObject({ overridable: true, override: { points: 2 }, keyText: 'a, c' });
    expect(view.responses.find((r) => r.questionId === 'explain-overlap')).toMatchObject({ overridable: false });
  });

  it('regrades earlier versions against a corrected key on their stored numbers and lists whose score changed', async () => {
    const { browser, user } = await apprentice('Regraded Rae');
    const outside = await apprentice('Outside Ola', false);
    const attempt = await submitted(browser, new Date('2026-03-02T11:45:00Z'), regradeSlug);
    await submitted(outside.browser, new Date('2026-03-02T11:50:00Z'), regradeSlug);
    // Right answers to the numeric (301.2 cfm) and fresh questions: 1 + 0 + 2 + 3 = 6 of 11.
    expect(attempt.score!.points).toBe(6);
    const [{ drawn }] = await dataSource.query(`SELECT drawn FROM quiz_response WHERE attempt_id = $1 AND question_id = 'fresh-conversion'`, [attempt.id]);

    // The keys are "corrected": the numeric one to 280 cfm; the fresh one's fixed test pressure to 25 inH2O.
    const corrected = fixtureQuiz({ lesson: regradeSlug, title: 'Regrade fixture' });
    corrected.questions = corrected.questions.map((q) => {
      if (q.kind === 'numeric') return { ...q, key: { value: 280, unit: 'cfm' } };
      if (q.kind === 'fresh') return { ...q, inputs: { ...q.inputs, toPressureDrop: { value: 25, unit: 'inH2O' } } };
      return q;
    });
    (library.quizzes as Map<string, ReturnType<typeof loadedQuiz>>).set(regradeSlug, loadedQuiz(corrected));

    const grader = await signedIn(t.app, instructor);
    // The corrected questions are listed, with the answers to earlier versions in the instructor's cohorts.
    const corrections = async (browser: Browser) => ((await browser.get('/api/grading/corrections')).body as CorrectedQuestion[]).filter((c) => c.quiz.slug === regradeSlug);
    expect(await corrections(grader)).toEqual([
      { quiz: { slug: regradeSlug, title: 'Regrade fixture' }, questionId: 'convert-reading', questionNumber: 3, currentVersion: 2, earlierAnswers: 1, lastRegradedAt: null },
      { quiz: { slug: regradeSlug, title: 'Regrade fixture' }, questionId: 'fresh-conversion', questionNumber: 4, currentVersion: 2, earlierAnswers: 1, lastRegradedAt: null },
    ]);
    expect(await corrections(await signedIn(t.app, outsider))).toEqual([]);
    expect((await browser.get('/api/grading/corrections')).status).toBe(403);

    const numeric = await grader.send('post', '/api/grading/regrade', { quizSlug: regradeSlug, questionId: 'convert-reading' });
    expect(numeric.status).toBe(200);
    const first = numeric.body as RegradeResult;
    // Only the instructor's cohort: the outside apprentice's attempt is not touched.
    expect(first).toMatchObject({ quizSlug: regradeSlug, questionId: 'convert-reading', currentVersion: 2, responsesRegraded: 1 });
    expect(first.changed).toEqual([
      { apprentice: { id: user.id, displayName: 'Regraded Rae' }, attemptId: attempt.id, attemptNumber: 1, old: { percent: (100 * 6) / 11, passed: false }, new: { percent: (100 * 4) / 11, passed: false } },
    ]);

    expect((await corrections(grader)).map((c) => [c.questionId, c.lastRegradedAt !== null])).toEqual([
      ['convert-reading', true],
      ['fresh-conversion', false],
    ]);
    const fresh = (await grader.send('post', '/api/grading/regrade', { quizSlug: regradeSlug, questionId: 'fresh-conversion' })).body as RegradeResult;
    expect(fresh.changed.map((c) => [c.attemptId, c.new.percent])).toEqual([[attempt.id, (100 * 1) / 11]]);
    const [after] = await dataSource.query(`SELECT key, drawn, status FROM quiz_response WHERE attempt_id = $1 AND question_id = 'fresh-conversion'`, [attempt.id]);
    // The drawn numbers stay; the key is the engine's for them at 25 inH2O: flow·√(25/from) (the square-root rule).
    expect(after.drawn.inputs).toEqual(drawn.inputs);
    const flow = drawn.inputs.flow.value as number;
    const from = drawn.inputs.fromPressureDrop.value as number;
    expect(after.key.value).toBeCloseTo(flow * Math.sqrt(25 / from), 6);
    expect(after.status).toBe('incorrect');

    // A second run changes nothing; the outside apprentice is regraded by an admin.
    expect(((await grader.send('post', '/api/grading/regrade', { quizSlug: regradeSlug, questionId: 'convert-reading' })).body as RegradeResult).changed).toEqual([]);
    const admin = await signedIn(t.app, await createUser(dataSource, { role: 'admin' }));
    const byAdmin = (await admin.send('post', '/api/grading/regrade', { quizSlug: regradeSlug, questionId: 'convert-reading' })).body as RegradeResult;
    expect(byAdmin.changed.map((c) => c.apprentice.id)).toEqual([outside.user.id]);

    const result = (await browser.get(`/api/attempts/${attempt.id}`)).body as AttemptView;
    expect(result.questions.find((q) => q.id === 'convert-reading')!.result).toMatchObject({ status: 'incorrect', key: { value: 280, unit: 'cfm' } });
    // Each regrade that changed the score told the apprentice, newest first.
    const notices = (await browser.get('/api/notifications')).body as NotificationsPage;
    expect(notices.items.map((n) => [n.kind, n.body])).toEqual([
      ['answer-regraded', expect.stringMatching(/^Attempt 1 was 36\.4 % and is now 9\.1 %\. /)],
      ['answer-regraded', expect.stringMatching(/^Attempt 1 was 54\.5 % and is now 36\.4 %\. /)],
    ]);
    expect((await grader.send('post', '/api/grading/regrade', { quizSlug: regradeSlug, questionId: 'explain-overlap' })).status).toBe(409);
    expect((await grader.send('post', '/api/grading/regrade', { quizSlug: regradeSlug, questionId: 'no-such' })).status).toBe(404);
    const audit = await dataSource.query(`SELECT count(*)::int AS n FROM audit_entry WHERE action = 'quiz.question-regraded' AND detail->>'quiz' = $1`, [regradeSlug]);
    expect(audit[0].n).toBe(4);
  });
});
