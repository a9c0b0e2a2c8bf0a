import { randomUUID } from 'node:crypto';

import type { DataSource } from 'typeorm';

import { exampleRequest } from '../../shared/airflow';
import type { User } from '../accounts/user.entity';
import { Cohort } from '../cohorts/cohort.entity';
import { listRoutes } from '../http/route-list';
import { CohortMember } from '../cohorts/cohort-member.entity';
import { fixtureLibrary, fixtureQuiz, quizTestApp } from '../quizzes/test-quizzes/fixture-quiz';
import { Browser, createShopOwner, createUser, migratedTestDataSource, signedIn, uniqueEmail, type AccountsTestApp } from '../testing/accounts';

/**
 * Every API route × every kind of caller, with the status each must get. The table must name
 * every route the app has: a route added without a row fails the first test.
 * Columns: visitor, apprentice, instructor (owns the cohort), shop owner (owns the shop), admin,
 * outsider (an instructor with a cohort of their own, not this one).
 */
type Actor = 'visitor' | 'apprentice' | 'instructor' | 'owner' | 'admin' | 'outsider';
const ACTORS: Actor[] = ['visitor', 'apprentice', 'instructor', 'owner', 'admin', 'outsider'];

interface Fixture {
  cohortId: string;
  targetUserId: string;
  memberToAdd: string;
  /** The quiz (a fixture) and two open attempts of the apprentice, who is in the instructor's cohort. */
  quizSlug: string;
  attemptId: string;
  attemptToSubmit: string;
  /** A submitted attempt of the same apprentice: its written answer (pending) and an auto-graded one. */
  submittedAttemptId: string;
  writtenResponseId: string;
  autoGradedResponseId: string;
  users: Record<Exclude<Actor, 'visitor'>, User>;
}

interface Row {
  request: (f: Fixture, actor: Actor) => { method: 'get' | 'post' | 'put' | 'patch' | 'delete'; path: string; body?: object };
  expect: [visitor: number, apprentice: number, instructor: number, owner: number, admin: number, outsider: number];
}

const get = (path: string) => () => ({ method: 'get' as const, path });

