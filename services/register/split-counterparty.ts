/**
 * Split: chosen mentions out of a counterparty into a new one or another existing one, as one history event
 * (undone like any event: history/undo.ts). Refused where a cannot-link says a mention is not the target.
 */
import type { ActorInput, RegisterContext } from './context.ts';
import { RegisterError, invalid, notFound } from './errors.ts';
import { commitRequested } from './history/commit.ts';
import { addNameSighting, removeNameSighting } from './add-name-sighting.ts';
import { createCounterpartyRow } from './create-counterparty-row.ts';
import { lockActive, survivorFor } from './lock-active.ts';
import { touchCounterparty } from './touch-counterparty.ts';
import type { ChangeSet } from './state/change-set.ts';
import { write } from './transaction.ts';
import { recordedNameOf, recordedNamesOf } from './mention-names.ts';
import { cannotLinksOf } from '../../db/queries/review.ts';
import { survivorsOf } from '../../db/queries/counterparties.ts';
import { anyNameId } from '../../db/queries/names.ts';

export interface SplitInput {
  mentionIds: number[];
  /** Move into this counterparty; default a new one named after the first moved mention. */
  targetId?: number;
  expectedVersion?: number;
  /** Why (kept in the history); the actor's reason is used when absent. */
  reason?: string;
}

export interface SplitResult {
  eventId: number;
  sourceId: number;
  targetId: number;
  created: boolean;
  movedMentionIds: number[];
}

export async function splitCounterparty(ctx: RegisterContext, counterpartyId: number, input: SplitInput, who: ActorInput): Promise<SplitResult> {
  if (!Array.isArray(input.mentionIds) || input.mentionIds.length === 0) invalidSplit();
  return write(ctx, async (cs) => {
    const at = ctx.now();
    const iso = at.toISOString();
    const wanted = [counterpartyId, ...(input.targetId !== undefined ? [input.targetId] : [])];
    await lockActive(cs, wanted);
    const sourceId = survivorFor(cs, counterpartyId);
    const source = await cs.require('counterparty', sourceId);
    if (input.expectedVersion !== undefined && input.expectedVersion !== source.version) {
      throw new RegisterError('STALE_VERSION', `counterparty ${sourceId} changed since it was read`, { counterpartyId: sourceId });
    }
    const mentionIds = [...new Set(input.mentionIds)].sort((a, b) => a - b);
    const mentions = await cs.lock('mention', mentionIds);
    for (const id of mentionIds) {
      const m = mentions.find((x) => x.id === id);
      if (!m) throw notFound('mention', id);
      if (m.counterparty_id !== sourceId) throw invalid('mentionIds', `mention ${id} is not linked to counterparty ${sourceId}`);
    }
    let targetId: number;
    let created = false;
    if (input.targetId !== undefined) {
      targetId = survivorFor(cs, input.targetId);
      if (targetId === sourceId) throw invalid('targetId', 'must differ from the counterparty being split');
      await assertNoCannotLinkMentions(cs, targetId, mentionIds);
    } else {
      const first = mentions[0]!;
      const name = (recordedNameOf(first)?.name ?? first.text) as string;
      const cp = await createCounterpartyRow(cs, { name, kind: source.kind as 'organisation', jurisdiction: source.jurisdiction, at });
      targetId = cp.id;
      created = true;
    }
    for (const m of mentions) {
      for (const recorded of recordedNamesOf(m)) {
        await removeNameSighting(cs, sourceId, recorded.name, recorded.kind);
        await addNameSighting(cs, targetId, { name: recorded.name, kind: recorded.kind, source: m.source, mentionId: m.id }, at);
      }
      await cs.update('mention', m.id, {
        counterparty_id: targetId,
        status: 'linked',
        confirmed_by: who.actor,
        updated_at: iso,
      });
    }
    if (created) {
      // The names just moved are read with it (written first).
      if ((await anyNameId(await cs.flushed(), targetId)) === undefined) {
        const first = mentions[0]!;
        await addNameSighting(cs, targetId, { name: first.text, kind: 'observed', source: first.source, mentionId: first.id }, at);
      }
    }
    await touchCounterparty(cs, sourceId, at);
    await touchCounterparty(cs, targetId, at);
    const eventId = await commitRequested(cs, 'split', who, at, { sourceId, targetId, created, mentionIds }, input.reason ?? who.reason);
    return { eventId, sourceId, targetId, created, movedMentionIds: mentionIds };
  });
}

function invalidSplit(): never {
  throw invalid('mentionIds', 'name at least one mention to move');
}

async function assertNoCannotLinkMentions(cs: ChangeSet, targetId: number, mentionIds: number[]): Promise<void> {
  for (const mentionId of mentionIds) {
    const links = await cannotLinksOf(cs.trx, [], mentionId);
    const survivors = await survivorsOf(
      cs.trx,
      links.map((l) => l.counterpartyId),
    );
    if (links.some((l) => l.mentionId === mentionId && survivors.get(l.counterpartyId) === targetId)) {
      throw new RegisterError('CANNOT_LINK', `mention ${mentionId} was recorded as not being counterparty ${targetId}`, {
        mentionId,
        counterpartyId: targetId,
      });
    }
  }
}
