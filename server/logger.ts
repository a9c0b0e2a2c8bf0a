import pino, { type Logger } from 'pino';

/** Structured JSON logs on stdout; secrets in headers never reach a log line. */
export function createLogger(level: string): Logger {
  return pino({
    level,
    base: { service: 'flowlore' },
    redact: {
      paths: ['req.headers.cookie', 'req.headers.authorization', 'res.headers["set-cookie"]', '*.password', '*.token'],
      censor: '[redacted]',
    },
  });
}