const MATRIX: Record<string, Row> = {
  'GET /api/health': { request: get('/api/health'), expect: [200, 200, 200, 200, 200, 200] },
  'GET /api/calculators': { request: get('/api/calculators'), expect: [200, 200, 200, 200, 200, 200] },
  'GET /api/calculators/:id': { request: get('/api/calculators/mass-flow'), expect: [200, 200, 200, 200, 200, 200] },
  'POST /api/calculators/:id': {
    request: () => ({ method: 'post', path: '/api/calculators/mass-flow', body: exampleRequest('mass-flow')! }),
    expect: [200, 200, 200, 200, 200, 200],
  },
  'GET /api/lessons': { request: get('/api/lessons'), expect: [200, 200, 200, 200, 200, 200] },
  // The test app has no lessons, so a lesson page is a 404 for everyone (public route: no 401/403).
  'GET /api/lessons/:slug': { request: get('/api/lessons/pressure'), expect: [404, 404, 404, 404, 404, 404] },
  'GET /api/glossary': { request: get('/api/glossary'), expect: [200, 200, 200, 200, 200, 200] },

  'GET /api/auth/me': { request: get('/api/auth/me'), expect: [200, 200, 200, 200, 200, 200] },
  'GET /api/auth/csrf': { request: get('/api/auth/csrf'), expect: [200, 200, 200, 200, 200, 200] },
  // DEMO_MODE is off in tests (and by default): an empty list for everyone.
  'GET /api/auth/demo-accounts': { request: get('/api/auth/demo-accounts'), expect: [200, 200, 200, 200, 200, 200] },
  'POST /api/auth/sign-up': {
    request: () => ({ method: 'post', path: '/api/auth/sign-up', body: { accountType: 'apprentice', email: uniqueEmail('matrix'), displayName: 'Matrix', password: 'matrix sign-up passphrase' } }),
    expect: [202, 202, 202, 202, 202, 202],
  },
  'POST /api/auth/sign-in': {
    request: () => ({ method: 'post', path: '/api/auth/sign-in', body: { email: uniqueEmail('nobody'), password: 'not a real password' } }),
    expect: [401, 401, 401, 401, 401, 401],
  },
  'POST /api/auth/sign-out': { request: () => ({ method: 'post', path: '/api/auth/sign-out' }), expect: [204, 204, 204, 204, 204, 204] },
  'POST /api/auth/verify': { request: () => ({ method: 'post', path: '/api/auth/verify', body: { token: 'x'.repeat(43) } }), expect: [400, 400, 400, 400, 400, 400] },
  'POST /api/auth/forgot-password': {
    request: () => ({ method: 'post', path: '/api/auth/forgot-password', body: { email: uniqueEmail('nobody') } }),
    expect: [202, 202, 202, 202, 202, 202],
  },
  'POST /api/auth/reset-password': {
    request: () => ({ method: 'post', path: '/api/auth/reset-password', body: { token: 'x'.repeat(43), password: 'a new long passphrase' } }),
    expect: [400, 400, 400, 400, 400, 400],
  },
  // Signed in: 400 because the current password sent is wrong (the guard let it through).
  'POST /api/auth/change-password': {
    request: () => ({ method: 'post', path: '/api/auth/change-password', body: { currentPassword: 'not it', newPassword: 'a new long passphrase' } }),
    expect: [401, 400, 400, 400, 400, 400],
  },
  'PATCH /api/account/profile': {
    request: () => ({ method: 'patch', path: '/api/account/profile', body: { displayName: 'Renamed in the matrix' } }),
    expect: [401, 200, 200, 200, 200, 200],
  },
  'PATCH /api/account/preferences': {
    request: () => ({ method: 'patch', path: '/api/account/preferences', body: { unitSystem: 'us' } }),
    expect: [401, 200, 200, 200, 200, 200],
  },

  'GET /api/admin/users': { request: get('/api/admin/users?role=admin&sort=email&order=asc'), expect: [401, 403, 403, 403, 200, 403] },
  'PATCH /api/admin/users/:id': {
    request: (f) => ({ method: 'patch', path: `/api/admin/users/${f.targetUserId}`, body: { role: 'apprentice' } }),
    expect: [401, 403, 403, 403, 200, 403],
  },
  'GET /api/admin/outbox': { request: get('/api/admin/outbox'), expect: [401, 403, 403, 403, 200, 403] },
  'GET /api/admin/audit': { request: get('/api/admin/audit'), expect: [401, 403, 403, 403, 200, 403] },

  'GET /api/cohorts': { request: get('/api/cohorts'), expect: [401, 403, 200, 403, 200, 200] },
  'POST /api/cohorts': { request: () => ({ method: 'post', path: '/api/cohorts', body: { name: 'Matrix cohort' } }), expect: [401, 403, 201, 403, 403, 201] },
  'GET /api/cohorts/:id': { request: (f) => ({ method: 'get', path: `/api/cohorts/${f.cohortId}` }), expect: [401, 403, 200, 403, 200, 403] },
  'POST /api/cohorts/:id/members': {
    request: (f) => ({ method: 'post', path: `/api/cohorts/${f.cohortId}/members`, body: { userId: f.memberToAdd } }),
    expect: [401, 403, 201, 403, 201, 403],
  },
  // Signed in with the right: 404 because that apprentice is not a member (the guard let it through).
  'DELETE /api/cohorts/:id/members/:userId': {
    request: (f) => ({ method: 'delete', path: `/api/cohorts/${f.cohortId}/members/${randomUUID()}` }),
    expect: [401, 403, 404, 403, 404, 403],
  },

  'GET /api/shops/mine': { request: get('/api/shops/mine'), expect: [401, 403, 403, 200, 403, 403] },
  // Progress of the owner's own shop only (completion, no answers); nobody else's.
  'GET /api/shop/progress': { request: get('/api/shop/progress'), expect: [401, 403, 403, 200, 403, 403] },
  // The owner's shop has no seats paid for: invitations are skipped (200), an assignment is a 409.
  'GET /api/shop/seats': { request: get('/api/shop/seats'), expect: [401, 403, 403, 200, 403, 403] },
  'POST /api/shop/invitations': {
    request: () => ({ method: 'post', path: '/api/shop/invitations', body: { emails: ['matrix-invitee@example.test'] } }),
    expect: [401, 403, 403, 200, 403, 403],
  },
  'POST /api/shop/invitations/:id/resend': {
    request: () => ({ method: 'post', path: `/api/shop/invitations/${randomUUID()}/resend` }),
    expect: [401, 403, 403, 404, 403, 403],
  },
  'DELETE /api/shop/invitations/:id': { request: () => ({ method: 'delete', path: `/api/shop/invitations/${randomUUID()}` }), expect: [401, 403, 403, 404, 403, 403] },
  'POST /api/shop/seats/assign': {
    request: (f) => ({ method: 'post', path: '/api/shop/seats/assign', body: { userId: f.users.apprentice.id } }),
    expect: [401, 403, 403, 409, 403, 403],
  },
  'POST /api/shop/seats/:id/release': { request: () => ({ method: 'post', path: `/api/shop/seats/${randomUUID()}/release` }), expect: [401, 403, 403, 404, 403, 403] },
  // Buying is switched off in tests without a provider key: the owner's order is a clear 503.
  'POST /api/shop/orders': { request: () => ({ method: 'post', path: '/api/shop/orders', body: { quantity: 2 } }), expect: [401, 403, 403, 503, 403, 403] },
  'GET /api/shop/orders': { request: get('/api/shop/orders'), expect: [401, 403, 403, 200, 403, 403] },
  'GET /api/shop/orders/:id': { request: () => ({ method: 'get', path: `/api/shop/orders/${randomUUID()}` }), expect: [401, 403, 403, 404, 403, 403] },
  // The provider's events carry no session; without a configured provider every caller gets the 503.
  'POST /api/payments/webhook': { request: () => ({ method: 'post', path: '/api/payments/webhook', body: { id: 'evt_x' } }), expect: [503, 503, 503, 503, 503, 503] },
  // Only an apprentice may accept; this token matches no invitation.
  'POST /api/invitations/accept': {
    request: () => ({ method: 'post', path: '/api/invitations/accept', body: { token: 'x'.repeat(40) } }),
    expect: [401, 404, 403, 403, 403, 403],
  },
  // The gradebook: the cohort's instructor and admins; another instructor's is a 403.
  'GET /api/cohorts/:id/gradebook': { request: (f) => ({ method: 'get', path: `/api/cohorts/${f.cohortId}/gradebook?sort=name` }), expect: [401, 403, 200, 403, 200, 403] },
  'GET /api/cohorts/:id/gradebook.csv': { request: (f) => ({ method: 'get', path: `/api/cohorts/${f.cohortId}/gradebook.csv` }), expect: [401, 403, 200, 403, 200, 403] },

  // Quizzes: every signed-in user gets the list; only apprentices start, answer and submit, and only
  // their own attempts; the apprentice's cohort instructor and admins may look at an attempt.
  'GET /api/quizzes': { request: get('/api/quizzes'), expect: [401, 200, 200, 200, 200, 200] },
  'POST /api/quizzes/:slug/attempts': {
    request: (f) => ({ method: 'post', path: `/api/quizzes/${f.quizSlug}/attempts` }),
    expect: [401, 201, 403, 403, 403, 403],
  },
  'GET /api/attempts/:id': { request: (f) => ({ method: 'get', path: `/api/attempts/${f.attemptId}` }), expect: [401, 200, 200, 403, 200, 403] },
  'PUT /api/attempts/:id/answers/:questionId': {
    request: (f) => ({ method: 'put', path: `/api/attempts/${f.attemptId}/answers/why-test-pressure`, body: { answer: { choiceId: 'a' } } }),
    expect: [401, 200, 403, 403, 403, 403],
  },
  'POST /api/attempts/:id/submit': {
    request: (f) => ({ method: 'post', path: `/api/attempts/${f.attemptToSubmit}/submit` }),
    expect: [401, 200, 403, 403, 403, 403],
  },
  // The test app has no lessons: an apprentice's lesson event is a 404 (the guard let it through).
  'POST /api/progress/lessons/:slug': {
    request: () => ({ method: 'post', path: '/api/progress/lessons/pressure', body: { event: 'opened' } }),
    expect: [401, 404, 403, 403, 403, 403],
  },
  'GET /api/progress': { request: get('/api/progress'), expect: [401, 200, 403, 403, 403, 403] },
  // One's own notifications, whatever the role.
  'GET /api/notifications': { request: get('/api/notifications'), expect: [401, 200, 200, 200, 200, 200] },
  'POST /api/notifications/read': { request: () => ({ method: 'post', path: '/api/notifications/read', body: { all: true } }), expect: [401, 200, 200, 200, 200, 200] },
  // Own (apprentice), cohorts' (instructor), all (admin); never a shop owner's.
  'GET /api/learning-records': { request: get('/api/learning-records?limit=10'), expect: [401, 200, 200, 403, 200, 200] },

  // Grading: instructors (their cohorts' apprentices only) and admins. The outsider's queue and
  // regrade answer 200 with nothing of this apprentice in them; their answers are a 403.
  'GET /api/grading/queue': { request: get('/api/grading/queue'), expect: [401, 403, 200, 403, 200, 200] },
  'GET /api/grading/attempts/:id': { request: (f) => ({ method: 'get', path: `/api/grading/attempts/${f.submittedAttemptId}` }), expect: [401, 403, 200, 403, 200, 403] },
  'PUT /api/grading/responses/:id': {
    request: (f) => ({
      method: 'put',
      path: `/api/grading/responses/${f.writtenResponseId}`,
      body: {
        marks: [
          { criterion: 'Says overlap of intervals is not the test', points: 1 },
          { criterion: 'Names what cancels on the same bench and day', points: 1 },
        ],
        comment: 'Matrix grade.',
      },
    }),
    expect: [401, 403, 200, 403, 200, 403],
  },
  'POST /api/grading/responses/:id/override': {
    request: (f) => ({ method: 'post', path: `/api/grading/responses/${f.autoGradedResponseId}/override`, body: { points: 1, reason: 'Matrix override.' } }),
    expect: [401, 403, 200, 403, 200, 403],
  },
  'GET /api/grading/corrections': { request: get('/api/grading/corrections'), expect: [401, 403, 200, 403, 200, 200] },
  'POST /api/grading/regrade': {
    request: (f) => ({ method: 'post', path: '/api/grading/regrade', body: { quizSlug: f.quizSlug, questionId: 'convert-reading' } }),
    expect: [401, 403, 200, 403, 200, 200],
  },
};

