/**
 * Errors the register raises for callers to show: each has a stable UPPER_SNAKE_CASE code (the API maps it to
 * problem+json; the CLI prints the message) and the HTTP status it corresponds to.
 */
export const REGISTER_ERROR_CODES = {
  NOT_FOUND: 404,
  INVALID_INPUT: 422,
  CONFLICT: 409,
  IDENTIFIER_TAKEN: 409,
  CANNOT_LINK: 409,
  COUNTERPARTY_MERGED: 409,
  UNDO_BLOCKED: 409,
  ALREADY_UNDONE: 409,
  NOT_UNDOABLE: 422,
  STALE_VERSION: 412,
  TRANSACTION_RETRIES_EXHAUSTED: 503,
} as const;
export type RegisterErrorCode = keyof typeof REGISTER_ERROR_CODES;

export class RegisterError extends Error {
  readonly status: number;
  constructor(
    readonly code: RegisterErrorCode,
    message: string,
    readonly details: Record<string, unknown> = {},
    options?: { cause?: unknown },
  ) {
    super(message, options);
    this.name = 'RegisterError';
    this.status = REGISTER_ERROR_CODES[code];
  }
}

export function notFound(what: string, id: number | string): RegisterError {
  return new RegisterError('NOT_FOUND', `${what} ${id} does not exist`, { what, id });
}

export function invalid(field: string, message: string): RegisterError {
  return new RegisterError('INVALID_INPUT', `${field}: ${message}`, { field });
}
