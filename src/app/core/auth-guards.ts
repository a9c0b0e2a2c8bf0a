import { inject } from '@angular/core';
import { type CanActivateFn, Router } from '@angular/router';

import type { Role } from '../../../shared/api/accounts';
import { AuthService } from './auth.service';

/** Visitors go to the sign-in page and come back here afterwards. */
export const signedInGuard: CanActivateFn = async (_route, state) => {
  const auth = inject(AuthService);
  const router = inject(Router);
  await auth.whenKnown();
  if (auth.signedIn()) return true;
  return router.createUrlTree(['/account/sign-in'], { queryParams: { returnUrl: state.url } });
};

/** Signed in with one of these roles; anyone else signed in sees the "not allowed" page. */
export function roleGuard(...roles: Role[]): CanActivateFn {
  return async (_route, state) => {
    const auth = inject(AuthService);
    const router = inject(Router);
    await auth.whenKnown();
    const role = auth.role();
    if (role === null) return router.createUrlTree(['/account/sign-in'], { queryParams: { returnUrl: state.url } });
    if (roles.includes(role)) return true;
    return router.createUrlTree(['/account/not-allowed'], { queryParams: { from: state.url } });
  };
}
