import type { DataSource, EntityManager } from 'typeorm';

import { demoAccountsSeed } from '../accounts/demo-accounts';
import { demoSeatsSeed } from '../seats/demo-seats';
import { SeedRun } from './seed-run.entity';

/** A named, versioned set of rows; applied once per database, inside one transaction. */
export interface SeedSet {
  readonly name: string;
  readonly version: number;
  apply(manager: EntityManager): Promise<void>;
}

/** The demo scenario's seed sets, in order. Feature issues register theirs here. */
export const demoSeedSets: readonly SeedSet[] = [demoAccountsSeed, demoSeatsSeed];

/** Applies each seed set not yet recorded at its version; returns the names applied now. */
export async function runSeeds(dataSource: DataSource, sets: readonly SeedSet[] = demoSeedSets): Promise<string[]> {
  const applied: string[] = [];
  for (const set of sets) {
    const ran = await dataSource.transaction(async (manager) => {
      // Several app instances may start at once: one takes the lock, the others then see its row.
      await manager.query('SELECT pg_advisory_xact_lock(hashtext($1))', [`seed:${set.name}`]);
      const done = await manager.findOneBy(SeedRun, { name: set.name });
      if (done && done.version >= set.version) return false;
      await set.apply(manager);
      await manager.upsert(SeedRun, { name: set.name, version: set.version, appliedAt: new Date() }, ['name']);
      return true;
    });
    if (ran) applied.push(set.name);
  }
  return applied;
}
