import { Router, type Response } from 'express';
import { z } from 'zod';

import { ProviderError } from './errors';
import { expandObject } from './expand';
import { newId } from './ids';
import { commonQuery, expandParam, integerParam, metadataParam, readParams, textParam, urlParam } from './params';
import { listOf, NO_REQUEST, type CheckoutSessionObject, type LineItemObject, type RequestContext } from './resources';
import type { ProviderStore, SessionRecord } from './store';

// Limits below are the provider's as its public API reference gives them, from memory: sessions last
// 30 minutes to 24 hours (default 24 h); the smallest charge is 50 cents; an amount has at most 8 digits.
const DEFAULT_LIFETIME_S = 24 * 3600;
const MIN_LIFETIME_S = 30 * 60;
const MIN_TOTAL_MINOR = 50;
const MAX_UNIT_AMOUNT_MINOR = 99_999_999;

const priceDataSchema = z.strictObject({
  currency: z
    .string({ error: 'must be a three-letter ISO currency code' })
    .regex(/^[A-Za-z]{3}$/, { error: 'must be a three-letter ISO currency code' })
    .transform((code) => code.toLowerCase()),
  product_data: z.strictObject({
    name: textParam(250).min(1, { error: 'must not be empty' }),
    description: textParam(500).optional(),
    metadata: metadataParam.optional(),
  }),
  unit_amount: integerParam(1, MAX_UNIT_AMOUNT_MINOR),
});

const lineItemSchema = z.strictObject({
  price: z.never({ error: 'the local fake takes price_data only, not saved prices' }).optional(),
  price_data: priceDataSchema,
  quantity: integerParam(1, 999),
});

const createSchema = z.strictObject({
  mode: z.literal('payment', { error: 'the local fake supports mode=payment only' }),
  line_items: z.array(lineItemSchema, { error: 'must be a list (line_items[0][…])' }).min(1).max(100),
  success_url: urlParam,
  cancel_url: urlParam.optional(),
  client_reference_id: textParam(200).optional(),
  metadata: metadataParam.optional(),
  customer_email: z.string().max(800).regex(/^[^\s@]+@[^\s@]+\.[^\s@]+$/, { error: 'must be an e-mail address' }).optional(),
  expires_at: integerParam(0, 2 ** 40).optional(),
  expand: expandParam.optional(),
  payment_method_types: z.array(z.literal('card', { error: 'the local fake takes card only' })).optional(),
  payment_intent_data: z.strictObject({ metadata: metadataParam.optional(), description: textParam(1000).optional() }).optional(),
  ui_mode: z.literal('hosted', { error: 'the local fake has the hosted page only' }).optional(),
});
export type CheckoutSessionCreateParams = z.output<typeof createSchema>;

/** Creates an open session whose `url` is the fake's pay page under `baseUrl`. */
export function createSession(store: ProviderStore, params: CheckoutSessionCreateParams, baseUrl: string): SessionRecord {
  const created = store.nowSeconds();
  const currency = params.line_items[0]?.price_data.currency ?? 'usd';
  params.line_items.forEach((item, index) => {
    if (item.price_data.currency !== currency) {
      const param = `line_items[${index}][price_data][currency]`;
      throw ProviderError.invalidRequest(`All line items must share one currency (${currency}).`, param);
    }
  });
  const expiresAt = params.expires_at ?? created + DEFAULT_LIFETIME_S;
  if (expiresAt < created + MIN_LIFETIME_S || expiresAt > created + DEFAULT_LIFETIME_S) {
    throw ProviderError.invalidRequest('The `expires_at` timestamp must be between 30 minutes and 24 hours from now.', 'expires_at');
  }
  const lineItems: LineItemObject[] = params.line_items.map(({ price_data: price, quantity }) => {
    const amount = price.unit_amount * quantity;
    return {
      id: newId('li'),
      object: 'item',
      adjustable_quantity: null,
      amount_discount: 0,
      amount_subtotal: amount,
      amount_tax: 0,
      amount_total: amount,
      currency,
      description: price.product_data.name,
      metadata: {},
      quantity,
      price: {
        id: newId('price'),
        object: 'price',
        active: false,
        billing_scheme: 'per_unit',
        created,
        currency,
        custom_unit_amount: null,
        livemode: false,
        lookup_key: null,
        metadata: {},
        nickname: null,
        product: newId('prod'),
        recurring: null,
        tax_behavior: 'unspecified',
        tiers_mode: null,
        transform_quantity: null,
        type: 'one_time',
        unit_amount: price.unit_amount,
        unit_amount_decimal: String(price.unit_amount),
      },
    };
  });
  const total = lineItems.reduce((sum, item) => sum + item.amount_total, 0);
  if (total < MIN_TOTAL_MINOR) {
    throw ProviderError.invalidRequest(`The Checkout Session's total amount due must add up to at least ${MIN_TOTAL_MINOR} ${currency} minor units.`, 'line_items');
  }
  const id = newId('cs_test', 58);
  const session: CheckoutSessionObject = {
    id,
    object: 'checkout.session',
    amount_subtotal: total,
    amount_total: total,
    cancel_url: params.cancel_url ?? null,
    client_reference_id: params.client_reference_id ?? null,
    created,
    currency,
    customer: null,
    customer_details: null,
    customer_email: params.customer_email ?? null,
    expires_at: expiresAt,
    livemode: false,
    locale: null,
    metadata: params.metadata ?? {},
    mode: 'payment',
    payment_intent: null,
    payment_method_types: ['card'],
    payment_status: 'unpaid',
    status: 'open',
    success_url: params.success_url,
    total_details: { amount_discount: 0, amount_shipping: 0, amount_tax: 0 },
    ui_mode: 'hosted',
    url: `${baseUrl}/pay/${id}`,
  };
  const record: SessionRecord = {
    session,
    lineItems,
    attemptIntentId: null,
    pendingAuthentication: null,
    paymentIntentData: { metadata: params.payment_intent_data?.metadata ?? {}, description: params.payment_intent_data?.description ?? null },
  };
  store.sessions.set(id, record);
  return record;
}

