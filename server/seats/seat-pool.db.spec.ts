import type { DataSource } from 'typeorm';

import { createShopOwner, createUser, migratedTestDataSource } from '../testing/accounts';
import { SeatPool } from './seat-pool.entity';
import { Seat } from './seat.entity';

/**
 * The seat balance is the database's rule, not only the code's: whatever races, no pool has more
 * seats held (invited or assigned) plus refunded than were purchased (migration 1796800000000).
 */
describe('seat pools in PostgreSQL', () => {
  let dataSource: DataSource;

  beforeAll(async () => {
    dataSource = await migratedTestDataSource();
  });

  afterAll(async () => {
    await dataSource.destroy();
  });

  async function shopPool(purchased: number): Promise<SeatPool> {
    const { shop } = await createShopOwner(dataSource, `Seat Test Flow ${Math.random().toString(36).slice(2, 8)}`);
    return dataSource.getRepository(SeatPool).save({ shopId: shop.id, learnerId: null, purchased });
  }

  const inUse = async (poolId: string) => (await dataSource.getRepository(SeatPool).findOneByOrFail({ id: poolId })).inUse;

  it('50 concurrent assignments against 10 paid seats: exactly 10 seated, 40 refused by the balance check', async () => {
    const pool = await shopPool(10);
    const apprentices = await Promise.all(Array.from({ length: 50 }, () => createUser(dataSource, { role: 'apprentice' })));
    const results = await Promise.allSettled(
      apprentices.map((a) => dataSource.getRepository(Seat).insert({ poolId: pool.id, status: 'assigned', holderId: a.id, assignedAt: new Date() })),
    );
    const refused = results.filter((r): r is PromiseRejectedResult => r.status === 'rejected');
    expect(results.filter((r) => r.status === 'fulfilled')).toHaveLength(10);
    expect(refused).toHaveLength(40);
    for (const r of refused) expect(String(r.reason)).toMatch(/seat_pool_balance_check/);
    expect(await inUse(pool.id)).toBe(10);
    const [{ n }] = await dataSource.query(`SELECT count(*)::int AS n FROM seat WHERE pool_id = $1 AND status <> 'released'`, [pool.id]);
    expect(n).toBe(10);
  }, 30_000);

  it('counts invitations as held, gives the seat back on release, and refuses refunding a seat in use', async () => {
    const pool = await shopPool(3);
    const [a, b] = [await createUser(dataSource), await createUser(dataSource)];
    const seats = dataSource.getRepository(Seat);
    const invited = await seats.save({ poolId: pool.id, status: 'invited', invitedEmail: 'someone@example.test' });
    await seats.save({ poolId: pool.id, status: 'assigned', holderId: a.id, assignedAt: new Date() });
    expect(await inUse(pool.id)).toBe(2);
    // One seat is left: refunding two would take a seat in use.
    await expect(dataSource.query('UPDATE seat_pool SET refunded = refunded + 2 WHERE id = $1', [pool.id])).rejects.toThrow(/seat_pool_balance_check/);
    await seats.update({ id: invited.id }, { status: 'released', releasedAt: new Date() });
    expect(await inUse(pool.id)).toBe(1);
    await dataSource.query('UPDATE seat_pool SET refunded = refunded + 2 WHERE id = $1', [pool.id]);
    // Now every paid seat is in use or refunded: a further assignment is refused.
    await expect(seats.insert({ poolId: pool.id, status: 'assigned', holderId: b.id, assignedAt: new Date() })).rejects.toThrow(/seat_pool_balance_check/);
  });

  it('holds one seat per apprentice at a time, and history stays when it is released', async () => {
    const pool = await shopPool(5);
    const apprentice = await createUser(dataSource);
    const seats = dataSource.getRepository(Seat);
    const first = await seats.save({ poolId: pool.id, status: 'assigned', holderId: apprentice.id, assignedAt: new Date() });
    await expect(seats.insert({ poolId: pool.id, status: 'assigned', holderId: apprentice.id, assignedAt: new Date() })).rejects.toThrow(/seat_holder_key/);
    await seats.update({ id: first.id }, { status: 'released', releasedAt: new Date() });
    await seats.insert({ poolId: pool.id, status: 'assigned', holderId: apprentice.id, assignedAt: new Date() });
    expect(await seats.countBy({ holderId: apprentice.id })).toBe(2);
    expect(await inUse(pool.id)).toBe(1);
  });

  it('belongs to a shop or to one learner, never both or neither', async () => {
    const { shop } = await createShopOwner(dataSource, 'Seat Owner Check Flow');
    const learner = await createUser(dataSource);
    const pools = dataSource.getRepository(SeatPool);
    await expect(pools.insert({ shopId: shop.id, learnerId: learner.id })).rejects.toThrow(/seat_pool_owner_check/);
    await expect(pools.insert({ shopId: null, learnerId: null })).rejects.toThrow(/seat_pool_owner_check/);
    await pools.insert({ shopId: null, learnerId: learner.id, purchased: 1 });
  });
});
