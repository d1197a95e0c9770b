/**
 * POST /v1/mentions (one mention) and POST /v1/mentions/batch (a JSON array or NDJSON, at most 10,000 items,
 * 10 MB; per-item results in input order). Larger sets go to POST /v1/jobs/ingest.
 */
import type { FastifyError, FastifyInstance } from 'fastify';
import { resolveMention } from '../../../register/resolve/resolve-mention.ts';
import { resolveBatch } from '../../../register/batch.ts';
import { RegisterError } from '../../../register/errors.ts';
import { refusedItem, registerRefusal } from './batch-refusals.ts';
import { MAX_ID_LENGTH, type MentionInput } from '../../../../resolvers/vocabulary.ts';
import { ApiError, problemResponses } from '../../errors.ts';
import type { RoutePlugin } from '../../types.ts';
import { bodyText } from '../../body/strict-json.ts';
import { bodyValidator, compileBodySchema } from '../../validation.ts';
import { COUNTRY, IDENTIFIER, NAME, SOURCE_ID } from './schemas.ts';
import { actorOf } from './actor-of.ts';
import { registerContextOf } from './register-context-of.ts';
import { toApiError } from './to-api-error.ts';

export const MAX_BATCH_ITEMS = 10_000;
export const BATCH_BODY_LIMIT = 10 * 1024 * 1024;
export const NDJSON = 'application/x-ndjson';

export const MENTION_IN = {
  type: 'object',
  required: ['source', 'externalId', 'text'],
  additionalProperties: false,
  properties: {
    source: SOURCE_ID,
    externalId: SOURCE_ID,
    text: { ...NAME, description: 'the party name as the source wrote it (at most 1,000 characters)' },
    contract: { type: 'object', required: ['source', 'externalId'], additionalProperties: false, properties: { source: SOURCE_ID, externalId: SOURCE_ID } },
    role: { type: 'string', maxLength: MAX_ID_LENGTH },
    country: COUNTRY,
    address: { type: 'string', maxLength: 2000 },
    identifiers: { type: 'array', maxItems: 50, items: IDENTIFIER },
  },
  example: {
    source: 'clm',
    externalId: 'C-2031/p2',
    text: 'Brackenridge Fabrication, Inc.',
    contract: { source: 'clm', externalId: 'C-2031' },
    role: 'Supplier',
    country: 'US-DE',
  },
} as const;

/** Every field of a resolution result (services/register/resolve ResolveResult), always present. */
export const RESOLVE_REQUIRED = [
  'mentionId',
  'source',
  'externalId',
  'status',
  'counterpartyId',
  'canonicalName',
  'ownEntityId',
  'score',
  'reviewItemId',
  'alreadyIngested',
  'eventId',
];

export const RESOLVE_OUT = {
  type: 'object',
  required: RESOLVE_REQUIRED,
  properties: {
    mentionId: { type: 'integer' },
    source: { type: 'string' },
    externalId: { type: 'string' },
    status: { type: 'string' },
    counterpartyId: { type: 'integer', nullable: true },
    canonicalName: { type: 'string', nullable: true },
    ownEntityId: { type: 'integer', nullable: true },
    score: { type: 'number', nullable: true },
    explanation: { type: 'object', additionalProperties: true },
    reviewItemId: { type: 'integer', nullable: true },
    alreadyIngested: { type: 'boolean' },
    eventId: { type: 'integer', nullable: true },
  },
  example: {
    mentionId: 311,
    source: 'clm',
    externalId: 'C-2031/p2',
    status: 'linked',
    counterpartyId: 42,
    canonicalName: 'Brackenridge Fabrication, Inc.',
    ownEntityId: null,
    score: 14.2,
    explanation: { summary: 'same core name and legal form' },
    reviewItemId: null,
    alreadyIngested: false,
    eventId: 120,
  },
} as const;

const RULE_ERROR = { type: 'object', properties: { pointer: { type: 'string' }, message: { type: 'string' }, rule: { type: 'string' } } } as const;

