import type { NextFunction, Request, RequestHandler, Response } from 'express';
import { Passport } from 'passport';
import { Strategy as LocalStrategy } from 'passport-local';
import type { DataSource } from 'typeorm';

import { User } from '../accounts/user.entity';
import type { AuthService, CredentialCheck } from './auth.service';
import './session-user';

type Refusal = Exclude<CredentialCheck, { ok: true }>;

function refusal(info?: Refusal): Refusal {
  if (info?.reason === 'wait') return { ok: false, reason: 'wait', seconds: info.seconds };
  return { ok: false, reason: info?.reason === 'disabled' ? 'disabled' : 'wrong' };
}

export interface PassportWiring {
  readonly initialize: RequestHandler;
  readonly session: RequestHandler;
  /** Runs the local strategy on `{ email, password }`: the user, or why not. */
  checkCredentials(req: Request, res: Response, next: NextFunction): Promise<CredentialCheck>;
}

/**
 * A Passport instance of this app (not the global one: tests build many apps). The local strategy
 * asks AuthService; the session keeps only the user id, and each request loads the account afresh,
 * so a disabled account or a changed role takes effect at once.
 */
export function passportFor(dataSource: DataSource, auth: AuthService): PassportWiring {
  const passport = new Passport();
  passport.use(
    'local',
    new LocalStrategy({ usernameField: 'email', passwordField: 'password', session: false }, (email, password, done) => {
      auth.checkCredentials(email, password).then(
        (check) => (check.ok ? done(null, check.user) : done(null, false, { message: check.reason, ...check })),
        (err: unknown) => done(err),
      );
    }),
  );
  passport.serializeUser<string>((user, done) => done(null, (user as User).id));
  passport.deserializeUser<string>((id, done) => {
    dataSource
      .getRepository(User)
      .findOneBy({ id })
      .then((user) => done(null, user && !user.disabledAt ? user : false))
      .catch((err: unknown) => done(err));
  });
  return {
    initialize: passport.initialize(),
    session: passport.session(),
    checkCredentials: (req, res, next) =>
      new Promise<CredentialCheck>((resolve, reject) => {
        passport.authenticate('local', { session: false }, (err: unknown, user: User | false, info?: Refusal & { message: string }) => {
          if (err) reject(err);
          else resolve(user ? { ok: true, user } : refusal(info));
        })(req, res, next);
      }),
  };
}
