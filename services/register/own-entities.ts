/**
 * Our own legal entities: the organisation that runs cpreg. A mention or contract party that resolves to one of
 * them gets status `own_entity` and never becomes a counterparty. Adding and removing one are history events
 * (`created` / `withdrawn` with entity `own_entity`), so a replay rebuilds them too.
 */
import type { ActorInput, RegisterContext } from './context.ts';
import { RegisterError, notFound } from './errors.ts';
import { commitEvent } from './history/commit.ts';
import { checkName, normaliseIdentifierOrThrow, type IdentifierInput } from './records.ts';
import { write } from './transaction.ts';
import { analyse } from './matching/analysis.ts';
import { findOwnEntityId, listOwnEntities, type OwnEntityView } from '../../db/queries/own-entities.ts';

export interface OwnEntityInput {
  name: string;
  /** ISO 3166-1 alpha-2 or ISO 3166-2. */
  country?: string;
  identifiers?: IdentifierInput[];
}

export async function addOwnEntity(
  ctx: RegisterContext,
  input: OwnEntityInput,
  who: ActorInput,
): Promise<{ eventId: number | null; ownEntityId: number; created: boolean }> {
  const name = checkName('name', input.name);
  if (input.country !== undefined && !/^[A-Z]{2}(?:-[A-Z0-9]{1,3})?$/.test(input.country)) {
    throw new RegisterError('INVALID_INPUT', `country: "${input.country}" is not ISO 3166-1 alpha-2 or ISO 3166-2 (e.g. DE, US-DE)`, {
      field: 'country',
    });
  }
  const identifiers = (input.identifiers ?? []).map((id, i) => normaliseIdentifierOrThrow(`identifiers/${i}`, id, input.country));
  const normalised = analyse(name, input.country).normalised;
  return write(ctx, async (cs) => {
    const at = ctx.now();
    const existing = await findOwnEntityId(cs.trx, normalised);
    if (existing !== undefined) return { eventId: null, ownEntityId: existing, created: false };
    const row = await cs.insert('own_entity', {
      name,
      normalised,
      country: input.country ?? null,
      identifiers,
      created_at: at.toISOString(),
      removed_at: null,
    });
    const eventId = await commitEvent(cs, {
      type: 'created',
      actor: who.actor,
      at,
      reason: who.reason,
      requestId: who.requestId,
      details: { entity: 'own_entity', ownEntityId: row.id, name },
    });
    return { eventId, ownEntityId: row.id, created: true };
  });
}

/** Removes an own entity from the list (mentions already resolved to it keep their status and reference). */
export async function removeOwnEntity(ctx: RegisterContext, ownEntityId: number, who: ActorInput): Promise<{ eventId: number | null }> {
  return write(ctx, async (cs) => {
    const at = ctx.now();
    const row = await cs.get('own_entity', ownEntityId);
    if (!row) throw notFound('own entity', ownEntityId);
    if (row.removed_at !== null) return { eventId: null };
    await cs.update('own_entity', ownEntityId, { removed_at: at.toISOString() });
    const eventId = await commitEvent(cs, {
      type: 'withdrawn',
      actor: who.actor,
      at,
      reason: who.reason,
      requestId: who.requestId,
      details: { entity: 'own_entity', ownEntityId, name: row.name },
    });
    return { eventId };
  });
}

export function ownEntities(ctx: RegisterContext, options: { includeRemoved?: boolean } = {}): Promise<OwnEntityView[]> {
  return listOwnEntities(ctx.db, options);
}
