import type { Request, RequestHandler } from 'express';
import { doubleCsrf } from 'csrf-csrf';

import type { Config } from '../config';
import { readCookies } from '../http/cookies';
import { HttpProblem } from '../http/problem';

/** Angular's HttpClient reads this cookie and echoes it in the header below on mutating requests. */
export const CSRF_COOKIE = 'XSRF-TOKEN';
export const CSRF_HEADER = 'x-xsrf-token';
/** The problem `type` of a refused CSRF token, so the client can fetch a fresh one and retry. */
export const CSRF_PROBLEM_TYPE = '/problems/csrf-token';

/**
 * Requests exempt from CSRF checks because they change nothing: evaluating a calculator is a pure
 * computation that visitors may run (POST only because the inputs are a JSON body).
 */
function isExempt(req: Request): boolean {
  return req.method === 'POST' && /^\/api\/calculators\/[^/]+\/?$/.test(req.originalUrl.split('?')[0] ?? '');
}

export interface CsrfGuard {
  /** Rejects state-changing requests without a matching token (403 problem). */
  readonly protect: RequestHandler;
  /** Sets a fresh XSRF-TOKEN cookie bound to the current session; returns the token. */
  issue(req: Request, res: Parameters<RequestHandler>[1]): string;
}

/**
 * Double-submit CSRF tokens (csrf-csrf), bound to the session id with an HMAC under the session
 * secret: a token read from another session, or planted by a sibling subdomain, does not validate.
 * The cookie is readable by the app (not HttpOnly) by design; the session cookie is HttpOnly.
 */
export function csrfGuard(config: Config): CsrfGuard {
  const { generateCsrfToken, doubleCsrfProtection } = doubleCsrf({
    getSecret: () => config.sessionSecret,
    getSessionIdentifier: (req) => req.sessionID ?? '',
    cookieName: CSRF_COOKIE,
    cookieOptions: { httpOnly: false, sameSite: 'lax', path: '/', secure: config.env === 'production' },
    getCsrfTokenFromRequest: (req) => req.get(CSRF_HEADER),
    skipCsrfProtection: isExempt,
  });
  const withCookies: RequestHandler = (req, _res, next) => {
    (req as { cookies?: Record<string, string> }).cookies ??= readCookies(req);
    next();
  };
  const protect: RequestHandler = (req, res, next) => {
    withCookies(req, res, () => {
      doubleCsrfProtection(req, res, (err?: unknown) => {
        if (err) next(new HttpProblem(403, 'Forbidden', 'The request lacks a valid CSRF token. Reload the page and try again.', undefined, CSRF_PROBLEM_TYPE));
        else next();
      });
    });
  };
  return {
    protect,
    issue: (req, res) => {
      (req as { cookies?: Record<string, string> }).cookies ??= readCookies(req);
      return generateCsrfToken(req, res, { overwrite: true });
    },
  };
}
