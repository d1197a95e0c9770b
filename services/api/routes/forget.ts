/** POST /v1/counterparties/{id}/forget (admin): erase a natural person's personal data (services/forget). */
import { forgetCounterparty } from '../../forget/forget.ts';
import { problemResponses } from '../errors.ts';
import type { RoutePlugin } from '../types.ts';
import { ID_PARAM, REASON } from './v1/schemas.ts';
import { actorOf } from './v1/actor-of.ts';
import { v1Scope } from './v1/v1-scope.ts';

const FORGET_OUT = {
  type: 'object',
  properties: {
    eventId: { type: 'integer' },
    counterpartyId: { type: 'integer' },
    counterpartyIds: { type: 'array', items: { type: 'integer' } },
    pseudonym: { type: 'string' },
    rows: { type: 'object', additionalProperties: { type: 'integer' } },
    events: { type: 'integer' },
    storedAnswers: { type: 'integer' },
  },
} as const;

export const forgetRoutes: RoutePlugin = (app, deps) => {
  const ctx = v1Scope(app, deps);
  app.post<{ Params: { id: number }; Body: { reason?: string; allowOrganisation?: boolean } | undefined }>(
    '/v1/counterparties/:id/forget',
    {
      config: { scope: 'admin' },
      schema: {
        summary: 'Erase a person: names, identifiers, mention texts and addresses become a pseudonym in the register and its history (cannot be undone)',
        tags: ['counterparties'],
        params: ID_PARAM,
        body: {
          type: 'object',
          additionalProperties: false,
          properties: {
            reason: REASON,
            allowOrganisation: { type: 'boolean', default: false, description: 'also erase a counterparty recorded as an organisation' },
          },
          example: { reason: 'erasure request 2026-114' },
        },
        response: { 200: FORGET_OUT, ...problemResponses(404, 409) },
      },
    },
    async (request) =>
      forgetCounterparty(ctx, request.params.id, actorOf(request, request.body?.reason), { allowOrganisation: request.body?.allowOrganisation ?? false }),
  );
};
