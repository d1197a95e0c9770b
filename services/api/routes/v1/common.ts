/**
 * What every /v1 route plugin shares: the register context, the mapping of register errors to problems, the
 * actor of a request, ETags, cursors and the JSON schemas reused across routes.
 */
import type { FastifyError, FastifyInstance, FastifyReply, FastifyRequest } from 'fastify';
import { createRegisterContext, type ActorInput, type RegisterContext } from '../../../register/context.ts';
import { RegisterError } from '../../../register/errors.ts';
import { ApiError } from '../../errors.ts';
import { REGISTER_TO_API } from '../../register-error-codes.ts';
import type { AppDeps } from '../../types.ts';
import { IDENTIFIER_SCHEMES, MAX_ID_LENGTH, MAX_NAME_LENGTH, NAME_KINDS, RELATION_TYPES, RESOLUTION_STATUSES } from '../../../../resolvers/vocabulary.ts';

export const MAX_REASON = 2000;
export const MAX_PAGE = 500;
export const DEFAULT_PAGE = 50;

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

/**
 * Call at the top of a /v1 route plugin: register errors become problems (the error handler of the root
 * answers them). Throwing from a child error handler hands the error to the parent's.
 */
export function v1Scope(app: FastifyInstance, deps: AppDeps): RegisterContext {
  app.setErrorHandler((error: FastifyError | RegisterError, _request, _reply) => {
    if (error instanceof RegisterError) throw toApiError(error);
    throw error;
  });
  return registerContextOf(deps);
}

const contexts = new WeakMap<object, RegisterContext>();
/** One register context per database handle (it holds no request state). */
export function registerContextOf(deps: AppDeps): RegisterContext {
  let ctx = contexts.get(deps.db);
  if (!ctx) {
    ctx = createRegisterContext(deps.db);
    contexts.set(deps.db, ctx);
  }
  return ctx;
}

/** The actor of a request: the key's label (one key per person or system), with the request id. */
export function actorOf(request: FastifyRequest, reason?: string | null): ActorInput {
  const label = request.apiKey?.label ?? 'anonymous';
  return { actor: label, reason: reason ?? undefined, requestId: request.id };
}

export function etagOf(id: number, version: number): string {
  return `"cp${id}.v${version}"`;
}

/** The version an ETag names for counterparty `id` (weak or strong), or undefined when it names another. */
export function versionFromEtag(etag: string, id: number): number | undefined {
  const match = /^(?:W\/)?"cp(\d+)\.v(\d+)"$/.exec(etag.trim());
  if (!match || Number(match[1]) !== id) return undefined;
  return Number(match[2]);
}

/** If-Match is required on changes to a counterparty: answers the version it names. */
export function requireIfMatch(request: FastifyRequest, id: number): number {
  const header = request.headers['if-match'];
  if (typeof header !== 'string' || header.length === 0) {
    throw new ApiError('PRECONDITION_REQUIRED', `send If-Match with the ETag of counterparty ${id} (GET /v1/counterparties/${id} answers it)`);
  }
  const version = versionFromEtag(header, id);
  if (version === undefined) {
    throw new ApiError('PRECONDITION_FAILED', `If-Match ${header} is not an ETag of counterparty ${id}; read it again`);
  }
  return version;
}

/** Opaque cursors: base64url of the last id seen. */
export function encodeCursor(lastId: number): string {
  return Buffer.from(`i${lastId}`, 'utf8').toString('base64url');
}

export function decodeCursor(cursor: string | undefined, name = 'cursor'): number {
  if (cursor === undefined || cursor === '') return 0;
  const text = Buffer.from(cursor, 'base64url').toString('utf8');
  const match = /^i(\d{1,15})$/.exec(text);
  if (!match) {
    throw new ApiError('VALIDATION_FAILED', `${name} is not a cursor this service gave out`, {
      errors: [{ pointer: `/${name}`, message: 'is not a cursor this service gave out', in: 'query' }],
    });
  }
  return Number(match[1]);
}

export function page<T extends { id: number }>(items: T[], limit: number): { items: T[]; nextCursor: string | null } {
  const more = items.length > limit;
  const shown = more ? items.slice(0, limit) : items;
  return { items: shown, nextCursor: more ? encodeCursor(shown[shown.length - 1]!.id) : null };
}

/** Answers 308 to the survivor when a merged id was read (`merged` from getCounterparty). */
export function redirectToSurvivor(reply: FastifyReply, request: FastifyRequest, requestedId: number, survivorId: number): FastifyReply {
  const location = request.url.replace(`/counterparties/${requestedId}`, `/counterparties/${survivorId}`);
  return reply
    .code(308)
    .header('location', location)
    .send({ mergedId: requestedId, survivorId, location, detail: `counterparty ${requestedId} was merged into ${survivorId}` });
}

