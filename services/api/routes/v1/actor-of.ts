/** Who a request acts as, for the history. */
import type { FastifyRequest } from 'fastify';
import { type ActorInput } from '../../../register/context.ts';

export function actorOf(request: FastifyRequest, reason?: string | null): ActorInput {
  const label = request.apiKey?.label ?? 'anonymous';
  return { actor: label, reason: reason ?? undefined, requestId: request.id };
}
