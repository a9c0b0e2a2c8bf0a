// The embedded cluster of this checkout, as `npm start` and `npm test` use it.
import { join } from 'node:path';

import { dataDir } from './paths.mjs';
import { cluster, databaseUrl, ensureDatabase, startCluster, stopCluster } from './postgres.mjs';

export const DEFAULT_PG_PORT = 54329;

/**
 * Starts the checkout's cluster (unless it already runs) and makes sure `database` exists.
 * Returns its URL, an admin URL, and `stop`, which stops the cluster only if this call started it.
 */
export async function openLocalDatabase(database, { recreate = false } = {}) {
  const port = Number(process.env.FLOWLORE_PG_PORT ?? DEFAULT_PG_PORT);
  const c = cluster(join(dataDir, 'postgres'), port);
  const started = await startCluster(c);
  await ensureDatabase(c, database, { recreate });
  return {
    url: databaseUrl(c, database),
    adminUrl: databaseUrl(c, 'postgres'),
    stop: started ? () => stopCluster(c) : async () => {},
  };
}
