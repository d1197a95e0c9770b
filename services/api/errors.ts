/**
 * The error catalogue: every problem the API answers, with its stable code, HTTP status and title.
 * Codes are UPPER_SNAKE_CASE and never change meaning once published; docs/errors.md documents each
 * one (a test checks it). To add a code: add an entry here and a section in docs/errors.md.
 *
 * Answers follow RFC 9457 (Problem Details for HTTP APIs), media type application/problem+json:
 *   { type: "urn:cpreg:problem:<code>", title, status, detail, code, errors?: [{ pointer, message, in? }] }
 */

export const ERROR_CATALOGUE = {
  MALFORMED_JSON: { status: 400, title: 'The request body is not valid JSON' },
  BAD_REQUEST: { status: 400, title: 'The request cannot be read' },
  UNSTORABLE_TEXT: { status: 400, title: 'A text holds a character that cannot be stored' },
  BODY_NOT_UTF8: { status: 400, title: 'The request body is not valid UTF-8' },
  UNAUTHENTICATED: { status: 401, title: 'An API key is required' },
  FORBIDDEN: { status: 403, title: "The API key's scope does not allow this" },
  ROUTE_NOT_FOUND: { status: 404, title: 'No such route' },
  NOT_FOUND: { status: 404, title: 'No such resource' },
  METHOD_NOT_ALLOWED: { status: 405, title: 'The route does not accept this method' },
  REQUEST_TIMEOUT: { status: 408, title: 'The request was not received in time' },
  CONFLICT: { status: 409, title: 'The request conflicts with the current state' },
  IDENTIFIER_TAKEN: { status: 409, title: 'A strong identifier is held by another counterparty' },
  CANNOT_LINK: { status: 409, title: 'A recorded decision keeps these records apart' },
  COUNTERPARTY_MERGED: { status: 409, title: 'The counterparty was merged into another' },
  UNDO_BLOCKED: { status: 409, title: 'Later events depend on the event to undo' },
  ALREADY_UNDONE: { status: 409, title: 'The event was already undone' },
  IDEMPOTENCY_KEY_IN_USE: { status: 409, title: 'A request with this Idempotency-Key is still running' },
  IDEMPOTENT_ANSWER_LOST: { status: 409, title: 'The first request with this Idempotency-Key was done but its answer was lost' },
  PRECONDITION_FAILED: { status: 412, title: 'The resource changed since it was read' },
  PAYLOAD_TOO_LARGE: { status: 413, title: 'The request body is too large' },
  BATCH_TOO_LARGE: { status: 413, title: 'The batch has too many items' },
  URI_TOO_LONG: { status: 414, title: 'A path parameter is too long' },
  UNSUPPORTED_MEDIA_TYPE: { status: 415, title: 'The request body has an unsupported media type' },
  VALIDATION_FAILED: { status: 422, title: 'The request does not match its schema' },
  BODY_TOO_DEEP: { status: 422, title: 'The request body is nested too deeply' },
  ARCHIVE_REFUSED: { status: 422, title: 'The uploaded archive cannot be imported' },
  NOT_UNDOABLE: { status: 422, title: 'This event cannot be undone' },
  IDEMPOTENCY_KEY_REUSED: { status: 422, title: 'The Idempotency-Key was used for another request' },
  PRECONDITION_REQUIRED: { status: 428, title: 'The request must say which version it changes (If-Match)' },
  RATE_LIMITED: { status: 429, title: 'Too many requests' },
  HEADERS_TOO_LARGE: { status: 431, title: 'The request line and headers are too large' },
  INTERNAL_ERROR: { status: 500, title: 'Internal error' },
  DATABASE_UNAVAILABLE: { status: 503, title: 'The database is not answering' },
  SCHEMA_NOT_READY: { status: 503, title: 'The database schema is not the one this service expects' },
  BUSY_RETRY: { status: 503, title: 'The change collided with concurrent changes too often' },
} as const satisfies Record<string, { status: number; title: string }>;

export type ErrorCode = keyof typeof ERROR_CATALOGUE;

