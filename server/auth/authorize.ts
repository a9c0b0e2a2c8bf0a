import type { NextFunction, Request, RequestHandler, Response } from 'express';
import type { DataSource } from 'typeorm';

import type { Role } from '../../shared/api/accounts';
import type { User } from '../accounts/user.entity';
import { Cohort } from '../cohorts/cohort.entity';
import { HttpProblem } from '../http/problem';
import './session-user';

/**
 * The one authorisation layer. Every route names who may call it with these guards; the role
 * always comes from the account loaded from the database for this request, never from the client.
 * Not signed in → 401 problem; signed in without the right → 403 problem.
 */
export function signedInUser(req: Request): User {
  if (!req.user) throw HttpProblem.unauthorized();
  return req.user;
}

export const requireSignedIn: RequestHandler = (req, _res, next) => {
  next(req.user ? undefined : HttpProblem.unauthorized());
};

export function requireRole(...roles: Role[]): RequestHandler {
  return (req, _res, next) => {
    if (!req.user) return next(HttpProblem.unauthorized());
    next(roles.includes(req.user.role) ? undefined : HttpProblem.forbidden());
  };
}

/** Async guards hand their errors to Express 5, which forwards rejected promises. */
type AsyncGuard = (req: Request, res: Response, next: NextFunction) => Promise<void>;

/**
 * The cohort in `:id` exists and the caller is its instructor (or an admin). Leaves the cohort in
 * `res.locals.cohort`. A cohort of another instructor answers 403, an unknown id 404.
 */
export function requireCohortInstructor(dataSource: DataSource): AsyncGuard {
  return async (req, res, next) => {
    const user = signedInUser(req);
    if (user.role !== 'instructor' && user.role !== 'admin') throw HttpProblem.forbidden();
    const id = String(req.params['id'] ?? '');
    const cohort = /^[0-9a-f-]{36}$/i.test(id) ? await dataSource.getRepository(Cohort).findOneBy({ id }) : null;
    if (!cohort) throw HttpProblem.notFound(`There is no cohort "${id}".`);
    if (user.role !== 'admin' && cohort.instructorId !== user.id) throw HttpProblem.forbidden('This cohort belongs to another instructor.');
    res.locals['cohort'] = cohort;
    next();
  };
}

/** The caller is a shop owner with a shop (left in `res.locals.shopId`). */
export const requireShopOwner: RequestHandler = (req, res, next) => {
  if (!req.user) return next(HttpProblem.unauthorized());
  if (req.user.role !== 'shop_owner') return next(HttpProblem.forbidden());
  if (!req.user.shopId) return next(HttpProblem.notFound('Your account has no shop yet.'));
  res.locals['shopId'] = req.user.shopId;
  next();
};
