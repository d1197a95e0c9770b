/**
 * How each register error code becomes an API error code. Written out for every code the register raises
 * (`satisfies` makes a new register code a type error until it is mapped here, so none falls back to a
 * default); tests/services/api/app-errors-documented.test.ts checks the statuses agree.
 */
import type { RegisterErrorCode } from '../register/errors.ts';
import type { ErrorCode } from './errors.ts';

export const REGISTER_TO_API = {
  NOT_FOUND: 'NOT_FOUND',
  INVALID_INPUT: 'VALIDATION_FAILED',
  CONFLICT: 'CONFLICT',
  IDENTIFIER_TAKEN: 'IDENTIFIER_TAKEN',
  CANNOT_LINK: 'CANNOT_LINK',
  COUNTERPARTY_MERGED: 'COUNTERPARTY_MERGED',
  UNDO_BLOCKED: 'UNDO_BLOCKED',
  ALREADY_UNDONE: 'ALREADY_UNDONE',
  NOT_UNDOABLE: 'NOT_UNDOABLE',
  STALE_VERSION: 'PRECONDITION_FAILED',
  TRANSACTION_RETRIES_EXHAUSTED: 'BUSY_RETRY',
} as const satisfies Record<RegisterErrorCode, ErrorCode>;
