import { resolve } from 'node:path';

import { z } from 'zod';

import { DEFAULT_SEAT_PRICES, parseSeatTiers, type SeatPricing } from '../shared/billing/pricing';

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
  /** Serve the service worker's kill switch in place of the worker (README, "Turning the service worker off"). */
  readonly serviceWorkerOff: boolean;
  /** The lesson Markdown files (content/lessons), rendered at start-up. */
  readonly contentDir: string;
  /** The quiz definitions (content/quizzes, one YAML file per lesson), validated at start-up. */
  readonly quizDir: string;
  /** Seconds to let in-flight requests finish on shutdown before closing them. */
  readonly shutdownGraceSeconds: number;
  /** Signs session cookies and CSRF tokens; required in production. */
  readonly sessionSecret: string;
  /** bcrypt cost factor for password hashes (12 or more outside tests). */
  readonly passwordHashCost: number;
  /** Lists the demo sign-ins on GET /api/auth/demo-accounts (the demo scenario only). */
  readonly demoMode: boolean;
  /** Where links in e-mails point (the public address of the app, no trailing slash). */
  readonly appBaseUrl: string;
  readonly mail: MailConfig;
  /** What a seat costs (per-seat price by volume tier, integer cents, one currency). */
  readonly seatPricing: SeatPricing;
  readonly payments: PaymentsConfig;
}

/**
 * The payment provider: its secret key and webhook signing secret (unset: buying is switched off),
 * and, for the local fake, its address (unset: the provider's own API).
 */
export interface PaymentsConfig {
  readonly secretKey?: string;
  readonly webhookSecret?: string;
  /** e.g. `http://127.0.0.1:12111` for `server/provider-fake`; unset for the real provider. */
  readonly apiUrl?: string;
}

export interface MailConfig {
  readonly host: string;
  readonly port: number;
  /** TLS from the first byte (port 465); otherwise STARTTLS is used when the server offers it. */
  readonly secure: boolean;
  readonly user?: string;
  readonly pass?: string;
  readonly from: string;
}

const DEV_SESSION_SECRET = 'flowlore-development-session-secret-not-for-production';

const flag = z
  .enum(['true', 'false', '1', '0', 'yes', 'no'])
  .transform((value) => value === 'true' || value === '1' || value === 'yes');


const schema = z.object({
  NODE_ENV: z.enum(['development', 'test', 'production']).default('development'),
  HOST: z.string().min(1).default('127.0.0.1'),
  PORT: z.coerce.number().int().min(0).max(65535).default(4300),
  DATABASE_URL: z.url({ protocol: /^postgres(ql)?$/, error: 'DATABASE_URL must be a postgres:// URL' }),
  TRUST_PROXY_HOPS: z.coerce.number().int().min(0).default(0),
  LOG_LEVEL: z.enum(['fatal', 'error', 'warn', 'info', 'debug', 'trace', 'silent']).default('info'),
  CLIENT_DIR: z.string().min(1).default('dist/client/browser'),
  SERVICE_WORKER_OFF: flag.default(false),
  CONTENT_DIR: z.string().min(1).default('content/lessons'),
  QUIZ_DIR: z.string().min(1).default('content/quizzes'),
  SHUTDOWN_GRACE_SECONDS: z.coerce.number().positive().default(10),
  SESSION_SECRET: z.string().min(32, 'SESSION_SECRET must be at least 32 characters').optional(),
  PASSWORD_HASH_COST: z.coerce.number().int().min(4).max(15).default(12),
  DEMO_MODE: flag.default(false),
  APP_BASE_URL: z.url({ protocol: /^https?$/ }).optional(),
  SMTP_HOST: z.string().min(1).default('127.0.0.1'),
  SMTP_PORT: z.coerce.number().int().min(1).max(65535).default(1025),
  SMTP_SECURE: flag.default(false),
  SMTP_USER: z.string().min(1).optional(),
  SMTP_PASS: z.string().min(1).optional(),
  MAIL_FROM: z.string().min(3).default('Flowlore <no-reply@flowlore.test>'),
  SEAT_PRICES: z
    .string()
    .default(DEFAULT_SEAT_PRICES)
    .transform((text, ctx) => {
      const tiers = parseSeatTiers(text);
      if (typeof tiers === 'string') {
        ctx.addIssue({ code: 'custom', message: tiers });
        return z.NEVER;
      }
      return tiers;
    }),
  STRIPE_SECRET_KEY: z.string().regex(/^(sk|rk)_(test|live)_\w+$/, 'STRIPE_SECRET_KEY looks like sk_test_… or sk_live_…').optional(),
  STRIPE_WEBHOOK_SECRET: z.string().regex(/^whsec_\w+$/, 'STRIPE_WEBHOOK_SECRET looks like whsec_…').optional(),
  PAYMENT_PROVIDER_URL: z.url({ protocol: /^https?$/ }).optional(),
  SEAT_CURRENCY: z
    .string()
    .regex(/^[a-zA-Z]{3}$/, 'SEAT_CURRENCY is a three-letter ISO 4217 code, e.g. usd')
    .default('usd')
    .transform((code) => code.toLowerCase()),
}).superRefine((value, ctx) => {
  if (value.NODE_ENV === 'production' && !value.SESSION_SECRET) {
    ctx.addIssue({ code: 'custom', path: ['SESSION_SECRET'], message: 'SESSION_SECRET is required in production' });
  }
  if (value.NODE_ENV !== 'test' && value.PASSWORD_HASH_COST < 12) {
    ctx.addIssue({ code: 'custom', path: ['PASSWORD_HASH_COST'], message: 'PASSWORD_HASH_COST below 12 is allowed in tests only' });
  }
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
    serviceWorkerOff: value.SERVICE_WORKER_OFF,
    contentDir: resolve(value.CONTENT_DIR),
    quizDir: resolve(value.QUIZ_DIR),
    shutdownGraceSeconds: value.SHUTDOWN_GRACE_SECONDS,
    sessionSecret: value.SESSION_SECRET ?? DEV_SESSION_SECRET,
    passwordHashCost: value.PASSWORD_HASH_COST,
    demoMode: value.DEMO_MODE,
    appBaseUrl: (value.APP_BASE_URL ?? `http://${value.HOST === '0.0.0.0' ? '127.0.0.1' : value.HOST}:${value.PORT}`).replace(/\/+$/, ''),
    mail: {
      host: value.SMTP_HOST,
      port: value.SMTP_PORT,
      secure: value.SMTP_SECURE,
      user: value.SMTP_USER,
      pass: value.SMTP_PASS,
      from: value.MAIL_FROM,
    },
    seatPricing: { currency: value.SEAT_CURRENCY, tiers: value.SEAT_PRICES },
    payments: { secretKey: value.STRIPE_SECRET_KEY, webhookSecret: value.STRIPE_WEBHOOK_SECRET, apiUrl: value.PAYMENT_PROVIDER_URL },
  };
}
