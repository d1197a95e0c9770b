/** Mention upkeep (admin): unlink, set aside, withdraw; and own entities (read to list, admin to change). */
import { setAsideMention, unlinkMention, withdrawMention } from '../../../register/upkeep.ts';
import { addOwnEntity, MAX_OWN_ENTITY_OTHER_NAMES, ownEntities, removeOwnEntity } from '../../../register/own-entities.ts';
import { OWN_ENTITY_NAME_KINDS, type OwnEntityNameKind } from '../../../../resolvers/vocabulary.ts';
import { openItemOfMention } from '../../../../db/queries/review.ts';
import { getMention } from '../../../../db/queries/mentions.ts';
import { withLegalForm } from './legal-form.ts';
import { ApiError, problemResponses } from '../../errors.ts';
import type { RoutePlugin } from '../../types.ts';
import { COUNTRY, ID_PARAM, IDENTIFIER, MENTION_OUT, NAME, REASON } from './schemas.ts';
import { actorOf } from './actor-of.ts';
import { v1Scope } from './v1-scope.ts';

const MENTION_CHANGE = {
  type: 'object',
  properties: {
    eventId: { type: 'integer', nullable: true },
    mentionId: { type: 'integer' },
    status: { type: 'string' },
    previousCounterpartyId: { type: 'integer', nullable: true },
  },
} as const;

const ACTIONS = {
  unlink: { fn: unlinkMention, summary: 'Unlink a mention from its counterparty (recorded as not that counterparty)' },
  'set-aside': { fn: setAsideMention, summary: 'Set a mention aside: it names no party' },
  withdraw: { fn: withdrawMention, summary: 'Withdraw a mention deleted in its source system' },
} as const;

const OWN_ENTITY_OUT = {
  type: 'object',
  properties: {
    id: { type: 'integer' },
    name: { type: 'string' },
    country: { type: 'string', nullable: true },
    identifiers: { type: 'array', items: { type: 'object', additionalProperties: true } },
    otherNames: { type: 'array', items: { type: 'object', properties: { name: { type: 'string' }, kind: { type: 'string' } } } },
    createdAt: { type: 'string' },
    removedAt: { type: 'string', nullable: true },
  },
} as const;

export const upkeepRoutes: RoutePlugin = (app, deps) => {
  const ctx = v1Scope(app, deps);

  app.get<{ Params: { id: number } }>(
    '/v1/mentions/:id',
    {
      config: { scope: 'read' },
      schema: {
        summary: 'One mention with its status, counterparty, score and evidence',
        tags: ['mentions'],
        params: ID_PARAM,
        response: { 200: MENTION_OUT, ...problemResponses(404) },
      },
    },
    async (request) => {
      const mention = await getMention(deps.db, request.params.id);
      if (!mention) throw new ApiError('NOT_FOUND', `mention ${request.params.id} does not exist`);
      // A contract system asks next "which item do I decide?": answered here, not by paging the queue.
      const reviewItemId = mention.status === 'review' ? ((await openItemOfMention(deps.db, mention.id)) ?? null) : null;
      return { ...withLegalForm(mention), reviewItemId };
    },
  );

  for (const [action, { fn, summary }] of Object.entries(ACTIONS)) {
    app.post<{ Params: { id: number }; Body: { reason?: string } | undefined }>(
      `/v1/mentions/:id/${action}`,
      {
        config: { scope: 'admin' },
        schema: {
          summary,
          tags: ['mentions'],
          params: ID_PARAM,
          body: { type: 'object', additionalProperties: false, properties: { reason: REASON } },
          response: { 200: MENTION_CHANGE, ...problemResponses(404, 409) },
        },
      },
      async (request) => fn(ctx, request.params.id, actorOf(request, request.body?.reason)),
    );
  }

  app.get<{ Querystring: { includeRemoved: boolean } }>(
    '/v1/own-entities',
    {
      config: { scope: 'read' },
      schema: {
        summary: 'Our own legal entities (never counterparties)',
        tags: ['own entities'],
        querystring: { type: 'object', additionalProperties: false, properties: { includeRemoved: { type: 'boolean', default: false } } },
        response: { 200: { type: 'object', properties: { items: { type: 'array', items: OWN_ENTITY_OUT } } } },
      },
    },
    async (request) => ({ items: await ownEntities(ctx, { includeRemoved: request.query.includeRemoved }) }),
  );

  app.post<{
    Body: {
      name: string;
      country?: string;
      identifiers?: { scheme: string; value: string; label?: string }[];
      otherNames?: { name: string; kind: OwnEntityNameKind }[];
      reason?: string;
    };
  }>(
    '/v1/own-entities',
    {
      config: { scope: 'admin' },
      schema: {
        summary: 'Add one of our own legal entities',
        tags: ['own entities'],
        body: {
          type: 'object',
          required: ['name'],
          additionalProperties: false,
          properties: {
            name: NAME,
            country: COUNTRY,
            identifiers: { type: 'array', maxItems: 50, items: IDENTIFIER },
            otherNames: {
              type: 'array',
              maxItems: MAX_OWN_ENTITY_OTHER_NAMES,
              description: 'other names it is known by (a trading name, a former name), recognised as ours like the legal name',
              items: {
                type: 'object',
                required: ['name', 'kind'],
                additionalProperties: false,
                properties: { name: NAME, kind: { type: 'string', enum: [...OWN_ENTITY_NAME_KINDS] } },
              },
            },
            reason: REASON,
          },
          example: { name: 'Orvane Holdings B.V.', country: 'NL', otherNames: [{ name: 'Orvane Trading', kind: 'trade' }] },
        },
        response: {
          201: {
            type: 'object',
            properties: {
              eventId: { type: 'integer', nullable: true },
              ownEntityId: { type: 'integer' },
              created: { type: 'boolean' },
              otherNamesAdded: { type: 'array', items: { type: 'string' } },
            },
          },
          ...problemResponses(409),
        },
      },
    },
    async (request, reply) => {
      const { reason, ...input } = request.body;
      const result = await addOwnEntity(ctx, input, actorOf(request, reason));
      reply.code(result.created ? 201 : 200);
      return result;
    },
  );

  app.delete<{ Params: { id: number }; Querystring: { reason?: string } }>(
    '/v1/own-entities/:id',
    {
      config: { scope: 'admin' },
      schema: {
        summary: 'Remove an own entity from the list (mentions resolved to it keep their status)',
        tags: ['own entities'],
        params: ID_PARAM,
        querystring: { type: 'object', additionalProperties: false, properties: { reason: REASON } },
        response: { 200: { type: 'object', properties: { eventId: { type: 'integer', nullable: true } } }, ...problemResponses(404) },
      },
    },
    async (request) => removeOwnEntity(ctx, request.params.id, actorOf(request, request.query.reason)),
  );
};
