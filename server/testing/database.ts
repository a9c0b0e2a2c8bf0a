import { randomBytes } from 'node:crypto';

import { Client } from 'pg';
import pino from 'pino';

import { createDataSource } from '../database/data-source';
import { loadConfig, type Config } from '../config';

/** Tests run against real PostgreSQL: `npm test` provides DATABASE_URL (a throwaway test database). */
export function testDatabaseUrl(): string {
  const url = process.env['DATABASE_URL'];
  if (!url) throw new Error('DATABASE_URL is not set: run the suite with `npm test`, which starts PostgreSQL.');
  return url;
}

export function testConfig(overrides: Partial<Config> = {}): Config {
  const env = process.env;
  const mail = { SMTP_HOST: env['SMTP_HOST'], SMTP_PORT: env['SMTP_PORT'] };
  return { ...loadConfig({ DATABASE_URL: testDatabaseUrl(), NODE_ENV: 'test', LOG_LEVEL: 'silent', ...mail }), ...overrides };
}

export const silentLogger = pino({ level: 'silent' });

export function testDataSource(url = testDatabaseUrl(), applicationName = 'flowlore-test') {
  return createDataSource({ url, logger: silentLogger, poolSize: 4, applicationName });
}

/** An empty database of its own for a test that must start from nothing; dropped by `drop()`. */
export async function scratchDatabase(): Promise<{ url: string; drop: () => Promise<void> }> {
  const adminUrl = process.env['TEST_ADMIN_DATABASE_URL'];
  if (!adminUrl) throw new Error('TEST_ADMIN_DATABASE_URL is not set: run the suite with `npm test`.');
  const name = `flowlore_scratch_${randomBytes(6).toString('hex')}`;
  await adminQuery(adminUrl, `CREATE DATABASE ${name}`);
  const url = new URL(adminUrl);
  url.pathname = `/${name}`;
  return {
    url: url.toString(),
    drop: () => adminQuery(adminUrl, `DROP DATABASE IF EXISTS ${name} WITH (FORCE)`),
  };
}

async function adminQuery(url: string, sql: string): Promise<void> {
  const client = new Client({ connectionString: url });
  await client.connect();
  try {
    await client.query(sql);
  } finally {
    await client.end();
  }
}
