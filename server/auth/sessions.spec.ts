import type { DataSource } from 'typeorm';

import { User } from '../accounts/user.entity';
import { accountsTestApp, Browser, createUser, migratedTestDataSource, sessionCookie, sidOf, signedIn, TEST_PASSWORD, type AccountsTestApp } from '../testing/accounts';

describe('sessions', () => {
  let dataSource: DataSource;
  let clock = Date.now();
  let t: AccountsTestApp;

  beforeAll(async () => {
    dataSource = await migratedTestDataSource();
    t = accountsTestApp(dataSource, { now: () => new Date(clock) });
  });
  afterAll(async () => {
    await t.mailer.idle();
    await dataSource.destroy();
  });

  const sessionRows = async (sid: string): Promise<number> =>
    (await dataSource.query('SELECT count(*)::int AS n FROM session WHERE sid = $1', [sid]))[0].n;

  it('gives a new session id at sign-in (no session fixation) and keeps it in PostgreSQL', async () => {
    const user = await createUser(dataSource);
    const browser = new Browser(t.app);
    const before = sessionCookie(await browser.agent.get('/api/auth/csrf').then((res) => ((browser.csrf = res.body.token), res)));
    expect(before).toBeDefined();
    const signIn = await browser.signIn(user.email);
    expect(signIn.status).toBe(200);
    expect(signIn.body.user).toMatchObject({ email: user.email, role: 'apprentice', verified: true });
    const after = sessionCookie(signIn);
    expect(after).toBeDefined();
    expect(sidOf(after!)).not.toBe(sidOf(before!));
    expect(await sessionRows(sidOf(before!))).toBe(0);
    expect(await sessionRows(sidOf(after!))).toBe(1);
    const cookie = signIn.headers['set-cookie'] as unknown as string[];
    expect(cookie.find((c) => c.startsWith('flowlore.sid='))).toMatch(/HttpOnly/i);
    expect(cookie.find((c) => c.startsWith('flowlore.sid='))).toMatch(/SameSite=Lax/i);
    expect((await browser.get('/api/auth/me')).body.user.email).toBe(user.email);
  });

  it('ends the session at sign-out: the row is gone from PostgreSQL', async () => {
    const user = await createUser(dataSource);
    const browser = new Browser(t.app);
    const sid = sidOf(sessionCookie(await browser.signIn(user.email))!);
    expect(await sessionRows(sid)).toBe(1);
    expect((await browser.send('post', '/api/auth/sign-out')).status).toBe(204);
    expect(await sessionRows(sid)).toBe(0);
    expect((await browser.get('/api/auth/me')).body).toEqual({ user: null });
  });

  it('refuses a state-changing request without a CSRF token with a 403 problem', async () => {
    const user = await createUser(dataSource);
    const browser = await signedIn(t.app, user);
    const bare = await browser.agent.patch('/api/account/profile').send({ displayName: 'Changed' });
    expect(bare.status).toBe(403);
    expect(bare.headers['content-type']).toMatch(/^application\/problem\+json/);
    const forged = await browser.agent.patch('/api/account/profile').set('X-XSRF-TOKEN', 'abc.def').send({ displayName: 'Changed' });
    expect(forged.status).toBe(403);
    const visitor = await new Browser(t.app).agent.post('/api/auth/sign-in').send({ email: user.email, password: TEST_PASSWORD });
    expect(visitor.status).toBe(403);
    const good = await browser.send('patch', '/api/account/profile', { displayName: 'Changed' });
    expect(good.status).toBe(200);
    expect(good.body.user.displayName).toBe('Changed');
  });

  it('does not accept a CSRF token issued to another session', async () => {
    const [a, b] = [await createUser(dataSource), await createUser(dataSource)];
    const browserA = await signedIn(t.app, a);
    const browserB = await signedIn(t.app, b);
    const res = await browserA.agent.patch('/api/account/profile').set('X-XSRF-TOKEN', browserB.csrf).send({ displayName: 'X' });
    expect(res.status).toBe(403);
  });

  it('lets a calculator be evaluated without a session or token (it changes nothing)', async () => {
    const res = await new Browser(t.app).agent.post('/api/calculators/mass-flow').send({ inputs: {} });
    expect(res.status).not.toBe(403);
  });

  it('sends no session cookie with the course, which is the same for everyone and may be kept by a shared cache', async () => {
    const user = await createUser(dataSource);
    const reader = await signedIn(t.app, user);
    for (const path of ['/api/lessons', '/api/glossary']) {
      const res = await reader.get(path);
      expect({ path, status: res.status, cookie: res.headers['set-cookie'] }).toEqual({ path, status: 200, cookie: undefined });
    }
  });

  it('rolls a 30-minute idle expiry and ends any session 12 hours after sign-in', async () => {
    const user = await createUser(dataSource);
    const browser = await signedIn(t.app, user);
    const row = (await dataSource.query(`SELECT expire, sess FROM session WHERE sess->'passport'->>'user' = $1`, [user.id]))[0];
    const idleMinutes = (new Date(row.expire).getTime() - Date.now()) / 60_000;
    expect(idleMinutes).toBeGreaterThan(25);
    expect(idleMinutes).toBeLessThanOrEqual(31);
    clock += 11 * 3600_000;
    expect((await browser.get('/api/auth/me')).body.user).not.toBeNull();
    clock += 2 * 3600_000;
    expect((await browser.get('/api/auth/me')).body).toEqual({ user: null });
    expect((await dataSource.query(`SELECT count(*)::int AS n FROM session WHERE sess->'passport'->>'user' = $1`, [user.id]))[0].n).toBe(0);
    clock = Date.now();
  });

  it('ends the other sessions of a user who changes their password, keeping this one', async () => {
    const user = await createUser(dataSource);
    const here = await signedIn(t.app, user);
    const elsewhere = await signedIn(t.app, user);
    const res = await here.send('post', '/api/auth/change-password', { currentPassword: TEST_PASSWORD, newPassword: 'a brand new bench passphrase' });
    expect(res.status).toBe(204);
    expect((await here.get('/api/auth/me')).body.user.email).toBe(user.email);
    expect((await elsewhere.get('/api/auth/me')).body).toEqual({ user: null });
    const wrong = await here.send('post', '/api/auth/change-password', { currentPassword: 'not the password', newPassword: 'another long passphrase' });
    expect(wrong.status).toBe(400);
    await t.mailer.idle();
  });

  it('signs a disabled account out everywhere at once and refuses its sign-in', async () => {
    const admin = await createUser(dataSource, { role: 'admin' });
    const user = await createUser(dataSource);
    const victim = await signedIn(t.app, user);
    const adminBrowser = await signedIn(t.app, admin);
    const res = await adminBrowser.send('patch', `/api/admin/users/${user.id}`, { disabled: true });
    expect(res.status).toBe(200);
    expect(res.body.disabled).toBe(true);
    expect((await dataSource.query(`SELECT count(*)::int AS n FROM session WHERE sess->'passport'->>'user' = $1`, [user.id]))[0].n).toBe(0);
    expect((await victim.get('/api/auth/me')).body).toEqual({ user: null });
    const again = await new Browser(t.app).signIn(user.email);
    expect(again.status).toBe(403);
    const audit = await dataSource.query(`SELECT action, actor_id FROM audit_entry WHERE target_id = $1`, [user.id]);
    expect(audit).toEqual([{ action: 'account.disabled', actor_id: admin.id }]);
  });

  it('takes a role change into effect on the next request (the role is read from the database)', async () => {
    const user = await createUser(dataSource);
    const browser = await signedIn(t.app, user);
    expect((await browser.get('/api/cohorts')).status).toBe(403);
    await dataSource.getRepository(User).update({ id: user.id }, { role: 'instructor' });
    expect((await browser.get('/api/cohorts')).status).toBe(200);
  });
});
