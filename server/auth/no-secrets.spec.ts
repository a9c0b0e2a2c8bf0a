import { Writable } from 'node:stream';

import pino from 'pino';
import type request from 'supertest';
import type { DataSource } from 'typeorm';

import { accountsTestApp, Browser, createUser, migratedTestDataSource, signedIn, TEST_PASSWORD, uniqueEmail } from '../testing/accounts';
import { describeWithMailCatcher, tokenIn, waitForMail } from '../testing/mail-catcher';

describeWithMailCatcher('no password, hash or token in any response or log line', () => {
  let dataSource: DataSource;
  const logLines: string[] = [];
  const logger = pino(
    { level: 'trace' },
    new Writable({
      write(chunk, _enc, done) {
        logLines.push(String(chunk));
        done();
      },
    }),
  );

  beforeAll(async () => {
    dataSource = await migratedTestDataSource();
  });
  afterAll(async () => {
    await dataSource.destroy();
  });

  it('walks every account flow and finds none of them in what it sees', async () => {
    const t = accountsTestApp(dataSource, { logger });
    const responses: request.Response[] = [];
    const keep = (res: request.Response) => (responses.push(res), res);
    const email = uniqueEmail('secret-keeper');
    const password = 'correct horse battery staple on the flow bench';
    const newPassword = 'a second passphrase nobody should ever see';
    const browser = new Browser(t.app);

    keep(await browser.send('post', '/api/auth/sign-up', { accountType: 'apprentice', email, displayName: 'Secret Keeper', password }));
    const verifyToken = tokenIn((await waitForMail(email))[0]!);
    keep(await browser.send('post', '/api/auth/verify', { token: verifyToken }));
    keep(await browser.signIn(email, 'a wrong password attempt'));
    keep(await browser.signIn(email, password));
    keep(await browser.get('/api/auth/me'));
    keep(await browser.send('patch', '/api/account/profile', { displayName: 'Still Secret' }));
    keep(await browser.send('post', '/api/auth/change-password', { currentPassword: password, newPassword }));
    keep(await browser.send('post', '/api/auth/forgot-password', { email }));
    const resetToken = tokenIn((await waitForMail(email, 3)).find((m) => /new Flowlore password/.test(m.subject))!);
    keep(await browser.send('post', '/api/auth/reset-password', { token: resetToken, password: `${newPassword}!` }));
    keep(await browser.send('post', '/api/auth/reset-password', { token: resetToken, password: `${newPassword}?` }));

    const admin = await signedIn(t.app, await createUser(dataSource, { role: 'admin' }));
    keep(await admin.get(`/api/admin/users?q=${encodeURIComponent(email)}`));
    keep(await admin.get('/api/admin/outbox?pageSize=100'));
    keep(await admin.get('/api/admin/audit'));
    await t.mailer.idle();

    const [row] = await dataSource.query('SELECT id, password_hash FROM user_account WHERE email = $1', [email]);
    const everything = [...responses.map((r) => `${JSON.stringify(r.headers)}\n${r.text}`), ...logLines].join('\n');
    expect(responses.find((r) => r.status >= 500)).toBeUndefined();
    expect(logLines.length).toBeGreaterThan(10);
    for (const secret of [password, newPassword, row.password_hash, verifyToken, resetToken, TEST_PASSWORD]) {
      expect(everything.includes(secret)).toBe(false);
    }
    expect(everything).not.toMatch(/\$2[aby]\$\d\d\$/);
  });
});
