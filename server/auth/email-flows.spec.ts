import type { DataSource } from 'typeorm';

import { User } from '../accounts/user.entity';
import { Mailer, smtpTransport } from '../mail/mailer';
import { verifyEmailMail } from '../mail/templates/verify-email';
import { accountsTestApp, Browser, createUser, migratedTestDataSource, signedIn, uniqueEmail, type AccountsTestApp } from '../testing/accounts';
import { silentLogger } from '../testing/database';
import { describeWithMailCatcher, mailTo, tokenIn, waitForMail } from '../testing/mail-catcher';

describeWithMailCatcher('e-mail flows, read back from the mail catcher', () => {
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

  it('signs up an apprentice, sends the verification link, and lets it be used once', async () => {
    const email = uniqueEmail('new-apprentice');
    const browser = new Browser(t.app);
    const res = await browser.send('post', '/api/auth/sign-up', { accountType: 'apprentice', email, displayName: 'Rowan <b>Test</b>', password: 'a long enough passphrase' });
    expect(res.status).toBe(202);
    const [mail] = await waitForMail(email);
    expect(mail!.subject).toMatch(/Confirm your e-mail/);
    expect(mail!.html).toContain('Rowan &lt;b&gt;Test&lt;/b&gt;');
    const token = tokenIn(mail!);
    expect((await browser.send('post', '/api/auth/verify', { token })).status).toBe(204);
    expect((await dataSource.getRepository(User).findOneByOrFail({ email })).verifiedAt).not.toBeNull();
    const again = await browser.send('post', '/api/auth/verify', { token });
    expect(again.status).toBe(400);
    expect(again.headers['content-type']).toMatch(/^application\/problem\+json/);
    // The outbox keeps the message, with the secret link removed.
    const [outbox] = await dataSource.query(`SELECT status, text_body FROM mail_outbox WHERE to_address = $1`, [email]);
    expect(outbox.status).toBe('sent');
    expect(outbox.text_body).toContain('[link removed]');
    expect(outbox.text_body).not.toContain(token);
  });

  it('signs up a shop owner with a shop of their own', async () => {
    const email = uniqueEmail('new-owner');
    const browser = new Browser(t.app);
    const res = await browser.send('post', '/api/auth/sign-up', { accountType: 'shop_owner', email, displayName: 'Ada Owner', password: 'another long passphrase', shopName: 'Quarry Lane Flow' });
    expect(res.status).toBe(202);
    const owner = await dataSource.getRepository(User).findOneByOrFail({ email });
    expect(owner.role).toBe('shop_owner');
    const [shop] = await dataSource.query('SELECT name, owner_id FROM shop WHERE id = $1', [owner.shopId]);
    expect(shop).toEqual({ name: 'Quarry Lane Flow', owner_id: owner.id });
    await waitForMail(email);
  });

  it('answers a sign-up with a registered address exactly as a new one, and tells the owner of that address', async () => {
    const user = await createUser(dataSource, { email: uniqueEmail('Existing.Person') });
    const browser = new Browser(t.app);
    const fresh = await browser.send('post', '/api/auth/sign-up', { accountType: 'apprentice', email: uniqueEmail('someone-new'), displayName: 'New', password: 'a long enough passphrase' });
    const taken = await browser.send('post', '/api/auth/sign-up', { accountType: 'apprentice', email: user.email.toUpperCase(), displayName: 'Intruder', password: 'a long enough passphrase' });
    expect(taken.status).toBe(fresh.status);
    expect(taken.body).toEqual(fresh.body);
    const [mail] = await waitForMail(user.email);
    expect(mail!.subject).toMatch(/tried to sign up/);
    expect(await dataSource.getRepository(User).countBy({ email: user.email })).toBe(1);
  });

  it('resets a password by a one-hour, single-use link, and answers 202 for unknown addresses too', async () => {
    const user = await createUser(dataSource);
    const browser = new Browser(t.app);
    const unknown = uniqueEmail('nobody');
    const forUnknown = await browser.send('post', '/api/auth/forgot-password', { email: unknown });
    const forKnown = await browser.send('post', '/api/auth/forgot-password', { email: user.email });
    expect(forUnknown.status).toBe(202);
    expect(forKnown.status).toBe(202);
    expect(forUnknown.body).toEqual(forKnown.body);
    const [mail] = await waitForMail(user.email);
    const token = tokenIn(mail!);
    const [row] = await dataSource.query(`SELECT extract(epoch FROM expires_at - created_at)::float AS lifetime, token_hash FROM account_token WHERE user_id = $1 AND purpose = 'reset-password'`, [user.id]);
    expect(Math.abs(row.lifetime - 3600)).toBeLessThan(5);
    expect(row.token_hash).not.toBe(token);

    const newPassword = 'fresh passphrase for the flow bench';
    expect((await browser.send('post', '/api/auth/reset-password', { token, password: newPassword })).status).toBe(204);
    expect((await browser.send('post', '/api/auth/reset-password', { token, password: 'yet another passphrase' })).status).toBe(400);
    expect((await new Browser(t.app).signIn(user.email, newPassword)).status).toBe(200);
    await waitForMail(user.email, 2); // "your password was changed"
    await t.mailer.idle();
    expect(await mailTo(unknown)).toEqual([]);
  });

  it('refuses an expired reset link', async () => {
    const user = await createUser(dataSource);
    const browser = new Browser(t.app);
    await browser.send('post', '/api/auth/forgot-password', { email: user.email });
    const token = tokenIn((await waitForMail(user.email))[0]!);
    await dataSource.query(`UPDATE account_token SET expires_at = now() - interval '1 second' WHERE user_id = $1`, [user.id]);
    expect((await browser.send('post', '/api/auth/reset-password', { token, password: 'fresh passphrase for the bench' })).status).toBe(400);
  });

  it('refuses an expired verification link', async () => {
    const email = uniqueEmail('late-verifier');
    const browser = new Browser(t.app);
    await browser.send('post', '/api/auth/sign-up', { accountType: 'apprentice', email, displayName: 'Late', password: 'a long enough passphrase' });
    const token = tokenIn((await waitForMail(email))[0]!);
    await dataSource.query(`UPDATE account_token SET expires_at = now() - interval '1 second' WHERE token_hash = encode(sha256($1::bytea), 'hex')`, [token]);
    expect((await browser.send('post', '/api/auth/verify', { token })).status).toBe(400);
  });

  it('records a message that could not be sent as failed, keeping it in the outbox', async () => {
    const user = await createUser(dataSource);
    const broken = new Mailer(smtpTransport({ ...t.config.mail, host: '127.0.0.1', port: 9 }), t.config.mail.from, dataSource, silentLogger);
    const status = await broken.send({ to: user.email, userId: user.id }, verifyEmailMail({ displayName: 'X', link: 'http://127.0.0.1/x' }));
    expect(status).toBe('failed');
    const [row] = await dataSource.query(`SELECT status, error, sent_at FROM mail_outbox WHERE user_id = $1`, [user.id]);
    expect(row.status).toBe('failed');
    expect(row.error).toBeTruthy();
    expect(row.sent_at).toBeNull();
  });

  it('shows admins the outbox without secret links', async () => {
    const admin = await createUser(dataSource, { role: 'admin' });
    const browser = await signedIn(t.app, admin);
    const res = await browser.get('/api/admin/outbox?pageSize=100');
    expect(res.status).toBe(200);
    expect(res.body.items.length).toBeGreaterThan(0);
    for (const item of res.body.items) expect(item.text).not.toMatch(/token=[A-Za-z0-9_-]{20,}/);
  });
});
