import { createServer } from 'node:http';
import { setTimeout as sleep } from 'node:timers/promises';

import type { DataSource } from 'typeorm';
import type { Logger } from 'pino';

import { createApp } from './app';
import { loadConfig } from './config';
import { createDataSource } from './database/data-source';
import { LessonStore } from './lessons/lesson-store';
import { closeGracefully } from './http/graceful-shutdown';
import { createLogger } from './logger';
import { Mailer, smtpTransport } from './mail/mailer';
import { AttemptsService } from './quizzes/attempts.service';
import { quizStore } from './quizzes/quiz-store';

const EXPIRED_SWEEP_MS = 60_000;

/** Starts the API and the client on one port; stops gracefully on SIGINT/SIGTERM. */
async function main(): Promise<void> {
  const config = loadConfig();
  const logger = createLogger(config.logLevel);
  const dataSource = createDataSource({ url: config.databaseUrl, logger });
  await connectWithRetry(dataSource, logger);

  const lessons = new LessonStore(config.contentDir, logger);
  lessons.current(); // render the course now, not on the first reader's request
  if (config.env === 'development') lessons.watch();
  const mailer = new Mailer(smtpTransport(config.mail), config.mail.from, dataSource, logger);
  const quizzes = quizStore(config.quizDir, () => lessons.current().lessons.map((lesson) => lesson.meta.slug), logger);
  quizzes(); // read and check the quizzes now (problems are logged at start-up, not on a first request)
  const app = createApp({ config, dataSource, logger, lessons, mailer, quizzes });
  // Attempts past their time limit are graded within a minute even if nobody opens them again, so
  // the gradebook does not show them in progress. Safe with several instances: an attempt is
  // graded once (AttemptsService.gradeOnce).
  const attempts = new AttemptsService(dataSource, { quizzes, appBaseUrl: config.appBaseUrl });
  const sweep = setInterval(() => {
    attempts.gradeExpired().catch((err: unknown) => logger.warn({ err }, 'grading attempts past their deadline failed'));
  }, EXPIRED_SWEEP_MS);
  sweep.unref();
  const server = createServer(app);
  server.listen(config.port, config.host, () => {
    const address = server.address();
    const port = typeof address === 'object' && address ? address.port : config.port;
    logger.info({ port, host: config.host }, 'listening');
    process.stdout.write(`\nFlowlore is running at http://${config.host}:${port}/\n\n`);
  });

  let stopping = false;
  const stop = async (signal: string) => {
    if (stopping) return;
    stopping = true;
    logger.info({ signal }, 'shutting down: finishing in-flight requests');
    clearInterval(sweep);
    const { forced } = await closeGracefully(server, config.shutdownGraceSeconds * 1000);
    if (forced) logger.warn('grace period over: remaining connections were closed');
    await mailer.idle();
    await dataSource.destroy().catch((err: unknown) => logger.warn({ err }, 'closing the database pool failed'));
    logger.info('stopped');
    process.exit(0);
  };
  process.on('SIGINT', () => void stop('SIGINT'));
  process.on('SIGTERM', () => void stop('SIGTERM'));
}

/** The database may still be starting (or briefly away) when the app starts: retry for a while. */
async function connectWithRetry(dataSource: DataSource, logger: Logger, attempts = 30): Promise<void> {
  for (let attempt = 1; ; attempt++) {
    try {
      await dataSource.initialize();
      return;
    } catch (err) {
      if (attempt >= attempts) throw err;
      logger.warn({ err, attempt }, 'database not reachable yet; retrying');
      await sleep(1000);
    }
  }
}

main().catch((err: unknown) => {
  process.stderr.write(`Flowlore could not start: ${err instanceof Error ? err.message : String(err)}\n`);
  process.exit(1);
});
