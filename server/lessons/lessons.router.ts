import { Router } from 'express';

import { sendCachedJson as sendCached } from '../http/cached-body';
import { HttpProblem } from '../http/problem';
import type { LessonLibrary } from './lesson-library';

/** The course: outline, lesson pages and glossary, rendered and compressed once, served from memory. */
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
