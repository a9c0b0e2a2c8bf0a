import { randomBytes } from 'node:crypto';

import { expireIfDue } from './checkout-sessions';
import { newId } from './ids';
import { NO_REQUEST, type CardDetails, type ChargeObject, type PaymentError, type PaymentIntentObject } from './resources';
import type { ProviderStore, SessionRecord } from './store';

export type CardOutcome = 'succeeds' | 'declined' | 'insufficient_funds' | 'authentication_required';

// The provider's public test card numbers and what they do (its testing docs, from memory):
// 4242… succeeds, …0002 is a generic decline, …9995 is declined for insufficient funds,
// 4000 0027 6000 3184 asks for authentication on every payment.
const TEST_CARDS: ReadonlyMap<string, CardOutcome> = new Map([
  ['4242424242424242', 'succeeds'],
  ['4000000000000002', 'declined'],
  ['4000000000009995', 'insufficient_funds'],
  ['4000002760003184', 'authentication_required'],
]);

// Decline codes and messages as the provider reports them to a customer (from memory).
const DECLINES: Record<'declined' | 'insufficient_funds' | 'authentication_failed', PaymentError> = {
  declined: { type: 'card_error', code: 'card_declined', decline_code: 'generic_decline', message: 'Your card was declined.' },
  insufficient_funds: { type: 'card_error', code: 'card_declined', decline_code: 'insufficient_funds', message: 'Your card has insufficient funds.' },
  authentication_failed: {
    type: 'card_error',
    code: 'payment_intent_authentication_failure',
    message: 'We are unable to authenticate your payment method. Please choose a different payment method and try again.',
  },
};

export interface CardInput {
  /** Digits only (see `cardDigits`). */
  readonly number: string;
  readonly expMonth: number;
  readonly expYear: number;
}

export type PaymentResult =
  | { readonly kind: 'paid'; readonly record: SessionRecord }
  | { readonly kind: 'declined'; readonly error: PaymentError }
  | { readonly kind: 'authentication_required'; readonly attemptId: string }
  | { readonly kind: 'not_open'; readonly status: string };

/** The digits of a card number as typed (spaces and dashes allowed); null when it has anything else. */
export function cardDigits(typed: string): string | null {
  const digits = typed.replace(/[\s-]/g, '');
  return /^\d{12,19}$/.test(digits) ? digits : null;
}

/** The Luhn check digit test (ISO/IEC 7812-1, Annex B), which every real card number passes. */
export function passesLuhn(digits: string): boolean {
  let sum = 0;
  for (let index = 0; index < digits.length; index++) {
    let digit = Number(digits[digits.length - 1 - index]);
    if (index % 2 === 1) digit = digit * 2 > 9 ? digit * 2 - 9 : digit * 2;
    sum += digit;
  }
  return sum % 10 === 0;
}

/** What a card does here: a listed test card as listed, any other valid-looking number like 4242. */
export function cardOutcome(digits: string): { readonly outcome: CardOutcome; readonly listed: boolean } {
  const listed = TEST_CARDS.get(digits);
  return { outcome: listed ?? 'succeeds', listed: listed !== undefined };
}

/** The card network by its leading digits (ISO/IEC 7812 issuer ranges, the common ones only). */
export function cardBrand(digits: string): string {
  if (digits.startsWith('4')) return 'visa';
  if (/^(5[1-5]|2[2-7])/.test(digits)) return 'mastercard';
  if (/^3[47]/.test(digits)) return 'amex';
  if (/^(6011|65)/.test(digits)) return 'discover';
  return 'unknown';
}

/** One attempt to pay an open session with a card; `authenticate` answers the authentication step at once. */
export function attemptPayment(store: ProviderStore, record: SessionRecord, card: CardInput, authenticate?: 'approve' | 'fail'): PaymentResult {
  expireIfDue(store, record);
  if (record.session.status !== 'open') return { kind: 'not_open', status: record.session.status };
  const details = cardDetails(card);
  const { outcome } = cardOutcome(card.number);
  if (outcome === 'declined' || outcome === 'insufficient_funds') return failAttempt(store, record, DECLINES[outcome]);
  if (outcome === 'authentication_required') {
    const attemptId = newId('auth');
    record.pendingAuthentication = { attemptId, card: details };
    return authenticate ? resolveAuthentication(store, record, attemptId, authenticate) : { kind: 'authentication_required', attemptId };
  }
  return completePayment(store, record, details);
}

