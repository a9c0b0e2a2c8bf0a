import { Router, type RequestHandler, type Response } from 'express';

import { expireIfDue } from './checkout-sessions';
import { formBody, type FormObject } from './form-body';
import { formText } from './params';
import { authenticationPage, closedPage, notFoundPage, PAY_PAGE_CSS, payPage, type CardField, type CardFormState, type PageOptions } from './pay-page-html';
import { attemptPayment, cardDigits, passesLuhn, resolveAuthentication, type CardInput, type PaymentResult } from './payments';
import type { ProviderStore, SessionRecord } from './store';

/**
 * The hosted pay page at a session's `url`: `GET /pay/:id` shows the order and a card form; the form
 * posts back, and a payment that goes through ends in a 303 to `success_url` (with
 * `{CHECKOUT_SESSION_ID}` filled in). Works without JavaScript.
 */
export function payPageRouter(store: ProviderStore, options: PageOptions): Router {
  const router = Router();
  router.use(pageHeaders, ...formBody());
  router.get('/assets/pay-page.css', (_req, res) => {
    res.type('text/css').set('Cache-Control', 'no-cache').send(PAY_PAGE_CSS);
  });
  router.get('/:id', (req, res) => {
    const record = openRecord(store, req.params.id, res);
    if (record) res.type('html').send(payPage(record.session, record.lineItems, {}, options));
  });
  router.post('/:id', (req, res) => {
    const record = openRecord(store, req.params.id, res);
    if (!record) return;
    const form = req.body as FormObject;
    const { card, state } = readCardForm(form, store.nowMs());
    if (!card) {
      res.status(422).type('html').send(payPage(record.session, record.lineItems, state, options));
      return;
    }
    answer(res, record, attemptPayment(store, record, card), state, options);
  });
  router.post('/:id/authenticate', (req, res) => {
    const record = openRecord(store, req.params.id, res);
    if (!record) return;
    const form = req.body as FormObject;
    const decision = formText(form['decision']) === 'approve' ? 'approve' : 'fail';
    answer(res, record, resolveAuthentication(store, record, formText(form['attempt']) ?? '', decision), {}, options);
  });
  router.get('/:id/cancel', (req, res) => {
    const record = store.sessions.get(req.params.id);
    if (!record) {
      res.status(404).type('html').send(notFoundPage());
      return;
    }
    // Cancelling leaves the session open (the provider expires it later), as the provider does.
    if (record.session.cancel_url) res.redirect(303, record.session.cancel_url);
    else res.redirect(303, `/pay/${record.session.id}`);
  });
  return router;
}

function answer(res: Response, record: SessionRecord, result: PaymentResult, state: CardFormState, options: PageOptions): void {
  switch (result.kind) {
    case 'paid':
      res.redirect(303, record.session.success_url.replaceAll('{CHECKOUT_SESSION_ID}', record.session.id));
      return;
    case 'declined':
      res.type('html').send(payPage(record.session, record.lineItems, { ...state, failure: result.error.message }, options));
      return;
    case 'authentication_required':
      res.type('html').send(authenticationPage(record.session, result.attemptId, record.pendingAuthentication?.card.last4 ?? ''));
      return;
    case 'not_open':
      if (record.session.status === 'open') {
        // An answer to an authentication step that is no longer waiting (sent twice, or out of date).
        res.status(409).type('html').send(payPage(record.session, record.lineItems, { failure: 'That authentication step is over. Enter the card again.' }, options));
      } else {
        res.status(409).type('html').send(closedPage(record.session));
      }
  }
}

/** The session if it can still be paid; otherwise the page is answered here (404 or closed) and undefined returned. */
function openRecord(store: ProviderStore, id: string, res: Response): SessionRecord | undefined {
  const record = store.sessions.get(id);
  if (!record) {
    res.status(404).type('html').send(notFoundPage());
    return undefined;
  }
  expireIfDue(store, record);
  if (record.session.status !== 'open') {
    res.type('html').send(closedPage(record.session));
    return undefined;
  }
  return record;
}

/** The card form checked field by field; the card only when every field is right. */
function readCardForm(form: FormObject, nowMs: number): { card?: CardInput; state: CardFormState } {
  const typedNumber = (formText(form['card_number']) ?? '').trim();
  const typedExpiry = (formText(form['card_expiry']) ?? '').trim();
  const typedCvc = (formText(form['card_cvc']) ?? '').trim();
  const errors: Partial<Record<CardField, string>> = {};

  const number = cardDigits(typedNumber);
  if (!typedNumber) errors.card_number = 'Enter a card number.';
  else if (!number) errors.card_number = 'Enter a card number of 12 to 19 digits (spaces are fine).';
  else if (!passesLuhn(number)) errors.card_number = 'This card number is not valid: check the digits, or use a test card such as 4242 4242 4242 4242.';

  const expiry = /^(\d{1,2})\s*\/\s*(\d{2}|\d{4})$/.exec(typedExpiry);
  const month = expiry ? Number(expiry[1]) : 0;
  const year = expiry ? Number((expiry[2] ?? '').padStart(4, '20')) : 0;
  const now = new Date(nowMs);
  if (!typedExpiry) errors.card_expiry = 'Enter the expiry date.';
  else if (!expiry || month < 1 || month > 12) errors.card_expiry = 'Enter the expiry date as MM / YY, for example 12 / 34.';
  else if (year < now.getUTCFullYear() || (year === now.getUTCFullYear() && month < now.getUTCMonth() + 1)) {
    errors.card_expiry = 'This card has expired: enter a date in the future.';
  }

  if (!/^\d{3,4}$/.test(typedCvc)) errors.card_cvc = 'Enter the 3 or 4 digit security code.';

  const state: CardFormState = { cardNumber: typedNumber, expiry: typedExpiry, errors };
  if (Object.keys(errors).length || !number) return { state };
  return { card: { number, expMonth: month, expYear: year }, state: { cardNumber: typedNumber, expiry: typedExpiry } };
}

const pageHeaders: RequestHandler = (_req, res, next) => {
  res.set({
    // No script at all; styles from this server only; the form posts here (then the 303 leaves).
    'Content-Security-Policy': "default-src 'none'; style-src 'self'; base-uri 'none'; frame-ancestors 'none'",
    'Cache-Control': 'no-store',
    'Referrer-Policy': 'no-referrer',
    'X-Content-Type-Options': 'nosniff',
  });
  next();
};
