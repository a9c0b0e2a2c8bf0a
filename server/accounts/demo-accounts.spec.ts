import type { DataSource } from 'typeorm';

import { runSeeds } from '../database/seeds';
import { demoSeatsSeed } from '../seats/demo-seats';
import { accountsTestApp, signedIn } from '../testing/accounts';
import { scratchDatabase, testDataSource } from '../testing/database';
import { DEMO_PASSWORD, DEMO_PEOPLE, demoAccountsSeed } from './demo-accounts';
import { passwordProblem } from '../auth/passwords';

describe('the demo accounts seed', () => {
  let db: Awaited<ReturnType<typeof scratchDatabase>>;
  let dataSource: DataSource;

  beforeAll(async () => {
    db = await scratchDatabase();
    dataSource = testDataSource(db.url);
    await dataSource.initialize();
    await dataSource.runMigrations();
  });
  afterAll(async () => {
    await dataSource?.destroy();
    await db?.drop();
  });

  it('seeds verified people, the Larkfield Flow Lab and two cohorts, once', async () => {
    expect(await runSeeds(dataSource, [demoAccountsSeed])).toEqual(['demo-accounts']);
    expect(await runSeeds(dataSource, [demoAccountsSeed])).toEqual([]);
    const [counts] = await dataSource.query(`
      SELECT (SELECT count(*)::int FROM user_account WHERE verified_at IS NOT NULL) AS verified,
             (SELECT count(*)::int FROM user_account WHERE role = 'apprentice') AS apprentices,
             (SELECT count(*)::int FROM cohort) AS cohorts,
             (SELECT count(*)::int FROM user_account u JOIN shop s ON s.id = u.shop_id WHERE s.name = 'Larkfield Flow Lab' AND u.role = 'apprentice') AS in_shop`);
    expect(counts).toEqual({ verified: DEMO_PEOPLE.length, apprentices: 6, cohorts: 2, in_shop: 4 });
  });

  it('gives the shop 10 paid seats, one held by each of its four apprentices, once', async () => {
    expect(await runSeeds(dataSource, [demoAccountsSeed, demoSeatsSeed])).toEqual(['demo-seats']);
    expect(await runSeeds(dataSource, [demoAccountsSeed, demoSeatsSeed])).toEqual([]);
    const [pool] = await dataSource.query(`SELECT p.purchased, p.in_use FROM seat_pool p JOIN shop s ON s.id = p.shop_id WHERE s.name = 'Larkfield Flow Lab'`);
    expect(pool).toEqual({ purchased: 10, in_use: 4 });
    // 10 seats at the 10-seat tier of the default prices (44.00 each).
    const [order] = await dataSource.query(`SELECT quantity, unit_amount, total_amount, currency, status FROM seat_order`);
    expect(order).toEqual({ quantity: 10, unit_amount: 4400, total_amount: 44_000, currency: 'usd', status: 'paid' });
  });

  it('lets Jo Okafor sign in with the demo password, which passes our own password rules', async () => {
    expect(passwordProblem(DEMO_PASSWORD, { email: 'jo.okafor@demo.flowlore.test' })).toBeUndefined();
    const t = accountsTestApp(dataSource);
    const jo = await signedIn(t.app, { email: 'jo.okafor@demo.flowlore.test' }, DEMO_PASSWORD);
    expect((await jo.get('/api/auth/me')).body.user).toMatchObject({ displayName: 'Jo Okafor', role: 'apprentice', verified: true });
  });
});
