/** Contracts (post: write; read: read), review items (list: read; decide: admin) and the score statistics. */
import { storeContract, type ContractInput } from '../../../register/contracts.ts';
import { applyGivenParties, type GivenParty } from '../../../register/contract-given-parties.ts';
import { normaliseIdentifierOrThrow } from '../../../register/records.ts';
import { decideReview, detailsOf, listReviewItems, type ReviewDecisionInput } from '../../../register/review.ts';
import { countOpenReviewItems, getReviewItem } from '../../../../db/queries/review.ts';
import { recentMentionScores } from '../../../../db/queries/mentions.ts';
import { decideReviewGroup, listRankedReviewItems } from '../../../register/review-queue.ts';
import { currentModel } from '../../../register/matching/model.ts';
import { findContractId, getContract, searchContracts } from '../../../../db/queries/contracts.ts';
import { ApiError, problemResponses } from '../../errors.ts';
import type { RoutePlugin } from '../../types.ts';
import {
  ID,
  ID_PARAM,
  IDENTIFIER,
  MENTION_OUT,
  NAME,
  PAGE_QUERY,
  REASON,
  SOURCE_ID,
  actorOf,
  decodeCursor,
  encodeCursor,
  page,
  pagedOf,
  v1Scope,
} from './common.ts';
import { RESOLVE_OUT, RESOLVE_REQUIRED } from './mentions.ts';
import { withLegalForm } from './legal-form.ts';

export const CONTRACT_BODY_LIMIT = 1024 * 1024;
const MAX_CONTRACT_TEXT = 1024 * 1024;

const CONTRACT_OUT = {
  type: 'object',
  properties: {
    id: { type: 'integer' },
    source: { type: 'string' },
    externalId: { type: 'string' },
    title: { type: 'string', nullable: true },
    status: { type: 'string' },
    contentHash: { type: 'string' },
    parties: {
      type: 'array',
      items: {
        type: 'object',
        properties: {
          position: { type: 'integer' },
          mentionId: { type: 'integer' },
          text: { type: 'string' },
          role: { type: 'string', nullable: true },
          terms: { type: 'array', items: { type: 'string' } },
          status: { type: 'string' },
          counterpartyId: { type: 'integer', nullable: true },
          ownEntityId: { type: 'integer', nullable: true },
          canonicalName: { type: 'string', nullable: true },
        },
      },
    },
    definedTerms: {
      type: 'array',
      items: { type: 'object', properties: { term: { type: 'string' }, partyIndex: { type: 'integer', nullable: true }, collective: { type: 'boolean' } } },
    },
    createdAt: { type: 'string' },
    updatedAt: { type: 'string' },
  },
} as const;

const SUMMARY = {
  type: 'object',
  properties: {
    id: { type: 'integer' },
    canonicalName: { type: 'string' },
    jurisdiction: { type: 'string', nullable: true },
    status: { type: 'string' },
    version: { type: 'integer' },
  },
} as const;

interface ReviewQuery {
  cursor?: string;
  limit: number;
  order: 'priority' | 'oldest';
  status: 'open' | 'decided' | 'obsolete';
  kind?: 'mention_link' | 'duplicate' | 'affiliate';
  mentionId?: number;
  counterpartyId?: number;
  createdBefore?: string;
  createdAfter?: string;
}

