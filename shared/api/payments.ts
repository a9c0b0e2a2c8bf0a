import { z } from 'zod';

import { MAX_SEATS_PER_ORDER, MIN_SEATS_PER_ORDER } from '../billing/pricing';

/** `POST /api/shop/orders`: seats to buy. */
export const createOrderSchema = z
  .object({ quantity: z.number().int('Whole seats only.').min(MIN_SEATS_PER_ORDER, `At least ${MIN_SEATS_PER_ORDER} seat.`).max(MAX_SEATS_PER_ORDER, `At most ${MAX_SEATS_PER_ORDER} seats at a time.`) })
  .strict();

export type OrderStatus = 'pending' | 'paid' | 'expired' | 'failed';

/** An order as its buyer sees it (amounts in minor units). */
export interface OrderView {
  id: string;
  number: string;
  quantity: number;
  unitAmount: number;
  totalAmount: number;
  currency: string;
  status: OrderStatus;
  createdAt: string;
  paidAt: string | null;
  cardLast4: string | null;
}

/** `POST /api/shop/orders`: the order, and where to pay for it (the provider's hosted page). */
export interface CheckoutStart {
  order: OrderView;
  checkoutUrl: string;
}
