import type { DataSource } from 'typeorm';

import type { AuditView } from '../../shared/api/accounts';
import { accountsTestApp, createShopOwner, createUser, migratedTestDataSource, signedIn, uniqueEmail, type AccountsTestApp } from '../testing/accounts';

describe('admin, cohort and shop APIs', () => {
  let dataSource: DataSource;
  let t: AccountsTestApp;

  beforeAll(async () => {
    dataSource = await migratedTestDataSource();
    t = accountsTestApp(dataSource);
  });
  afterAll(async () => {
    await dataSource.destroy();
  });

  it('lets an admin find users by text and role, sorted and paginated, and never shows a hash', async () => {
    const tag = uniqueEmail('findme').split('@')[0]!;
    for (const name of ['Cara', 'Abel', 'Bryn']) await createUser(dataSource, { email: `${tag}-${name.toLowerCase()}@test.flowlore.test`, displayName: name });
    await createUser(dataSource, { email: `${tag}-inst@test.flowlore.test`, role: 'instructor' });
    const admin = await signedIn(t.app, await createUser(dataSource, { role: 'admin' }));
    const page1 = await admin.get(`/api/admin/users?q=${tag}&role=apprentice&sort=displayName&order=asc&pageSize=2`);
    expect(page1.status).toBe(200);
    expect(page1.body.total).toBe(3);
    expect(page1.body.items.map((u: { displayName: string }) => u.displayName)).toEqual(['Abel', 'Bryn']);
    const page2 = await admin.get(`/api/admin/users?q=${tag}&role=apprentice&sort=displayName&order=asc&pageSize=2&page=2`);
    expect(page2.body.items.map((u: { displayName: string }) => u.displayName)).toEqual(['Cara']);
    expect(JSON.stringify(page1.body)).not.toMatch(/password|hash|failed/i);
    expect((await admin.get('/api/admin/users?sort=shoeSize')).status).toBe(400);
  });

  it('audits a role change with who, whom, from and to', async () => {
    const adminUser = await createUser(dataSource, { role: 'admin' });
    const target = await createUser(dataSource);
    const admin = await signedIn(t.app, adminUser);
    const res = await admin.send('patch', `/api/admin/users/${target.id}`, { role: 'instructor' });
    expect(res.status).toBe(200);
    expect(res.body.role).toBe('instructor');
    const audit = await admin.get('/api/admin/audit?pageSize=100');
    expect(audit.body.items).toEqual(
      expect.arrayContaining([expect.objectContaining({ actorId: adminUser.id, targetId: target.id, action: 'role.changed', detail: { from: 'apprentice', to: 'instructor' } })]),
    );
    // Names, not bare ids, for the audit page.
    const entry = (audit.body.items as AuditView[]).find((e) => e.action === 'role.changed' && e.targetId === target.id)!;
    expect(entry.actor).toEqual({ id: adminUser.id, displayName: adminUser.displayName, email: adminUser.email });
    expect(entry.target).toEqual({ id: target.id, displayName: target.displayName, email: target.email });
    expect((await admin.send('patch', `/api/admin/users/${adminUser.id}`, { disabled: true })).status).toBe(409);
  });

  it('lets an instructor build a cohort, add apprentices by e-mail or id, and remove one', async () => {
    const instructor = await signedIn(t.app, await createUser(dataSource, { role: 'instructor', displayName: 'Morag Test' }));
    const [a, b] = [await createUser(dataSource, { displayName: 'Apprentice A' }), await createUser(dataSource, { displayName: 'Apprentice B' })];
    const created = await instructor.send('post', '/api/cohorts', { name: 'Autumn bench class' });
    expect(created.status).toBe(201);
    const id = created.body.id;
    expect((await instructor.send('post', `/api/cohorts/${id}/members`, { email: a.email.toUpperCase() })).status).toBe(201);
    const added = await instructor.send('post', `/api/cohorts/${id}/members`, { userId: b.id });
    expect(added.body.members.map((m: { displayName: string }) => m.displayName)).toEqual(['Apprentice A', 'Apprentice B']);
    const notApprentice = await createUser(dataSource, { role: 'instructor' });
    expect((await instructor.send('post', `/api/cohorts/${id}/members`, { userId: notApprentice.id })).status).toBe(400);
    expect((await instructor.send('delete', `/api/cohorts/${id}/members/${a.id}`)).status).toBe(204);
    const detail = await instructor.get(`/api/cohorts/${id}`);
    expect(detail.body).toMatchObject({ name: 'Autumn bench class', memberCount: 1, instructor: { displayName: 'Morag Test' } });
    const list = await instructor.get('/api/cohorts');
    expect(list.body.map((c: { id: string }) => c.id)).toEqual([id]);
  });

  it('shows a shop owner their own apprentices only', async () => {
    const mine = await createShopOwner(dataSource, 'North Bay Flow');
    const theirs = await createShopOwner(dataSource, 'South Bay Flow');
    await createUser(dataSource, { displayName: 'Mine', shopId: mine.shop.id });
    await createUser(dataSource, { displayName: 'Theirs', shopId: theirs.shop.id });
    const owner = await signedIn(t.app, mine.owner);
    const res = await owner.get('/api/shops/mine');
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ name: 'North Bay Flow', owner: { id: mine.owner.id } });
    expect(res.body.apprentices.map((a: { displayName: string }) => a.displayName)).toEqual(['Mine']);
  });

  it('lists the demo sign-ins only in demo mode', async () => {
    const demo = accountsTestApp(dataSource, { config: { demoMode: true } });
    const res = await (await import('supertest')).default(demo.app).get('/api/auth/demo-accounts');
    expect(res.status).toBe(200);
    expect(res.body).toEqual(expect.arrayContaining([expect.objectContaining({ email: 'admin@demo.flowlore.test', role: 'admin' })]));
    const off = await (await import('supertest')).default(t.app).get('/api/auth/demo-accounts');
    expect(off.status).toBe(200);
    expect(off.body).toEqual([]);
  });
});
