// The embedded cluster of this checkout, as `npm start` and `npm test` use it.
import { join } from 'node:path';

import { dataDir } from './paths.mjs';
import { cluster, databaseUrl, DEFAULT_PG_PORT, ensureDatabase, startCluster, stopCluster } from './postgres.mjs';

export { DEFAULT_PG_PORT };

/**
 * Starts the checkout's cluster (unless it already runs, on whatever port) and makes sure `database`
 * exists. The cluster asks for FLOWLORE_PG_PORT (54329) and takes the next free port when another
 * checkout's PostgreSQL holds it. Returns its URL, an admin URL, the port, and `stop`, which stops
 * the cluster only if this call started it.
 */
export async function openLocalDatabase(database, { recreate = false, dir = join(dataDir, 'postgres') } = {}) {
  const wanted = cluster(dir, Number(process.env.FLOWLORE_PG_PORT ?? DEFAULT_PG_PORT));
  const { started, port } = await startCluster(wanted);
  const c = { ...wanted, port };
  try {
    await ensureDatabase(c, database, { recreate });
  } catch (error) {
    if (started) await stopCluster(c);
    throw error;
  }
  return {
    url: databaseUrl(c, database),
    adminUrl: databaseUrl(c, 'postgres'),
    port,
    stop: started ? () => stopCluster(c) : async () => {},
  };
}
