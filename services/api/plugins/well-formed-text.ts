/**
 * Text the database cannot store is refused at the door with 422 and the field's pointer: a lone UTF-16
 * surrogate (JSON allows "\ud800"; PostgreSQL's text and jsonb refuse it) and the NUL character (PostgreSQL
 * text cannot hold U+0000). Without this they reached the database and answered 500. Checked for body,
 * query string and path parameters, keys included, iteratively (a deeply nested body cannot overflow the stack).
 */
import type { FastifyRequest } from 'fastify';
import { ApiError, type FieldError } from '../errors.ts';
import type { AppPlugin } from '../types.ts';
import { findUnstorableText } from '../../ingest/unstorable-text.ts';

export { findUnstorableText };

function check(request: FastifyRequest): void {
  const parts: [FieldError['in'], unknown][] = [['body', request.body], ['query', request.query], ['path', request.params]];
  for (const [where, value] of parts) {
    const found = findUnstorableText(value);
    if (found) {
      throw new ApiError('VALIDATION_FAILED', `${where} field ${found.pointer || '(the whole body)'} ${found.message}`, {
        errors: [{ pointer: found.pointer, message: found.message, in: where }],
      });
    }
  }
}

export const wellFormedTextPlugin: AppPlugin = (app) => {
  app.addHook('preValidation', async (request) => check(request));
};
