import type { DataSource } from 'typeorm';

import { AuditEntry } from '../admin/audit-entry.entity';
import { PasswordHasher } from '../auth/passwords';
import { Shop } from '../shops/shop.entity';
import { accountsTestApp, FAST_HASH_COST, migratedTestDataSource, signedIn, uniqueEmail } from '../testing/accounts';
import { CreateUserRefused, createVerifiedUser } from './create-user';

describe('creating an account from the command line (createVerifiedUser)', () => {
  let dataSource: DataSource;
  const hasher = new PasswordHasher(FAST_HASH_COST);
  const password = 'first admin bench passphrase';

  beforeAll(async () => {
    dataSource = await migratedTestDataSource();
  });
  afterAll(async () => {
    await dataSource.destroy();
  });

  it('creates a verified admin who signs in through the API, and audits it with no actor', async () => {
    const email = uniqueEmail('first-admin');
    const user = await createVerifiedUser({ dataSource, hasher }, { email: email.toUpperCase(), displayName: 'Fern Admin', role: 'admin', password });
    expect(user).toMatchObject({ email, role: 'admin', shopId: null });
    expect(user.verifiedAt).toBeInstanceOf(Date);

    const admin = await signedIn(accountsTestApp(dataSource).app, { email }, password);
    expect((await admin.get('/api/auth/me')).body.user).toMatchObject({ id: user.id, displayName: 'Fern Admin', role: 'admin', verified: true });
    expect((await admin.get('/api/admin/users')).status).toBe(200);

    const audit = await dataSource.getRepository(AuditEntry).findBy({ targetId: user.id });
    expect(audit).toEqual([expect.objectContaining({ actorId: null, action: 'account.created', detail: { role: 'admin', by: 'cli' } })]);
  });

  it('refuses an address that already has an account, in any letter case, and changes nothing', async () => {
    const email = uniqueEmail('taken');
    const first = await createVerifiedUser({ dataSource, hasher }, { email, displayName: 'First', role: 'instructor', password });
    await expect(createVerifiedUser({ dataSource, hasher }, { email: email.toUpperCase(), displayName: 'Second', role: 'admin', password })).rejects.toThrow(
      new CreateUserRefused(`There is already an account for ${email}; nothing was changed.`),
    );
    const [row] = await dataSource.query('SELECT role, display_name FROM user_account WHERE lower(email) = $1', [email]);
    expect(row).toEqual({ role: 'instructor', display_name: 'First' });
    expect(first.role).toBe('instructor');
  });

  it('refuses a common password and a short one, as sign-up does', async () => {
    const email = uniqueEmail('weak');
    await expect(createVerifiedUser({ dataSource, hasher }, { email, displayName: 'Weak', role: 'admin', password: 'password123' })).rejects.toThrow(/most commonly used/);
    await expect(createVerifiedUser({ dataSource, hasher }, { email, displayName: 'Weak', role: 'admin', password: 'short' })).rejects.toThrow(/at least 8 characters/);
    expect(await dataSource.query('SELECT id FROM user_account WHERE email = $1', [email])).toEqual([]);
  });

  it('gives a shop owner the named shop, and asks for one only from a shop owner', async () => {
    const email = uniqueEmail('owner');
    const owner = await createVerifiedUser({ dataSource, hasher }, { email, displayName: 'Hale Owner', role: 'shop_owner', shopName: 'Quarry Road Flow', password });
    const shop = await dataSource.getRepository(Shop).findOneByOrFail({ ownerId: owner.id });
    expect(shop.name).toBe('Quarry Road Flow');
    expect(owner.shopId).toBe(shop.id);

    const browser = await signedIn(accountsTestApp(dataSource).app, { email }, password);
    expect((await browser.get('/api/shops/mine')).body).toMatchObject({ name: 'Quarry Road Flow', owner: { id: owner.id } });

    await expect(createVerifiedUser({ dataSource, hasher }, { email: uniqueEmail('owner'), displayName: 'No Shop', role: 'shop_owner', password })).rejects.toThrow(/needs a shop/);
    await expect(
      createVerifiedUser({ dataSource, hasher }, { email: uniqueEmail('inst'), displayName: 'Inst', role: 'instructor', shopName: 'Stray Shop', password }),
    ).rejects.toThrow(/Only a shop owner/);
  });

  it('puts an apprentice in the existing shop of the name given, and refuses an unknown or ambiguous name', async () => {
    const shopName = `Join Test Flow ${uniqueEmail('x').slice(0, 12)}`;
    const owner = await createVerifiedUser({ dataSource, hasher }, { email: uniqueEmail('owner'), displayName: 'Join Owner', role: 'shop_owner', shopName, password });
    const apprentice = await createVerifiedUser({ dataSource, hasher }, { email: uniqueEmail('app'), displayName: 'Join Apprentice', role: 'apprentice', shopName, password });
    expect(apprentice.shopId).toBe(owner.shopId);
    const browser = await signedIn(accountsTestApp(dataSource).app, owner, password);
    expect((await browser.get('/api/shops/mine')).body.apprentices).toEqual([expect.objectContaining({ id: apprentice.id })]);

    const lost = uniqueEmail('lost');
    await expect(createVerifiedUser({ dataSource, hasher }, { email: lost, displayName: 'Lost', role: 'apprentice', shopName: 'No Such Shop 7', password })).rejects.toThrow(/no shop named "No Such Shop 7"/);
    expect(await dataSource.query('SELECT id FROM user_account WHERE email = $1', [lost])).toEqual([]);
    await createVerifiedUser({ dataSource, hasher }, { email: uniqueEmail('owner'), displayName: 'Twin Owner', role: 'shop_owner', shopName, password });
    await expect(createVerifiedUser({ dataSource, hasher }, { email: uniqueEmail('app'), displayName: 'Torn', role: 'apprentice', shopName, password })).rejects.toThrow(/More than one shop/);
  });
});
