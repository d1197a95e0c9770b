/** Register errors as the problems the API answers. */
import type { RegisterError } from '../../../register/errors.ts';
import { ApiError } from '../../errors.ts';
import { REGISTER_TO_API } from '../../register-error-codes.ts';

/** A register error as the problem the API answers (field errors point into the body). */
export function toApiError(error: RegisterError): ApiError {
  const code = REGISTER_TO_API[error.code];
  const field = typeof error.details.field === 'string' ? error.details.field : undefined;
  const extensions: Record<string, unknown> = {};
  for (const [name, value] of Object.entries(error.details)) if (name !== 'field' && name !== 'what') extensions[name] = value;
  return new ApiError(code, error.message, {
    errors: code === 'VALIDATION_FAILED' ? [{ pointer: field ? `/${field.replace(/^\//, '')}` : '', message: error.message }] : undefined,
    headers: code === 'BUSY_RETRY' ? { 'retry-after': '1' } : undefined,
    extensions,
    cause: error,
  });
}
