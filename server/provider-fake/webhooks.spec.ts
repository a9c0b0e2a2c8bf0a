import { createServer, type Server } from 'node:http';
import type { AddressInfo } from 'node:net';

import Stripe from 'stripe';
import request from 'supertest';

import { createProviderFake, type ProviderFake } from './provider-fake';

/*
 * Signed webhook delivery, checked by a tiny receiver with the SDK's own verifier
 * (stripe.webhooks.constructEvent, default tolerance 300 s: stripe 23.1.0 cjs/Webhooks.js).
 * The signature scheme follows the provider's webhook docs (t=…,v1=HMAC-SHA256 of "t.body").
 */

const SECRET_KEY = 'sk_test_flowlore_webhooks_0123456789';
const WEBHOOK_SECRET = 'whsec_flowlore_test_secret_0123456789';
const RETRY_BASE_MS = 40;

interface Received {
  readonly body: string;
  readonly signature: string;
  readonly atMs: number;
}

let receiver: Server;
let received: Received[] = [];
/** Statuses the receiver answers with, one per request; 200 once they run out. */
let answers: number[] = [];
let fake: ProviderFake;
const verifier = new Stripe(SECRET_KEY);

beforeAll(async () => {
  receiver = createServer((req, res) => {
    const chunks: Buffer[] = [];
    req.on('data', (chunk: Buffer) => chunks.push(chunk));
    req.on('end', () => {
      received.push({ body: Buffer.concat(chunks).toString('utf8'), signature: String(req.headers['stripe-signature']), atMs: Date.now() });
      res.writeHead(answers.shift() ?? 200).end();
    });
  });
  await new Promise<void>((resolve) => receiver.listen(0, '127.0.0.1', resolve));
  const { port } = receiver.address() as AddressInfo;
  fake = createProviderFake({
    secretKey: SECRET_KEY,
    webhook: { url: `http://127.0.0.1:${port}/api/payments/webhook`, secret: WEBHOOK_SECRET, retryBaseMs: RETRY_BASE_MS, maxAttempts: 4 },
  });
});

beforeEach(async () => {
  await fake.controls.idle();
  received = [];
  answers = [];
});

afterAll(async () => {
  await fake.webhooks.stop();
  await new Promise((resolve) => receiver.close(resolve));
});

/** A new open session (through the API, as the app makes them). */
async function newSession(): Promise<string> {
  const response = await request(fake.app)
    .post('/v1/checkout/sessions')
    .set('Authorization', `Bearer ${SECRET_KEY}`)
    .type('form')
    .send(
      'mode=payment&success_url=http://127.0.0.1:4000/thanks&line_items[0][quantity]=1' +
        '&line_items[0][price_data][currency]=usd&line_items[0][price_data][unit_amount]=2500&line_items[0][price_data][product_data][name]=Seat',
    )
    .expect(200);
  return response.body.id as string;
}

async function paidSessionEvent(): Promise<string> {
  const sessionId = await newSession();
  fake.controls.pay(sessionId, '4242424242424242');
  const event = fake.controls.events().find((each) => each.type === 'checkout.session.completed' && each.data.object.id === sessionId);
  return event?.id as string;
}

function verified(delivery: Received): Stripe.Event {
  return verifier.webhooks.constructEvent(delivery.body, delivery.signature, WEBHOOK_SECRET);
}

