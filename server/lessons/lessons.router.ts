import { Router, type Response } from 'express';

import { HttpProblem } from '../http/problem';
import type { CachedBody, LessonLibrary } from './lesson-library';

/** Sends a pre-serialised body with its ETag; a matching If-None-Match gets 304 with no body. */
function sendCached(res: Response, body: CachedBody): void {
  res.set({ ETag: body.etag, 'Cache-Control': 'no-cache' });
  if (res.req.fresh) {
    res.status(304).end();
    return;
  }
  res.type('application/json').send(body.json);
}

/** The course: outline, lesson pages and glossary, rendered once and served from memory. */
export function lessonsRouter(library: () => LessonLibrary): Router {
  const router = Router();
  router.get('/lessons', (_req, res) => sendCached(res, library().outline));
  router.get('/lessons/:slug', (req, res) => {
    const page = library().pages.get(req.params.slug);
    if (!page) throw HttpProblem.notFound(`There is no lesson "${req.params.slug}". GET /api/lessons lists them.`);
    sendCached(res, page);
  });
  router.get('/glossary', (_req, res) => sendCached(res, library().glossary));
  return router;
}
