/**
 * Structured logs (pino, one JSON object per line) with request ids. Secrets never reach a log line:
 * Authorization and cookie headers are redacted wherever they appear.
 */
import type { LoggerOptions } from 'pino';

export const REDACTED_PATHS = [
  'req.headers.authorization',
  'req.headers.cookie',
  'req.headers["x-api-key"]',
  'headers.authorization',
  'headers.cookie',
  'authorization',
];

export function loggerOptions(level: string = process.env.CPREG_LOG_LEVEL ?? 'info'): LoggerOptions {
  return {
    level,
    redact: { paths: REDACTED_PATHS, censor: '[redacted]' },
  };
}
