/** The JSON schemas the /v1 routes share (ids, pages, names, identifiers, counterparties, mentions, events). */
import { IDENTIFIER_SCHEMES, MAX_ID_LENGTH, MAX_NAME_LENGTH, NAME_KINDS, RELATION_TYPES, RESOLUTION_STATUSES } from '../../../../resolvers/vocabulary.ts';
import { MAX_PAGE, DEFAULT_PAGE, MAX_REASON } from './page-limits.ts';

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