/** A session by id, expired first if its time has passed (the fake checks lazily as well as on a timer). */
export function findSession(store: ProviderStore, id: string): SessionRecord {
  const record = store.sessions.get(id);
  if (!record) throw ProviderError.noSuch('checkout.session', id);
  expireIfDue(store, record);
  return record;
}

export function expireIfDue(store: ProviderStore, record: SessionRecord): void {
  if (record.session.status === 'open' && record.session.expires_at <= store.nowSeconds()) expireSession(store, record, NO_REQUEST);
}

export function expireDueSessions(store: ProviderStore): void {
  for (const record of store.sessions.values()) expireIfDue(store, record);
}

export function expireSession(store: ProviderStore, record: SessionRecord, request: RequestContext): void {
  const { session } = record;
  if (session.status !== 'open') {
    throw ProviderError.invalidRequest(
      `Only Checkout Sessions with a status in ["open"] can be expired. This Checkout Session has a status of ${session.status}.`,
    );
  }
  session.status = 'expired';
  session.url = null;
  record.pendingAuthentication = null;
  store.emit('checkout.session.expired', session, request);
}

function sessionView(store: ProviderStore, record: SessionRecord, expand: readonly string[] | undefined): CheckoutSessionObject {
  return expandObject(store, record.session, expand, {
    line_items: () => listOf(structuredClone(record.lineItems), lineItemsUrl(record.session.id)),
  });
}

function lineItemsUrl(sessionId: string): string {
  return `/v1/checkout/sessions/${sessionId}/line_items`;
}

const listQuery = z.looseObject({
  limit: integerParam(1, 100).optional(),
  status: z.enum(['open', 'complete', 'expired']).optional(),
  payment_intent: z.string().optional(),
  client_reference_id: z.string().optional(),
});

export interface SessionRouterDependencies {
  readonly store: ProviderStore;
  readonly baseUrl: (res: Response) => string;
  readonly requestContext: (res: Response) => RequestContext;
}

/** `/v1/checkout/sessions`: create, list, retrieve (with `expand[]`), line items, expire. */
export function checkoutSessionsRouter({ store, baseUrl, requestContext }: SessionRouterDependencies): Router {
  const router = Router();
  router.post('/', (req, res) => {
    const params = readParams(createSchema, req.body);
    const record = createSession(store, params, baseUrl(res));
    res.json(sessionView(store, record, params.expand));
  });
  router.get('/', (req, res) => {
    const query = readParams(listQuery, req.query);
    expireDueSessions(store);
    const matching = [...store.sessions.values()]
      .map((record) => record.session)
      .filter((session) => !query.status || session.status === query.status)
      .filter((session) => !query.payment_intent || session.payment_intent === query.payment_intent)
      .filter((session) => !query.client_reference_id || session.client_reference_id === query.client_reference_id)
      .reverse();
    const limit = query.limit ?? 10;
    res.json(listOf(structuredClone(matching.slice(0, limit)), '/v1/checkout/sessions', matching.length > limit));
  });
  router.get('/:id', (req, res) => {
    const { expand } = readParams(commonQuery, req.query);
    res.json(sessionView(store, findSession(store, req.params.id), expand));
  });
  router.get('/:id/line_items', (req, res) => {
    const { limit = 10 } = readParams(listQuery, req.query);
    const record = findSession(store, req.params.id);
    res.json(listOf(structuredClone(record.lineItems.slice(0, limit)), lineItemsUrl(record.session.id), record.lineItems.length > limit));
  });
  router.post('/:id/expire', (req, res) => {
    const { expand } = readParams(commonQuery, req.body);
    const record = findSession(store, req.params.id);
    expireSession(store, record, requestContext(res));
    res.json(sessionView(store, record, expand));
  });
  return router;
}
