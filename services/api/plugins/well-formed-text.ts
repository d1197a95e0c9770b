/**
 * Text the database cannot store is refused at the door with 400 UNSTORABLE_TEXT and the parameter's pointer: a
 * lone UTF-16 surrogate (JSON allows "\ud800"; PostgreSQL's text and jsonb refuse it) and the NUL character
 * (PostgreSQL text cannot hold U+0000). Without this they reached the database and answered 500. Every part of a
 * request is checked — body, query string, path parameters and headers, keys included — iteratively (a deeply
 * nested body cannot overflow the stack). The query parser and the router hand over objects whose prototype is
 * not Object.prototype: they are copied into plain objects first, or the walk would skip them (it did).
 * A surrogate can only travel in a URL as invalid UTF-8 (its CESU-8 bytes), which the query parser would keep as
 * the raw percent-text: the raw query string is decoded strictly too (queryEncodingProblem).
 */
import type { FastifyRequest } from 'fastify';
import { ApiError, type FieldError } from '../errors.ts';
import type { AppPlugin } from '../types.ts';
import { findUnstorableText } from '../../ingest/unstorable-text.ts';
import { queryEncodingProblem } from './query-encoding-problem.ts';

export { findUnstorableText };

const PART_NAME: Record<NonNullable<FieldError['in']>, string> = { body: 'body field', query: 'query parameter', path: 'path parameter', header: 'header' };

/** Own fields of a non-plain record (query, params, headers) as a plain object the walk descends into. */
function ownFields(value: unknown): unknown {
  return value !== null && typeof value === 'object' ? Object.fromEntries(Object.entries(value)) : value;
}

function refuse(where: NonNullable<FieldError['in']>, pointer: string, message: string): ApiError {
  // Names the part, the parameter and the rule; the value itself is never repeated.
  const subject = pointer ? `${PART_NAME[where]} ${pointer}` : where === 'body' ? 'the body' : `the ${where === 'query' ? 'query string' : where}`;
  return new ApiError('UNSTORABLE_TEXT', `${subject} ${message}`, {
    errors: [{ pointer, message, in: where }],
  });
}

function check(request: FastifyRequest): void {
  const encoding = queryEncodingProblem(request.url);
  if (encoding) throw refuse('query', encoding.pointer, encoding.message);
  const parts: [NonNullable<FieldError['in']>, unknown][] = [
    // A parsed JSON body is plain objects; a streamed body (NDJSON upload) is checked line by line by its route.
    ['body', request.body],
    ['query', ownFields(request.query)],
    ['path', ownFields(request.params)],
    ['header', ownFields(request.headers)],
  ];
  for (const [where, value] of parts) {
    const found = findUnstorableText(value);
    if (found) throw refuse(where, found.pointer, found.message);
  }
}

export const wellFormedTextPlugin: AppPlugin = (app) => {
  app.addHook('preValidation', async (request) => check(request));
};
