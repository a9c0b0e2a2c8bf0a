import { Foundation1764650000000 } from './1764650000000-foundation';

/** Every migration, oldest first. Schema changes happen only here. */
export const migrations = [Foundation1764650000000];
