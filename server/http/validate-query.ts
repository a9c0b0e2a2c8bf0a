import type { Request } from 'express';
import type { z } from 'zod';

import { HttpProblem } from './problem';
import { fieldProblems } from './validate';

/** Parses `req.query` with a schema from shared/; a bad query is a 400 naming each parameter. */
export function parseQuery<T extends z.ZodType>(schema: T, req: Request): z.infer<T> {
  const parsed = schema.safeParse(req.query);
  if (!parsed.success) throw HttpProblem.badRequest('The query is not valid.', fieldProblems(parsed.error));
  return parsed.data;
}