/** One review item with its mention and both sides; the ranked list adds priority, uncertainty and group. */
const REVIEW_ITEM_OUT = {
  type: 'object',
  required: ['id', 'kind', 'status'],
  properties: {
    id: { type: 'integer' },
    kind: { type: 'string' },
    mentionId: { type: 'integer', nullable: true },
    leftCounterpartyId: { type: 'integer', nullable: true },
    rightCounterpartyId: { type: 'integer' },
    score: { type: 'number', nullable: true },
    evidence: { type: 'object', additionalProperties: true },
    status: { type: 'string' },
    createdAt: { type: 'string' },
    mention: { ...MENTION_OUT, nullable: true },
    left: { ...SUMMARY, nullable: true },
    right: { ...SUMMARY, nullable: true },
    priority: { type: 'number', description: "order=priority: the group's rank value (higher first)" },
    uncertainty: { type: 'number', description: 'order=priority: 1 midway between the thresholds, 0 at either' },
    group: {
      type: 'object',
      description: 'order=priority: the open items one decision settles (scope "group" on the decision)',
      properties: {
        key: { type: 'string' },
        size: { type: 'integer' },
        itemIds: { type: 'array', items: { type: 'integer' } },
        contracts: { type: 'integer' },
      },
    },
    decision: { type: 'string', nullable: true },
    decidedBy: { type: 'string', nullable: true },
    decidedAt: { type: 'string', nullable: true },
    reason: { type: 'string', nullable: true },
  },
} as const;

const DECISION_OUT = {
  eventId: { type: 'integer' },
  reviewItemId: { type: 'integer' },
  decision: { type: 'string' },
  counterpartyId: { type: 'integer', nullable: true },
} as const;

/** The review list also says how many items are open in all (the console's counter). */
function withOpenCount(schema: object): object {
  const s = schema as { properties: Record<string, unknown> };
  return { ...s, properties: { ...s.properties, open: { type: 'integer', description: 'open review items in all' } } };
}

