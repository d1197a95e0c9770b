/**
 * The refused items of POST /v1/mentions/batch, each answered in its place in the request with its own problem:
 * the place (index), the item's ids when it has them, an API error code and the field as a JSON pointer.
 */
import type { MentionInput } from '../../../../resolvers/vocabulary.ts';
import type { RegisterErrorCode } from '../../../register/errors.ts';
import { REGISTER_TO_API } from '../../register-error-codes.ts';
import type { RuleError } from '../../validation.ts';

/** An item that breaks the mention schema, answered in its place with its own problem; the rest of the batch goes on. */
export function refusedItem(index: number, item: unknown, errors: RuleError[], message?: string) {
  const first = errors[0]!;
  const object = typeof item === 'object' && item !== null && !Array.isArray(item) ? (item as Record<string, unknown>) : {};
  const text = (key: string): string | undefined => (typeof object[key] === 'string' ? (object[key] as string) : undefined);
  return {
    index,
    ...(text('source') !== undefined ? { source: text('source') } : {}),
    ...(text('externalId') !== undefined ? { externalId: text('externalId') } : {}),
    status: 'rejected' as const,
    error: {
      code: 'VALIDATION_FAILED',
      message: `item ${index}: ${message ?? errors.map((e) => `${e.pointer || '(the item)'} ${e.message}`).join('; ')}`,
      field: first.pointer,
      rule: first.rule,
      errors,
    },
  };
}

/**
 * An item the register refused (a bad check digit, say), answered like a schema refusal: its place in the request
 * (the register numbers only the items it was given), its ids, the API's error code and the field as a JSON pointer.
 */
export function registerRefusal(index: number, mention: MentionInput, error: { code: string; message: string; field?: string }) {
  const code = REGISTER_TO_API[error.code as RegisterErrorCode] ?? 'VALIDATION_FAILED';
  const pointer = error.field === undefined ? '' : `/${error.field.replace(/^\//, '')}`;
  return {
    index,
    source: mention.source,
    externalId: mention.externalId,
    status: 'rejected' as const,
    error: { code, message: `item ${index}: ${error.message}`, field: pointer, errors: [{ pointer, message: error.message }] },
  };
}
