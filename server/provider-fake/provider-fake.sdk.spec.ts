import Stripe from 'stripe';

import { createProviderFake, type ProviderFake, type RunningProviderFake } from './provider-fake';

/*
 * The real SDK (stripe 23.1.0) against the fake, for every call Flowlore makes. Behaviour mirrored:
 * the provider's public API reference (Checkout Sessions, Refunds, Events, Errors, Idempotent
 * requests), from memory where not looked up; which error class the SDK raises for which status and
 * type is read from the SDK itself (cjs/Error.js generateV1Error).
 */

const SECRET_KEY = 'sk_test_flowlore_fake_0123456789abcdef';
const ORIGIN = 'http://127.0.0.1:4000';

let fake: ProviderFake;
let running: RunningProviderFake;
let stripe: Stripe;

beforeAll(async () => {
  fake = createProviderFake({ secretKey: SECRET_KEY });
  running = await fake.start(0);
  // No retries: each test sees the fake's first answer (the retry path is tested on its own below).
  stripe = new Stripe(SECRET_KEY, { host: '127.0.0.1', port: running.port, protocol: 'http', maxNetworkRetries: 0 });
});

afterAll(() => running.stop());

function sessionParams(overrides: Partial<Stripe.Checkout.SessionCreateParams> = {}): Stripe.Checkout.SessionCreateParams {
  return {
    mode: 'payment',
    line_items: [
      { price_data: { currency: 'usd', unit_amount: 2500, product_data: { name: 'Course seat, Larkfield Flow Lab' } }, quantity: 3 },
      { price_data: { currency: 'usd', unit_amount: 900, product_data: { name: 'Printed workbook' } }, quantity: 1 },
    ],
    success_url: `${ORIGIN}/seats/thanks?session_id={CHECKOUT_SESSION_ID}`,
    cancel_url: `${ORIGIN}/seats`,
    client_reference_id: 'order-42',
    metadata: { order: '42', shop: 'larkfield' },
    customer_email: 'owner@larkfield.example',
    ...overrides,
  };
}

async function paidSession(): Promise<Stripe.Checkout.Session> {
  const session = await stripe.checkout.sessions.create(sessionParams());
  expect(fake.controls.pay(session.id, '4242 4242 4242 4242').result).toBe('paid');
  return session;
}

