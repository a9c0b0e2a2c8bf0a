import { Router, type Response } from 'express';

import { saveAnswerSchema } from '../../shared/api/quizzes';
import { requireSignedIn, signedInUser } from '../auth/authorize';
import { validateBody } from '../http/validate';
import type { AttemptsService } from './attempts.service';

/** Per-user answers: never cached, not by the browser, not by anything in between. */
function privateJson(res: Response, status: number, body: unknown): void {
  res.status(status).set('Cache-Control', 'private, no-store').json(body);
}

/**
 * `/api/quizzes` and `/api/attempts`: the quiz list, starting an attempt, autosave, submit and the
 * result. Who may take or see what is decided in `quiz-access.ts`, through the service.
 */
export function quizzesRouter(attempts: AttemptsService): Router {
  const router = Router();
  router.get('/quizzes', requireSignedIn, async (req, res) => {
    privateJson(res, 200, await attempts.list(signedInUser(req)));
  });
  router.post('/quizzes/:slug/attempts', requireSignedIn, async (req, res) => {
    const view = await attempts.start(signedInUser(req), String(req.params['slug']));
    res.location(`/api/attempts/${view.id}`);
    privateJson(res, 201, view);
  });
  router.get('/attempts/:id', requireSignedIn, async (req, res) => {
    privateJson(res, 200, await attempts.view(signedInUser(req), String(req.params['id'])));
  });
  router.put('/attempts/:id/answers/:questionId', requireSignedIn, validateBody(saveAnswerSchema), async (req, res) => {
    const body = res.locals['body'] as { answer?: unknown };
    privateJson(res, 200, await attempts.saveAnswer(signedInUser(req), String(req.params['id']), String(req.params['questionId']), body.answer ?? null));
  });
  router.post('/attempts/:id/submit', requireSignedIn, async (req, res) => {
    privateJson(res, 200, await attempts.submit(signedInUser(req), String(req.params['id'])));
  });
  return router;
}