describe('webhook delivery', () => {
  it('signs each event so the SDK verifies it, and a wrong secret does not', async () => {
    const eventId = await paidSessionEvent();
    await fake.controls.idle();
    expect(received).toHaveLength(1);
    const [delivery] = received as [Received];
    expect(delivery.signature).toMatch(/^t=\d+,v1=[0-9a-f]{64}$/);
    const event = verified(delivery);
    expect(event).toMatchObject({ id: eventId, object: 'event', type: 'checkout.session.completed', livemode: false });
    expect(event.data.object).toMatchObject({ object: 'checkout.session', status: 'complete', payment_status: 'paid' });
    expect(() => verifier.webhooks.constructEvent(delivery.body, delivery.signature, 'whsec_other')).toThrow(Stripe.errors.StripeSignatureVerificationError);
  });

  it('sends payment_intent.payment_failed for a declined card', async () => {
    fake.controls.pay(await newSession(), '4000 0000 0000 0002');
    await fake.controls.idle();
    const event = verified(received[0] as Received);
    expect(event.type).toBe('payment_intent.payment_failed');
    expect(event.data.object).toMatchObject({ object: 'payment_intent', last_payment_error: { code: 'card_declined', decline_code: 'generic_decline' } });
  });

  it('retries after a 500 with backoff, delivering the same event again', async () => {
    answers = [500, 503];
    const eventId = await paidSessionEvent();
    await fake.controls.idle();
    expect(received.map((delivery) => verified(delivery).id)).toEqual([eventId, eventId, eventId]);
    // Waits of 1×, then 2× the base between tries (less a few ms of timer slack)
    expect((received[1] as Received).atMs - (received[0] as Received).atMs).toBeGreaterThanOrEqual(RETRY_BASE_MS - 5);
    expect((received[2] as Received).atMs - (received[1] as Received).atMs).toBeGreaterThanOrEqual(2 * RETRY_BASE_MS - 5);
    const log = fake.controls.deliveries().filter((delivery) => delivery.eventId === eventId);
    expect(log.map((delivery) => [delivery.attempt, delivery.status, delivery.ok])).toEqual([
      [1, 500, false],
      [2, 503, false],
      [3, 200, true],
    ]);
    expect(fake.state.events.get(eventId)?.pending_webhooks).toBe(0);
  });

  it('gives up after the last attempt', async () => {
    answers = [500, 500, 500, 500];
    const eventId = await paidSessionEvent();
    await fake.controls.idle();
    expect(received).toHaveLength(4);
    expect(fake.state.events.get(eventId)?.pending_webhooks).toBe(1);
  });
});

describe('webhook test controls', () => {
  it('delivers an event twice more on request', async () => {
    const eventId = await paidSessionEvent();
    await fake.controls.idle();
    await fake.controls.redeliver(eventId, 2);
    expect(received.map((delivery) => verified(delivery).id)).toEqual([eventId, eventId, eventId]);
  });

  it('redelivers over HTTP with ?times=2', async () => {
    const eventId = await paidSessionEvent();
    await fake.controls.idle();
    const response = await request(fake.app).post(`/_test/events/${eventId}/redeliver?times=2`).expect(200);
    expect(response.body.deliveries).toHaveLength(2);
    expect(received).toHaveLength(3);
  });

  it('delivers a batch in the order given, not the order the events happened', async () => {
    const first = await paidSessionEvent();
    const second = await paidSessionEvent();
    const third = await paidSessionEvent();
    await fake.controls.idle();
    received = [];
    await request(fake.app).post('/_test/events/redeliver-batch').send({ ids: [third, first, second] }).expect(200);
    expect(received.map((delivery) => verified(delivery).id)).toEqual([third, first, second]);
  });

  it('holds new events and releases them in reverse', async () => {
    fake.controls.hold();
    const first = await paidSessionEvent();
    const second = await paidSessionEvent();
    await new Promise((resolve) => setTimeout(resolve, 20));
    expect(received).toHaveLength(0);
    await fake.controls.release('reverse');
    expect(received.map((delivery) => verified(delivery).id)).toEqual([second, first]);
  });

  it('signs with a stale timestamp on request, which the SDK refuses', async () => {
    fake.controls.staleNext();
    const eventId = await paidSessionEvent();
    await fake.controls.idle();
    const [stale] = received as [Received];
    expect(() => verified(stale)).toThrow(/Timestamp outside the tolerance zone/);
    // The signature itself is right: with the age check off (tolerance 0) it verifies.
    expect(verifier.webhooks.constructEvent(stale.body, stale.signature, WEBHOOK_SECRET, 0).id).toBe(eventId);

    received = [];
    await fake.controls.redeliver(eventId, 1, { staleTimestamp: true });
    expect(() => verified(received[0] as Received)).toThrow(Stripe.errors.StripeSignatureVerificationError);
  });

  it('delays the next delivery', async () => {
    const delayMs = 250;
    fake.controls.delayNext(delayMs);
    const startedMs = Date.now();
    await paidSessionEvent();
    await new Promise((resolve) => setTimeout(resolve, 100));
    expect(received).toHaveLength(0);
    await fake.controls.idle();
    expect(received).toHaveLength(1);
    expect((received[0] as Received).atMs - startedMs).toBeGreaterThanOrEqual(delayMs - 5);
  });

  it('lists events and deliveries over HTTP, from loopback', async () => {
    const eventId = await paidSessionEvent();
    await fake.controls.idle();
    const response = await request(fake.app).get('/_test/events').expect(200);
    expect(response.body.events.map((event: { id: string }) => event.id)).toContain(eventId);
    expect(response.body.deliveries.some((delivery: { eventId: string; ok: boolean }) => delivery.eventId === eventId && delivery.ok)).toBe(true);
  });
});
