/** A merged counterparty id read: 308 to its survivor. */
import type { FastifyReply, FastifyRequest } from 'fastify';

/** Answers 308 to the survivor when a merged id was read (`merged` from getCounterparty). */
export function redirectToSurvivor(reply: FastifyReply, request: FastifyRequest, requestedId: number, survivorId: number): FastifyReply {
  const location = request.url.replace(`/counterparties/${requestedId}`, `/counterparties/${survivorId}`);
  return reply
    .code(308)
    .header('location', location)
    .send({ mergedId: requestedId, survivorId, location, detail: `counterparty ${requestedId} was merged into ${survivorId}` });
}
