/** Read routes of a counterparty follow a merged id with 308 to its survivor. */
import type { FastifyReply, FastifyRequest } from 'fastify';
import { survivorOf } from '../../../register/lock-active.ts';
import { ApiError } from '../../errors.ts';
import { redirectToSurvivor } from './redirect-to-survivor.ts';

/** Follows a merged id: answers 308 (and returns undefined) or the active id. */
export async function activeOr308(request: FastifyRequest, reply: FastifyReply, db: Parameters<typeof survivorOf>[0], id: number): Promise<number | undefined> {
  const survivor = await survivorOf(db, id);
  if (!survivor) throw new ApiError('NOT_FOUND', `counterparty ${id} does not exist`);
  if (survivor.merged) {
    redirectToSurvivor(reply, request, id, survivor.id);
    return undefined;
  }
  return survivor.id;
}