// ---- schemas ------------------------------------------------------------------------------------------------

/**
 * An id (path parameter or body field): a safe positive integer. Ids are bigint in the database, but a JSON
 * number above 2^53 − 1 is not exact in JavaScript (9007199254740993 parses as …992, another id) and one past
 * bigint's range answered 500 from the driver: both are refused by name (422) instead.
 */
export const ID = { type: 'integer', minimum: 1, maximum: Number.MAX_SAFE_INTEGER } as const;

export const ID_PARAM = {
  type: 'object',
  required: ['id'],
  additionalProperties: false,
  properties: { id: ID },
} as const;

/** Path parameters that are all ids, e.g. idParams('id', 'relationId'). */
export function idParams<const N extends string>(
  ...names: N[]
): { type: 'object'; required: N[]; additionalProperties: false; properties: Record<N, typeof ID> } {
  return { type: 'object', required: names, additionalProperties: false, properties: Object.fromEntries(names.map((n) => [n, ID])) as Record<N, typeof ID> };
}

export const PAGE_QUERY = {
  cursor: { type: 'string', maxLength: 100, description: 'opaque cursor from a previous page (nextCursor)' },
  limit: { type: 'integer', minimum: 1, maximum: MAX_PAGE, default: DEFAULT_PAGE },
} as const;

export const REDIRECT_308 = {
  308: {
    description: 'The id was merged: Location names the survivor (follow it; store the survivor id).',
    type: 'object',
    properties: { mergedId: { type: 'integer' }, survivorId: { type: 'integer' }, location: { type: 'string' }, detail: { type: 'string' } },
  },
} as const;

export const REASON = { type: 'string', maxLength: MAX_REASON, description: 'why (kept in the history)' } as const;
export const NAME = { type: 'string', minLength: 1, maxLength: MAX_NAME_LENGTH } as const;
export const SOURCE_ID = { type: 'string', minLength: 1, maxLength: MAX_ID_LENGTH } as const;
export const COUNTRY = { type: 'string', pattern: '^[A-Z]{2}(-[A-Z0-9]{1,3})?$', description: 'ISO 3166-1 alpha-2 or ISO 3166-2', example: 'DE' } as const;

export const IDENTIFIER = {
  type: 'object',
  required: ['scheme', 'value'],
  additionalProperties: false,
  properties: {
    scheme: { type: 'string', enum: [...IDENTIFIER_SCHEMES] },
    value: { type: 'string', minLength: 1, maxLength: 100 },
    label: { type: 'string', maxLength: 100 },
  },
  // An invented LEI with valid ISO 17442 check digits (ISO 7064 MOD 97-10; tests/services/api/v1-wording.test.ts checks it).
  example: { scheme: 'lei', value: 'CPREG0EXAMPLE0000185' },
} as const;

export const IDENTIFIER_OUT = {
  type: 'object',
  properties: {
    id: { type: 'integer' },
    scheme: { type: 'string' },
    value: { type: 'string' },
    label: { type: 'string', nullable: true },
    strong: { type: 'boolean' },
    source: { type: 'string', nullable: true },
    confirmedBy: { type: 'string', nullable: true },
    createdAt: { type: 'string' },
  },
} as const;

export const NAME_OUT = {
  type: 'object',
  properties: {
    id: { type: 'integer' },
    name: { type: 'string' },
    kind: { type: 'string', enum: [...NAME_KINDS] },
    legalForm: { type: 'string', nullable: true },
    seenCount: { type: 'integer' },
    source: { type: 'string', nullable: true },
    mentionId: { type: 'integer', nullable: true },
    contractId: { type: 'integer', nullable: true },
    confirmedBy: { type: 'string', nullable: true },
    createdAt: { type: 'string' },
  },
} as const;

export const RELATION_OUT = {
  type: 'object',
  properties: {
    id: { type: 'integer' },
    fromCounterpartyId: { type: 'integer' },
    toCounterpartyId: { type: 'integer' },
    type: { type: 'string', enum: [...RELATION_TYPES] },
    since: { type: 'string', nullable: true },
    origin: { type: 'string' },
    status: { type: 'string' },
    evidence: { type: 'object', additionalProperties: true },
    createdBy: { type: 'string' },
    createdAt: { type: 'string' },
  },
} as const;

export const COUNTERPARTY_SUMMARY_PROPS = {
  id: { type: 'integer' },
  canonicalName: { type: 'string' },
  kind: { type: 'string' },
  jurisdiction: { type: 'string', nullable: true },
  status: { type: 'string', enum: ['active', 'merged'] },
  mergedInto: { type: 'integer', nullable: true },
  nameLockedBy: { type: 'string', nullable: true },
  version: { type: 'integer' },
  etag: { type: 'string' },
  createdAt: { type: 'string' },
  updatedAt: { type: 'string' },
} as const;

