import type { DataSource } from 'typeorm';

import { accountsTestApp, Browser, createUser, migratedTestDataSource, signedIn, type AccountsTestApp } from '../testing/accounts';

describe('PATCH /api/account/preferences', () => {
  let dataSource: DataSource;
  let t: AccountsTestApp;

  beforeAll(async () => {
    dataSource = await migratedTestDataSource();
    t = accountsTestApp(dataSource);
  });
  afterAll(async () => {
    await t.mailer.idle();
    await dataSource.destroy();
  });

  it('starts with no unit system, saves one, and returns it from /me and at sign-in on another device', async () => {
    const user = await createUser(dataSource);
    const laptop = await signedIn(t.app, user);
    expect((await laptop.get('/api/auth/me')).body.user).toMatchObject({ id: user.id, unitSystem: null });

    const saved = await laptop.send('patch', '/api/account/preferences', { unitSystem: 'us' });
    expect(saved.status).toBe(200);
    expect(saved.body.user).toMatchObject({ id: user.id, email: user.email, unitSystem: 'us' });
    expect((await laptop.get('/api/auth/me')).body.user.unitSystem).toBe('us');

    const phone = new Browser(t.app);
    const signIn = await phone.signIn(user.email);
    expect(signIn.body.user.unitSystem).toBe('us');
    expect((await phone.send('patch', '/api/account/preferences', { unitSystem: 'si' })).body.user.unitSystem).toBe('si');
    expect((await laptop.get('/api/auth/me')).body.user.unitSystem).toBe('si');

    // A name change leaves the choice alone.
    const renamed = await laptop.send('patch', '/api/account/profile', { displayName: 'Renamed' });
    expect(renamed.body.user).toMatchObject({ displayName: 'Renamed', unitSystem: 'si' });
  });

  it('refuses a value that is not a unit system with a 400 problem naming the field, and keeps the saved one', async () => {
    const user = await createUser(dataSource);
    const browser = await signedIn(t.app, user);
    await browser.send('patch', '/api/account/preferences', { unitSystem: 'us' });

    for (const body of [{ unitSystem: 'imperial' }, { unitSystem: null }, {}]) {
      const res = await browser.send('patch', '/api/account/preferences', body);
      expect(res.status).toBe(400);
      expect(res.headers['content-type']).toMatch(/^application\/problem\+json/);
      expect(res.body).toMatchObject({ status: 400, errors: [{ field: 'unitSystem', message: expect.any(String) }] });
    }
    const extra = await browser.send('patch', '/api/account/preferences', { unitSystem: 'si', role: 'admin' });
    expect(extra.status).toBe(400);
    expect((await browser.get('/api/auth/me')).body.user).toMatchObject({ role: 'apprentice', unitSystem: 'us' });
  });

  it('answers a visitor with 401', async () => {
    const visitor = new Browser(t.app);
    const res = await visitor.send('patch', '/api/account/preferences', { unitSystem: 'us' });
    expect(res.status).toBe(401);
    expect(res.headers['content-type']).toMatch(/^application\/problem\+json/);
  });
});
