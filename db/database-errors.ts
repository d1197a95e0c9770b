/**
 * Errors that mean "the database is not answering" (as opposed to a bad query): the API turns them
 * into 503 DATABASE_UNAVAILABLE and the CLI into one line naming the server.
 */

/** Raised by openDatabase when the target cannot be reached or opened. */
export class DatabaseOpenError extends Error {
  constructor(message: string, options?: { cause?: unknown }) {
    super(message, options);
    this.name = 'DatabaseOpenError';
  }
}

/** Raised by openDatabase with `create: false` when an embedded directory holds no database; nothing was written. */
export class NoDatabaseError extends DatabaseOpenError {
  constructor(readonly target: string) {
    super(`there is no database at ${target} (nothing was created)`);
    this.name = 'NoDatabaseError';
  }
}

/** Raised when a database call does not finish within the configured timeout. */
export class DatabaseTimeoutError extends Error {
  constructor(readonly timeoutMs: number) {
    super(`the database did not answer within ${timeoutMs} ms`);
    this.name = 'DatabaseTimeoutError';
  }
}

// SQLSTATE classes and codes that say the server is away, overloaded or cancelled our statement.
const UNAVAILABLE_SQLSTATES = new Set([
  '57014', // query_canceled (statement_timeout)
  '57P01', // admin_shutdown
  '57P02', // crash_shutdown
  '57P03', // cannot_connect_now
  '53300', // too_many_connections
  '55P03', // lock_not_available (lock_timeout)
]);
const UNAVAILABLE_ERRNOS = new Set(['ECONNREFUSED', 'ECONNRESET', 'ETIMEDOUT', 'EHOSTUNREACH', 'ENOTFOUND', 'EPIPE', 'EAI_AGAIN']);
// node-postgres reports these without a code.
const UNAVAILABLE_MESSAGES = [
  'timeout exceeded when trying to connect',
  'Connection terminated',
  'Query read timeout',
  'Client has encountered a connection error',
  'connection timeout',
];

export function isDatabaseUnavailable(error: unknown): boolean {
  for (let current = error, depth = 0; current && depth < 5; depth++) {
    if (current instanceof DatabaseTimeoutError || current instanceof DatabaseOpenError) return true;
    const code = (current as { code?: unknown }).code;
    if (typeof code === 'string') {
      if (UNAVAILABLE_SQLSTATES.has(code) || UNAVAILABLE_ERRNOS.has(code) || code.startsWith('08')) return true;
    }
    const message = (current as { message?: unknown }).message;
    if (typeof message === 'string' && UNAVAILABLE_MESSAGES.some((m) => message.includes(m))) return true;
    if (current instanceof AggregateError && current.errors.some(isDatabaseUnavailable)) return true;
    current = (current as { cause?: unknown }).cause;
  }
  return false;
}

/**
 * True when the database answered that a table or column the code uses does not exist (SQLSTATE 42P01
 * undefined_table, 42703 undefined_column): the schema is not at the expected migration.
 */
export function isSchemaMissing(error: unknown): boolean {
  for (let current = error, depth = 0; current && depth < 5; depth++) {
    const code = (current as { code?: unknown }).code;
    if (code === '42P01' || code === '42703') return true;
    current = (current as { cause?: unknown }).cause;
  }
  return false;
}

/** Runs `work`, rejecting with DatabaseTimeoutError after `timeoutMs` (the work itself is not cancelled). */
export async function withDatabaseTimeout<T>(work: Promise<T>, timeoutMs: number): Promise<T> {
  let timer: NodeJS.Timeout | undefined;
  const timeout = new Promise<never>((_, reject) => {
    timer = setTimeout(() => reject(new DatabaseTimeoutError(timeoutMs)), timeoutMs);
  });
  try {
    return await Promise.race([work, timeout]);
  } finally {
    clearTimeout(timer);
  }
}
