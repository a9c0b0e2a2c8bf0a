import { SeedRun } from './seed-run.entity';

/** Every entity the DataSource knows; feature folders add theirs here. */
export const entities = [SeedRun];
