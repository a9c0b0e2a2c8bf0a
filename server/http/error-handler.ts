import type { ErrorRequestHandler, RequestHandler } from 'express';
import type { Logger } from 'pino';

import { HttpProblem, PROBLEM_CONTENT_TYPE } from './problem';

/** Any /api path no router claimed. */
export const apiNotFound: RequestHandler = (req, _res, next) => {
  next(HttpProblem.notFound(`There is no API route ${req.method} ${req.originalUrl.split('?')[0]}.`));
};

interface BodyParserError extends Error {
  type?: string;
  status?: number;
  expose?: boolean;
}

/** Turns every error into RFC 9457 problem+json; unexpected ones are logged, never echoed. */
export function problemHandler(logger: Logger): ErrorRequestHandler {
  return (error: unknown, req, res, next) => {
    if (res.headersSent) {
      next(error);
      return;
    }
    const problem = toProblem(error);
    if (problem.status >= 500) logger.error({ err: error, reqId: res.locals['requestId'] }, 'request failed');
    res.status(problem.status).type(PROBLEM_CONTENT_TYPE).json(problem.toBody(req.originalUrl));
  };
}

function toProblem(error: unknown): HttpProblem {
  if (error instanceof HttpProblem) return error;
  const parserError = error as BodyParserError;
  if (parserError?.type === 'entity.parse.failed') {
    return HttpProblem.badRequest('The request body is not valid JSON.', [{ field: 'body', message: parserError.message }]);
  }
  if (parserError?.type === 'entity.too.large') {
    return new HttpProblem(413, 'Payload too large', 'The request body is larger than this endpoint accepts.');
  }
  if (parserError?.expose && typeof parserError.status === 'number' && parserError.status < 500) {
    return new HttpProblem(parserError.status, parserError.message);
  }
  return new HttpProblem(500, 'Internal server error', 'Something went wrong on our side. It has been logged.');
}
