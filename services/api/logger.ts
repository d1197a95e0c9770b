/**
 * Structured logs (pino, one JSON object per line) with request ids. Secrets never reach a log line:
 * Authorization and cookie headers are redacted wherever they appear.
 */
import type { LoggerOptions } from 'pino';
import { maskedError, maskedRequest, maskSensitive } from './log-mask.ts';

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
    // API keys, IBANs and phone numbers never in full; query values not at all (log-mask.ts).
    serializers: { req: maskedRequest, err: maskedError, error: maskedError },
    formatters: {
      log(object) {
        const out: Record<string, unknown> = {};
        for (const [key, value] of Object.entries(object)) out[key] = typeof value === 'string' ? maskSensitive(value) : value;
        return out;
      },
    },
    hooks: {
      logMethod(args, method) {
        method.apply(this, args.map((arg) => (typeof arg === 'string' ? maskSensitive(arg) : arg)) as Parameters<typeof method>);
      },
    },
  };
}
