import type { DataSource } from 'typeorm';

import { runSeeds } from '../database/seeds';
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

  it('lets Jo Okafor sign in with the demo password, which passes our own password rules', async () => {
    expect(passwordProblem(DEMO_PASSWORD, { email: 'jo.okafor@demo.flowlore.test' })).toBeUndefined();
    const t = accountsTestApp(dataSource);
    const jo = await signedIn(t.app, { email: 'jo.okafor@demo.flowlore.test' }, DEMO_PASSWORD);
    expect((await jo.get('/api/auth/me')).body.user).toMatchObject({ displayName: 'Jo Okafor', role: 'apprentice', verified: true });
  });
});