describe('route-by-role matrix', () => {
  let dataSource: DataSource;
  let t: AccountsTestApp;
  let fixture: Fixture;

  beforeAll(async () => {
    dataSource = await migratedTestDataSource();
    const quiz = fixtureQuiz({ lesson: `matrix-quiz-${randomUUID().slice(0, 8)}`, attemptLimit: 4 });
    t = quizTestApp(dataSource, fixtureLibrary(quiz));
    const { owner, shop } = await createShopOwner(dataSource);
    const users = {
      apprentice: await createUser(dataSource, { role: 'apprentice', shopId: shop.id }),
      instructor: await createUser(dataSource, { role: 'instructor' }),
      owner,
      admin: await createUser(dataSource, { role: 'admin' }),
      outsider: await createUser(dataSource, { role: 'instructor' }),
    };
    const cohort = await dataSource.getRepository(Cohort).save({ name: 'Matrix home cohort', instructorId: users.instructor.id });
    await dataSource.getRepository(Cohort).save({ name: 'Outsider cohort', instructorId: users.outsider.id });
    await dataSource.getRepository(CohortMember).save({ cohortId: cohort.id, userId: users.apprentice.id });
    const apprentice = await signedIn(t.app, users.apprentice);
    const startAttempt = async () => (await apprentice.send('post', `/api/quizzes/${quiz.lesson}/attempts`)).body.id as string;
    const submittedAttemptId = await startAttempt();
    await apprentice.send('put', `/api/attempts/${submittedAttemptId}/answers/explain-overlap`, { answer: { text: 'The bands overlapping is not the test.' } });
    await apprentice.send('post', `/api/attempts/${submittedAttemptId}/submit`);
    const responseOf = async (questionId: string) =>
      ((await dataSource.query('SELECT id FROM quiz_response WHERE attempt_id = $1 AND question_id = $2', [submittedAttemptId, questionId])) as Array<{ id: string }>)[0]!.id;
    fixture = {
      quizSlug: quiz.lesson,
      attemptId: await startAttempt(),
      attemptToSubmit: await startAttempt(),
      submittedAttemptId,
      writtenResponseId: await responseOf('explain-overlap'),
      autoGradedResponseId: await responseOf('why-test-pressure'),
      cohortId: cohort.id,
      targetUserId: (await createUser(dataSource)).id,
      memberToAdd: (await createUser(dataSource)).id,
      users,
    };
  });

  afterAll(async () => {
    await t.mailer.idle();
    await dataSource.destroy();
  });

  it('has a row for every API route the app answers, and no row for a route it lacks', () => {
    const routes = listRoutes(t.app)
      .filter((r) => r.path.startsWith('/api/'))
      .map((r) => `${r.method} ${r.path}`)
      .sort();
    expect(routes).toEqual(Object.keys(MATRIX).sort());
  });

  describe.each(Object.entries(MATRIX))('%s', (_route, row) => {
    it.each(ACTORS.map((actor, i) => [actor, row.expect[i]] as const))('as %s → %i', async (actor, expected) => {
      const browser = actor === 'visitor' ? new Browser(t.app) : await signedIn(t.app, fixture.users[actor]);
      const { method, path, body } = row.request(fixture, actor);
      const res = method === 'get' ? await browser.get(path) : await browser.send(method, path, body);
      expect({ status: res.status, body: res.status === expected ? undefined : res.body }).toEqual({ status: expected, body: undefined });
      if (res.status >= 400) expect(res.headers['content-type']).toMatch(/^application\/problem\+json/);
    });
  });
});
