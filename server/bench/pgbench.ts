/**
 * pgbench's default TPC-B-like script on the benchmark's own cluster, as the yardstick the submits
 * figure is compared with: the same machine, PostgreSQL and settings, so the ratio says how much of
 * the database's plain transaction rate a graded submit keeps. It gets a database of its own,
 * created and dropped here through the cluster's admin URL.
 */
import { spawn } from 'node:child_process';
import { existsSync } from 'node:fs';
import { join } from 'node:path';
import { performance } from 'node:perf_hooks';

import type { DataSource } from 'typeorm';

export interface PgbenchOptions {
  /** The cluster's admin URL (`TEST_ADMIN_DATABASE_URL`); pgbench's database is made beside the app's. */
  readonly adminUrl: string;
  readonly clients: number;
  readonly threads: number;
  readonly seconds: number;
  readonly scale: number;
  readonly database?: string;
}

export interface PgbenchResult {
  readonly tps: number;
  readonly processed: number;
  readonly failed: number;
  readonly initSeconds: number;
  readonly version: string;
}

/** Debian's tools of the major version the cluster runs (the binaries that started it). */
async function toolsDir(dataSource: DataSource): Promise<{ dir: string; version: string }> {
  const [{ server_version: version, server_version_num: num }] = await dataSource.query(
    `SELECT current_setting('server_version') AS server_version, current_setting('server_version_num') AS server_version_num`,
  );
  const major = Math.floor(Number(num) / 10000);
  const dir = `/usr/lib/postgresql/${major}/bin`;
  if (!existsSync(join(dir, 'pgbench'))) throw new Error(`pgbench for PostgreSQL ${major} is not at ${dir}/pgbench (Debian's postgresql-${major} package ships it)`);
  // `15.18 (Debian 15.18-0+deb12u1)`: the number is enough.
  return { dir, version: String(version).split(' ')[0]! };
}

/** libpq's variables for the admin URL: the password stays out of the process list. */
function connectionEnv(adminUrl: string): NodeJS.ProcessEnv {
  const url = new URL(adminUrl);
  return {
    ...process.env,
    PGHOST: url.hostname,
    PGPORT: url.port || '5432',
    PGUSER: decodeURIComponent(url.username),
    PGPASSWORD: decodeURIComponent(url.password),
  };
}

function tool(command: string, args: readonly string[], env: NodeJS.ProcessEnv): Promise<string> {
  return new Promise((resolve, reject) => {
    const child = spawn(command, args, { env, stdio: ['ignore', 'pipe', 'pipe'] });
    let out = '';
    let err = '';
    child.stdout.on('data', (chunk: Buffer) => (out += chunk.toString()));
    child.stderr.on('data', (chunk: Buffer) => (err += chunk.toString()));
    child.on('error', reject);
    child.on('exit', (code) => (code === 0 ? resolve(out) : reject(new Error(`${command} ${args.join(' ')} exited ${code}: ${err.trim()}`))));
  });
}

/** `pgbench -i -s scale`, then `pgbench -c clients -j threads -T seconds -n`; the database is dropped afterwards. */
export async function runPgbench(dataSource: DataSource, options: PgbenchOptions): Promise<PgbenchResult> {
  const database = options.database ?? 'flowlore_bench_pgbench';
  const { dir, version } = await toolsDir(dataSource);
  const env = connectionEnv(options.adminUrl);
  const pgbench = join(dir, 'pgbench');
  await tool(join(dir, 'dropdb'), ['--if-exists', '--force', database], env);
  await tool(join(dir, 'createdb'), [database], env);
  try {
    const started = performance.now();
    await tool(pgbench, ['-i', '-q', '-s', String(options.scale), database], env);
    const initSeconds = (performance.now() - started) / 1000;
    // -n: no vacuum before the run (the fresh tables were vacuumed by -i).
    const out = await tool(pgbench, ['-c', String(options.clients), '-j', String(options.threads), '-T', String(options.seconds), '-n', database], env);
    const tps = /^tps = ([\d.]+)/m.exec(out);
    if (!tps) throw new Error(`pgbench printed no "tps = …" line:\n${out}`);
    const processed = /number of transactions actually processed: (\d+)/.exec(out);
    const failed = /number of failed transactions: (\d+)/.exec(out);
    return { tps: Number(tps[1]), processed: Number(processed?.[1] ?? 0), failed: Number(failed?.[1] ?? 0), initSeconds, version };
  } finally {
    // A failed drop is reported, not thrown: it must not hide the error that brought us here.
    await tool(join(dir, 'dropdb'), ['--if-exists', '--force', database], env).catch((error: unknown) => console.error(`could not drop ${database}:`, error));
  }
}
