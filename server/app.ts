import { existsSync } from 'node:fs';
import { join } from 'node:path';

import express, { type Express, type RequestHandler } from 'express';
import helmet from 'helmet';
import type { Logger } from 'pino';
import type { DataSource } from 'typeorm';

import type { Config } from './config';
import { calculatorsRouter } from './calculators/calculators.router';
import { healthRouter } from './health/health.router';
import { apiNotFound, problemHandler } from './http/error-handler';
import { requestLog } from './http/request-log';
import { LessonStore } from './lessons/lesson-store';
import { lessonsRouter } from './lessons/lessons.router';

export interface AppDependencies {
  readonly config: Config;
  readonly dataSource: DataSource;
  readonly logger: Logger;
  /** The rendered course; made from `config.contentDir` when not given. */
  readonly lessons?: LessonStore;
}

/** Builds the Express app (API + the built Angular client); it does not listen. */
export function createApp({ config, dataSource, logger, lessons = new LessonStore(config.contentDir, logger) }: AppDependencies): Express {
  const app = express();
  app.disable('x-powered-by');
  app.set('trust proxy', config.trustProxyHops);
  app.use(securityHeaders(config));
  app.use(requestLog(logger));

  const api = express.Router();
  api.use(express.json({ limit: '100kb' }));
  api.use('/health', healthRouter(dataSource));
  api.use('/calculators', calculatorsRouter());
  api.use(lessonsRouter(lessons.current));
  api.use(apiNotFound);
  app.use('/api', api);

  app.use(clientApp(config.clientDir));
  app.use(problemHandler(logger));
  return app;
}

function securityHeaders(config: Config): RequestHandler {
  return helmet({
    contentSecurityPolicy: {
      useDefaults: false,
      directives: {
        'default-src': ["'self'"],
        // No inline script anywhere: the Angular build emits files only.
        'script-src': ["'self'"],
        // Angular and KaTeX set style attributes at run time; styles cannot run code.
        'style-src': ["'self'", "'unsafe-inline'"],
        'img-src': ["'self'", 'data:', 'blob:'],
        'font-src': ["'self'"],
        'connect-src': ["'self'"],
        'object-src': ["'none'"],
        'base-uri': ["'self'"],
        'form-action': ["'self'"],
        'frame-ancestors': ["'none'"],
        ...(config.env === 'production' ? { 'upgrade-insecure-requests': [] } : {}),
      },
    },
    strictTransportSecurity: config.env === 'production',
  });
}

/** Serves the built Angular app: hashed files cached for a year, every other path gets index.html. */
function clientApp(clientDir: string): RequestHandler {
  const indexFile = join(clientDir, 'index.html');
  const files = express.static(clientDir, {
    index: false,
    setHeaders: (res, path) => {
      const hashed = /-[A-Z0-9]{8}\.(js|css|woff2?|ttf)$/.test(path) || /\/media\//.test(path);
      res.setHeader('Cache-Control', hashed ? 'public, max-age=31536000, immutable' : 'no-cache');
    },
  });
  return (req, res, next) => {
    files(req, res, () => {
      if ((req.method !== 'GET' && req.method !== 'HEAD') || !req.accepts('html') || !existsSync(indexFile)) {
        next();
        return;
      }
      res.setHeader('Cache-Control', 'no-cache');
      res.sendFile(indexFile);
    });
  };
}