describe('Checkout Sessions through the SDK', () => {
  it('creates an open session with every parameter the app sends', async () => {
    const expiresAt = Math.floor(Date.now() / 1000) + 2 * 3600;
    const session = await stripe.checkout.sessions.create(sessionParams({ expires_at: expiresAt }));
    expect(session).toMatchObject({
      object: 'checkout.session',
      mode: 'payment',
      status: 'open',
      payment_status: 'unpaid',
      // 3 × 25.00 + 9.00, in cents
      amount_total: 8400,
      amount_subtotal: 8400,
      currency: 'usd',
      client_reference_id: 'order-42',
      metadata: { order: '42', shop: 'larkfield' },
      customer_email: 'owner@larkfield.example',
      expires_at: expiresAt,
      payment_intent: null,
      livemode: false,
      success_url: `${ORIGIN}/seats/thanks?session_id={CHECKOUT_SESSION_ID}`,
      cancel_url: `${ORIGIN}/seats`,
    });
    expect(session.id).toMatch(/^cs_test_[A-Za-z0-9]+$/);
    expect(session.url).toBe(`${running.url}/pay/${session.id}`);
  });

  it('replays the first answer for a repeated Idempotency-Key and refuses the key with other parameters', async () => {
    const idempotencyKey = `order-43-${Date.now()}`;
    const first = await stripe.checkout.sessions.create(sessionParams({ client_reference_id: 'order-43' }), { idempotencyKey });
    const again = await stripe.checkout.sessions.create(sessionParams({ client_reference_id: 'order-43' }), { idempotencyKey });
    expect(again.id).toBe(first.id);
    expect(again.lastResponse.headers['idempotent-replayed']).toBe('true');

    const reused = stripe.checkout.sessions.create(sessionParams({ client_reference_id: 'order-44' }), { idempotencyKey });
    await expect(reused).rejects.toBeInstanceOf(Stripe.errors.StripeIdempotencyError);
  });

  it('refuses a wrong key with a 401 that masks the key', async () => {
    const wrongKey = 'sk_test_wrong_key_abcdefghijklmnop1234';
    const intruder = new Stripe(wrongKey, { host: '127.0.0.1', port: running.port, protocol: 'http', maxNetworkRetries: 0 });
    const error = await intruder.checkout.sessions.create(sessionParams()).catch((caught: unknown) => caught);
    expect(error).toBeInstanceOf(Stripe.errors.StripeAuthenticationError);
    const { message, statusCode } = error as Stripe.errors.StripeAuthenticationError;
    expect(statusCode).toBe(401);
    expect(message).toMatch(/^Invalid API Key provided: sk_test_\*+1234$/);
    expect(message).not.toContain('wrong_key');
  });

  it.each([
    ['a quantity of 0', sessionParams({ line_items: [{ price_data: { currency: 'usd', unit_amount: 2500, product_data: { name: 'Seat' } }, quantity: 0 }] }), 'line_items[0][quantity]'],
    ['a subscription', sessionParams({ mode: 'subscription' }), 'mode'],
    ['a relative success URL', sessionParams({ success_url: '/thanks' }), 'success_url'],
    ['an amount in fractions of a cent', sessionParams({ line_items: [{ price_data: { currency: 'usd', unit_amount: 12.5, product_data: { name: 'Seat' } }, quantity: 1 }] }), 'line_items[0][price_data][unit_amount]'],
    ['a total under 50 cents', sessionParams({ line_items: [{ price_data: { currency: 'usd', unit_amount: 49, product_data: { name: 'Seat' } }, quantity: 1 }] }), 'line_items'],
    ['an expiry in 10 minutes', sessionParams({ expires_at: Math.floor(Date.now() / 1000) + 600 }), 'expires_at'],
  ])('refuses %s as an invalid request naming the parameter', async (_case, params, param) => {
    const error = await stripe.checkout.sessions.create(params).catch((caught: unknown) => caught);
    expect(error).toBeInstanceOf(Stripe.errors.StripeInvalidRequestError);
    expect((error as Stripe.errors.StripeInvalidRequestError).param).toBe(param);
  });

  it('names a missing required parameter', async () => {
    const { success_url: _left, ...withoutSuccess } = sessionParams();
    const error = await stripe.checkout.sessions.create(withoutSuccess).catch((caught: unknown) => caught);
    expect(error).toMatchObject({ type: 'StripeInvalidRequestError', param: 'success_url', code: 'parameter_missing' });
  });

  it('retrieves a paid session with its payment intent and charge expanded', async () => {
    const session = await paidSession();
    const paid = await stripe.checkout.sessions.retrieve(session.id, { expand: ['payment_intent', 'payment_intent.latest_charge'] });
    expect(paid).toMatchObject({ status: 'complete', payment_status: 'paid', url: null });
    const intent = paid.payment_intent as Stripe.PaymentIntent;
    expect(intent).toMatchObject({ object: 'payment_intent', status: 'succeeded', amount: 8400, amount_received: 8400, currency: 'usd' });
    expect(intent.id).toMatch(/^pi_/);
    const charge = intent.latest_charge as Stripe.Charge;
    expect(charge.id).toMatch(/^ch_/);
    expect(charge.payment_method_details?.card).toMatchObject({ brand: 'visa', last4: '4242' });

    const plain = await stripe.checkout.sessions.retrieve(session.id);
    expect(plain.payment_intent).toBe(intent.id);
  });

  it('lists line items', async () => {
    const session = await stripe.checkout.sessions.create(sessionParams());
    const items = await stripe.checkout.sessions.listLineItems(session.id);
    expect(items.object).toBe('list');
    expect(items.has_more).toBe(false);
    expect(items.data.map((item) => [item.description, item.quantity, item.amount_total])).toEqual([
      ['Course seat, Larkfield Flow Lab', 3, 7500],
      ['Printed workbook', 1, 900],
    ]);
    expect(items.data[0]?.price?.unit_amount).toBe(2500);
    expect(String(items.data[0]?.price?.unit_amount_decimal)).toBe('2500');
  });

  it('expires an open session and refuses to expire it twice', async () => {
    const session = await stripe.checkout.sessions.create(sessionParams());
    const expired = await stripe.checkout.sessions.expire(session.id);
    expect(expired).toMatchObject({ status: 'expired', payment_status: 'unpaid', url: null });
    await expect(stripe.checkout.sessions.expire(session.id)).rejects.toBeInstanceOf(Stripe.errors.StripeInvalidRequestError);
    expect(fake.controls.events().some((event) => event.type === 'checkout.session.expired' && event.data.object.id === session.id)).toBe(true);
  });

  it('expires a session once its expires_at has passed', async () => {
    const session = await stripe.checkout.sessions.create(sessionParams());
    fake.controls.advanceClock(24 * 3600 + 1);
    const later = await stripe.checkout.sessions.retrieve(session.id);
    expect(later.status).toBe('expired');
  });

  it('answers an unknown session with a 404 resource_missing', async () => {
    const error = await stripe.checkout.sessions.retrieve('cs_test_nothing').catch((caught: unknown) => caught);
    expect(error).toBeInstanceOf(Stripe.errors.StripeInvalidRequestError);
    expect(error).toMatchObject({ statusCode: 404, code: 'resource_missing' });
  });

  it('finds a session by its payment intent', async () => {
    const session = await paidSession();
    const { payment_intent: intentId } = await stripe.checkout.sessions.retrieve(session.id);
    const found = await stripe.checkout.sessions.list({ payment_intent: intentId as string });
    expect(found.data.map((each) => each.id)).toEqual([session.id]);
  });
});

