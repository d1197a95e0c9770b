/** /v1/review-items: the ranked queue (read), one item with its details, and a decision on an item or its group (admin). */
import { decideReview, detailsOf, listReviewItems, type ReviewDecisionInput } from '../../../register/review.ts';
import { countOpenReviewItems, getReviewItem } from '../../../../db/queries/review.ts';
import { decideReviewGroup, listRankedReviewItems } from '../../../register/review-queue.ts';
import { ApiError, problemResponses } from '../../errors.ts';
import { ID, ID_PARAM, MENTION_OUT, PAGE_QUERY, REASON, pagedOf } from './schemas.ts';
import { actorOf } from './actor-of.ts';
import { decodeCursor, encodeCursor, page } from './cursors.ts';
import { withLegalForm } from './legal-form.ts';
import { INSTANT_QUERY, instantOf } from './instant-query.ts';
import type { FastifyInstance } from 'fastify';
import type { RegisterContext } from '../../../register/context.ts';
import type { AppDeps } from '../../types.ts';

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

export function reviewItemRoutes(app: FastifyInstance, deps: AppDeps, ctx: RegisterContext): void {
  const db = deps.db;

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
            createdBefore: { ...INSTANT_QUERY, description: `items raised before this instant: ${INSTANT_QUERY.description}` },
            createdAfter: { ...INSTANT_QUERY, description: `items raised at or after this instant: ${INSTANT_QUERY.description}` },
          },
        },
        response: {
          200: withOpenCount(pagedOf(REVIEW_ITEM_OUT)),
        },
      },
    },
    async (request) => {
      const { limit, order, cursor: _cursor, status, createdBefore, createdAfter, ...ids } = request.query;
      const narrow = { ...ids, createdBefore: instantOf('createdBefore', createdBefore), createdAfter: instantOf('createdAfter', createdAfter) };
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
}
