import type { Metadata } from './params';

/*
 * The objects the fake answers with. Field names and which fields are always present follow the SDK's
 * typings (node_modules/stripe/cjs/resources/*.d.ts, stripe 23.1.0); only the cheap ones are filled,
 * the rest are absent or null. Amounts are integer minor units (cents); times are Unix seconds.
 */

export type SessionStatus = 'open' | 'complete' | 'expired';
export type SessionPaymentStatus = 'unpaid' | 'paid';

export interface CheckoutSessionObject {
  id: string;
  object: 'checkout.session';
  amount_subtotal: number;
  amount_total: number;
  cancel_url: string | null;
  client_reference_id: string | null;
  created: number;
  currency: string;
  customer: null;
  customer_details: CustomerDetails | null;
  customer_email: string | null;
  expires_at: number;
  livemode: false;
  locale: null;
  metadata: Metadata;
  mode: 'payment';
  payment_intent: string | null;
  payment_method_types: string[];
  payment_status: SessionPaymentStatus;
  status: SessionStatus;
  success_url: string;
  total_details: { amount_discount: number; amount_shipping: number; amount_tax: number };
  ui_mode: 'hosted';
  /** The pay page while the session is open; null once it is complete or expired. */
  url: string | null;
}

export interface CustomerDetails {
  email: string | null;
  name: string | null;
  phone: null;
  address: null;
  tax_exempt: 'none';
  tax_ids: [];
}

export interface PriceObject {
  id: string;
  object: 'price';
  active: boolean;
  billing_scheme: 'per_unit';
  created: number;
  currency: string;
  custom_unit_amount: null;
  livemode: false;
  lookup_key: null;
  metadata: Metadata;
  nickname: null;
  product: string;
  recurring: null;
  tax_behavior: 'unspecified';
  tiers_mode: null;
  transform_quantity: null;
  type: 'one_time';
  unit_amount: number;
  /** A decimal string: the SDK turns it into its Decimal type. */
  unit_amount_decimal: string;
}

export interface LineItemObject {
  id: string;
  object: 'item';
  adjustable_quantity: null;
  amount_discount: number;
  amount_subtotal: number;
  amount_tax: number;
  amount_total: number;
  currency: string;
  description: string;
  metadata: Metadata;
  price: PriceObject;
  quantity: number;
}

export interface CardDetails {
  brand: string;
  last4: string;
  exp_month: number;
  exp_year: number;
  funding: 'credit';
  network: string;
  three_d_secure: { result: 'authenticated' } | null;
}

export interface PaymentError {
  type: 'card_error';
  code: string;
  decline_code?: string;
  message: string;
}

export type PaymentIntentStatus = 'requires_payment_method' | 'succeeded';

export interface PaymentIntentObject {
  id: string;
  object: 'payment_intent';
  amount: number;
  amount_capturable: number;
  amount_received: number;
  canceled_at: null;
  cancellation_reason: null;
  capture_method: 'automatic_async';
  client_secret: string;
  confirmation_method: 'automatic';
  created: number;
  currency: string;
  customer: null;
  description: string | null;
  last_payment_error: PaymentError | null;
  latest_charge: string | null;
  livemode: false;
  metadata: Metadata;
  next_action: null;
  payment_method: string | null;
  payment_method_types: string[];
  receipt_email: string | null;
  status: PaymentIntentStatus;
}

export interface ChargeObject {
  id: string;
  object: 'charge';
  amount: number;
  amount_captured: number;
  amount_refunded: number;
  balance_transaction: null;
  billing_details: { address: null; email: string | null; name: string | null; phone: null };
  captured: boolean;
  created: number;
  currency: string;
  customer: null;
  description: string | null;
  disputed: boolean;
  failure_code: null;
  failure_message: null;
  livemode: false;
  metadata: Metadata;
  outcome: { network_status: 'approved_by_network'; reason: null; risk_level: 'normal'; seller_message: string; type: 'authorized' };
  paid: boolean;
  payment_intent: string;
  payment_method: string;
  payment_method_details: { type: 'card'; card: CardDetails };
  receipt_email: string | null;
  receipt_url: null;
  refunded: boolean;
  status: 'succeeded';
}

export type RefundReason = 'duplicate' | 'fraudulent' | 'requested_by_customer';

export interface RefundObject {
  id: string;
  object: 'refund';
  amount: number;
  balance_transaction: null;
  charge: string;
  created: number;
  currency: string;
  customer: null;
  metadata: Metadata;
  payment_intent: string;
  payment_method: string;
  reason: RefundReason | null;
  receipt_number: null;
  source_transfer_reversal: null;
  status: 'succeeded';
  transfer_reversal: null;
}

export type EventType =
  | 'checkout.session.completed'
  | 'checkout.session.expired'
  | 'payment_intent.payment_failed'
  | 'refund.created'
  | 'charge.refunded';

export type EventObject = CheckoutSessionObject | PaymentIntentObject | ChargeObject | RefundObject;

/** Which API request caused an event: both null when a customer's action on the pay page did. */
export interface RequestContext {
  id: string | null;
  idempotency_key: string | null;
}

export interface ProviderEvent {
  id: string;
  object: 'event';
  api_version: string;
  created: number;
  data: { object: EventObject; previous_attributes?: Record<string, unknown> };
  livemode: false;
  pending_webhooks: number;
  request: RequestContext;
  type: EventType;
}

export interface ListObject<T> {
  object: 'list';
  data: T[];
  has_more: boolean;
  url: string;
}

export function listOf<T>(data: readonly T[], url: string, hasMore = false): ListObject<T> {
  return { object: 'list', data: [...data], has_more: hasMore, url };
}

export const NO_REQUEST: RequestContext = { id: null, idempotency_key: null };
