import compression from 'compression';
import express, { type Express, type RequestHandler } from 'express';
import helmet from 'helmet';
import type { Logger } from 'pino';
import type { DataSource } from 'typeorm';

import type { Config } from './config';
import { demoAccounts } from './accounts/demo-accounts';
import { profileRouter } from './accounts/profile.router';
import { adminRouter } from './admin/admin.router';
import { AdminService } from './admin/admin.service';
import { authRouter } from './auth/auth.router';
import { AuthService } from './auth/auth.service';
import { csrfGuard } from './auth/csrf';
import { passportFor } from './auth/passport-setup';
import { PasswordHasher } from './auth/passwords';
import { DEFAULT_RATE_LIMITS, type AuthRateLimits } from './auth/rate-limits';
import { sessionCookieName, sessionMiddleware, sessionTimeouts } from './auth/session';
import { calculatorsRouter } from './calculators/calculators.router';
import { cohortsRouter } from './cohorts/cohorts.router';
import { CohortsService } from './cohorts/cohorts.service';
import { gradebookRouter, shopProgressRouter } from './gradebook/gradebook.router';
import { GradebookService } from './gradebook/gradebook.service';
import { healthRouter } from './health/health.router';
import { clientApp } from './http/client-app';
import { apiNotFound, problemHandler } from './http/error-handler';
import { requestLog } from './http/request-log';
import { LessonStore } from './lessons/lesson-store';
import { lessonsRouter } from './lessons/lessons.router';
import { Mailer, smtpTransport } from './mail/mailer';
import { notificationsRouter } from './notifications/notifications.router';
import { NotificationsService } from './notifications/notifications.service';
import { progressRouter } from './progress/progress.router';
import { ProgressService } from './progress/progress.service';
import { AttemptsService } from './quizzes/attempts.service';
import { gradingRouter } from './quizzes/grading.router';
import { GradingService } from './quizzes/grading.service';
import type { QuizLibrary } from './quizzes/quiz-library';
import { quizStore } from './quizzes/quiz-store';
import { quizzesRouter } from './quizzes/quizzes.router';
import { paymentsWebhookRouter, shopOrdersRouter } from './payments/payments.router';
import { PaymentsService } from './payments/payments.service';
import { providerClient } from './payments/provider-client';
import { seatsRouter } from './seats/seats.router';
import { SeatsService } from './seats/seats.service';
import { shopsRouter } from './shops/shops.router';

export interface AppDependencies {
  readonly config: Config;
  readonly dataSource: DataSource;
  readonly logger: Logger;
  /** The rendered course; made from `config.contentDir` when not given. */
  readonly lessons?: LessonStore;
  /** The quizzes (definitions with keys: server only); loaded from `config.quizDir` on first use when not given. */
  readonly quizzes?: () => QuizLibrary;
  /** Sends and records e-mail; made from `config.mail` when not given. */
  readonly mailer?: Mailer;
  /** Per-address limits of sign-in, sign-up and reset (tests use their own key prefix). */
  readonly rateLimits?: AuthRateLimits;
  /** The clock for token expiry, session age and sign-in delays. */
  readonly now?: () => Date;
}

/** Builds the Express app (API + the built Angular client); it does not listen. */
export function createApp({
  config,
  dataSource,
  logger,
  lessons = new LessonStore(config.contentDir, logger),
  quizzes = quizStore(config.quizDir, () => lessons.current().lessons.map((lesson) => lesson.meta.slug), logger),
  mailer = new Mailer(smtpTransport(config.mail), config.mail.from, dataSource, logger),
  rateLimits = DEFAULT_RATE_LIMITS,
  now = () => new Date(),
}: AppDependencies): Express {
  const app = express();
  app.disable('x-powered-by');
  app.set('trust proxy', config.trustProxyHops);
  app.use(requestLog(logger));
  // Answers over 1 KB go out compressed (Brotli when the browser takes it). Static files come
  // compressed from the build and lessons from memory (both set Content-Encoding, so this skips them).
  app.use(compression({ threshold: 1024 }));
  const client = clientApp(config.clientDir, { serviceWorkerOff: config.serviceWorkerOff });
  app.use(client.assets);
  app.use(securityHeaders(config));

  const stripe = providerClient(config.payments);
  const seats = new SeatsService(dataSource, { mailer, appBaseUrl: config.appBaseUrl, now, pricing: config.seatPricing, buying: stripe !== undefined });
  const payments = new PaymentsService(dataSource, {
    stripe,
    webhookSecret: config.payments.webhookSecret,
    pricing: config.seatPricing,
    seats,
    mailer,
    appBaseUrl: config.appBaseUrl,
    now,
  });

  const api = express.Router();
  // The provider's events first: they need the raw body for their signature, and carry no session.
  api.use(paymentsWebhookRouter(payments));
  api.use(express.json({ limit: '100kb' }));
  api.use('/health', healthRouter(dataSource));
  // Ahead of sessions and CSRF on purpose: evaluating a calculator changes nothing (POST only because
  // the inputs are a JSON body), visitors use it, and it needs no identity, so it is CSRF-exempt.
  api.use('/calculators', calculatorsRouter());
  // The course too: the same for everyone, so no session is read or refreshed and no cookie is set
  // on an answer a shared cache may keep. (When lessons are gated, they move below and turn private.)
  api.use(lessonsRouter(lessons.current));

  // Everything below knows who is calling. Sessions in PostgreSQL, then the signed-in user, then
  // CSRF checks on every POST/PUT/PATCH/DELETE (Angular's XSRF-TOKEN cookie / X-XSRF-TOKEN header).
  const hasher = new PasswordHasher(config.passwordHashCost);
  const auth = new AuthService({ dataSource, hasher, mailer, logger, appBaseUrl: config.appBaseUrl, now });
  const passport = passportFor(dataSource, auth);
  const csrf = csrfGuard(config);
  api.use(sessionMiddleware(config, dataSource), sessionTimeouts(now), passport.initialize, passport.session, csrf.protect);

  api.use(
    '/auth',
    authRouter({
      auth,
      passport,
      csrf,
      dataSource,
      limits: rateLimits,
      sessionCookie: sessionCookieName(config),
      now,
      demoAccounts: config.demoMode ? demoAccounts() : undefined,
    }),
  );
  api.use('/account', profileRouter(dataSource));
  api.use('/admin', adminRouter(new AdminService(dataSource, now)));
  const lessonSlugs = () => lessons.current().lessons.map((lesson) => lesson.meta.slug);
  const gradebook = new GradebookService(dataSource, { quizzes, lessonSlugs, now });
  api.use('/cohorts', gradebookRouter(gradebook, dataSource));
  api.use('/cohorts', cohortsRouter(new CohortsService(dataSource), dataSource));
  api.use(shopProgressRouter(gradebook));
  api.use('/shops', shopsRouter(dataSource));
  api.use(seatsRouter(seats));
  api.use(shopOrdersRouter(payments));
  const attempts = new AttemptsService(dataSource, { quizzes, now, appBaseUrl: config.appBaseUrl });
  api.use(quizzesRouter(attempts));
  api.use(gradingRouter(new GradingService(dataSource, { quizzes, attempts, mailer, appBaseUrl: config.appBaseUrl, now })));
  api.use(notificationsRouter(new NotificationsService(dataSource)));
  api.use(progressRouter(new ProgressService(dataSource, attempts, () => lessons.current().lessons.map((lesson) => lesson.meta.slug), now)));
  api.use(apiNotFound);
  app.use('/api', api);

  app.use(client.pages);
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
