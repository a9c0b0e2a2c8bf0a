import type { DataSource } from 'typeorm';

import { scratchDatabase, testDataSource } from '../testing/database';
import { migrations } from './migrations';

async function tables(dataSource: DataSource): Promise<string[]> {
  const rows: Array<{ table_name: string }> = await dataSource.query(
    `SELECT table_name FROM information_schema.tables WHERE table_schema = 'public' ORDER BY table_name`,
  );
  return rows.map((row) => row.table_name);
}

describe('migrations on an empty database', () => {
  let db: Awaited<ReturnType<typeof scratchDatabase>>;
  let dataSource: DataSource;

  beforeAll(async () => {
    db = await scratchDatabase();
    dataSource = testDataSource(db.url);
    await dataSource.initialize();
  });

  afterAll(async () => {
    await dataSource?.destroy();
    await db?.drop();
  });

  it('run up, then all the way down again, leaving nothing behind', async () => {
    expect(await tables(dataSource)).toEqual([]);

    const applied = await dataSource.runMigrations({ transaction: 'each' });
    expect(applied.map((m) => m.name)).toEqual(migrations.map((m) => m.name));
    expect(await tables(dataSource)).toEqual(expect.arrayContaining(['schema_migration', 'seed_run']));
    expect(await dataSource.showMigrations()).toBe(false);

    for (let i = 0; i < migrations.length; i++) await dataSource.undoLastMigration({ transaction: 'each' });
    expect(await tables(dataSource)).toEqual(['schema_migration']);
    expect(await dataSource.query('SELECT count(*)::int AS n FROM schema_migration')).toEqual([{ n: 0 }]);
  });

  it('leave the entities in step with the schema (no pending schema change)', async () => {
    await dataSource.runMigrations({ transaction: 'each' });
    const pending = await dataSource.driver.createSchemaBuilder().log();
    expect(pending.upQueries.map((q) => q.query)).toEqual([]);
  });
});
