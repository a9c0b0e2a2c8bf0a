import type { RequestHandler } from 'express';
import session from 'express-session';
import connectPgSimple from 'connect-pg-simple';
import type { Pool } from 'pg';
import type { DataSource } from 'typeorm';

import type { Config } from '../config';
import './session-user';

export const IDLE_TIMEOUT_MS = 30 * 60_000;
export const ABSOLUTE_TIMEOUT_MS = 12 * 3600_000;

/** Production uses the `__Host-` prefix: the browser then insists on Secure, path=/ and no Domain. */
export function sessionCookieName(config: Config): string {
  return config.env === 'production' ? '__Host-flowlore.sid' : 'flowlore.sid';
}

/**
 * Sessions live in PostgreSQL (connect-pg-simple, table made by our migration), so any app instance
 * can serve any request and ending a session is deleting its row. The cookie is HttpOnly,
 * SameSite=Lax, Secure over TLS; it rolls: 30 idle minutes end a session, and `sessionTimeouts`
 * ends every session 12 hours after sign-in.
 */
export function sessionMiddleware(config: Config, dataSource: DataSource): RequestHandler {
  const PgStore = connectPgSimple(session);
  // The store queries through TypeORM's pool, so the app holds one pool and one set of credentials.
  const pool = { query: async (sql: string, params: unknown[]) => ({ rows: await dataSource.query(sql, params) }) } as unknown as Pool;
  const production = config.env === 'production';
  return session({
    name: sessionCookieName(config),
    secret: config.sessionSecret,
    store: new PgStore({ pool, tableName: 'session', createTableIfMissing: false, pruneSessionInterval: 15 * 60 }),
    resave: false,
    saveUninitialized: false,
    rolling: true,
    cookie: {
      httpOnly: true,
      sameSite: 'lax',
      path: '/',
      // `__Host-` requires Secure; elsewhere Secure follows the request (req.secure honours TRUST_PROXY_HOPS).
      secure: production ? true : 'auto',
      maxAge: IDLE_TIMEOUT_MS,
    },
  });
}

/** Ends a session older than the absolute limit, whatever its activity: its row goes, a blank one takes its place. */
export function sessionTimeouts(now: () => Date): RequestHandler {
  return (req, _res, next) => {
    const started = req.session?.createdAt;
    if (started && now().getTime() - started > ABSOLUTE_TIMEOUT_MS) {
      req.session.regenerate((err) => next(err));
      return;
    }
    next();
  };
}