/** The answer to the authentication step; an unknown or used attempt id is refused as not open. */
export function resolveAuthentication(store: ProviderStore, record: SessionRecord, attemptId: string, decision: 'approve' | 'fail'): PaymentResult {
  expireIfDue(store, record);
  const pending = record.pendingAuthentication;
  if (record.session.status !== 'open') return { kind: 'not_open', status: record.session.status };
  if (!pending || pending.attemptId !== attemptId) return { kind: 'not_open', status: 'no_pending_authentication' };
  record.pendingAuthentication = null;
  if (decision === 'fail') return failAttempt(store, record, DECLINES.authentication_failed);
  return completePayment(store, record, { ...pending.card, three_d_secure: { result: 'authenticated' } });
}

function cardDetails(card: CardInput): CardDetails {
  const brand = cardBrand(card.number);
  return { brand, last4: card.number.slice(-4), exp_month: card.expMonth, exp_year: card.expYear, funding: 'credit', network: brand, three_d_secure: null };
}

/** The session's payment intent, made on the first attempt (the provider makes it when the customer pays). */
function attemptIntent(store: ProviderStore, record: SessionRecord): PaymentIntentObject {
  const existing = record.attemptIntentId ? store.paymentIntents.get(record.attemptIntentId) : undefined;
  if (existing) return existing;
  const id = newId('pi');
  const intent: PaymentIntentObject = {
    id,
    object: 'payment_intent',
    amount: record.session.amount_total,
    amount_capturable: 0,
    amount_received: 0,
    canceled_at: null,
    cancellation_reason: null,
    capture_method: 'automatic_async',
    client_secret: `${id}_secret_${randomBytes(12).toString('hex')}`,
    confirmation_method: 'automatic',
    created: store.nowSeconds(),
    currency: record.session.currency,
    customer: null,
    description: record.paymentIntentData.description,
    last_payment_error: null,
    latest_charge: null,
    livemode: false,
    metadata: { ...record.paymentIntentData.metadata },
    next_action: null,
    payment_method: null,
    payment_method_types: ['card'],
    receipt_email: record.session.customer_email,
    status: 'requires_payment_method',
  };
  store.paymentIntents.set(id, intent);
  record.attemptIntentId = id;
  return intent;
}

function failAttempt(store: ProviderStore, record: SessionRecord, error: PaymentError): PaymentResult {
  const intent = attemptIntent(store, record);
  intent.status = 'requires_payment_method';
  intent.payment_method = null;
  intent.last_payment_error = { ...error };
  store.emit('payment_intent.payment_failed', intent, NO_REQUEST);
  return { kind: 'declined', error };
}

function completePayment(store: ProviderStore, record: SessionRecord, card: CardDetails): PaymentResult {
  const { session } = record;
  const intent = attemptIntent(store, record);
  const paymentMethod = newId('pm');
  const charge: ChargeObject = {
    id: newId('ch'),
    object: 'charge',
    amount: intent.amount,
    amount_captured: intent.amount,
    amount_refunded: 0,
    balance_transaction: null,
    billing_details: { address: null, email: session.customer_email, name: null, phone: null },
    captured: true,
    created: store.nowSeconds(),
    currency: intent.currency,
    customer: null,
    description: intent.description,
    disputed: false,
    failure_code: null,
    failure_message: null,
    livemode: false,
    metadata: {},
    outcome: { network_status: 'approved_by_network', reason: null, risk_level: 'normal', seller_message: 'Payment complete.', type: 'authorized' },
    paid: true,
    payment_intent: intent.id,
    payment_method: paymentMethod,
    payment_method_details: { type: 'card', card },
    receipt_email: session.customer_email,
    receipt_url: null,
    refunded: false,
    status: 'succeeded',
  };
  store.charges.set(charge.id, charge);
  Object.assign(intent, { status: 'succeeded', amount_received: intent.amount, latest_charge: charge.id, payment_method: paymentMethod, last_payment_error: null });
  Object.assign(session, {
    status: 'complete',
    payment_status: 'paid',
    payment_intent: intent.id,
    url: null,
    customer_details: { email: session.customer_email, name: null, phone: null, address: null, tax_exempt: 'none', tax_ids: [] },
  });
  store.emit('checkout.session.completed', session, NO_REQUEST);
  return { kind: 'paid', record };
}
