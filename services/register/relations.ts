/**
 * Relations between counterparties that are not merges: parent_of, successor_of (with a date), affiliate_of.
 * Added by a person, a strong source, or proposed by the duplicate sweep; they never make two counterparties one.
 */
import { RELATION_TYPES, type RelationType } from '../../resolvers/vocabulary.ts';
import type { RelationOrigin } from '../../db/types.ts';
import type { ActorInput, RegisterContext } from './context.ts';
import { RegisterError, invalid, notFound } from './errors.ts';
import { commitRequested } from './history/commit.ts';
import { lockActive, survivorFor } from './lock-active.ts';
import { touchCounterparty } from './touch-counterparty.ts';
import type { ChangeSet } from './state/change-set.ts';
import type { StateRow } from './state/tables.ts';
import { write } from './transaction.ts';
import { findRelation, relationEnds } from '../../db/queries/relations.ts';

export interface RelationInput {
  fromId: number;
  toId: number;
  type: RelationType;
  /** successor_of: the date of succession, YYYY-MM-DD (required for successor_of). */
  since?: string;
  origin?: RelationOrigin;
  /** `proposed` for the sweep's suggestions; people and strong sources add `confirmed` ones. */
  status?: 'proposed' | 'confirmed';
  evidence?: Record<string, unknown>;
}

/**
 * A calendar date YYYY-MM-DD from year 0001 (the Gregorian calendar has no year 0; "0000-01-01" was stored). The
 * message names the field and the rule, not the value given (issue 17: errors do not repeat the caller's input).
 */
function checkDate(field: string, value: string): string {
  if (!/^\d{4}-\d{2}-\d{2}$/.test(value)) throw invalid(field, 'must be a date in the form YYYY-MM-DD');
  const date = new Date(`${value}T00:00:00Z`);
  if (Number.isNaN(date.getTime()) || date.toISOString().slice(0, 10) !== value || date.getUTCFullYear() < 1) {
    throw invalid(field, 'must be a calendar date from year 0001 (e.g. 2021-02-28, not 2021-02-30)');
  }
  return value;
}

/** Inserts a relation inside an open ChangeSet (both ends locked by the caller). */
export async function insertRelation(
  cs: ChangeSet,
  from: number,
  to: number,
  input: RelationInput,
  actor: string,
  at: Date,
): Promise<StateRow<'counterparty_relation'> | undefined> {
  if (from === to) throw invalid('toId', 'a counterparty cannot be related to itself');
  const existing = await findRelation(cs.trx, from, to, input.type);
  if (existing !== undefined) return undefined;
  return cs.insert('counterparty_relation', {
    from_counterparty_id: from,
    to_counterparty_id: to,
    type: input.type,
    since: input.since ?? null,
    origin: input.origin ?? 'person',
    status: input.status ?? 'confirmed',
    evidence: input.evidence ?? {},
    created_by: actor,
    created_at: at.toISOString(),
  });
}

export async function addRelation(ctx: RegisterContext, input: RelationInput, who: ActorInput): Promise<{ eventId: number | null; relationId: number }> {
  if (!(RELATION_TYPES as readonly string[]).includes(input.type)) throw invalid('type', `must be one of ${RELATION_TYPES.join(', ')}`);
  if (input.type === 'successor_of' && !input.since) throw invalid('since', 'successor_of needs the date of succession (YYYY-MM-DD)');
  if (input.since !== undefined) checkDate('since', input.since);
  return write(ctx, async (cs) => {
    const at = ctx.now();
    await lockActive(cs, [input.fromId, input.toId]);
    const from = survivorFor(cs, input.fromId);
    const to = survivorFor(cs, input.toId);
    const row = await insertRelation(cs, from, to, input, who.actor, at);
    if (!row) {
      // The insert met the relation already there; both ends are locked, so it is still there.
      const existing = await findRelation(cs.trx, from, to, input.type);
      if (existing === undefined) throw new Error(`relation ${from} ${input.type} ${to}: the insert found it but the read did not`);
      return { eventId: null, relationId: existing };
    }
    await touchCounterparty(cs, from, at);
    await touchCounterparty(cs, to, at);
    const eventId = await commitRequested(cs, 'relation_added', who, at, {
      relationId: row.id,
      fromId: from,
      toId: to,
      relation: input.type,
      since: input.since ?? null,
    });
    return { eventId, relationId: row.id };
  });
}

export async function removeRelation(ctx: RegisterContext, relationId: number, who: ActorInput): Promise<{ eventId: number }> {
  return write(ctx, async (cs) => {
    const at = ctx.now();
    const peek = await relationEnds(cs.trx, relationId);
    if (!peek) throw notFound('relation', relationId);
    await cs.lock('counterparty', [peek.from, peek.to]);
    const row = await cs.get('counterparty_relation', relationId);
    if (!row) throw new RegisterError('CONFLICT', `relation ${relationId} was removed meanwhile`);
    await cs.delete('counterparty_relation', relationId);
    await touchCounterparty(cs, row.from_counterparty_id, at);
    await touchCounterparty(cs, row.to_counterparty_id, at);
    const eventId = await commitRequested(cs, 'relation_removed', who, at, {
      relationId,
      fromId: row.from_counterparty_id,
      toId: row.to_counterparty_id,
      relation: row.type,
    });
    return { eventId };
  });
}
