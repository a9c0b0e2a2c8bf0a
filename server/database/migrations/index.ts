import { Foundation1764650000000 } from './1764650000000-foundation';
import { Accounts1764700000000 } from './1764700000000-accounts';

/** Every migration, oldest first. Schema changes happen only here. */
export const migrations = [Foundation1764650000000, Accounts1764700000000];
