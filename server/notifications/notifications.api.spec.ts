import type { DataSource } from 'typeorm';

import type { NotificationsPage } from '../../shared/api/notifications';
import type { User } from '../accounts/user.entity';
import { fixtureLibrary, fixtureQuiz, quizTestApp } from '../quizzes/test-quizzes/fixture-quiz';
import { Browser, createUser, migratedTestDataSource, signedIn } from '../testing/accounts';
import { notify } from './notifications.service';

/**
 * `/api/notifications` against real PostgreSQL: one's own only, newest first, the unread count,
 * marking read (some or all), and bad input refused as problem+json. Notifications made by grading
 * are checked in grading.api.spec.ts.
 */
describe('notifications API', () => {
  let dataSource: DataSource;
  let t: ReturnType<typeof quizTestApp>;

  beforeAll(async () => {
    dataSource = await migratedTestDataSource();
    t = quizTestApp(dataSource, fixtureLibrary(fixtureQuiz()));
  });

  afterAll(async () => {
    await t.mailer.idle();
    await dataSource.destroy();
  });

  async function withNotices(count: number): Promise<User> {
    const user = await createUser(dataSource, { role: 'apprentice' });
    for (let i = 1; i <= count; i++) {
      await notify(dataSource.manager, { userId: user.id, kind: 'answer-graded', title: `Notice ${i}`, body: `Body ${i}`, link: `/course/pressure/quiz?n=${i}` });
    }
    return user;
  }

  it('lists only one’s own, newest first, with the unread count; ?limit and ?unread page it', async () => {
    const me = await withNotices(3);
    await withNotices(2); // someone else's
    const browser = await signedIn(t.app, me);
    const res = await browser.get('/api/notifications');
    expect(res.status).toBe(200);
    expect(res.headers['cache-control']).toBe('private, no-store');
    const page = res.body as NotificationsPage;
    expect(page.unread).toBe(3);
    expect(page.items.map((n) => n.title)).toEqual(['Notice 3', 'Notice 2', 'Notice 1']);
    expect(page.items[0]).toMatchObject({ kind: 'answer-graded', body: 'Body 3', link: '/course/pressure/quiz?n=3', readAt: null });
    expect(((await browser.get('/api/notifications?limit=1')).body as NotificationsPage).items.map((n) => n.title)).toEqual(['Notice 3']);
    expect(((await browser.get('/api/notifications?unread=false')).body as NotificationsPage).items).toEqual([]);
  });

  it('marks some by id, then all, read; another user’s ids change nothing', async () => {
    const me = await withNotices(3);
    const other = await withNotices(1);
    const browser = await signedIn(t.app, me);
    const mine = ((await browser.get('/api/notifications')).body as NotificationsPage).items;
    const theirs = ((await (await signedIn(t.app, other)).get('/api/notifications')).body as NotificationsPage).items;

    const some = await browser.send('post', '/api/notifications/read', { ids: [mine[0]!.id, theirs[0]!.id] });
    expect(some.status).toBe(200);
    expect(some.body).toEqual({ unread: 2 });
    const [{ read_at }] = await dataSource.query('SELECT read_at FROM notification WHERE id = $1', [theirs[0]!.id]);
    expect(read_at).toBeNull();
    const unread = (await browser.get('/api/notifications?unread=true')).body as NotificationsPage;
    expect(unread.items.map((n) => n.title)).toEqual(['Notice 2', 'Notice 1']);

    expect((await browser.send('post', '/api/notifications/read', { all: true })).body).toEqual({ unread: 0 });
    const after = (await browser.get('/api/notifications')).body as NotificationsPage;
    expect(after.items.every((n) => n.readAt !== null)).toBe(true);
  });

  it('refuses bad input with a problem naming the field, and visitors with 401', async () => {
    const browser = await signedIn(t.app, await withNotices(1));
    for (const body of [{}, { ids: [] }, { ids: ['not-a-uuid'] }, { all: false }, { all: true, ids: [] }]) {
      const res = await browser.send('post', '/api/notifications/read', body);
      expect(res.status).toBe(400);
      expect(res.headers['content-type']).toMatch(/^application\/problem\+json/);
    }
    expect((await browser.get('/api/notifications?limit=500')).status).toBe(400);
    const visitor = await new Browser(t.app).get('/api/notifications');
    expect(visitor.status).toBe(401);
  });

  it('refuses a link that leaves the app', async () => {
    const user = await createUser(dataSource, { role: 'apprentice' });
    await expect(notify(dataSource.manager, { userId: user.id, kind: 'answer-graded', title: 'x', body: 'y', link: 'https://elsewhere.example/' })).rejects.toThrow(/inside the app/);
  });
});
