import { HttpClient, HttpErrorResponse, HttpXsrfTokenExtractor, type HttpInterceptorFn, type HttpRequest } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { type Observable, catchError, finalize, map, shareReplay, switchMap, throwError } from 'rxjs';

import { problemOf } from './problem';

export const XSRF_COOKIE = 'XSRF-TOKEN';
export const XSRF_HEADER = 'X-XSRF-TOKEN';

/**
 * The CSRF token for this session. Angular's own XSRF interceptor copies the XSRF-TOKEN cookie into
 * the X-XSRF-TOKEN header of every same-origin change; this service only makes sure a cookie exists
 * (`GET /api/auth/csrf` issues one bound to the session) and fetches a fresh one when the session
 * changed under it (sign-out, idle expiry).
 */
@Injectable({ providedIn: 'root' })
export class CsrfToken {
  private readonly http = inject(HttpClient);
  private readonly cookie = inject(HttpXsrfTokenExtractor);
  private pending: Observable<string> | null = null;

  current(): string | null {
    return this.cookie.getToken();
  }

  /** One request at a time, however many changes are waiting for it. */
  refresh(): Observable<string> {
    this.pending ??= this.http.get<{ token: string }>('/api/auth/csrf').pipe(
      map((body) => body.token),
      finalize(() => (this.pending = null)),
      shareReplay(1),
    );
    return this.pending;
  }
}

function needsToken(req: HttpRequest<unknown>): boolean {
  if (req.method === 'GET' || req.method === 'HEAD' || req.method === 'OPTIONS') return false;
  // Evaluating a calculator changes nothing and is exempt on the server too.
  return req.url.startsWith('/api/') && !req.url.startsWith('/api/calculators');
}

/** The server's answer to a missing or stale token (a 403 problem naming CSRF). */
function isCsrfRefusal(error: unknown): boolean {
  return error instanceof HttpErrorResponse && error.status === 403 && problemOf(error)?.type === '/problems/csrf-token';
}

/**
 * Runs after Angular's XSRF interceptor: fetches a token before the first change of a visit, and
 * retries a change once with a fresh token when the server refused a stale one.
 */
export const csrfInterceptor: HttpInterceptorFn = (req, next) => {
  if (!needsToken(req)) return next(req);
  const csrf = inject(CsrfToken);
  const sendWith = (token: string) => next(req.clone({ headers: req.headers.set(XSRF_HEADER, token) }));
  const first = csrf.current() === null ? csrf.refresh().pipe(switchMap(sendWith)) : next(req);
  return first.pipe(
    catchError((error: unknown) => (isCsrfRefusal(error) ? csrf.refresh().pipe(switchMap(sendWith)) : throwError(() => error))),
  );
};
