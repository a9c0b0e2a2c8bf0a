import { Router, type Response } from 'express';

import { gradeResponseSchema, gradingQueueQuerySchema, overrideResponseSchema, regradeSchema } from '../../shared/api/grading';
import { requireRole, signedInUser } from '../auth/authorize';
import { parseQuery } from '../http/validate-query';
import { validateBody } from '../http/validate';
import type { GradingService } from './grading.service';

/** Apprentices' answers and marks: never cached, not by the browser, not by anything in between. */
function privateJson(res: Response, status: number, body: unknown): void {
  res.status(status).set('Cache-Control', 'private, no-store').json(body);
}

/**
 * `/api/grading/*`: the instructor's queue of written answers, rubric marks, overrides and
 * regrades. Instructors and admins only (the guard); whose answers each may touch is decided in
 * `quiz-access.ts`, through the service (another instructor's apprentice → 403).
 */
export function gradingRouter(grading: GradingService): Router {
  const router = Router();
  const graders = requireRole('instructor', 'admin');
  router.get('/grading/queue', graders, async (req, res) => {
    const { limit } = parseQuery(gradingQueueQuerySchema, req);
    privateJson(res, 200, await grading.queue(signedInUser(req), limit));
  });
  router.get('/grading/attempts/:id', graders, async (req, res) => {
    privateJson(res, 200, await grading.attempt(signedInUser(req), String(req.params['id'])));
  });
  router.put('/grading/responses/:id', graders, validateBody(gradeResponseSchema), async (req, res) => {
    privateJson(res, 200, await grading.grade(signedInUser(req), String(req.params['id']), res.locals['body']));
  });
  router.post('/grading/responses/:id/override', graders, validateBody(overrideResponseSchema), async (req, res) => {
    privateJson(res, 200, await grading.override(signedInUser(req), String(req.params['id']), res.locals['body']));
  });
  router.get('/grading/corrections', graders, async (req, res) => {
    privateJson(res, 200, await grading.corrections(signedInUser(req)));
  });
  router.post('/grading/regrade', graders, validateBody(regradeSchema), async (req, res) => {
    const body = res.locals['body'] as { quizSlug: string; questionId: string };
    privateJson(res, 200, await grading.regrade(signedInUser(req), body.quizSlug, body.questionId));
  });
  return router;
}
