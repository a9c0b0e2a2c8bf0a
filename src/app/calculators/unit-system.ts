/* SI or US customary: which of an input's two default units the form uses. */

import type { UnitSystem } from '../../../shared/api/accounts';

// Declared once, with the account's preference it is stored as (shared/api/accounts.ts).
export type { UnitSystem };

export function isUnitSystem(value: unknown): value is UnitSystem {
  return value === 'si' || value === 'us';
}

// Which units are US customary is the engine's knowledge (its SI examples are checked against it);
// imported from its own small module so this file never pulls mathjs in.
export { isUsCustomary } from '../../../shared/airflow/us-customary';
