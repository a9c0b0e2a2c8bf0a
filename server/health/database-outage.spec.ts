import { execFileSync } from 'node:child_process';
import { chmodSync, mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';

import { Client } from 'pg';
import request from 'supertest';
import type { DataSource } from 'typeorm';

import { createApp } from '../app';
import { silentLogger, testConfig, testDataSource } from '../testing/database';

// A PostgreSQL cluster of this test's own, so stopping it cannot disturb any other test.
const clusterCli = resolve(__dirname, '../devstack/postgres.mjs');
const dataDir = mkdtempSync(join(tmpdir(), 'flowlore-outage-'));
chmodSync(dataDir, 0o755); // the server's unprivileged OS user must reach it
const port = 55000 + Math.floor(Math.random() * 4000);
const pg = (command: string) =>
  execFileSync('node', [clusterCli, command, '--data', dataDir, '--port', String(port)], { encoding: 'utf8' }).trim();

async function healthStatus(app: ReturnType<typeof createApp>): Promise<number> {
  return (await request(app).get('/api/health')).status;
}

async function secondsUntilHealthy(app: ReturnType<typeof createApp>, limitSeconds: number): Promise<number> {
  const started = Date.now();
  while ((Date.now() - started) / 1000 < limitSeconds) {
    if ((await healthStatus(app)) === 200) return (Date.now() - started) / 1000;
    await new Promise((r) => setTimeout(r, 200));
  }
  return Infinity;
}

describe('the server when its database goes away', () => {
  let dataSource: DataSource;
  let app: ReturnType<typeof createApp>;
  let url: string;

  beforeAll(async () => {
    pg('start');
    url = pg('url');
    dataSource = testDataSource(url);
    await dataSource.initialize();
    app = createApp({ config: testConfig(), dataSource, logger: silentLogger });
  }, 60_000);

  afterAll(async () => {
    if (dataSource?.isInitialized) await dataSource.destroy();
    pg('destroy');
  }, 60_000);

  it('recovers when every pooled connection is killed (pg_terminate_backend)', async () => {
    // Fill the pool with several open connections first.
    await Promise.all(Array.from({ length: 4 }, () => dataSource.query('SELECT pg_sleep(0.05)')));
    expect(await healthStatus(app)).toBe(200);

    const admin = new Client({ connectionString: url });
    await admin.connect();
    const killed = await admin.query(
      `SELECT pg_terminate_backend(pid) FROM pg_stat_activity
        WHERE backend_type = 'client backend' AND pid <> pg_backend_pid()`,
    );
    await admin.end();
    expect(killed.rowCount).toBeGreaterThanOrEqual(1);

    expect(await secondsUntilHealthy(app, 10)).toBeLessThan(10);
  }, 30_000); // it waits at most 10 s; the limit is three times that

  it('answers 503 while PostgreSQL is stopped and 200 within 10 s of its return, without a restart', async () => {
    expect(await healthStatus(app)).toBe(200);

    pg('stop');
    const down = await request(app).get('/api/health');
    expect(down.status).toBe(503);
    expect(down.body).toMatchObject({ status: 'degraded', database: 'down' });
    expect(await healthStatus(app)).toBe(503);

    pg('start');
    expect(await secondsUntilHealthy(app, 10)).toBeLessThan(10);
    expect(dataSource.isInitialized).toBe(true);
  }, 60_000); // a stop and a start of PostgreSQL (seconds each) and at most 10 s of waiting
});
