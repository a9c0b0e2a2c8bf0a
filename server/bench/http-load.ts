import { fork } from 'node:child_process';

import autocannon from 'autocannon';

/** Shared by the benchmark scripts: 32 connections against a server in its own process. */
export const CONNECTIONS = 32;
export const DURATION_SECONDS = Number(process.env['BENCH_SECONDS'] ?? 8);

export interface LoadInit {
  method?: 'GET' | 'POST';
  body?: string;
  headers?: Record<string, string>;
  /** A fresh body for every request (defeats caches that key on the body). */
  freshBody?: () => string;
}

export interface LoadResult {
  rps: number;
  p50: number;
  p99: number;
  errors: number;
}

export async function load(url: string, init: LoadInit = {}): Promise<LoadResult> {
  const hasBody = init.body !== undefined || init.freshBody !== undefined;
  const result = await autocannon({
    url,
    method: init.method ?? 'GET',
    body: init.body,
    headers: { ...(hasBody ? { 'content-type': 'application/json' } : {}), ...init.headers },
    connections: CONNECTIONS,
    duration: DURATION_SECONDS,
    ...(init.freshBody ? { requests: [{ setupRequest: (req) => ({ ...req, body: init.freshBody!() }) }] } : {}),
  });
  return { rps: result.requests.average, p50: result.latency.p50, p99: result.latency.p99, errors: result.errors + result.non2xx };
}

export function formatLoad(name: string, r: LoadResult): string {
  return `  ${name.padEnd(38)} ${r.rps.toFixed(0).padStart(7)} req/s   p50 ${r.p50} ms   p99 ${r.p99} ms   errors ${r.errors}`;
}

/** Runs `script serve` in a child process (so load and server do not share a thread); resolves its port. */
export async function startServerProcess(script: string): Promise<{ port: number; stop: () => void }> {
  const child = fork(script, ['serve'], { stdio: 'inherit' });
  const port = await new Promise<number>((resolve) => child.once('message', (m: { port: number }) => resolve(m.port)));
  return { port, stop: () => child.kill() };
}
