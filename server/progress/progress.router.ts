import { Router } from 'express';

import { learningRecordsQuerySchema, lessonEventSchema } from '../../shared/api/progress';
import { requireRole, requireSignedIn, signedInUser } from '../auth/authorize';
import { parseQuery } from '../http/validate-query';
import { validateBody } from '../http/validate';
import type { ProgressService } from './progress.service';

/** `/api/progress` (an apprentice's own) and `/api/learning-records` (xAPI statements). */
export function progressRouter(progress: ProgressService): Router {
  const router = Router();
  router.post('/progress/lessons/:slug', requireRole('apprentice'), validateBody(lessonEventSchema), async (req, res) => {
    const view = await progress.recordLesson(signedInUser(req), String(req.params['slug']), res.locals['body']);
    res.set('Cache-Control', 'private, no-store').json(view);
  });
  router.get('/progress', requireRole('apprentice'), async (req, res) => {
    res.set('Cache-Control', 'private, no-store').json(await progress.mine(signedInUser(req)));
  });
  router.get('/learning-records', requireSignedIn, async (req, res) => {
    const page = await progress.learningRecords(signedInUser(req), parseQuery(learningRecordsQuerySchema, req), '/api/learning-records');
    // xAPI clients read the version header; the body is a StatementResult.
    res.set('Cache-Control', 'private, no-store').set('X-Experience-API-Version', '1.0.3').json(page);
  });
  return router;
}
