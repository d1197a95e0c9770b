/** POST /v1/history/{eventId}/undo (admin) and GET /v1/changes: the change feed with a cursor (read). */
import { undoEvent } from '../../../register/history/undo.ts';
import { eventsAfter, getEvent, lastEventId } from '../../../../db/queries/history.ts';
import { ApiError, problemResponses } from '../../errors.ts';
import type { RoutePlugin } from '../../types.ts';
import { EVENT_OUT, REASON, idParams } from './schemas.ts';
import { actorOf } from './actor-of.ts';
import { decodeCursor, encodeCursor } from './cursors.ts';
import { v1Scope } from './v1-scope.ts';

export const historyRoutes: RoutePlugin = (app, deps) => {
  const ctx = v1Scope(app, deps);

  app.get<{ Params: { eventId: number } }>(
    '/v1/history/:eventId',
    {
      config: { scope: 'read' },
      schema: {
        summary: 'One history event',
        tags: ['history'],
        params: idParams('eventId'),
        response: { 200: EVENT_OUT, ...problemResponses(404) },
      },
    },
    async (request) => {
      const event = await getEvent(deps.db, request.params.eventId);
      if (!event) throw new ApiError('NOT_FOUND', `history event ${request.params.eventId} does not exist`);
      return event;
    },
  );

  app.post<{ Params: { eventId: number }; Body: { reason: string } }>(
    '/v1/history/:eventId/undo',
    {
      config: { scope: 'admin' },
      schema: {
        summary: 'Undo an event (refused while a later event that depends on it stands; the refusal names them)',
        tags: ['history'],
        params: idParams('eventId'),
        body: {
          type: 'object',
          required: ['reason'],
          additionalProperties: false,
          properties: { reason: { ...REASON, minLength: 1 } },
          example: { reason: 'merged by mistake' },
        },
        response: {
          200: {
            type: 'object',
            properties: {
              eventId: { type: 'integer' },
              undoneEventId: { type: 'integer' },
              counterpartyIds: { type: 'array', items: { type: 'integer' } },
              mentionIds: { type: 'array', items: { type: 'integer' } },
            },
          },
          ...problemResponses(404, 409, 422),
        },
      },
    },
    async (request) => undoEvent(ctx, request.params.eventId, actorOf(request, request.body.reason)),
  );

  app.get<{ Querystring: { cursor?: string; limit: number } }>(
    '/v1/changes',
    {
      config: { scope: 'read' },
      schema: {
        summary: 'The change feed: every history event in order, after a cursor',
        description:
          'Poll with the nextCursor of the previous page (start without one). Each event names the counterparty and mention ids it touched; a `merged` event gives survivorId and mergedIds, `split` sourceId and targetId, `renamed` from/to, `undone` the undone event. nextCursor is given even on the last page so that the next poll continues from there.',
        tags: ['history'],
        querystring: {
          type: 'object',
          additionalProperties: false,
          properties: { cursor: { type: 'string', maxLength: 100 }, limit: { type: 'integer', minimum: 1, maximum: 1000, default: 100 } },
        },
        response: {
          200: {
            type: 'object',
            required: ['items', 'nextCursor'],
            properties: { items: { type: 'array', items: EVENT_OUT }, nextCursor: { type: 'string' }, lastEventId: { type: 'integer' } },
          },
        },
      },
    },
    async (request) => {
      const after = decodeCursor(request.query.cursor);
      const items = await eventsAfter(deps.db, after, request.query.limit);
      const last = items.length > 0 ? items[items.length - 1]!.id : after;
      return { items, nextCursor: encodeCursor(last), lastEventId: await lastEventId(deps.db) };
    },
  );
};
