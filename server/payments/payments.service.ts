import type Stripe from 'stripe';
import type { DataSource, EntityManager } from 'typeorm';

import type { CheckoutStart, OrderView } from '../../shared/api/payments';
import { quoteSeats, type SeatPricing } from '../../shared/billing/pricing';
import type { User } from '../accounts/user.entity';
import { HttpProblem } from '../http/problem';
import { isUuid } from '../http/uuid';
import type { Mailer } from '../mail/mailer';
import { receiptMail } from '../mail/templates/receipt';
import { SeatOrder } from '../seats/seat-order.entity';
import type { SeatsService } from '../seats/seats.service';

export interface PaymentsServiceOptions {
  /** The provider's SDK, or undefined when buying is switched off (no secret key configured). */
  readonly stripe?: Stripe;
  readonly webhookSecret?: string;
  readonly pricing: SeatPricing;
  readonly seats: SeatsService;
  readonly mailer: Mailer;
  readonly appBaseUrl: string;
  readonly now?: () => Date;
}

/** How long a checkout stays open (the provider's shortest allowed, from memory of its API reference). */
const CHECKOUT_MINUTES = 30;
/** Events older than this are refused (the SDK's default tolerance). */
const SIGNATURE_TOLERANCE_S = 300;

export type WebhookOutcome = 'applied' | 'ignored' | 'duplicate';

/**
 * Buying seats: an order in the database, a hosted checkout at the provider (the order's id as
 * `client_reference_id` and idempotency key), and seats credited only from the provider's signed
 * `checkout.session.completed` event, once per event id (`payment_event`), under the order's and
 * the pool's row locks. A receipt e-mail follows each payment.
 */
export class PaymentsService {
  private readonly now: () => Date;

  constructor(
    private readonly dataSource: DataSource,
    private readonly options: PaymentsServiceOptions,
  ) {
    this.now = options.now ?? (() => new Date());
  }

  private provider(): Stripe {
    if (!this.options.stripe) throw HttpProblem.serviceUnavailable('Buying seats is not set up on this server yet. Ask Flowlore to add seats to your shop.');
    return this.options.stripe;
  }

  async createShopOrder(owner: User, shopId: string, quantity: number): Promise<CheckoutStart> {
    const stripe = this.provider();
    if (!owner.verifiedAt) throw HttpProblem.forbidden('Confirm your e-mail address before buying seats.');
    const quote = quoteSeats(this.options.pricing, quantity);
    const pool = await this.options.seats.poolOf(this.dataSource.manager, shopId);
    const created = this.now();
    const expiresAt = new Date(created.getTime() + CHECKOUT_MINUTES * 60_000);
    const order = await this.dataSource.getRepository(SeatOrder).save({
      poolId: pool.id,
      buyerId: owner.id,
      quantity: quote.quantity,
      unitAmount: quote.unitAmount,
      totalAmount: quote.totalAmount,
      currency: quote.currency,
      status: 'pending',
      expiresAt,
    });
    let session: Stripe.Checkout.Session;
    try {
      session = await stripe.checkout.sessions.create(
        {
          mode: 'payment',
          line_items: [{ quantity: quote.quantity, price_data: { currency: quote.currency, unit_amount: quote.unitAmount, product_data: { name: 'Flowlore seat (one apprentice, whole course)' } } }],
          client_reference_id: order.id,
          metadata: { orderId: order.id, orderNumber: String(order.number) },
          customer_email: owner.email,
          success_url: `${this.options.appBaseUrl}/shop?order=${order.id}&session={CHECKOUT_SESSION_ID}`,
          cancel_url: `${this.options.appBaseUrl}/shop?order=${order.id}&cancelled=1`,
          expires_at: Math.floor(expiresAt.getTime() / 1000),
        },
        { idempotencyKey: `seat-order-${order.id}` },
      );
    } catch {
      // Nothing was charged; the order does not wait for a payment that cannot come.
      await this.dataSource.getRepository(SeatOrder).update({ id: order.id }, { status: 'failed' });
      throw HttpProblem.serviceUnavailable('The payment provider could not be reached, so nothing was charged. Try again in a few minutes.');
    }
    await this.dataSource.getRepository(SeatOrder).update({ id: order.id }, { checkoutSessionId: session.id });
    if (!session.url) throw HttpProblem.serviceUnavailable('The payment provider gave no payment page. Try again in a few minutes.');
    return { order: orderView(await this.dataSource.getRepository(SeatOrder).findOneByOrFail({ id: order.id })), checkoutUrl: session.url };
  }

