import { Router, type Response } from 'express';
import { z } from 'zod';

import { ProviderError } from './errors';
import { expandObject } from './expand';
import { newId } from './ids';
import { commonQuery, expandParam, integerParam, metadataParam, readParams } from './params';
import { listOf, type ChargeObject, type RefundObject, type RequestContext } from './resources';
import type { ProviderStore } from './store';

const createSchema = z.strictObject({
  payment_intent: z.string().optional(),
  charge: z.string().optional(),
  amount: integerParam(1, 99_999_999).optional(),
  metadata: metadataParam.optional(),
  reason: z.enum(['duplicate', 'fraudulent', 'requested_by_customer'], { error: 'must be duplicate, fraudulent or requested_by_customer' }).optional(),
  expand: expandParam.optional(),
});
export type RefundCreateParams = z.output<typeof createSchema>;

const listQuery = z.looseObject({
  payment_intent: z.string().optional(),
  charge: z.string().optional(),
  limit: integerParam(1, 100).optional(),
});

/**
 * Refunds all that is left of a payment's charge, or `amount` of it. Refused (messages from memory of
 * the provider's answers): no payment named, nothing left to refund, or more than is left (param amount).
 * Sends `refund.created` and then `charge.refunded` with the charge's totals before and after.
 */
export function createRefund(store: ProviderStore, params: RefundCreateParams, request: RequestContext): RefundObject {
  const charge = chargeToRefund(store, params);
  const left = charge.amount - charge.amount_refunded;
  if (left <= 0) throw ProviderError.invalidRequest(`Charge ${charge.id} has already been refunded.`, 'charge', 'charge_already_refunded');
  const amount = params.amount ?? left;
  if (amount > left) {
    throw ProviderError.invalidRequest(
      `Refund amount (${money(amount, charge.currency)}) is greater than unrefunded amount on charge (${money(left, charge.currency)})`,
      'amount',
    );
  }
  const refund: RefundObject = {
    id: newId('re'),
    object: 'refund',
    amount,
    balance_transaction: null,
    charge: charge.id,
    created: store.nowSeconds(),
    currency: charge.currency,
    customer: null,
    metadata: params.metadata ?? {},
    payment_intent: charge.payment_intent,
    payment_method: charge.payment_method,
    reason: params.reason ?? null,
    receipt_number: null,
    source_transfer_reversal: null,
    status: 'succeeded',
    transfer_reversal: null,
  };
  store.refunds.set(refund.id, refund);
  const before = { amount_refunded: charge.amount_refunded, refunded: charge.refunded };
  charge.amount_refunded += amount;
  charge.refunded = charge.amount_refunded === charge.amount;
  store.emit('refund.created', refund, request);
  store.emit('charge.refunded', charge, request, before);
  return refund;
}

function chargeToRefund(store: ProviderStore, params: RefundCreateParams): ChargeObject {
  if (params.charge) {
    const charge = store.charges.get(params.charge);
    if (!charge) throw ProviderError.noSuch('charge', params.charge, 'charge');
    if (params.payment_intent && params.payment_intent !== charge.payment_intent) {
      throw ProviderError.invalidRequest(`Charge ${charge.id} does not belong to payment intent ${params.payment_intent}.`, 'charge');
    }
    return charge;
  }
  if (!params.payment_intent) {
    throw ProviderError.invalidRequest('One of the following params should be provided for this request: payment_intent or charge.');
  }
  const intent = store.paymentIntents.get(params.payment_intent);
  if (!intent) throw ProviderError.noSuch('payment_intent', params.payment_intent, 'payment_intent');
  const charge = intent.latest_charge ? store.charges.get(intent.latest_charge) : undefined;
  if (!charge || intent.status !== 'succeeded') {
    throw ProviderError.invalidRequest(`This PaymentIntent (${intent.id}) does not have a successful charge to refund.`, 'payment_intent');
  }
  return charge;
}

function money(amountMinor: number, currency: string): string {
  return `${(amountMinor / 100).toFixed(2)} ${currency}`;
}

export interface RefundRouterDependencies {
  readonly store: ProviderStore;
  readonly requestContext: (res: Response) => RequestContext;
}

/** `/v1/refunds`: create, retrieve, list by payment intent or charge. */
export function refundsRouter({ store, requestContext }: RefundRouterDependencies): Router {
  const router = Router();
  router.post('/', (req, res) => {
    const params = readParams(createSchema, req.body);
    res.json(expandObject(store, createRefund(store, params, requestContext(res)), params.expand));
  });
  router.get('/', (req, res) => {
    const query = readParams(listQuery, req.query);
    const matching = [...store.refunds.values()]
      .filter((refund) => !query.payment_intent || refund.payment_intent === query.payment_intent)
      .filter((refund) => !query.charge || refund.charge === query.charge)
      .reverse();
    const limit = query.limit ?? 10;
    res.json(listOf(structuredClone(matching.slice(0, limit)), '/v1/refunds', matching.length > limit));
  });
  router.get('/:id', (req, res) => {
    const { expand } = readParams(commonQuery, req.query);
    const refund = store.refunds.get(req.params.id);
    if (!refund) throw ProviderError.noSuch('refund', req.params.id);
    res.json(expandObject(store, refund, expand));
  });
  return router;
}
