import type { DataSource } from 'typeorm';

import { loadConfig } from '../config';
import { accountsTestApp, Browser, migratedTestDataSource, uniqueEmail } from '../testing/accounts';
import { PasswordHasher, passwordProblem, prehash } from './passwords';

describe('password hashing', () => {
  it('uses bcrypt at cost 12 by default', async () => {
    const hasher = new PasswordHasher(loadConfig({ DATABASE_URL: 'postgres://u:p@127.0.0.1/x' }).passwordHashCost);
    const hash = await hasher.hash('a long passphrase about orifice plates');
    expect(hash).toMatch(/^\$2[aby]\$12\$/);
    expect(await hasher.verify('a long passphrase about orifice plates', hash)).toBe(true);
    expect(await hasher.verify('a long passphrase about orifice plate', hash)).toBe(false);
  });

  it('lets every character of a long passphrase count (no silent cut at 72 bytes)', async () => {
    const hasher = new PasswordHasher(4);
    const shared = 'the discharge coefficient of a sharp-edged orifice plate is about 0.6 '.repeat(2);
    expect(Buffer.byteLength(shared)).toBeGreaterThan(72);
    const hash = await hasher.hash(`${shared}A`);
    expect(await hasher.verify(`${shared}A`, hash)).toBe(true);
    expect(await hasher.verify(`${shared}B`, hash)).toBe(false);
    expect(Buffer.byteLength(prehash(shared))).toBeLessThanOrEqual(72);
  });

  it('refuses common passwords and the account’s own address, but has no composition rules', () => {
    expect(passwordProblem('password123', { email: 'a@b.test' })).toMatch(/commonly used/);
    expect(passwordProblem('Qwertyuiop', { email: 'a@b.test' })).toMatch(/commonly used/);
    expect(passwordProblem('sunshine2024', { email: 'a@b.test' })).toMatch(/commonly used/);
    expect(passwordProblem('morag.tull@larkfield.test', { email: 'morag.tull@larkfield.test' })).toMatch(/e-mail/);
    expect(passwordProblem('all lower case words here', { email: 'a@b.test' })).toBeUndefined();
  });
});

describe('sign-up password rules over the API', () => {
  let dataSource: DataSource;
  beforeAll(async () => {
    dataSource = await migratedTestDataSource();
  });
  afterAll(async () => {
    await dataSource.destroy();
  });

  it('answers a short or common password with a 400 naming the password field', async () => {
    const t = accountsTestApp(dataSource);
    const browser = new Browser(t.app);
    for (const password of ['short', 'password1']) {
      const res = await browser.send('post', '/api/auth/sign-up', { accountType: 'apprentice', email: uniqueEmail('weak'), displayName: 'Weak', password });
      expect(res.status).toBe(400);
      expect(res.body.errors.map((e: { field: string }) => e.field)).toEqual(['password']);
    }
  });
});
