import { randomUUID } from 'node:crypto';

import { Client } from 'pg';
import request from 'supertest';
import type { DataSource } from 'typeorm';

import { createApp } from '../app';
import { silentLogger, testConfig, testDatabaseUrl, testDataSource } from '../testing/database';
import { appVersion } from '../version';

describe('GET /api/health', () => {
  let dataSource: DataSource;
  const applicationName = `health-spec-${randomUUID()}`;

  beforeEach(async () => {
    dataSource = testDataSource(testDatabaseUrl(), applicationName);
    await dataSource.initialize();
  });

  afterEach(async () => {
    if (dataSource.isInitialized) await dataSource.destroy();
  });

  it('reports the database up after a real round trip to PostgreSQL', async () => {
    const app = createApp({ config: testConfig(), dataSource, logger: silentLogger });
    expect(await probesSeenByPostgres(applicationName)).toBe(0);
    const res = await request(app).get('/api/health');
    expect(res.status).toBe(200);
    expect(res.body).toEqual({ status: 'ok', database: 'up', version: appVersion });
    expect(res.headers['cache-control']).toBe('no-store');
    // The probe really reached the server: PostgreSQL shows it as our pool's last query.
    expect(await probesSeenByPostgres(applicationName)).toBe(1);
  });

  it('answers 503 with the database down when the pool is gone', async () => {
    const app = createApp({ config: testConfig(), dataSource, logger: silentLogger });
    await dataSource.destroy();
    const res = await request(app).get('/api/health');
    expect(res.status).toBe(503);
    expect(res.body).toEqual({ status: 'degraded', database: 'down', version: appVersion });
  });
});

async function probesSeenByPostgres(applicationName: string): Promise<number> {
  const client = new Client({ connectionString: testDatabaseUrl() });
  await client.connect();
  try {
    const result = await client.query(
      `SELECT count(*)::int AS n FROM pg_stat_activity WHERE application_name = $1 AND query = 'SELECT 1 AS up'`,
      [applicationName],
    );
    return result.rows[0].n;
  } finally {
    await client.end();
  }
}