const BATCH_ITEM_OUT = {
  type: 'object',
  properties: {
    ...RESOLVE_OUT.properties,
    index: { type: 'integer', description: "the item's place in the request, from 0" },
    error: {
      type: 'object',
      description:
        "why the item was not taken: VALIDATION_FAILED (the item breaks the mention schema: field is its first JSON pointer inside the item, rule the schema rule, errors every one) or the register's own refusal",
      properties: {
        code: { type: 'string' },
        message: { type: 'string' },
        field: { type: 'string' },
        rule: { type: 'string' },
        errors: { type: 'array', items: RULE_ERROR },
      },
    },
  },
} as const;

const checkMention = bodyValidator(MENTION_IN);

/** The batch body's own check: an array (of anything; the items are checked one by one). */
const checkArray = compileBodySchema({ type: 'array' });

function tooLarge(detail: string, extensions: Record<string, unknown>): ApiError {
  return new ApiError('BATCH_TOO_LARGE', detail, { extensions: { ...extensions, jobRoute: '/v1/jobs/ingest' } });
}

/** NDJSON: one JSON value per non-empty line; a bad line is a 400 naming it. */
export function parseNdjson(text: string): unknown[] {
  const out: unknown[] = [];
  let line = 0;
  for (const raw of text.split('\n')) {
    line++;
    const trimmed = raw.trim();
    if (trimmed === '') continue;
    try {
      out.push(JSON.parse(trimmed));
    } catch (error) {
      throw new ApiError('MALFORMED_JSON', `line ${line} of the NDJSON body is not valid JSON: ${(error as Error).message}`, { extensions: { line } });
    }
    if (out.length > MAX_BATCH_ITEMS) {
      throw tooLarge(`the batch has more than ${MAX_BATCH_ITEMS} items; send it to POST /v1/jobs/ingest (NDJSON, any size)`, { limit: MAX_BATCH_ITEMS });
    }
  }
  return out;
}

function mentionScope(app: FastifyInstance): void {
  app.setErrorHandler((error: FastifyError | RegisterError, request, _reply) => {
    if (error instanceof RegisterError) throw toApiError(error);
    if ((error as FastifyError).code === 'FST_ERR_CTP_BODY_TOO_LARGE') {
      const limit = request.routeOptions.bodyLimit;
      throw new ApiError(
        'PAYLOAD_TOO_LARGE',
        `the body exceeds this route's limit of ${limit} bytes${request.routeOptions.url === '/v1/mentions/batch' ? '; send larger sets to POST /v1/jobs/ingest (NDJSON, any size)' : ''}`,
        {
          extensions: { limitBytes: limit, ...(request.routeOptions.url === '/v1/mentions/batch' ? { jobRoute: '/v1/jobs/ingest' } : {}) },
        },
      );
    }
    throw error;
  });
}

