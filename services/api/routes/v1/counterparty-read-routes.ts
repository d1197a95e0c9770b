/** What hangs off one counterparty: its history, its mentions, its relationship network; and every counterparty with its mentions. */
import { getCounterparty } from '../../../register/counterparties.ts';
import { eventsOfCounterparty } from '../../../../db/queries/history.ts';
import { mentionsOfCounterparty } from '../../../../db/queries/mentions.ts';
import { getSummaries } from '../../../../db/queries/counterparties.ts';
import { problemResponses } from '../../errors.ts';
import { COUNTERPARTY_OUT, EVENT_OUT, ID_PARAM, MENTION_OUT, PAGE_QUERY, REDIRECT_308, RELATION_OUT, pagedOf } from './schemas.ts';
import { decodeCursor, page } from './cursors.ts';
import { withLegalForm } from './legal-form.ts';
import { counterpartyGroups, otherPartiesOf } from '../../../../db/queries/counterparty-reads.ts';
import type { FastifyInstance } from 'fastify';
import type { RegisterContext } from '../../../register/context.ts';
import type { AppDeps } from '../../types.ts';
import { activeOr308 } from './active-or-308.ts';

const TAGS = ['counterparties'];

interface IdParams {
  id: number;
}

export function counterpartyReadRoutes(app: FastifyInstance, deps: AppDeps, ctx: RegisterContext): void {
  const db = deps.db;

  app.get<{ Params: IdParams; Querystring: { cursor?: string; limit: number } }>(
    '/v1/counterparties/:id/history',
    {
      config: { scope: 'read' },
      schema: {
        summary: "A counterparty's history, newest first",
        tags: TAGS,
        params: ID_PARAM,
        querystring: { type: 'object', additionalProperties: false, properties: PAGE_QUERY },
        response: { 200: pagedOf(EVENT_OUT), ...REDIRECT_308, ...problemResponses(404) },
      },
    },
    async (request, reply) => {
      const id = await activeOr308(request, reply, db, request.params.id);
      if (id === undefined) return reply;
      const before = decodeCursor(request.query.cursor);
      const events = await eventsOfCounterparty(db, id, { beforeId: before === 0 ? undefined : before, limit: request.query.limit + 1 });
      return page(events, request.query.limit);
    },
  );

  app.get<{ Params: IdParams; Querystring: { cursor?: string; limit: number } }>(
    '/v1/counterparties/:id/mentions',
    {
      config: { scope: 'read' },
      schema: {
        summary: 'The mentions linked to a counterparty, in id order',
        tags: TAGS,
        params: ID_PARAM,
        querystring: { type: 'object', additionalProperties: false, properties: PAGE_QUERY },
        response: { 200: pagedOf(MENTION_OUT), ...REDIRECT_308, ...problemResponses(404) },
      },
    },
    async (request, reply) => {
      const id = await activeOr308(request, reply, db, request.params.id);
      if (id === undefined) return reply;
      const mentions = await mentionsOfCounterparty(db, id, { afterId: decodeCursor(request.query.cursor), limit: request.query.limit + 1 });
      return page(mentions.map(withLegalForm), request.query.limit);
    },
  );

  app.get<{ Params: IdParams }>(
    '/v1/counterparties/:id/network',
    {
      config: { scope: 'read' },
      schema: {
        summary: 'The relationship network: contracts with roles, the other parties of those contracts, and relations',
        tags: TAGS,
        params: ID_PARAM,
        response: {
          200: {
            type: 'object',
            properties: {
              counterparty: { type: 'object', properties: { id: { type: 'integer' }, canonicalName: { type: 'string' } } },
              contracts: COUNTERPARTY_OUT.properties.contracts,
              parties: {
                type: 'array',
                items: {
                  type: 'object',
                  properties: {
                    contractId: { type: 'integer' },
                    role: { type: 'string', nullable: true },
                    counterpartyId: { type: 'integer', nullable: true },
                    ownEntityId: { type: 'integer', nullable: true },
                    name: { type: 'string' },
                  },
                },
              },
              relations: {
                type: 'array',
                items: {
                  ...RELATION_OUT,
                  properties: {
                    ...RELATION_OUT.properties,
                    relatedCounterpartyId: { type: 'integer', description: 'the counterparty at the other end of the relation' },
                    relatedCanonicalName: { type: 'string', description: 'its canonical name' },
                  },
                },
              },
            },
          },
          ...REDIRECT_308,
          ...problemResponses(404),
        },
      },
    },
    async (request, reply) => {
      const id = await activeOr308(request, reply, db, request.params.id);
      if (id === undefined) return reply;
      const view = await getCounterparty(ctx, id);
      const parties = await otherPartiesOf(db, id);
      const relatedId = (r: { fromCounterpartyId: number; toCounterpartyId: number }) =>
        r.fromCounterpartyId === id ? r.toCounterpartyId : r.fromCounterpartyId;
      const related = await getSummaries(db, [...new Set(view.counterparty.relations.map(relatedId))]);
      const relations = view.counterparty.relations.map((r) => ({
        ...r,
        relatedCounterpartyId: relatedId(r),
        relatedCanonicalName: related.get(relatedId(r))?.canonicalName ?? `counterparty #${relatedId(r)}`,
      }));
      return { counterparty: { id, canonicalName: view.counterparty.canonicalName }, contracts: view.counterparty.contracts, parties, relations };
    },
  );

  app.get<{ Querystring: { cursor?: string; limit: number; mentionsPerGroup: number } }>(
    '/v1/counterparty-groups',
    {
      config: { scope: 'read' },
      schema: {
        summary: 'Every active counterparty with its mentions grouped under it, in id order',
        tags: TAGS,
        querystring: {
          type: 'object',
          additionalProperties: false,
          properties: {
            ...PAGE_QUERY,
            limit: { type: 'integer', minimum: 1, maximum: 200, default: 50 },
            mentionsPerGroup: { type: 'integer', minimum: 0, maximum: 1000, default: 100 },
          },
        },
        response: {
          200: pagedOf({
            type: 'object',
            properties: {
              id: { type: 'integer' },
              canonicalName: { type: 'string' },
              jurisdiction: { type: 'string', nullable: true },
              version: { type: 'integer' },
              mentionCount: { type: 'integer' },
              mentions: { type: 'array', items: MENTION_OUT },
            },
          }),
        },
      },
    },
    async (request) => {
      const groups = await counterpartyGroups(db, decodeCursor(request.query.cursor), request.query.limit + 1, request.query.mentionsPerGroup);
      return page(groups, request.query.limit);
    },
  );
}