export const COUNTERPARTY_OUT = {
  type: 'object',
  // Always present (nullable ones as null): a generated client types them as such, not as optional.
  required: ['id', 'canonicalName', 'kind', 'status', 'version'],
  properties: {
    ...COUNTERPARTY_SUMMARY_PROPS,
    names: { type: 'array', items: NAME_OUT },
    identifiers: { type: 'array', items: IDENTIFIER_OUT },
    relations: { type: 'array', items: RELATION_OUT },
    mentionCount: { type: 'integer' },
    contracts: {
      type: 'array',
      items: {
        type: 'object',
        properties: {
          contractId: { type: 'integer' },
          source: { type: 'string' },
          externalId: { type: 'string' },
          title: { type: 'string', nullable: true },
          roles: { type: 'array', items: { type: 'string' } },
        },
      },
    },
  },
  example: {
    id: 42,
    canonicalName: 'Brackenridge Fabrication, Inc.',
    kind: 'organisation',
    jurisdiction: 'US-DE',
    status: 'active',
    mergedInto: null,
    version: 3,
    etag: '"cp42.v3"',
    names: [{ id: 7, name: 'Brackenridge Fabrication, Inc.', kind: 'legal', legalForm: 'inc', seenCount: 4 }],
    identifiers: [{ id: 3, scheme: 'us_ein', value: '12-3456789', strong: true }],
    relations: [],
    mentionCount: 4,
    contracts: [{ contractId: 9, source: 'clm', externalId: 'C-2031', title: 'Supply Agreement', roles: ['Supplier'] }],
  },
} as const;

export const MENTION_OUT = {
  type: 'object',
  required: ['id', 'source', 'externalId', 'text', 'status'],
  properties: {
    id: { type: 'integer' },
    source: { type: 'string' },
    externalId: { type: 'string' },
    text: { type: 'string' },
    contract: { type: 'object', nullable: true, properties: { source: { type: 'string' }, externalId: { type: 'string' } } },
    contractId: { type: 'integer', nullable: true },
    role: { type: 'string', nullable: true },
    country: { type: 'string', nullable: true },
    address: { type: 'string', nullable: true },
    identifiers: { type: 'array', items: { type: 'object', additionalProperties: true } },
    status: { type: 'string', enum: [...RESOLUTION_STATUSES] },
    counterpartyId: { type: 'integer', nullable: true },
    ownEntityId: { type: 'integer', nullable: true },
    score: { type: 'number', nullable: true },
    evidence: { type: 'object', additionalProperties: true },
    confirmedBy: { type: 'string', nullable: true },
    reviewItemId: {
      type: 'integer',
      nullable: true,
      description: 'GET /v1/mentions/{id}: the open review item about this mention (GET /v1/review-items/{id}), null when none',
    },
    legalForm: {
      type: 'object',
      nullable: true,
      description: 'the legal form analysed from the text (as resolution reads it), null when it carries none',
      properties: { text: { type: 'string' }, family: { type: 'string' } },
    },
    createdAt: { type: 'string' },
    updatedAt: { type: 'string' },
  },
} as const;

export const EVENT_OUT = {
  type: 'object',
  properties: {
    id: { type: 'integer' },
    type: { type: 'string' },
    actor: { type: 'string' },
    at: { type: 'string' },
    reason: { type: 'string', nullable: true },
    details: { type: 'object', additionalProperties: true },
    counterpartyIds: { type: 'array', items: { type: 'integer' } },
    mentionIds: { type: 'array', items: { type: 'integer' } },
    undoesEventId: { type: 'integer', nullable: true },
    requestId: { type: 'string', nullable: true },
  },
  example: {
    id: 118,
    type: 'merged',
    actor: 'legal operations (admin key)',
    at: '2026-11-30T10:00:00.000Z',
    reason: 'same EIN',
    details: { survivorId: 42, mergedIds: [57] },
    counterpartyIds: [42, 57],
    mentionIds: [],
    undoesEventId: null,
  },
} as const;

export const CHANGE_RESULT = {
  type: 'object',
  required: ['counterpartyId', 'eventId', 'version'],
  properties: { counterpartyId: { type: 'integer' }, eventId: { type: 'integer', nullable: true }, version: { type: 'integer' }, etag: { type: 'string' } },
} as const;

export function pagedOf(items: object, example?: unknown): object {
  return {
    type: 'object',
    required: ['items', 'nextCursor'],
    properties: { items: { type: 'array', items }, nextCursor: { type: 'string', nullable: true } },
    ...(example ? { example } : {}),
  };
}

export function withEtag<T extends { id: number; version: number }>(cp: T): T & { etag: string } {
  return { ...cp, etag: etagOf(cp.id, cp.version) };
}