export const mentionRoutes: RoutePlugin = (app, deps) => {
  mentionScope(app);
  const ctx = registerContextOf(deps);
  app.addContentTypeParser(NDJSON, { parseAs: 'buffer', bodyLimit: BATCH_BODY_LIMIT }, (request, body, done) => {
    try {
      // UTF-8 to the last byte, as every JSON body (body/strict-json.ts): an ill-formed line is named, not repaired.
      done(null, parseNdjson(bodyText(request, body as Buffer, 'the NDJSON body')));
    } catch (error) {
      done(error as Error, undefined);
    }
  });

  app.post<{ Body: MentionInput }>(
    '/v1/mentions',
    {
      config: { scope: 'write' },
      schema: {
        summary: 'Resolve one mention: status, counterparty, score and the explanation',
        description:
          'The same (source, externalId) sent again with the same content answers the stored result (alreadyIngested); with another text the mention is updated and resolved again.',
        tags: ['mentions'],
        body: MENTION_IN,
        response: { 200: RESOLVE_OUT, ...problemResponses(409) },
      },
    },
    async (request) => {
      return resolveMention(ctx, request.body, actorOf(request));
    },
  );

  app.post<{ Body: MentionInput[] }>(
    '/v1/mentions/batch',
    {
      config: { scope: 'write' },
      bodyLimit: BATCH_BODY_LIMIT,
      schema: {
        summary: 'Resolve up to 10,000 mentions together (JSON array or NDJSON); results in input order',
        description:
          'Content-Type application/json (an array) or application/x-ndjson (one mention per line). At most 10,000 items and 10 MB; a larger batch answers 413 BATCH_TOO_LARGE / PAYLOAD_TOO_LARGE naming the limit and POST /v1/jobs/ingest. The batch is clustered together with the register, so the outcome does not depend on the order of the items. Every item is answered in its place: the valid ones are taken; one that breaks the mention schema (an empty text, a missing field) or that the register refuses (e.g. a bad check digit) answers status `rejected` with its own error (index, field, rule) and nothing of it is stored. With an Idempotency-Key the batch is one request: a retry answers the first answer whole.',
        tags: ['mentions'],
        body: { type: 'array', items: MENTION_IN, description: `at most ${MAX_BATCH_ITEMS} items` },
        // (The items are documented with the mention schema but checked one by one in the handler, so that one bad
        // item answers its own problem instead of refusing the batch: see validatorCompiler below.)
        response: {
          200: {
            type: 'object',
            properties: { items: { type: 'array', items: BATCH_ITEM_OUT }, counts: { type: 'object', additionalProperties: { type: 'integer' } } },
          },
          ...problemResponses(413),
        },
      },
      // The body must be an array; its items are checked one by one in the handler (per-item problems).
      validatorCompiler: ({ httpPart }) => (httpPart === 'body' ? checkArray : () => true),
      preValidation: async (request) => {
        if (Array.isArray(request.body) && request.body.length > MAX_BATCH_ITEMS) {
          throw tooLarge(
            `the batch has ${request.body.length} items, more than the limit of ${MAX_BATCH_ITEMS}; send it to POST /v1/jobs/ingest (NDJSON, any size)`,
            { limit: MAX_BATCH_ITEMS, items: request.body.length },
          );
        }
      },
    },
    async (request) => {
      const body = request.body as unknown[];
      const taken: { index: number; mention: MentionInput }[] = [];
      const answers: Array<Record<string, unknown> & { index: number; status: string; alreadyIngested?: boolean }> = new Array(body.length);
      const seen = new Map<string, number>();
      body.forEach((item, index) => {
        const errors = checkMention(item);
        if (errors.length > 0) {
          answers[index] = refusedItem(index, item, errors);
          return;
        }
        const mention = item as MentionInput;
        // A repeat is named here, by the places in the request: the register only sees the items taken.
        const key = JSON.stringify([mention.source, mention.externalId]);
        const first = seen.get(key);
        if (first !== undefined) {
          const message = `the batch holds (source, externalId) ${mention.source}/${mention.externalId} twice (items ${first} and ${index}): send each once`;
          answers[index] = refusedItem(index, item, [{ pointer: '/externalId', message, rule: 'unique' }], message);
          return;
        }
        seen.set(key, index);
        taken.push({ index, mention });
      });
      const results =
        taken.length === 0
          ? []
          : await resolveBatch(
              ctx,
              taken.map((t) => t.mention),
              actorOf(request),
            );
      results.forEach((r, i) => {
        const { index, mention } = taken[i]!;
        answers[index] = 'error' in r ? registerRefusal(index, mention, r.error) : { index, ...r };
      });
      const counts: Record<string, number> = {};
      for (const a of answers) {
        const key = a.status === 'rejected' ? 'rejected' : a.alreadyIngested ? 'already_ingested' : a.status;
        counts[key] = (counts[key] ?? 0) + 1;
      }
      return { items: answers, counts };
    },
  );
};