  /** The shop's orders, newest first (a pending one past its checkout's end shows as expired). */
  async orders(shopId: string): Promise<OrderView[]> {
    await this.expireStale(shopId);
    const rows = await this.dataSource.getRepository(SeatOrder).find({ where: { pool: { shopId } }, order: { createdAt: 'DESC' } });
    return rows.map(orderView);
  }

  /** One of the shop's orders (the page polls it while a payment is being confirmed: reads only). */
  async order(shopId: string, orderId: string): Promise<OrderView> {
    if (!isUuid(orderId)) throw HttpProblem.notFound('Your shop has no such order.');
    await this.expireStale(shopId, orderId);
    const order = await this.dataSource.getRepository(SeatOrder).findOneBy({ id: orderId, pool: { shopId } });
    if (!order) throw HttpProblem.notFound('Your shop has no such order.');
    return orderView(order);
  }

  /**
   * A provider event: verified with the SDK (signature and a timestamp at most 300 s old; a bad one
   * is a 400 and changes nothing), recorded once by id, applied in the same transaction. A
   * completed checkout is looked up again at the provider (its state there is what counts, and the
   * card's last four digits come with it). An error rolls it all back and answers 500, so the
   * provider delivers the event again.
   */
  async receiveEvent(rawBody: Buffer, signature: string | undefined): Promise<WebhookOutcome> {
    const stripe = this.provider();
    const secret = this.options.webhookSecret;
    if (!secret) throw HttpProblem.serviceUnavailable('The payment provider\'s events are not set up on this server.');
    let event: Stripe.Event;
    try {
      event = stripe.webhooks.constructEvent(rawBody, signature ?? '', secret, SIGNATURE_TOLERANCE_S);
    } catch {
      throw HttpProblem.badRequest('The event\'s signature does not match, or it is too old.');
    }
    const completed = event.type === 'checkout.session.completed' || event.type === 'checkout.session.async_payment_succeeded';
    const session = completed
      ? await stripe.checkout.sessions.retrieve((event.data.object as Stripe.Checkout.Session).id, { expand: ['payment_intent.latest_charge'] })
      : undefined;
    const result = await this.dataSource.transaction(async (manager) => {
      const [row] = await manager.query(
        `INSERT INTO payment_event (id, type, outcome) VALUES ($1, $2, 'ignored')
           ON CONFLICT (id) DO UPDATE SET deliveries = payment_event.deliveries + 1, last_received_at = now()
         RETURNING (xmax = 0) AS fresh, outcome`,
        [event.id, event.type],
      );
      if (!row.fresh && row.outcome !== 'failed') return { outcome: 'duplicate' as const };
      const applied = await this.apply(manager, event, session);
      await manager.query('UPDATE payment_event SET outcome = $2, reason = $3, order_id = $4 WHERE id = $1', [event.id, applied.outcome, applied.reason, applied.orderId]);
      return applied;
    });
    if (result.outcome === 'applied' && 'receiptFor' in result && result.receiptFor) await this.sendReceipt(result.receiptFor);
    return result.outcome;
  }

