import type { DataSource } from 'typeorm';

import { scratchDatabase, testDataSource } from '../testing/database';
import { runSeeds, type SeedSet } from './seeds';

describe('runSeeds', () => {
  let db: Awaited<ReturnType<typeof scratchDatabase>>;
  let dataSource: DataSource;

  beforeAll(async () => {
    db = await scratchDatabase();
    dataSource = testDataSource(db.url);
    await dataSource.initialize();
    await dataSource.runMigrations();
    await dataSource.query('CREATE TABLE bench (name text PRIMARY KEY)');
  });

  afterAll(async () => {
    await dataSource?.destroy();
    await db?.drop();
  });

  const benches = (version: number, names: string[]): SeedSet => ({
    name: 'benches',
    version,
    apply: async (manager) => {
      for (const name of names) await manager.query('INSERT INTO bench (name) VALUES ($1) ON CONFLICT DO NOTHING', [name]);
    },
  });

  it('applies a set once: a second start adds nothing twice', async () => {
    expect(await runSeeds(dataSource, [benches(1, ['north bay'])])).toEqual(['benches']);
    expect(await runSeeds(dataSource, [benches(1, ['north bay', 'should not appear'])])).toEqual([]);
    expect(await dataSource.query('SELECT name FROM bench ORDER BY name')).toEqual([{ name: 'north bay' }]);
  });

  it('applies a set again when its version rises', async () => {
    expect(await runSeeds(dataSource, [benches(2, ['north bay', 'south bay'])])).toEqual(['benches']);
    expect(await dataSource.query('SELECT count(*)::int AS n FROM bench')).toEqual([{ n: 2 }]);
  });

  it('rolls a failing set back completely and records nothing', async () => {
    const failing: SeedSet = {
      name: 'half-done',
      version: 1,
      apply: async (manager) => {
        await manager.query(`INSERT INTO bench (name) VALUES ('half')`);
        throw new Error('seed failed midway');
      },
    };
    await expect(runSeeds(dataSource, [failing])).rejects.toThrow('seed failed midway');
    expect(await dataSource.query(`SELECT count(*)::int AS n FROM bench WHERE name = 'half'`)).toEqual([{ n: 0 }]);
    expect(await dataSource.query(`SELECT count(*)::int AS n FROM seed_run WHERE name = 'half-done'`)).toEqual([{ n: 0 }]);
  });

  it('lets concurrent starts apply a set exactly once', async () => {
    const counted: SeedSet = {
      name: 'counted',
      version: 1,
      apply: async (manager) => {
        await manager.query(`INSERT INTO bench (name) VALUES ('counted-' || gen_random_uuid())`);
      },
    };
    const results = await Promise.all([runSeeds(dataSource, [counted]), runSeeds(dataSource, [counted])]);
    expect(results.flat()).toEqual(['counted']);
    expect(await dataSource.query(`SELECT count(*)::int AS n FROM bench WHERE name LIKE 'counted-%'`)).toEqual([{ n: 1 }]);
  });
});
