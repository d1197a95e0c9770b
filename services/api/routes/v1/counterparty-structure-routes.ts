/** How counterparties are joined and cut: merge, split, and the relations between them (never a merge). */
import { mergeCounterparties } from '../../../register/merge-counterparties.ts';
import { splitCounterparty } from '../../../register/split-counterparty.ts';
import { addRelation, removeRelation } from '../../../register/relations.ts';
import { survivorOf } from '../../../register/lock-active.ts';
import { relationEnds } from '../../../../db/queries/relations.ts';
import { RELATION_TYPES } from '../../../../resolvers/vocabulary.ts';
import { ApiError, problemResponses } from '../../errors.ts';
import { ID, ID_PARAM, REASON, idParams } from './schemas.ts';
import { actorOf } from './actor-of.ts';
import { etagOf, requireIfMatch, versionFromEtag } from './etags.ts';
import type { FastifyInstance } from 'fastify';
import type { RegisterContext } from '../../../register/context.ts';
import type { AppDeps } from '../../types.ts';

const TAGS = ['counterparties'];

interface IdParams {
  id: number;
}

export function counterpartyStructureRoutes(app: FastifyInstance, deps: AppDeps, ctx: RegisterContext): void {
  const db = deps.db;

  app.post<{ Body: { items: { id: number; etag: string }[]; survivorId?: number; reason: string } }>(
    '/v1/counterparties/merge',
    {
      config: { scope: 'admin' },
      schema: {
        summary: 'Merge two or more counterparties into one survivor (412 if any changed since read)',
        tags: TAGS,
        body: {
          type: 'object',
          required: ['items', 'reason'],
          additionalProperties: false,
          properties: {
            items: {
              type: 'array',
              minItems: 2,
              maxItems: 100,
              items: {
                type: 'object',
                required: ['id', 'etag'],
                additionalProperties: false,
                properties: { id: ID, etag: { type: 'string', maxLength: 100 } },
              },
            },
            survivorId: ID,
            reason: { ...REASON, minLength: 1 },
          },
          example: {
            items: [
              { id: 42, etag: '"cp42.v3"' },
              { id: 57, etag: '"cp57.v1"' },
            ],
            survivorId: 42,
            reason: 'same EIN on both',
          },
        },
        response: {
          200: {
            type: 'object',
            properties: {
              eventId: { type: 'integer' },
              survivorId: { type: 'integer' },
              mergedIds: { type: 'array', items: { type: 'integer' } },
              version: { type: 'integer' },
              etag: { type: 'string' },
            },
          },
          ...problemResponses(404, 409, 412),
        },
      },
    },
    async (request, reply) => {
      const expectedVersions: Record<number, number> = {};
      request.body.items.forEach((item, i) => {
        const version = versionFromEtag(item.etag, item.id);
        if (version === undefined) {
          throw new ApiError('PRECONDITION_FAILED', `items/${i}/etag ${item.etag} is not an ETag of counterparty ${item.id}; read it again`);
        }
        expectedVersions[item.id] = version;
      });
      const result = await mergeCounterparties(
        ctx,
        { ids: request.body.items.map((i) => i.id), survivorId: request.body.survivorId, expectedVersions },
        actorOf(request, request.body.reason),
      );
      const etag = etagOf(result.survivorId, result.version);
      reply.header('etag', etag);
      return { ...result, etag };
    },
  );

  app.post<{ Params: IdParams; Body: { mentionIds: number[]; targetId?: number; reason: string } }>(
    '/v1/counterparties/:id/split',
    {
      config: { scope: 'admin' },
      schema: {
        summary: 'Move chosen mentions out of a counterparty into a new one or into targetId (If-Match optional)',
        tags: TAGS,
        params: ID_PARAM,
        body: {
          type: 'object',
          required: ['mentionIds', 'reason'],
          additionalProperties: false,
          properties: {
            mentionIds: { type: 'array', minItems: 1, maxItems: 10_000, items: ID },
            targetId: ID,
            reason: { ...REASON, minLength: 1 },
          },
          example: { mentionIds: [311, 312], reason: 'these name the UK subsidiary' },
        },
        response: {
          200: {
            type: 'object',
            properties: {
              eventId: { type: 'integer' },
              sourceId: { type: 'integer' },
              targetId: { type: 'integer' },
              created: { type: 'boolean' },
              movedMentionIds: { type: 'array', items: { type: 'integer' } },
            },
          },
          ...problemResponses(404, 409, 412),
        },
      },
    },
    async (request) => {
      const id = request.params.id;
      const expectedVersion = typeof request.headers['if-match'] === 'string' ? requireIfMatch(request, id) : undefined;
      return splitCounterparty(
        ctx,
        id,
        { mentionIds: request.body.mentionIds, targetId: request.body.targetId, expectedVersion },
        actorOf(request, request.body.reason),
      );
    },
  );

  app.post<{ Params: IdParams; Body: { toId: number; type: (typeof RELATION_TYPES)[number]; since?: string; reason?: string } }>(
    '/v1/counterparties/:id/relations',
    {
      config: { scope: 'admin' },
      schema: {
        summary: 'Add a relation from this counterparty (parent_of, successor_of with since, affiliate_of); never a merge',
        tags: TAGS,
        params: ID_PARAM,
        body: {
          type: 'object',
          required: ['toId', 'type'],
          additionalProperties: false,
          properties: {
            toId: ID,
            type: { type: 'string', enum: [...RELATION_TYPES] },
            since: { type: 'string', maxLength: 10, description: 'YYYY-MM-DD (successor_of)' },
            reason: REASON,
          },
          example: { toId: 57, type: 'parent_of', reason: 'group structure from the annual report' },
        },
        response: {
          201: { type: 'object', properties: { eventId: { type: 'integer', nullable: true }, relationId: { type: 'integer' } } },
          ...problemResponses(404, 409),
        },
      },
    },
    async (request, reply) => {
      const { toId, type, since, reason } = request.body;
      const result = await addRelation(ctx, { fromId: request.params.id, toId, type, ...(since ? { since } : {}) }, actorOf(request, reason));
      reply.code(201);
      return result;
    },
  );

  app.delete<{ Params: { id: number; relationId: number }; Querystring: { reason?: string } }>(
    '/v1/counterparties/:id/relations/:relationId',
    {
      config: { scope: 'admin' },
      schema: {
        summary: 'Remove a relation of this counterparty',
        tags: TAGS,
        params: idParams('id', 'relationId'),
        querystring: { type: 'object', additionalProperties: false, properties: { reason: REASON } },
        response: { 200: { type: 'object', properties: { eventId: { type: 'integer' } } }, ...problemResponses(404, 409) },
      },
    },
    async (request) => {
      const relation = await relationEnds(db, request.params.relationId);
      const survivor = await survivorOf(db, request.params.id);
      const ends = relation ? [relation.from, relation.to] : [];
      if (!relation || !survivor || !ends.includes(survivor.id)) {
        throw new ApiError('NOT_FOUND', `counterparty ${request.params.id} has no relation ${request.params.relationId}`);
      }
      return removeRelation(ctx, request.params.relationId, actorOf(request, request.query.reason));
    },
  );
}
