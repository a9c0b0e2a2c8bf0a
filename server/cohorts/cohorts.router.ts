import { Router } from 'express';
import type { DataSource } from 'typeorm';

import { addCohortMemberSchema, createCohortSchema } from '../../shared/api/accounts';
import { requireCohortInstructor, requireRole, signedInUser } from '../auth/authorize';
import { HttpProblem } from '../http/problem';
import { validateBody } from '../http/validate';
import type { Cohort } from './cohort.entity';
import type { CohortsService } from './cohorts.service';

/** `/api/cohorts/*`: an instructor's own cohorts (an admin sees all). */
export function cohortsRouter(cohorts: CohortsService, dataSource: DataSource): Router {
  const router = Router();
  const ownCohort = requireCohortInstructor(dataSource);
  const cohortOf = (locals: Record<string, unknown>) => locals['cohort'] as Cohort;

  router.get('/', requireRole('instructor', 'admin'), async (req, res) => {
    const user = signedInUser(req);
    res.set('Cache-Control', 'no-store').json(await cohorts.listFor(user.role === 'admin' ? null : user.id));
  });

  router.post('/', requireRole('instructor'), validateBody(createCohortSchema), async (req, res) => {
    res.status(201).json(await cohorts.create(signedInUser(req).id, res.locals['body'].name));
  });

  router.get('/:id', ownCohort, async (_req, res) => {
    res.set('Cache-Control', 'no-store').json(await cohorts.detail(cohortOf(res.locals).id));
  });

  router.post('/:id/members', ownCohort, validateBody(addCohortMemberSchema), async (_req, res) => {
    res.status(201).json(await cohorts.addMember(cohortOf(res.locals).id, res.locals['body']));
  });

  router.delete('/:id/members/:userId', ownCohort, async (req, res) => {
    const userId = String(req.params['userId']);
    if (!/^[0-9a-f-]{36}$/i.test(userId)) throw HttpProblem.notFound('That apprentice is not in this cohort.');
    await cohorts.removeMember(cohortOf(res.locals).id, userId);
    res.status(204).end();
  });
  return router;
}