describe('Refunds and events through the SDK', () => {
  it('refunds part, then the rest, and refuses more than is left', async () => {
    const session = await paidSession();
    const intentId = (await stripe.checkout.sessions.retrieve(session.id)).payment_intent as string;

    const part = await stripe.refunds.create({ payment_intent: intentId, amount: 2500, metadata: { seats: '1' } });
    expect(part).toMatchObject({ object: 'refund', amount: 2500, status: 'succeeded', payment_intent: intentId, metadata: { seats: '1' } });
    expect(part.id).toMatch(/^re_/);

    const tooMuch = await stripe.refunds.create({ payment_intent: intentId, amount: 6000 }).catch((caught: unknown) => caught);
    expect(tooMuch).toBeInstanceOf(Stripe.errors.StripeInvalidRequestError);
    expect((tooMuch as Stripe.errors.StripeInvalidRequestError).param).toBe('amount');

    // 8400 paid − 2500 refunded
    const rest = await stripe.refunds.create({ payment_intent: intentId });
    expect(rest.amount).toBe(5900);
    expect((await stripe.refunds.retrieve(rest.id)).amount).toBe(5900);
    const charge = await stripe.charges.retrieve(rest.charge as string);
    expect(charge).toMatchObject({ amount_refunded: 8400, refunded: true });
  });

  it('records refund.created and charge.refunded, and the SDK retrieves them', async () => {
    const session = await paidSession();
    const intentId = (await stripe.checkout.sessions.retrieve(session.id)).payment_intent as string;
    const refund = await stripe.refunds.create({ payment_intent: intentId, amount: 1000 }, { idempotencyKey: `refund-${intentId}` });

    const events = fake.controls.events().filter((event) => (event.data.object as { id: string }).id === refund.id || event.data.object.id === refund.charge);
    expect(events.map((event) => event.type)).toEqual(['refund.created', 'charge.refunded']);
    const chargeRefunded = await stripe.events.retrieve(events[1]?.id as string);
    expect(chargeRefunded).toMatchObject({ object: 'event', type: 'charge.refunded', livemode: false, request: { idempotency_key: `refund-${intentId}` } });
    expect(chargeRefunded.data.object).toMatchObject({ object: 'charge', amount_refunded: 1000, refunded: false });
    expect(chargeRefunded.data.previous_attributes).toEqual({ amount_refunded: 0, refunded: false });

    const completed = fake.controls.events().find((event) => event.type === 'checkout.session.completed' && event.data.object.id === session.id);
    const fetched = await stripe.events.retrieve(completed?.id as string);
    expect(fetched.data.object).toMatchObject({ id: session.id, status: 'complete', payment_status: 'paid' });
  });
});

describe('the provider down', () => {
  afterEach(() => fake.controls.comeBack());

  it('answers 503, which the SDK raises as an API error, until it comes back', async () => {
    fake.controls.goDown();
    const error = await stripe.checkout.sessions.create(sessionParams()).catch((caught: unknown) => caught);
    expect(error).toBeInstanceOf(Stripe.errors.StripeAPIError);
    expect((error as Stripe.errors.StripeAPIError).statusCode).toBe(503);
    fake.controls.comeBack();
    await expect(stripe.checkout.sessions.create(sessionParams())).resolves.toMatchObject({ status: 'open' });
  });

  it('is retried by the SDK, which gets through once the fake is back', async () => {
    const retrying = new Stripe(SECRET_KEY, { host: '127.0.0.1', port: running.port, protocol: 'http', maxNetworkRetries: 1 });
    fake.controls.goDown();
    // The SDK waits at least 0.5 s before its first retry (stripe 23.1.0, INITIAL_NETWORK_RETRY_DELAY_SEC).
    setTimeout(() => fake.controls.comeBack(), 150);
    const before = fake.state.sessions.size;
    const session = await retrying.checkout.sessions.create(sessionParams());
    expect(session.status).toBe('open');
    expect(fake.state.sessions.size).toBe(before + 1);
  });
});