export const contractReviewRoutes: RoutePlugin = (app, deps) => {
  const ctx = v1Scope(app, deps);
  const db = deps.db;

  app.post<{ Body: ContractInput & { parties?: GivenParty[] } }>(
    '/v1/contracts',
    {
      config: { scope: 'write' },
      bodyLimit: CONTRACT_BODY_LIMIT,
      schema: {
        summary: 'Store a contract, find its parties and defined terms, and resolve each party into the register',
        description:
          'Body up to 1 MB. The same (source, externalId) with the same text answers the stored contract (alreadyStored). Mentions that named this contract before it arrived are resolved again (reresolved). ' +
          "`parties` (optional): the parties the contract system already knows. They are reconciled with the parties read from the text (`reconciliation`: which given party is which, given parties the text does not name, parties of the text not given, roles and defined terms that differ); the identifiers given for a party the text names are added to its mention, which is resolved again (`identifiersAdded`). The text stays the source of the contract's parties: a given party it does not name is reported, not added.",
        tags: ['contracts'],
        body: {
          type: 'object',
          required: ['source', 'externalId', 'text'],
          additionalProperties: false,
          properties: {
            source: SOURCE_ID,
            externalId: SOURCE_ID,
            title: { type: 'string', maxLength: 1000 },
            text: { type: 'string', minLength: 1, maxLength: MAX_CONTRACT_TEXT },
            parties: {
              type: 'array',
              maxItems: 50,
              items: {
                type: 'object',
                required: ['name'],
                additionalProperties: false,
                properties: {
                  name: NAME,
                  role: { type: 'string', minLength: 1, maxLength: 300 },
                  definedTerm: { type: 'string', minLength: 1, maxLength: 300 },
                  identifiers: { type: 'array', maxItems: 50, items: IDENTIFIER },
                },
              },
            },
          },
          example: {
            source: 'clm',
            externalId: 'C-2031',
            title: 'Supply Agreement',
            text: 'This Supply Agreement is made between Brackenridge Fabrication, Inc. ("Supplier") and Orvane Trading B.V. ("Buyer")…',
          },
        },
        response: {
          200: {
            type: 'object',
            required: ['contractId', 'alreadyStored', 'parties', 'reresolved'],
            properties: {
              contractId: { type: 'integer' },
              alreadyStored: { type: 'boolean' },
              parties: {
                type: 'array',
                items: {
                  type: 'object',
                  required: [...RESOLVE_REQUIRED, 'position', 'role', 'terms'],
                  properties: {
                    ...RESOLVE_OUT.properties,
                    position: { type: 'integer' },
                    role: { type: 'string', nullable: true },
                    terms: { type: 'array', items: { type: 'string' } },
                  },
                },
              },
              reresolved: { type: 'array', items: RESOLVE_OUT },
              contract: CONTRACT_OUT,
              reconciliation: {
                type: 'object',
                description: 'only when parties were given',
                properties: {
                  matched: { type: 'array', items: { type: 'object', properties: { given: { type: 'integer' }, position: { type: 'integer' } } } },
                  givenNotInText: { type: 'array', items: { type: 'integer' } },
                  parsedNotGiven: { type: 'array', items: { type: 'integer' } },
                  disagreements: {
                    type: 'array',
                    items: {
                      type: 'object',
                      properties: {
                        given: { type: 'integer' },
                        position: { type: 'integer' },
                        field: { type: 'string', enum: ['role', 'definedTerm'] },
                        givenValue: { type: 'string' },
                        parsedValue: { type: 'string', nullable: true },
                      },
                    },
                  },
                },
              },
              identifiersAdded: { type: 'array', items: { type: 'object', properties: { ...RESOLVE_OUT.properties, position: { type: 'integer' } } } },
            },
          },
        },
      },
    },
    async (request) => {
      const { parties: given, ...input } = request.body;
      // Every given identifier is checked before anything is stored.
      (given ?? []).forEach((g, i) => (g.identifiers ?? []).forEach((x, j) => normaliseIdentifierOrThrow(`parties/${i}/identifiers/${j}`, x)));
      const stored = await storeContract(ctx, input, actorOf(request));
      if (!given) return stored;
      return { ...stored, ...(await applyGivenParties(ctx, stored, given, actorOf(request))) };
    },
  );

  app.get<{ Querystring: { q?: string; source?: string; externalId?: string; cursor?: string; limit: number } }>(
    '/v1/contracts',
    {
      config: { scope: 'read' },
      schema: {
        summary: 'Contracts by title or external id (q), or the one with source and externalId; in id order',
        tags: ['contracts'],
        querystring: {
          type: 'object',
          additionalProperties: false,
          properties: { q: { type: 'string', maxLength: 1000 }, source: SOURCE_ID, externalId: SOURCE_ID, ...PAGE_QUERY },
        },
        response: {
          200: pagedOf({
            type: 'object',
            properties: {
              id: { type: 'integer' },
              source: { type: 'string' },
              externalId: { type: 'string' },
              title: { type: 'string', nullable: true },
              status: { type: 'string' },
              createdAt: { type: 'string' },
            },
          }),
        },
      },
    },
    async (request) => {
      const { q, source, externalId, limit } = request.query;
      const rows = await searchContracts(db, { afterId: decodeCursor(request.query.cursor), limit: limit + 1, source, externalId, q });
      return page(rows, limit);
    },
  );

  app.get<{ Params: { id: number } }>(
    '/v1/contracts/:id',
    {
      config: { scope: 'read' },
      schema: {
        summary: 'A contract with its parties (roles, terms, resolution) and defined terms',
        tags: ['contracts'],
        params: ID_PARAM,
        response: { 200: CONTRACT_OUT, ...problemResponses(404) },
      },
    },
    async (request) => {
      const contract = await getContract(db, request.params.id);
      if (!contract) throw new ApiError('NOT_FOUND', `contract ${request.params.id} does not exist`);
      return contract;
    },
  );

  app.get<{ Querystring: { source: string; externalId: string } }>(
    '/v1/contracts/by-source',
    {
      config: { scope: 'read' },
      schema: {
        summary: 'The contract with this source and external id',
        tags: ['contracts'],
        querystring: {
          type: 'object',
          required: ['source', 'externalId'],
          additionalProperties: false,
          properties: { source: SOURCE_ID, externalId: SOURCE_ID },
        },
        response: { 200: CONTRACT_OUT, ...problemResponses(404) },
      },
    },
    async (request) => {
      const id = await findContractId(db, request.query.source, request.query.externalId);
      const contract = id === undefined ? undefined : await getContract(db, id);
      if (!contract) throw new ApiError('NOT_FOUND', `no contract ${request.query.source}/${request.query.externalId}`);
      return contract;
    },
  );

  app.get<{ Querystring: ReviewQuery }>(
    '/v1/review-items',
    {
      config: { scope: 'read' },
      schema: {
        summary: 'Open review items, with both sides, the score and its explanation; most worth deciding first, or oldest first',
        description:
          'order=priority (the default): groups of items one decision settles (the same spelling of a name waiting on the same candidate) ' +
          'ranked by contracts affected × (0.5 + 0.5 × uncertainty), where uncertainty is 1 midway between newAt and linkAt; ' +
          'the items of a group come together. The order is recomputed on every call: after deciding, ask again from the start. ' +
          'order=oldest: in id order.',
        tags: ['review'],
        querystring: {
          type: 'object',
          additionalProperties: false,
          properties: {
            ...PAGE_QUERY,
            order: {
              type: 'string',
              enum: ['priority', 'oldest'],
              default: 'priority',
              description: 'priority applies to open items; other statuses come oldest first',
            },
            status: { type: 'string', enum: ['open', 'decided', 'obsolete'], default: 'open' },
            kind: { type: 'string', enum: ['mention_link', 'duplicate', 'affiliate'] },
            mentionId: { ...ID, description: 'items about this mention' },
            counterpartyId: { ...ID, description: 'items with this counterparty on either side' },
            createdBefore: { type: 'string', format: 'date-time', description: 'items raised before this instant (ISO 8601)' },
            createdAfter: { type: 'string', format: 'date-time', description: 'items raised at or after this instant (ISO 8601)' },
          },
        },
        response: {
          200: withOpenCount(pagedOf(REVIEW_ITEM_OUT)),
        },
      },
    },
    async (request) => {
      const { limit, order, cursor: _cursor, status, ...narrow } = request.query;
      const filter = { ...narrow, status };
      const start = decodeCursor(request.query.cursor);
      const open = await countOpenReviewItems(db);
      if (order === 'oldest' || status !== 'open') {
        const items = await listReviewItems(ctx, { afterId: start, limit: limit + 1, filter });
        const withForms = items.map((item) => ({ ...item, mention: item.mention ? withLegalForm(item.mention) : null }));
        return { ...page(withForms, limit), open };
      }
      // The cursor of the ranked order is the count of items already shown.
      const items = await listRankedReviewItems(ctx, { offset: start, limit: limit + 1, filter: narrow });
      const withForms = items.map((item) => ({ ...item, mention: item.mention ? withLegalForm(item.mention) : null }));
      const more = withForms.length > limit;
      return { items: more ? withForms.slice(0, limit) : withForms, nextCursor: more ? encodeCursor(start + limit) : null, open };
    },
  );

  app.get<{ Params: { id: number } }>(
    '/v1/review-items/:id',
    {
      config: { scope: 'read' },
      schema: {
        summary: 'One review item, open or decided, with both sides, the score and its explanation',
        tags: ['review'],
        params: ID_PARAM,
        response: { 200: REVIEW_ITEM_OUT, ...problemResponses(404) },
      },
    },
    async (request) => {
      const item = await getReviewItem(db, request.params.id);
      if (!item) throw new ApiError('NOT_FOUND', `review item ${request.params.id} does not exist`);
      const [detail] = await detailsOf(ctx, [item]);
      return { ...detail!, mention: detail!.mention ? withLegalForm(detail!.mention) : null };
    },
  );

  app.post<{ Params: { id: number }; Body: ReviewDecisionInput & { scope?: 'item' | 'group' } }>(
    '/v1/review-items/:id/decision',
    {
      config: { scope: 'admin' },
      schema: {
        summary:
          'Decide a review item: same (merge or link), different (a cannot-link every later resolution honours) or not_a_party (a mention that names no party)',
        tags: ['review'],
        params: ID_PARAM,
        body: {
          type: 'object',
          required: ['decision'],
          additionalProperties: false,
          properties: {
            decision: {
              type: 'string',
              enum: ['same', 'different', 'not_a_party'],
              description:
                'not_a_party (mention items only): the mention names no party (a place, a document word, a signer); it is set aside and never taught to the weights',
            },
            reason: REASON,
            scope: {
              type: 'string',
              enum: ['item', 'group'],
              default: 'item',
              description: "group: the same decision for every open item of this item's group (see GET /v1/review-items); each is its own history event",
            },
          },
          example: { decision: 'different', reason: 'different registration numbers' },
        },
        response: {
          200: {
            type: 'object',
            properties: {
              ...DECISION_OUT,
              settled: { type: 'array', description: 'scope group: every item settled', items: { type: 'object', properties: DECISION_OUT } },
              skipped: {
                type: 'array',
                description: 'scope group: items of the group left open, with why',
                items: { type: 'object', properties: { reviewItemId: { type: 'integer' }, code: { type: 'string' }, detail: { type: 'string' } } },
              },
            },
          },
          ...problemResponses(404, 409),
        },
      },
    },
    async (request) => {
      const { scope, ...input } = request.body;
      const who = actorOf(request, input.reason);
      return scope === 'group' ? decideReviewGroup(ctx, request.params.id, input, who) : decideReview(ctx, request.params.id, input, who);
    },
  );

  app.get<{ Querystring: { limit: number; buckets: number } }>(
    '/v1/stats/scores',
    {
      config: { scope: 'read' },
      schema: {
        summary: 'Distribution of recent resolution scores, with the two thresholds (linkAt, newAt)',
        tags: ['stats'],
        querystring: {
          type: 'object',
          additionalProperties: false,
          properties: {
            limit: { type: 'integer', minimum: 1, maximum: 100_000, default: 5000, description: 'how many recent scored mentions' },
            buckets: { type: 'integer', minimum: 2, maximum: 200, default: 40 },
          },
        },
        response: {
          200: {
            type: 'object',
            properties: {
              linkAt: { type: 'number' },
              newAt: { type: 'number' },
              count: { type: 'integer' },
              min: { type: 'number', nullable: true },
              max: { type: 'number', nullable: true },
              buckets: {
                type: 'array',
                items: {
                  type: 'object',
                  properties: {
                    from: { type: 'number' },
                    to: { type: 'number' },
                    count: { type: 'integer' },
                    byStatus: { type: 'object', additionalProperties: { type: 'integer' } },
                  },
                },
              },
            },
          },
        },
      },
    },
    async (request) => {
      const { model } = await currentModel(db);
      const rows = await recentMentionScores(db, request.query.limit);
      const scores = rows.map((r) => r.score);
      const min = scores.length ? Math.min(...scores, model.newAt) : null;
      const max = scores.length ? Math.max(...scores, model.linkAt) : null;
      const n = request.query.buckets;
      const width = min === null || max === null || max === min ? 1 : (max - min) / n;
      const buckets = Array.from({ length: min === null ? 0 : n }, (_, i) => ({
        from: min! + i * width,
        to: min! + (i + 1) * width,
        count: 0,
        byStatus: {} as Record<string, number>,
      }));
      rows.forEach((r, i) => {
        const b = buckets[Math.min(n - 1, Math.floor((scores[i]! - min!) / width))]!;
        b.count++;
        b.byStatus[r.status] = (b.byStatus[r.status] ?? 0) + 1;
      });
      return { linkAt: model.linkAt, newAt: model.newAt, count: rows.length, min, max, buckets };
    },
  );
};