export const PROBLEM_TYPE_PREFIX = 'urn:cpreg:problem:';
export const PROBLEM_MEDIA_TYPE = 'application/problem+json';

/** Where a field error lies: a JSON pointer (RFC 6901) into the body, or into the named request part. */
export interface FieldError {
  pointer: string;
  message: string;
  /** body (default), query, path or header. */
  in?: 'body' | 'query' | 'path' | 'header';
}

export interface Problem {
  type: string;
  title: string;
  status: number;
  detail: string;
  code: ErrorCode;
  errors?: FieldError[];
  /** Extension members a route may add (e.g. limit, retryAfterSeconds). */
  [extension: string]: unknown;
}

export interface ApiErrorOptions {
  errors?: FieldError[];
  /** Headers to send with the problem (Retry-After, Location…). */
  headers?: Record<string, string>;
  /** Extra members of the problem document. */
  extensions?: Record<string, unknown>;
  cause?: unknown;
}

/** Throw from a route (or hook): the error handler answers it as problem+json. */
export class ApiError extends Error {
  readonly status: number;
  readonly errors?: FieldError[];
  readonly headers: Record<string, string>;
  readonly extensions: Record<string, unknown>;

  constructor(
    readonly code: ErrorCode,
    readonly detail: string,
    options: ApiErrorOptions = {},
  ) {
    super(detail, { cause: options.cause });
    this.name = 'ApiError';
    this.status = ERROR_CATALOGUE[code].status;
    this.errors = options.errors;
    this.headers = options.headers ?? {};
    this.extensions = options.extensions ?? {};
  }
}

export function isErrorCode(value: unknown): value is ErrorCode {
  return typeof value === 'string' && Object.hasOwn(ERROR_CATALOGUE, value);
}

export function problem(code: ErrorCode, detail: string, errors?: FieldError[], extensions: Record<string, unknown> = {}): Problem {
  const entry = ERROR_CATALOGUE[code];
  const body: Problem = { type: `${PROBLEM_TYPE_PREFIX}${code}`, title: entry.title, status: entry.status, detail, code };
  if (errors && errors.length > 0) body.errors = errors;
  // Extensions never overwrite the standard members.
  for (const [name, value] of Object.entries(extensions)) if (!(name in body)) body[name] = value;
  return body;
}

/** JSON schema of a problem document, shared as `Problem` (components.schemas.Problem in OpenAPI). */
export const PROBLEM_SCHEMA = {
  $id: 'Problem',
  type: 'object',
  description: 'RFC 9457 problem details; `code` is stable (the error catalogue: /docs/errors).',
  required: ['type', 'title', 'status', 'detail', 'code'],
  properties: {
    type: { type: 'string', example: 'urn:cpreg:problem:VALIDATION_FAILED' },
    title: { type: 'string' },
    status: { type: 'integer' },
    detail: { type: 'string' },
    code: { type: 'string', enum: Object.keys(ERROR_CATALOGUE) },
    errors: {
      type: 'array',
      items: {
        type: 'object',
        required: ['pointer', 'message'],
        properties: {
          pointer: { type: 'string', description: 'JSON pointer (RFC 6901) to the field', example: '/text' },
          message: { type: 'string' },
          in: { type: 'string', enum: ['body', 'query', 'path', 'header'] },
        },
      },
    },
  },
  additionalProperties: true,
} as const;

/**
 * Response-schema entries for route schemas, so that /openapi.json lists a route's errors:
 *   schema: { response: { 200: {...}, ...problemResponses(404, 422) } }
 * 400, 413, 415, 429, 500 and 503 apply to every route and are listed once in the API description.
 */
export function problemResponses(...statuses: number[]): Record<string, unknown> {
  const out: Record<string, unknown> = {};
  for (const status of statuses) {
    const codes = Object.entries(ERROR_CATALOGUE)
      .filter(([, entry]) => entry.status === status)
      .map(([code]) => code);
    out[String(status)] = {
      description: `Problem: ${codes.join(', ') || 'see docs/errors.md'}`,
      content: { [PROBLEM_MEDIA_TYPE]: { schema: { $ref: 'Problem#' } } },
    };
  }
  return out;
}
