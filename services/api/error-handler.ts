/**
 * One error handler for the whole API: every failure leaves as RFC 9457 application/problem+json with
 * a code from the catalogue (errors.ts). Unexpected errors are logged in full and answered 500
 * without internals; a database that does not answer becomes 503 with Retry-After.
 */
import type { FastifyError, FastifyInstance, FastifyReply, FastifyRequest } from 'fastify';
import type { ErrorObject } from 'ajv';
import { isDatabaseUnavailable, isSchemaMissing } from '../../db/database-errors.ts';
import { ApiError, ERROR_CATALOGUE, PROBLEM_MEDIA_TYPE, problem, type ErrorCode, type Problem } from './errors.ts';
import { toFieldErrors } from './validation.ts';

export const RETRY_AFTER_SECONDS_WHEN_DATABASE_DOWN = 5;

export function sendProblem(reply: FastifyReply, body: Problem, headers: Record<string, string> = {}): FastifyReply {
  for (const [name, value] of Object.entries(headers)) reply.header(name, value);
  // Serialised here, not by a route's response schema, so a problem always has the same shape.
  return reply.code(body.status).type(PROBLEM_MEDIA_TYPE).send(JSON.stringify(body));
}

export function registerErrorHandling(app: FastifyInstance): void {
  app.setNotFoundHandler((request, reply) => {
    sendProblem(reply, problem('ROUTE_NOT_FOUND', `no route ${request.method} ${pathOf(request)}; see /openapi.json or /docs`));
  });

  app.setErrorHandler((error: FastifyError, request, reply) => {
    const { body, headers, unexpected } = classify(error, request);
    if (unexpected) request.log.error({ err: error }, 'unexpected error');
    else if (body.status >= 500) request.log.warn({ err: error, code: body.code }, body.detail);
    else request.log.info({ code: body.code, status: body.status }, body.detail);
    return sendProblem(reply, body, headers);
  });
}

function acceptedTypes(request: FastifyRequest): string {
  const consumes = (request.routeOptions.schema as { consumes?: unknown } | undefined)?.consumes;
  return Array.isArray(consumes) && consumes.length > 0 ? consumes.join(' or ') : 'application/json';
}

function pathOf(request: FastifyRequest): string {
  return request.url.split('?')[0] ?? request.url;
}

interface Classified {
  body: Problem;
  headers?: Record<string, string>;
  unexpected?: boolean;
}

function classify(error: FastifyError, request: FastifyRequest): Classified {
  if (error instanceof ApiError) {
    return { body: problem(error.code, error.detail, error.errors, error.extensions), headers: error.headers };
  }
  if (error.validation) {
    const errors = toFieldErrors(error.validation as ErrorObject[], error.validationContext);
    const where = error.validationContext === 'querystring' ? 'query string' : (error.validationContext ?? 'body');
    const detail = `the ${where} does not match the schema: ${errors.map((e) => `${e.pointer || '(root)'} ${e.message}`).join('; ')}`;
    return { body: problem('VALIDATION_FAILED', detail, errors) };
  }
  if (isSchemaMissing(error)) {
    return {
      body: problem('SCHEMA_NOT_READY', 'the database schema is not at the migration this service expects; run `cpreg migrate` against it'),
      headers: { 'retry-after': String(RETRY_AFTER_SECONDS_WHEN_DATABASE_DOWN) },
    };
  }
  if (isDatabaseUnavailable(error)) {
    return {
      body: problem('DATABASE_UNAVAILABLE', 'the database did not answer in time; retry later'),
      headers: { 'retry-after': String(RETRY_AFTER_SECONDS_WHEN_DATABASE_DOWN) },
    };
  }
  switch (error.code) {
    case 'FST_ERR_CTP_INVALID_JSON_BODY':
    case 'FST_ERR_CTP_EMPTY_JSON_BODY':
      return { body: problem('MALFORMED_JSON', `the body is not valid JSON: ${error.message}`) };
    case 'FST_ERR_CTP_BODY_TOO_LARGE': {
      const limit = request.routeOptions.bodyLimit;
      return {
        body: problem('PAYLOAD_TOO_LARGE', `the body exceeds this route's limit of ${limit} bytes`, undefined, {
          limitBytes: limit,
        }),
      };
    }
    case 'FST_ERR_CTP_INVALID_MEDIA_TYPE':
      return {
        // Names what is accepted (a route that takes an upload lists its types as `consumes`: the ingest route once
        // told a CSV sender to "send application/json", which it refuses too); the caller's Content-Type is not repeated.
        body: problem(
          'UNSUPPORTED_MEDIA_TYPE',
          `the body's Content-Type is not accepted by ${request.method} ${request.routeOptions.url ?? 'this route'}; send ${acceptedTypes(request)}`,
        ),
      };
  }
  // secure-json-parse rejects __proto__ / constructor.prototype keys with a SyntaxError marked 400.
  if (error instanceof SyntaxError && error.statusCode === 400) {
    return { body: problem('MALFORMED_JSON', `the body is not valid JSON: ${error.message}`) };
  }
  const status = error.statusCode ?? 500;
  if (status >= 400 && status < 500) {
    const code = codeForStatus(status);
    return { body: problem(code, error.message || ERROR_CATALOGUE[code].title) };
  }
  return { body: problem('INTERNAL_ERROR', 'an unexpected error occurred; it has been logged'), unexpected: true };
}

const STATUS_CODES: Record<number, ErrorCode> = {
  400: 'BAD_REQUEST',
  401: 'UNAUTHENTICATED',
  403: 'FORBIDDEN',
  404: 'NOT_FOUND',
  405: 'METHOD_NOT_ALLOWED',
  409: 'CONFLICT',
  412: 'PRECONDITION_FAILED',
  413: 'PAYLOAD_TOO_LARGE',
  415: 'UNSUPPORTED_MEDIA_TYPE',
  422: 'VALIDATION_FAILED',
  429: 'RATE_LIMITED',
};

function codeForStatus(status: number): ErrorCode {
  return STATUS_CODES[status] ?? 'BAD_REQUEST';
}
