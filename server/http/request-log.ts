import { randomUUID } from 'node:crypto';

import type { RequestHandler } from 'express';
import type { Logger } from 'pino';

/**
 * One structured line per finished request: id, method, path, status, milliseconds. Never headers
 * or bodies. Kept to a `finish` listener so a busy route pays microseconds, not a child logger.
 */
export function requestLog(logger: Logger): RequestHandler {
  return (req, res, next) => {
    const started = process.hrtime.bigint();
    const incoming = req.get('x-request-id');
    const id = incoming && /^[\w.-]{1,64}$/.test(incoming) ? incoming : randomUUID();
    res.locals['requestId'] = id;
    res.setHeader('X-Request-Id', id);
    res.on('finish', () => {
      const level = res.statusCode >= 500 ? 'error' : 'info';
      if (!logger.isLevelEnabled(level)) return;
      const ms = Number(process.hrtime.bigint() - started) / 1e6;
      logger[level]({ reqId: id, method: req.method, url: req.originalUrl.split('?')[0], status: res.statusCode, ms: Math.round(ms * 10) / 10 }, 'request');
    });
    next();
  };
}
