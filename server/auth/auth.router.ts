import { Router, type Request } from 'express';
import type { DataSource } from 'typeorm';

import {
  changePasswordSchema,
  forgotPasswordSchema,
  resetPasswordSchema,
  signInSchema,
  signUpSchema,
  verifyEmailSchema,
  type DemoAccount,
  type MeResponse,
} from '../../shared/api/accounts';
import { toAccount } from '../accounts/account-view';
import { HttpProblem } from '../http/problem';
import { validateBody } from '../http/validate';
import type { AuthService } from './auth.service';
import { requireSignedIn, signedInUser } from './authorize';
import type { CsrfGuard } from './csrf';
import type { PassportWiring } from './passport-setup';
import { rateLimiter, type AuthRateLimits } from './rate-limits';

export interface AuthRouterDeps {
  readonly auth: AuthService;
  readonly passport: PassportWiring;
  readonly csrf: CsrfGuard;
  readonly dataSource: DataSource;
  readonly limits: AuthRateLimits;
  readonly sessionCookie: string;
  readonly now: () => Date;
  /** The demo sign-ins, listed only in demo mode. */
  readonly demoAccounts?: readonly DemoAccount[];
}

const ACCEPTED_SIGN_UP = {
  message: 'Thank you. We have sent a message to that address: follow its link to confirm it, then sign in.',
};
const ACCEPTED_RESET = { message: 'If that address has an account, a link to choose a new password is on its way. It works once, for one hour.' };

function destroy(req: Request): Promise<void> {
  return new Promise((resolve, reject) => req.session.destroy((err) => (err ? reject(err) : resolve())));
}
function login(req: Request, user: Express.User): Promise<void> {
  return new Promise((resolve, reject) => req.login(user, { session: true, keepSessionInfo: false }, (err) => (err ? reject(err) : resolve())));
}

/** `/api/auth/*`: who am I, CSRF token, sign-up, sign-in/out, verification, password reset and change. */
export function authRouter(deps: AuthRouterDeps): Router {
  const router = Router();
  const { auth, csrf, limits, dataSource } = deps;
  const signInLimit = rateLimiter('sign-in', limits.signIn, limits, dataSource);
  const signUpLimit = rateLimiter('sign-up', limits.signUp, limits, dataSource);
  const resetLimit = rateLimiter('reset', limits.passwordReset, limits, dataSource);

  router.get('/me', (req, res) => {
    const body: MeResponse = { user: req.user ? toAccount(req.user) : null };
    res.set('Cache-Control', 'no-store').json(body);
  });

  /** A CSRF token bound to this session (a visitor gets a session for it), also set as the XSRF-TOKEN cookie. */
  router.get('/csrf', (req, res) => {
    req.session.createdAt ??= deps.now().getTime();
    const token = csrf.issue(req, res);
    res.set('Cache-Control', 'no-store').json({ token });
  });

  /** The demo sign-ins in demo mode; an empty list otherwise (the sign-in page then shows none). */
  router.get('/demo-accounts', (_req, res) => {
    res.set('Cache-Control', 'no-store').json(deps.demoAccounts ?? []);
  });

  router.post('/sign-up', signUpLimit, validateBody(signUpSchema), async (_req, res) => {
    await auth.signUp(res.locals['body']);
    res.status(202).json(ACCEPTED_SIGN_UP);
  });

  router.post('/sign-in', signInLimit, validateBody(signInSchema), async (req, res, next) => {
    const check = await deps.passport.checkCredentials(req, res, next);
    if (!check.ok) {
      if (check.reason === 'wait') {
        res.setHeader('Retry-After', String(check.seconds));
        throw new HttpProblem(429, 'Too many requests', `Too many failed sign-ins for this account. Try again in ${check.seconds} seconds.`);
      }
      if (check.reason === 'disabled') throw HttpProblem.forbidden('This account is disabled. Ask your instructor, shop owner or an administrator.');
      throw new HttpProblem(401, 'Unauthorized', 'The e-mail address or the password is not right.');
    }
    await login(req, check.user); // regenerates the session id: no session fixation
    req.session.createdAt = deps.now().getTime();
    csrf.issue(req, res);
    res.json({ user: toAccount(check.user) });
  });

  router.post('/sign-out', async (req, res) => {
    if (req.session) await destroy(req);
    res.clearCookie(deps.sessionCookie, { path: '/' });
    res.status(204).end();
  });

  router.post('/verify', validateBody(verifyEmailSchema), async (_req, res) => {
    await auth.verifyEmail(res.locals['body'].token);
    res.status(204).end();
  });

  router.post('/forgot-password', resetLimit, validateBody(forgotPasswordSchema), async (_req, res) => {
    await auth.requestPasswordReset(res.locals['body'].email);
    res.status(202).json(ACCEPTED_RESET);
  });

  router.post('/reset-password', resetLimit, validateBody(resetPasswordSchema), async (_req, res) => {
    await auth.resetPassword(res.locals['body'].token, res.locals['body'].password);
    res.status(204).end();
  });

  router.post('/change-password', requireSignedIn, validateBody(changePasswordSchema), async (req, res) => {
    const { currentPassword, newPassword } = res.locals['body'];
    await auth.changePassword(signedInUser(req), currentPassword, newPassword, req.sessionID);
    res.status(204).end();
  });

  return router;
}
