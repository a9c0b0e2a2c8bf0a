import type { DataSource } from 'typeorm';

import type { HealthReport } from '../../shared/api/health';
import { appVersion } from '../version';

const PROBE_TIMEOUT_MS = 2000;

/** Asks PostgreSQL a real question; a dead pool or a stopped server reads as "down", never a crash. */
export async function checkHealth(dataSource: DataSource): Promise<HealthReport> {
  const up = await probe(dataSource);
  return { status: up ? 'ok' : 'degraded', database: up ? 'up' : 'down', version: appVersion };
}

async function probe(dataSource: DataSource): Promise<boolean> {
  if (!dataSource.isInitialized) return false;
  let timer: NodeJS.Timeout | undefined;
  const timeout = new Promise<false>((resolve) => {
    timer = setTimeout(() => resolve(false), PROBE_TIMEOUT_MS);
  });
  const query = dataSource
    .query('SELECT 1 AS up')
    .then((rows: Array<{ up: number }>) => rows[0]?.up === 1)
    .catch(() => false);
  try {
    return await Promise.race([query, timeout]);
  } finally {
    clearTimeout(timer);
  }
}
