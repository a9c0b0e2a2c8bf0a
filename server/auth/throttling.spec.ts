import type { DataSource } from 'typeorm';

import { accountsTestApp, Browser, createUser, migratedTestDataSource, TEST_PASSWORD } from '../testing/accounts';
import { delayAfterFailures } from './sign-in-delay';

describe('sign-in throttling', () => {
  let dataSource: DataSource;

  beforeAll(async () => {
    dataSource = await migratedTestDataSource();
  });
  afterAll(async () => {
    await dataSource.destroy();
  });

  it('limits sign-in attempts per address with a 429 problem and Retry-After', async () => {
    const t = accountsTestApp(dataSource, { rateLimits: { signIn: { limit: 3, windowMs: 60_000 } } });
    const browser = new Browser(t.app);
    const statuses: number[] = [];
    for (let i = 0; i < 4; i++) statuses.push((await browser.signIn(`nobody-${i}@test.flowlore.test`, 'wrong password here')).status);
    expect(statuses).toEqual([401, 401, 401, 429]);
    const refused = await browser.signIn('nobody@test.flowlore.test', 'wrong password here');
    expect(refused.status).toBe(429);
    expect(refused.headers['content-type']).toMatch(/^application\/problem\+json/);
    expect(Number(refused.headers['retry-after'])).toBeGreaterThan(0);
  });

  it('limits password-reset requests too', async () => {
    const t = accountsTestApp(dataSource, { rateLimits: { passwordReset: { limit: 2, windowMs: 60_000 } } });
    const browser = new Browser(t.app);
    const statuses: number[] = [];
    for (let i = 0; i < 3; i++) statuses.push((await browser.send('post', '/api/auth/forgot-password', { email: `nobody-${i}@test.flowlore.test` })).status);
    expect(statuses).toEqual([202, 202, 429]);
    await t.mailer.idle();
  });

  it('makes an account wait longer after each failure beyond the third, even with the right password', async () => {
    let clock = Date.now();
    const t = accountsTestApp(dataSource, { now: () => new Date(clock) });
    const user = await createUser(dataSource);
    const browser = new Browser(t.app);
    for (let i = 0; i < 3; i++) expect((await browser.signIn(user.email, 'not my password')).status).toBe(401);
    // The third failure starts a 1-second delay: the right password is refused until it has passed.
    const waiting = await browser.signIn(user.email, TEST_PASSWORD);
    expect(waiting.status).toBe(429);
    expect(waiting.headers['retry-after']).toBe('1');
    clock += 1500;
    expect((await browser.signIn(user.email, 'not my password')).status).toBe(401);
    const longer = await browser.signIn(user.email, TEST_PASSWORD);
    expect(longer.status).toBe(429);
    expect(longer.headers['retry-after']).toBe('2');
    clock += 2500;
    expect((await browser.signIn(user.email, TEST_PASSWORD)).status).toBe(200);
    const [row] = await dataSource.query('SELECT failed_sign_ins FROM user_account WHERE id = $1', [user.id]);
    expect(row.failed_sign_ins).toBe(0);
  });

  it('grows the delay 1, 2, 4 … seconds and caps it at 15 minutes', () => {
    expect([0, 1, 2, 3, 4, 5, 6].map(delayAfterFailures)).toEqual([0, 0, 0, 1, 2, 4, 8]);
    expect(delayAfterFailures(40)).toBe(900);
  });
});
