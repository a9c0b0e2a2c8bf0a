import type { RequestHandler } from 'express';
import { rateLimit } from 'express-rate-limit';
import type { DataSource } from 'typeorm';

import { HttpProblem } from '../http/problem';
import { PostgresRateLimitStore } from './rate-limit-store';

export interface LimitRule {
  readonly limit: number;
  readonly windowMs: number;
}

/** Requests per client address and window for the endpoints that guess or send e-mail. */
export interface AuthRateLimits {
  readonly signIn: LimitRule;
  readonly signUp: LimitRule;
  readonly passwordReset: LimitRule;
  /** Separates the counters of several apps on one database (tests). */
  readonly keyPrefix: string;
}

export const DEFAULT_RATE_LIMITS: AuthRateLimits = {
  signIn: { limit: 20, windowMs: 15 * 60_000 },
  signUp: { limit: 10, windowMs: 60 * 60_000 },
  passwordReset: { limit: 5, windowMs: 15 * 60_000 },
  keyPrefix: 'rl:',
};

/** One limiter per rule; counters live in PostgreSQL; a refusal is a 429 problem with Retry-After. */
export function rateLimiter(name: string, rule: LimitRule, limits: AuthRateLimits, dataSource: DataSource): RequestHandler {
  return rateLimit({
    windowMs: rule.windowMs,
    limit: rule.limit,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    store: new PostgresRateLimitStore(dataSource, `${limits.keyPrefix}${name}:`),
    handler: (req, res, next) => {
      const reset = (req as { rateLimit?: { resetTime?: Date } }).rateLimit?.resetTime;
      const seconds = reset ? Math.max(1, Math.ceil((reset.getTime() - Date.now()) / 1000)) : Math.ceil(rule.windowMs / 1000);
      res.setHeader('Retry-After', String(seconds));
      next(new HttpProblem(429, 'Too many requests', `Too many attempts from your address. Try again in ${seconds} seconds.`));
    },
  });
}
