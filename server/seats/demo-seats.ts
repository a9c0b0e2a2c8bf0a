import { DEFAULT_SEAT_PRICES, parseSeatTiers, quoteSeats } from '../../shared/billing/pricing';
import { DEMO_PEOPLE, DEMO_SHOP_NAME } from '../accounts/demo-accounts';
import type { SeedSet } from '../database/seeds';
import { SeatOrder } from './seat-order.entity';
import { SeatPool } from './seat-pool.entity';
import { Seat } from './seat.entity';

const DEMO_SEATS = 10;

/**
 * Seed set: the demo shop bought 10 seats (one paid order at the default prices, card ending 4242,
 * a test card) and gave one to each of its four apprentices. Runs after `demo-accounts`.
 */
export const demoSeatsSeed: SeedSet = {
  name: 'demo-seats',
  version: 1,
  apply: async (manager) => {
    const [shop] = await manager.query('SELECT id FROM shop WHERE name = $1', [DEMO_SHOP_NAME]);
    if (!shop) return;
    await manager.query('INSERT INTO seat_pool (shop_id) VALUES ($1) ON CONFLICT (shop_id) DO NOTHING', [shop.id]);
    const pool = await manager.findOneByOrFail(SeatPool, { shopId: shop.id });
    if (pool.purchased > 0) return;
    const tiers = parseSeatTiers(DEFAULT_SEAT_PRICES) as Exclude<ReturnType<typeof parseSeatTiers>, string>;
    const quote = quoteSeats({ currency: 'usd', tiers }, DEMO_SEATS);
    const [owner] = await manager.query('SELECT owner_id FROM shop WHERE id = $1', [shop.id]);
    const paidAt = new Date();
    await manager.insert(SeatOrder, {
      poolId: pool.id,
      buyerId: owner.owner_id,
      quantity: quote.quantity,
      unitAmount: quote.unitAmount,
      totalAmount: quote.totalAmount,
      currency: quote.currency,
      status: 'paid',
      cardLast4: '4242',
      expiresAt: paidAt,
      paidAt,
    });
    await manager.update(SeatPool, { id: pool.id }, { purchased: DEMO_SEATS });
    const apprentices: Array<{ id: string }> = await manager.query(`SELECT id FROM user_account WHERE email = ANY($1) AND shop_id = $2`, [
      DEMO_PEOPLE.filter((p) => p.inShop).map((p) => p.email),
      shop.id,
    ]);
    for (const a of apprentices) await manager.insert(Seat, { poolId: pool.id, status: 'assigned', holderId: a.id, assignedAt: paidAt });
  },
};
