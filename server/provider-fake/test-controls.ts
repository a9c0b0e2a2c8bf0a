import express, { Router, type RequestHandler } from 'express';
import { z } from 'zod';

import { expireDueSessions, findSession } from './checkout-sessions';
import { ProviderError } from './errors';
import { formBody } from './form-body';
import { attemptPayment, cardDigits, type PaymentResult } from './payments';
import type { CheckoutSessionObject, PaymentError, ProviderEvent } from './resources';
import type { ProviderStore } from './store';
import type { DeliveryRecord, DeliveryTweaks, ReleaseOrder, WebhookDispatcher } from './webhooks';

export interface PayOutcome {
  readonly result: PaymentResult['kind'];
  readonly session: CheckoutSessionObject;
  readonly error?: PaymentError;
  /** For `authentication_required`: answer it with `pay(…, 'approve' | 'fail')` or on the pay page. */
  readonly attemptId?: string;
}

/** Levers for tests; the same ones answer over HTTP under `/_test/…` from loopback only. */
export interface TestControls {
  /** Pays an open session without the browser, with a test card number (spaces allowed). */
  pay(sessionId: string, cardNumber: string, authenticate?: 'approve' | 'fail'): PayOutcome;
  redeliver(eventId: string, times?: number, tweaks?: DeliveryTweaks): Promise<DeliveryRecord[]>;
  redeliverBatch(eventIds: readonly string[], shuffle?: boolean): Promise<DeliveryRecord[]>;
  delayNext(ms: number, count?: number): void;
  staleNext(count?: number): void;
  hold(): void;
  release(order?: ReleaseOrder): Promise<DeliveryRecord[]>;
  /** Every /v1 call answers 503 until `comeBack()`. */
  goDown(): void;
  comeBack(): void;
  /** Moves the fake's clock forward (and expires sessions now past their time). */
  advanceClock(seconds: number): void;
  events(): ProviderEvent[];
  deliveries(): DeliveryRecord[];
  /** Resolves when no webhook delivery is under way or waiting to retry. */
  idle(): Promise<void>;
}

export function testControls(store: ProviderStore, webhooks: WebhookDispatcher): TestControls {
  return {
    pay(sessionId, cardNumber, authenticate) {
      const record = findSession(store, sessionId);
      const number = cardDigits(cardNumber);
      if (!number) throw ProviderError.invalidRequest('card_number must be 12 to 19 digits.', 'card_number');
      const farYear = new Date(store.nowMs()).getUTCFullYear() + 5;
      const result = attemptPayment(store, record, { number, expMonth: 12, expYear: farYear }, authenticate);
      return {
        result: result.kind,
        session: structuredClone(record.session),
        ...(result.kind === 'declined' ? { error: result.error } : {}),
        ...(result.kind === 'authentication_required' ? { attemptId: result.attemptId } : {}),
      };
    },
    redeliver: (eventId, times, tweaks) => webhooks.redeliver(eventId, times, tweaks),
    redeliverBatch: (eventIds, shuffle) => webhooks.redeliverBatch(eventIds, shuffle),
    delayNext: (ms, count) => webhooks.delayNext(ms, count),
    staleNext: (count) => webhooks.staleNext(count),
    hold: () => webhooks.hold(),
    release: (order) => webhooks.release(order),
    goDown: () => void (store.down = true),
    comeBack: () => void (store.down = false),
    advanceClock(seconds) {
      store.advanceClock(seconds * 1000);
      expireDueSessions(store);
    },
    events: () => structuredClone([...store.events.values()]),
    deliveries: () => [...webhooks.deliveries],
    idle: () => webhooks.idle(),
  };
}

const count = z.coerce.number().int().min(1).max(100).default(1);
const flag = z.union([z.boolean(), z.enum(['true', 'false', '1', '0']).transform((value) => value === 'true' || value === '1')]).default(false);
const redeliverQuery = z.object({ times: count, stale: flag, delay_ms: z.coerce.number().int().min(0).max(600_000).default(0) });
const batchBody = z.object({ ids: z.array(z.string()).min(1), shuffle: flag });
const delayBody = z.object({ ms: z.coerce.number().int().min(0).max(600_000), count });
const payBody = z.object({ card_number: z.string(), authenticate: z.enum(['approve', 'fail']).optional() });
const releaseBody = z.object({ order: z.enum(['as_sent', 'reverse', 'shuffle']).default('as_sent') });
const clockBody = z.object({ seconds: z.coerce.number().int().min(0).max(30 * 24 * 3600) });

/** Test controls over HTTP (no API key; refused unless the caller is on this machine). */
export function testControlsRouter(controls: TestControls): Router {
  const router = Router();
  router.use(loopbackOnly, express.json({ limit: '100kb' }), ...formBody());
  router.get('/events', (_req, res) => {
    res.json({ events: controls.events(), deliveries: controls.deliveries() });
  });
  router.post('/events/redeliver-batch', async (req, res) => {
    const { ids, shuffle } = parse(batchBody, req.body);
    res.json({ deliveries: await controls.redeliverBatch(ids, shuffle) });
  });
  router.post('/events/:id/redeliver', async (req, res) => {
    const { times, stale, delay_ms: delayMs } = parse(redeliverQuery, { ...req.query, ...req.body });
    if (!controls.events().some((event) => event.id === req.params.id)) throw ProviderError.noSuch('event', req.params.id);
    res.json({ deliveries: await controls.redeliver(req.params.id, times, { staleTimestamp: stale, delayMs }) });
  });
  router.post('/webhooks/delay', (req, res) => {
    const { ms, count: next } = parse(delayBody, req.body);
    controls.delayNext(ms, next);
    res.json({ ok: true });
  });
  router.post('/webhooks/stale', (req, res) => {
    controls.staleNext(parse(z.object({ count }), req.body).count);
    res.json({ ok: true });
  });
  router.post('/webhooks/hold', (_req, res) => {
    controls.hold();
    res.json({ ok: true });
  });
  router.post('/webhooks/release', async (req, res) => {
    res.json({ deliveries: await controls.release(parse(releaseBody, req.body).order) });
  });
  router.post('/checkout/sessions/:id/pay', (req, res) => {
    const { card_number: cardNumber, authenticate } = parse(payBody, req.body);
    res.json(controls.pay(req.params.id, cardNumber, authenticate));
  });
  router.post('/down', (_req, res) => {
    controls.goDown();
    res.json({ down: true });
  });
  router.post('/up', (_req, res) => {
    controls.comeBack();
    res.json({ down: false });
  });
  router.post('/clock/advance', (req, res) => {
    controls.advanceClock(parse(clockBody, req.body).seconds);
    res.json({ ok: true });
  });
  return router;
}

const LOOPBACK = new Set(['127.0.0.1', '::1', '::ffff:127.0.0.1']);

const loopbackOnly: RequestHandler = (req, res, next) => {
  if (LOOPBACK.has(req.socket.remoteAddress ?? '')) next();
  else res.status(404).json({ error: { type: 'invalid_request_error', message: 'Not found.' } });
};

function parse<T extends z.ZodType>(schema: T, input: unknown): z.output<T> {
  const parsed = schema.safeParse(input ?? {});
  if (parsed.success) return parsed.data;
  const issue = parsed.error.issues[0];
  throw ProviderError.invalidRequest(`Invalid ${issue?.path.join('.') || 'body'}: ${issue?.message ?? 'not valid'}`, issue?.path.join('.'));
}
