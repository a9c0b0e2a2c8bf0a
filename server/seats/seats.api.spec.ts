import type { DataSource } from 'typeorm';

import type { InviteResult, ShopSeats } from '../../shared/api/seats';
import type { User } from '../accounts/user.entity';
import { tokenHash } from '../auth/account-tokens';
import { accountsTestApp, createShopOwner, createUser, migratedTestDataSource, signedIn, uniqueEmail, type AccountsTestApp, type Browser } from '../testing/accounts';

/**
 * A shop owner's seats against real PostgreSQL: invitations hold seats (resend, revoke, expiry),
 * the invited apprentice accepts through the link's token, the owner assigns and releases, and the
 * database's balance decides under concurrency (50 assignments against 10 paid seats).
 */
describe('seats API', () => {
  let dataSource: DataSource;
  let clock: Date;
  let t: AccountsTestApp;

  beforeAll(async () => {
    dataSource = await migratedTestDataSource();
    clock = new Date();
    t = accountsTestApp(dataSource, { now: () => clock });
  });

  afterAll(async () => {
    await t.mailer.idle();
    await dataSource.destroy();
  });

  /** A shop whose pool has `paid` seats purchased (as a paid order's event would credit them). */
  async function shopWithSeats(paid: number): Promise<{ owner: User; browser: Browser; shopId: string }> {
    const { owner, shop } = await createShopOwner(dataSource, `Seats Flow ${Math.random().toString(36).slice(2, 8)}`);
    await dataSource.query('INSERT INTO seat_pool (shop_id, purchased) VALUES ($1, $2)', [shop.id, paid]);
    return { owner, browser: await signedIn(t.app, owner), shopId: shop.id };
  }

  /** A known token for the address's open invitation (the outbox keeps links redacted; the e2e test reads the real one from the mail catcher). */
  async function tokenFor(email: string): Promise<string> {
    await t.mailer.idle();
    const token = `test-token-${Math.random().toString(36).slice(2)}-${Date.now()}`;
    await dataSource.query(`UPDATE seat_invitation SET token_hash = $2 WHERE email = $1 AND accepted_at IS NULL AND revoked_at IS NULL`, [email, tokenHash(token)]);
    return token;
  }

  it('invites addresses while seats are free, e-mails each a link, and skips the rest with the reason', async () => {
    const { browser } = await shopWithSeats(2);
    const [a, b, c] = [uniqueEmail('inv'), uniqueEmail('inv'), uniqueEmail('inv')];
    const res = await browser.send('post', '/api/shop/invitations', { emails: [a, b, a, c] });
    expect(res.status).toBe(201);
    const result = res.body as InviteResult;
    expect(result.invited.map((i) => i.email)).toEqual([a, b]);
    expect(result.skipped).toEqual([
      { email: a, reason: 'Listed twice.' },
      { email: c, reason: 'No free seat left: buy more seats or release one.' },
    ]);
    expect(result.available).toBe(0);
    const seats = (await browser.get('/api/shop/seats')).body as ShopSeats;
    expect(seats).toMatchObject({ purchased: 2, refunded: 0, inUse: 2, available: 0 });
    expect(seats.seats.map((s) => [s.state, s.invitation?.email])).toEqual(expect.arrayContaining([['invited', a], ['invited', b]]));

    await t.mailer.idle();
    const mails = await dataSource.query(`SELECT to_address, subject, text_body FROM mail_outbox WHERE to_address = ANY($1) ORDER BY to_address`, [[a, b]]);
    expect(mails).toHaveLength(2);
    expect(mails[0].subject).toMatch(/invites you to Seats Flow/);
    expect(mails[0].text_body).toContain('valid for 14 days');
    expect(mails[0].text_body).toContain('[link removed]'); // the token never lands in the outbox

    // Bad input: a problem naming the field.
    const bad = await browser.send('post', '/api/shop/invitations', { emails: ['not an address'] });
    expect(bad.status).toBe(400);
    expect(bad.headers['content-type']).toMatch(/^application\/problem\+json/);
    expect((await browser.send('post', '/api/shop/invitations', { emails: Array.from({ length: 51 }, (_, i) => `x${i}@example.test`) })).status).toBe(400);
  });

  it('revoking an invitation gives its seat back; resending makes a new link; the seat expires after 14 days', async () => {
    const { browser } = await shopWithSeats(1);
    const email = uniqueEmail('rev');
    const { invited } = (await browser.send('post', '/api/shop/invitations', { emails: [email] })).body as InviteResult;
    expect((await browser.send('post', `/api/shop/invitations/${invited[0]!.invitationId}/resend`)).status).toBe(204);
    const [{ send_count }] = await dataSource.query('SELECT send_count FROM seat_invitation WHERE id = $1', [invited[0]!.invitationId]);
    expect(send_count).toBe(2);
    expect((await browser.send('delete', `/api/shop/invitations/${invited[0]!.invitationId}`)).status).toBe(204);
    expect(((await browser.get('/api/shop/seats')).body as ShopSeats).available).toBe(1);
    expect((await browser.send('delete', `/api/shop/invitations/${invited[0]!.invitationId}`)).status).toBe(409);

    const later = uniqueEmail('exp');
    await browser.send('post', '/api/shop/invitations', { emails: [later] });
    expect(((await browser.get('/api/shop/seats')).body as ShopSeats).available).toBe(0);
    const [{ expires_at }] = await dataSource.query('SELECT expires_at FROM seat_invitation WHERE email = $1', [later]);
    expect(new Date(expires_at).getTime() - clock.getTime()).toBe(14 * 24 * 3600_000);
    // Fourteen days on (the invitation's end moved back rather than the clock on, which would end the session too).
    await dataSource.query(`UPDATE seat_invitation SET expires_at = $2 WHERE email = $1`, [later, new Date(clock.getTime() - 60_000)]);
    expect(((await browser.get('/api/shop/seats')).body as ShopSeats).available).toBe(1);
  });

  it('the invited apprentice accepts once with the link: seated, in the shop; others and reuse are refused', async () => {
    const { browser: owner, shopId } = await shopWithSeats(1);
    const email = uniqueEmail('acc');
    await owner.send('post', '/api/shop/invitations', { emails: [email] });
    const token = await tokenFor(email);

    const stranger = await signedIn(t.app, await createUser(dataSource));
    const wrong = await stranger.send('post', '/api/invitations/accept', { token });
    expect(wrong.status).toBe(403);
    expect(wrong.body.detail).toContain(email);
    const unverified = await createUser(dataSource, { email: uniqueEmail('unv'), verified: false });
    expect((await (await signedIn(t.app, unverified)).send('post', '/api/invitations/accept', { token })).status).toBe(403);

    const invitee = await createUser(dataSource, { email });
    const browser = await signedIn(t.app, invitee);
    const res = await browser.send('post', '/api/invitations/accept', { token });
    expect(res.status).toBe(200);
    expect(res.body.shop.id).toBe(shopId);
    const [row] = await dataSource.query('SELECT shop_id FROM user_account WHERE id = $1', [invitee.id]);
    expect(row.shop_id).toBe(shopId);
    const seats = (await owner.get('/api/shop/seats')).body as ShopSeats;
    expect(seats.seats).toEqual([expect.objectContaining({ state: 'assigned', holder: expect.objectContaining({ id: invitee.id }), progress: expect.any(Object) })]);
    expect((await browser.send('post', '/api/invitations/accept', { token })).status).toBe(409);
    expect((await browser.send('post', '/api/invitations/accept', { token: 'x'.repeat(40) })).status).toBe(404);

    // Released: the seat comes back; the apprentice stays in the shop's records with their history.
    expect((await owner.send('post', `/api/shop/seats/${seats.seats[0]!.seatId}/release`)).status).toBe(204);
    expect(((await owner.get('/api/shop/seats')).body as ShopSeats)).toMatchObject({ inUse: 0, available: 1, seats: [] });
  });

  it('50 concurrent assignments against 10 paid seats: exactly 10 seated, 40 clear refusals, the balance holds', async () => {
    const { browser, shopId } = await shopWithSeats(10);
    const apprentices = await Promise.all(Array.from({ length: 50 }, () => createUser(dataSource, { shopId })));
    await browser.fetchCsrf();
    const results = await Promise.all(apprentices.map((a) => browser.send('post', '/api/shop/seats/assign', { userId: a.id })));
    expect(results.filter((r) => r.status === 201)).toHaveLength(10);
    const refused = results.filter((r) => r.status === 409);
    expect(refused).toHaveLength(40);
    for (const r of refused) expect(r.body.detail).toBe('No free seat left: buy more seats or release one.');
    const [pool] = await dataSource.query('SELECT purchased, in_use FROM seat_pool WHERE shop_id = $1', [shopId]);
    expect(pool).toEqual({ purchased: 10, in_use: 10 });
    // Someone else's apprentice cannot be given a seat here.
    const outsider = await createUser(dataSource);
    expect((await browser.send('post', '/api/shop/seats/assign', { userId: outsider.id })).status).toBe(404);
  }, 30_000);
});
