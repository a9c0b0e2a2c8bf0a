import { resolve } from 'node:path';

import { z } from 'zod';

/** Server configuration, read once from the environment at start-up and passed in. */
export interface Config {
  readonly env: 'development' | 'test' | 'production';
  readonly host: string;
  readonly port: number;
  readonly databaseUrl: string;
  /** Hops of reverse proxies to trust for the client address and protocol (0 = none). */
  readonly trustProxyHops: number;
  readonly logLevel: string;
  /** The built Angular app, served from the same process as the API. */
  readonly clientDir: string;
  /** The lesson Markdown files (content/lessons), rendered at start-up. */
  readonly contentDir: string;
  /** Seconds to let in-flight requests finish on shutdown before closing them. */
  readonly shutdownGraceSeconds: number;
}

const schema = z.object({
  NODE_ENV: z.enum(['development', 'test', 'production']).default('development'),
  HOST: z.string().min(1).default('127.0.0.1'),
  PORT: z.coerce.number().int().min(0).max(65535).default(4300),
  DATABASE_URL: z.url({ protocol: /^postgres(ql)?$/, error: 'DATABASE_URL must be a postgres:// URL' }),
  TRUST_PROXY_HOPS: z.coerce.number().int().min(0).default(0),
  LOG_LEVEL: z.enum(['fatal', 'error', 'warn', 'info', 'debug', 'trace', 'silent']).default('info'),
  CLIENT_DIR: z.string().min(1).default('dist/client/browser'),
  CONTENT_DIR: z.string().min(1).default('content/lessons'),
  SHUTDOWN_GRACE_SECONDS: z.coerce.number().positive().default(10),
});

export class ConfigError extends Error {}

export function loadConfig(env: NodeJS.ProcessEnv = process.env): Config {
  const parsed = schema.safeParse(env);
  if (!parsed.success) {
    const lines = parsed.error.issues.map((issue) => `  ${issue.path.join('.')}: ${issue.message}`);
    throw new ConfigError(`Invalid configuration:\n${lines.join('\n')}`);
  }
  const value = parsed.data;
  return {
    env: value.NODE_ENV,
    host: value.HOST,
    port: value.PORT,
    databaseUrl: value.DATABASE_URL,
    trustProxyHops: value.TRUST_PROXY_HOPS,
    logLevel: value.LOG_LEVEL,
    clientDir: resolve(value.CLIENT_DIR),
    contentDir: resolve(value.CONTENT_DIR),
    shutdownGraceSeconds: value.SHUTDOWN_GRACE_SECONDS,
  };
}
