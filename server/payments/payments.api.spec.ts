import { createServer, type IncomingMessage, type Server, type ServerResponse } from 'node:http';
import type { AddressInfo } from 'node:net';

import type { Express } from 'express';
import Stripe from 'stripe';
import type { DataSource } from 'typeorm';

import type { CheckoutStart, OrderView } from '../../shared/api/payments';
import { createProviderFake, type ProviderFake, type RunningProviderFake } from '../provider-fake/provider-fake';
import { accountsTestApp, createShopOwner, migratedTestDataSource, signedIn, type Browser } from '../testing/accounts';

const SECRET_KEY = 'sk_test_flowlorePaymentsSpec';
const WEBHOOK_SECRET = 'whsec_flowlorePaymentsSpec';

/**
 * Buying seats against the running provider fake and the real SDK: the app listens on a port (the
 * fake delivers its signed events there) and calls the fake through PAYMENT_PROVIDER_URL. Seats are
 * credited only from a verified `checkout.session.completed`, once, whatever the deliveries do.
 */
describe('payments: orders, checkout and the provider’s events', () => {
  let dataSource: DataSource;
  let app: Express | undefined;
  let server: Server;
  let appUrl: string;
  let fake: ProviderFake;
  let running: RunningProviderFake;
  let t: ReturnType<typeof accountsTestApp>;
  /** Webhook answers to force before the app sees the request (a 500 to make the fake retry). */
  const forced: number[] = [];

  beforeAll(async () => {
    dataSource = await migratedTestDataSource();
    // The app's port first (the fake needs its webhook address), then the fake, then the app itself.
    server = createServer((req: IncomingMessage, res: ServerResponse) => {
      if (req.url === '/api/payments/webhook' && forced.length > 0) {
        res.statusCode = forced.shift()!;
        res.end();
        return;
      }
      if (app) app(req, res);
      else res.writeHead(503).end();
    });
    await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
    appUrl = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
    fake = createProviderFake({ secretKey: SECRET_KEY, webhook: { url: `${appUrl}/api/payments/webhook`, secret: WEBHOOK_SECRET, retryBaseMs: 50, maxAttempts: 4 }, onUnexpectedError: () => undefined });
    running = await fake.start(0);
    t = accountsTestApp(dataSource, { config: { appBaseUrl: appUrl, payments: { secretKey: SECRET_KEY, webhookSecret: WEBHOOK_SECRET, apiUrl: running.url } } });
    app = t.app;
  });

  afterAll(async () => {
    await fake.controls.idle();
    await running.stop();
    await new Promise<void>((resolve) => server.close(() => resolve()));
    await t.mailer.idle();
    await dataSource.destroy();
  });

  async function owner(): Promise<{ browser: Browser; shopId: string; email: string }> {
    const { owner: user, shop } = await createShopOwner(dataSource, `Pay Flow ${Math.random().toString(36).slice(2, 8)}`);
    return { browser: await signedIn(t.app, user), shopId: shop.id, email: user.email };
  }

  const provider = () => new Stripe(SECRET_KEY, { host: '127.0.0.1', port: running.port, protocol: 'http' });
  const purchased = async (shopId: string): Promise<number> => (await dataSource.query('SELECT purchased FROM seat_pool WHERE shop_id = $1', [shopId]))[0]?.purchased ?? 0;
  /** An order through the API; a refusal fails here with the server's problem, not later as a bad URL. */
  const buy = async (browser: Browser, quantity: number): Promise<CheckoutStart> => {
    const res = await browser.send('post', '/api/shop/orders', { quantity });
    expect({ status: res.status, body: res.status === 201 ? 'ok' : res.body }).toEqual({ status: 201, body: 'ok' });
    return res.body as CheckoutStart;
  };
  const sessionOf = (start: CheckoutStart) => new URL(start.checkoutUrl).pathname.split('/').pop()!;
  const completedEventOf = (sessionId: string) => fake.controls.events().find((e) => e.type === 'checkout.session.completed' && (e.data.object as { id: string }).id === sessionId)!;

  it('buys 5 seats: the hosted page, then the signed event credits them once and a receipt goes out', async () => {
    const { browser, shopId, email } = await owner();
    const res = await browser.send('post', '/api/shop/orders', { quantity: 5 });
    expect(res.status).toBe(201);
    const start = res.body as CheckoutStart;
    // 5 seats at the 1-seat tier of the default prices: 5 × 49.00.
    expect(start.order).toMatchObject({ quantity: 5, unitAmount: 4900, totalAmount: 24_500, currency: 'usd', status: 'pending' });
    expect(start.checkoutUrl.startsWith(running.url)).toBe(true);

    const paid = fake.controls.pay(sessionOf(start), '4242 4242 4242 4242');
    expect(paid.result).toBe('paid');
    await fake.controls.idle();
    const order = (await browser.get(`/api/shop/orders/${start.order.id}`)).body as OrderView;
    expect(order).toMatchObject({ status: 'paid', cardLast4: '4242' });
    expect(await purchased(shopId)).toBe(5);
    await t.mailer.idle();
    const receipts = await dataSource.query(`SELECT subject, text_body FROM mail_outbox WHERE to_address = $1 AND template = 'receipt'`, [email]);
    expect(receipts).toHaveLength(1);
    expect(receipts[0].text_body).toContain('Seats: 5 × $49.00');
    expect(receipts[0].text_body).toContain('Total paid: $245.00');
    expect(receipts[0].text_body).toContain('ending in 4242');
  });

  it('the same completed event delivered 10 times at once: credited once, one receipt', async () => {
    const { browser, shopId, email } = await owner();
    const start = await buy(browser, 3);
    fake.controls.pay(sessionOf(start), '4242424242424242');
    await fake.controls.idle();
    const event = completedEventOf(sessionOf(start));
    const deliveries = (await Promise.all(Array.from({ length: 10 }, () => fake.controls.redeliver(event.id)))).flat();
    expect(deliveries.every((d) => d.status === 200)).toBe(true);
    expect(await purchased(shopId)).toBe(3);
    await t.mailer.idle();
    expect(await dataSource.query(`SELECT id FROM mail_outbox WHERE to_address = $1 AND template = 'receipt'`, [email])).toHaveLength(1);
    const [log] = await dataSource.query('SELECT outcome, deliveries FROM payment_event WHERE id = $1', [event.id]);
    expect(log).toEqual({ outcome: 'applied', deliveries: 11 });
  });

  it('a bad signature or a stale timestamp is a 400 and changes nothing; an unknown event type is a 200 that changes nothing', async () => {
    const { browser, shopId } = await owner();
    const start = await buy(browser, 2);
    fake.controls.hold(); // deliver nothing yet
    fake.controls.pay(sessionOf(start), '4242424242424242');
    const event = completedEventOf(sessionOf(start));
    const forged = await fetch(`${appUrl}/api/payments/webhook`, {
      method: 'POST',
      headers: { 'Content-Type': 'application/json', 'Stripe-Signature': `t=${Math.floor(Date.now() / 1000)},v1=${'0'.repeat(64)}` },
      body: JSON.stringify(event),
    });
    expect(forged.status).toBe(400);
    expect(forged.headers.get('content-type')).toMatch(/^application\/problem\+json/);
    const stale = await fake.controls.redeliver(event.id, 1, { staleTimestamp: true });
    expect(stale.map((d) => d.status)).toContain(400);
    expect(await purchased(shopId)).toBe(0);
    expect(await dataSource.query('SELECT id FROM payment_event WHERE id = $1', [event.id])).toEqual([]);

    await fake.controls.release();
    await fake.controls.idle();
    expect(await purchased(shopId)).toBe(2);
    // A refund's events are not acted on yet (refunds of unused seats come with the admin's page): 200, nothing changes.
    const paid = await provider().checkout.sessions.retrieve(sessionOf(start));
    await provider().refunds.create({ payment_intent: paid.payment_intent as string, amount: 100 });
    await fake.controls.idle();
    const refundEvents = fake.controls.deliveries().filter((d) => d.eventType === 'refund.created' || d.eventType === 'charge.refunded');
    expect(refundEvents.map((d) => [d.eventType, d.status]).sort()).toEqual([['charge.refunded', 200], ['refund.created', 200]]);
    expect(await purchased(shopId)).toBe(2);
  });

  it('a batch delivered out of order ends in the right state: one order paid, the other expired', async () => {
    const { browser, shopId } = await owner();
    const first = await buy(browser, 2);
    const second = await buy(browser, 7);
    fake.controls.hold();
    try {
      fake.controls.pay(sessionOf(first), '4242424242424242');
      await provider().checkout.sessions.expire(sessionOf(second));
    } finally {
      await fake.controls.release('reverse');
    }
    await fake.controls.idle();
    const orders = (await browser.get('/api/shop/orders')).body as OrderView[];
    expect(Object.fromEntries(orders.map((o) => [o.quantity, o.status]))).toEqual({ 2: 'paid', 7: 'expired' });
    expect(await purchased(shopId)).toBe(2);
  });

  it('after the app answered 500, the fake retries and the retry is applied once', async () => {
    const { browser, shopId } = await owner();
    const start = await buy(browser, 4);
    forced.push(500);
    fake.controls.pay(sessionOf(start), '4242424242424242');
    await fake.controls.idle();
    const attempts = fake.controls.deliveries().filter((d) => d.eventId === completedEventOf(sessionOf(start)).id);
    expect(attempts.map((d) => d.status)).toEqual([500, 200]);
    expect(await purchased(shopId)).toBe(4);
  });

  it('a declined card credits nothing and leaves the order waiting for another try', async () => {
    const { browser, shopId } = await owner();
    const start = await buy(browser, 1);
    expect(fake.controls.pay(sessionOf(start), '4000 0000 0000 0002').result).toBe('declined');
    await fake.controls.idle();
    expect(((await browser.get(`/api/shop/orders/${start.order.id}`)).body as OrderView).status).toBe('pending');
    expect(await purchased(shopId)).toBe(0);
  });

  it('with the provider down, "buy" says so clearly and leaves no order pending', async () => {
    const { browser } = await owner();
    fake.controls.goDown();
    try {
      const res = await browser.send('post', '/api/shop/orders', { quantity: 2 });
      expect(res.status).toBe(503);
      expect(res.body.detail).toBe('The payment provider could not be reached, so nothing was charged. Try again in a few minutes.');
    } finally {
      fake.controls.comeBack();
    }
    const orders = (await browser.get('/api/shop/orders')).body as OrderView[];
    expect(orders.map((o) => o.status)).toEqual(['failed']);
    expect((await browser.send('post', '/api/shop/orders', { quantity: 0 })).status).toBe(400);
    expect((await browser.send('post', '/api/shop/orders', { quantity: 501 })).status).toBe(400);
  }, 30_000);
});
