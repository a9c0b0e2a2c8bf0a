import type { RequestHandler } from 'express';
import type { z } from 'zod';

import { HttpProblem, type FieldProblem } from './problem';

/** Validates `req.body` against a schema from shared/; a bad body becomes a 400 listing each field. */
export function validateBody<T extends z.ZodType>(schema: T): RequestHandler {
  return (req, res, next) => {
    const parsed = schema.safeParse(req.body);
    if (!parsed.success) {
      next(HttpProblem.badRequest('The request body is not valid.', fieldProblems(parsed.error)));
      return;
    }
    res.locals['body'] = parsed.data;
    next();
  };
}

export function fieldProblems(error: z.ZodError): FieldProblem[] {
  return error.issues.map((issue) => ({ field: issue.path.join('.') || 'body', message: issue.message }));
}