  private async apply(
    manager: EntityManager,
    event: Stripe.Event,
    session: Stripe.Checkout.Session | undefined,
  ): Promise<{ outcome: 'applied' | 'ignored'; reason: string | null; orderId: string | null; receiptFor?: string }> {
    if (event.type === 'checkout.session.expired') {
      const orderId = (event.data.object as Stripe.Checkout.Session).client_reference_id;
      const order = isUuid(orderId) ? await manager.getRepository(SeatOrder).findOne({ where: { id: orderId }, lock: { mode: 'pessimistic_write' } }) : null;
      if (!order) return { outcome: 'ignored', reason: 'No order of ours.', orderId: null };
      if (order.status !== 'pending') return { outcome: 'ignored', reason: `The order is already ${order.status}.`, orderId: order.id };
      await manager.update(SeatOrder, { id: order.id }, { status: 'expired' });
      return { outcome: 'applied', reason: null, orderId: order.id };
    }
    if (!session) return { outcome: 'ignored', reason: `Flowlore does not act on ${event.type}.`, orderId: null };
    const orderId = session.client_reference_id;
    const order = isUuid(orderId) ? await manager.getRepository(SeatOrder).findOne({ where: { id: orderId }, lock: { mode: 'pessimistic_write' } }) : null;
    if (!order) return { outcome: 'ignored', reason: 'No order of ours.', orderId: null };
    if (session.payment_status !== 'paid') return { outcome: 'ignored', reason: `The checkout is ${session.payment_status}, not paid.`, orderId: order.id };
    if (order.status === 'paid') return { outcome: 'ignored', reason: 'The order was credited before.', orderId: order.id };
    if (session.amount_total !== order.totalAmount || session.currency !== order.currency) {
      throw new Error(`order ${order.id}: the provider's amount ${session.amount_total} ${session.currency} is not the order's ${order.totalAmount} ${order.currency}`);
    }
    const intent = typeof session.payment_intent === 'object' ? session.payment_intent : null;
    const charge = intent && typeof intent.latest_charge === 'object' ? intent.latest_charge : null;
    await manager.update(SeatOrder, { id: order.id }, {
      status: 'paid',
      paidAt: this.now(),
      paymentIntentId: intent?.id ?? (typeof session.payment_intent === 'string' ? session.payment_intent : null),
      cardLast4: charge?.payment_method_details?.card?.last4 ?? null,
    });
    // The pool's row lock: concurrent credits queue here; the balance CHECK holds.
    await manager.query('UPDATE seat_pool SET purchased = purchased + $2 WHERE id = $1', [order.poolId, order.quantity]);
    return { outcome: 'applied', reason: null, orderId: order.id, receiptFor: order.id };
  }

  private async sendReceipt(orderId: string): Promise<void> {
    const order = await this.dataSource.getRepository(SeatOrder).findOneByOrFail({ id: orderId });
    const [buyer] = await this.dataSource.query(
      `SELECT u.email, u.display_name, coalesce(s.name, u.display_name) AS place FROM seat_pool p LEFT JOIN shop s ON s.id = p.shop_id
         JOIN user_account u ON u.id = $2 WHERE p.id = $1`,
      [order.poolId, order.buyerId],
    );
    if (!buyer) return;
    this.options.mailer.sendInBackground(
      { to: buyer.email as string, userId: order.buyerId },
      receiptMail({
        name: buyer.display_name as string,
        shopName: buyer.place as string,
        orderNumber: String(order.number),
        paidAt: order.paidAt ?? this.now(),
        quantity: order.quantity,
        unitAmount: order.unitAmount,
        totalAmount: order.totalAmount,
        currency: order.currency,
        cardLast4: order.cardLast4,
        link: `${this.options.appBaseUrl}/shop`,
      }),
    );
  }

  /** Pending orders of the shop (or just one) whose checkout has ended without a payment are expired (the provider's event may come later). */
  private async expireStale(shopId: string, orderId?: string): Promise<void> {
    await this.dataSource.query(
      `UPDATE seat_order o SET status = 'expired' FROM seat_pool p
        WHERE p.id = o.pool_id AND p.shop_id = $1 AND o.status = 'pending' AND o.expires_at < $2 AND ($3::uuid IS NULL OR o.id = $3)`,
      [shopId, this.now(), orderId ?? null],
    );
  }
}

function orderView(o: Pick<SeatOrder, 'id' | 'number' | 'quantity' | 'unitAmount' | 'totalAmount' | 'currency' | 'status' | 'createdAt' | 'paidAt' | 'cardLast4'>): OrderView {
  return {
    id: o.id,
    number: String(o.number),
    quantity: o.quantity,
    unitAmount: o.unitAmount,
    totalAmount: o.totalAmount,
    currency: o.currency,
    status: o.status,
    createdAt: new Date(o.createdAt).toISOString(),
    paidAt: o.paidAt ? new Date(o.paidAt).toISOString() : null,
    cardLast4: o.cardLast4,
  };
}

