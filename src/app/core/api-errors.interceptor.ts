import { HttpErrorResponse, type HttpInterceptorFn } from '@angular/common/http';
import { Injector, inject } from '@angular/core';
import { Router } from '@angular/router';
import { catchError, throwError } from 'rxjs';

import { AuthService } from './auth.service';
import { PROBLEM_DISPLAY, problemMessage, problemOf } from './problem';

// These answer 401 as part of their job: "nobody is signed in" and "wrong password".
const OWN_401 = ['/api/auth/me', '/api/auth/sign-in'];

/**
 * A 401 from the API means the session is gone: forget the user and go to the sign-in page, coming
 * back afterwards. Other problems of changes appear in a snackbar, except field errors of a form,
 * which the form shows beside its fields. Reads leave their errors to their pages.
 */
export const apiErrorsInterceptor: HttpInterceptorFn = (req, next) => {
  if (!req.url.startsWith('/api/')) return next(req);
  const router = inject(Router);
  const auth = inject(AuthService);
  const injector = inject(Injector);
  return next(req).pipe(
    catchError((error: unknown) => {
      if (!(error instanceof HttpErrorResponse)) return throwError(() => error);
      const path = req.url.split('?')[0] ?? '';
      const display = req.context.get(PROBLEM_DISPLAY) ?? (req.method === 'GET' ? 'page' : 'snackbar');
      if (error.status === 401 && !OWN_401.includes(path)) {
        auth.setUser(null);
        if (display === 'background') return throwError(() => error);
        const returnUrl = router.url.startsWith('/account/') ? undefined : router.url;
        void router.navigate(['/account/sign-in'], { queryParams: { returnUrl } });
        return throwError(() => error);
      }
      const fieldErrors = problemOf(error)?.errors?.length ?? 0;
      if (display === 'snackbar' || (display === 'form' && fieldErrors === 0)) {
        showNotice(injector, problemMessage(error));
      }
      return throwError(() => error);
    }),
  );
};

/** The snackbar loads only when there is something to say, keeping it out of the first download. */
function showNotice(injector: Injector, message: string): void {
  void import('@angular/material/snack-bar').then(({ MatSnackBar }) => {
    injector.get(MatSnackBar).open(message, 'Close', { duration: 10_000, politeness: 'assertive' });
  });
}
