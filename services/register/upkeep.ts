/**
 * Manual upkeep of mentions and contracts: unlink, set aside (not a party), withdraw (deleted in the source
 * system). Each is one history event.
 */
import type { ActorInput, RegisterContext } from './context.ts';
import { RegisterError, notFound } from './errors.ts';
import { commitWritten } from './history/commit.ts';
import { removeNameSighting } from './add-name-sighting.ts';
import { touchCounterparty } from './touch-counterparty.ts';
import type { ChangeSet } from './state/change-set.ts';
import type { StateRow } from './state/tables.ts';
import { write } from './transaction.ts';
import { recordedNamesOf } from './mention-names.ts';
import { counterpartiesOfMentions, mentionOutcome } from '../../db/queries/mentions.ts';
import { mentionByRef } from '../../db/queries/mentions-by-ref.ts';
import { partyMentionIdsOf } from '../../db/queries/contracts.ts';
import { openItemsOfMention } from '../../db/queries/review.ts';

export interface MentionChangeResult {
  eventId: number | null;
  mentionId: number;
  status: string;
  previousCounterpartyId: number | null;
}

/**
 * Takes a mention off its counterparty (names it contributed go with it) and gives it `status` (one that needs no
 * counterparty). The caller has locked the counterparty.
 */
export async function detachMention(
  cs: ChangeSet,
  mention: StateRow<'mention'>,
  at: Date,
  status: 'review' | 'set_aside' | 'withdrawn' = 'review',
): Promise<number | null> {
  const cpId = mention.counterparty_id;
  if (cpId === null) return null;
  for (const recorded of recordedNamesOf(mention)) await removeNameSighting(cs, cpId, recorded.name, recorded.kind);
  await cs.update('mention', mention.id, { status, counterparty_id: null, updated_at: at.toISOString() });
  await touchCounterparty(cs, cpId, at);
  return cpId;
}

async function lockMention(cs: ChangeSet, mentionId: number): Promise<StateRow<'mention'>> {
  // Lock order everywhere: counterparties before mentions. Read the mention's counterparty, lock it, then the
  // mention; if the mention moved meanwhile, go round again.
  for (let attempt = 0; attempt < 10; attempt++) {
    const peek = await mentionOutcome(cs.trx, mentionId);
    if (!peek) throw notFound('mention', mentionId);
    const cpId = peek.counterparty_id;
    if (cpId !== null) await cs.lock('counterparty', [cpId]);
    const mention = await cs.require('mention', mentionId);
    if (mention.counterparty_id === cpId) return mention;
  }
  throw new RegisterError('CONFLICT', `mention ${mentionId} keeps moving; try again`);
}

async function changeMention(
  ctx: RegisterContext,
  mentionId: number,
  who: ActorInput,
  type: 'unlinked' | 'set_aside' | 'withdrawn',
  status: 'review' | 'set_aside' | 'withdrawn',
): Promise<MentionChangeResult> {
  return write(ctx, async (cs) => {
    const at = ctx.now();
    const mention = await lockMention(cs, mentionId);
    if (type === 'unlinked' && mention.counterparty_id === null) {
      throw new RegisterError('CONFLICT', `mention ${mentionId} is not linked to a counterparty (status ${String(mention.status)})`);
    }
    if (mention.status === status && mention.counterparty_id === null) {
      return { eventId: null, mentionId, status, previousCounterpartyId: null };
    }
    const previous = await detachMention(cs, mention, at, status);
    if (type === 'unlinked' && previous !== null) {
      // The person said this mention is not that counterparty: every later resolution honours it.
      await cs.insert('cannot_link', {
        counterparty_id: previous,
        other_counterparty_id: null,
        mention_id: mentionId,
        review_item_id: null,
        created_by: who.actor,
        reason: who.reason ?? null,
        created_at: at.toISOString(),
      });
    }
    await closeOpenItemsOfMention(cs, mentionId);
    await cs.update('mention', mentionId, {
      status,
      own_entity_id: null,
      // A person decided a set-aside or a withdrawal; an unlinked mention waits for resolution again.
      confirmed_by: type === 'unlinked' ? null : who.actor,
      updated_at: at.toISOString(),
    });
    const eventId = await commitWritten(cs, {
      type,
      actor: who.actor,
      at,
      reason: who.reason,
      requestId: who.requestId,
      details: { mentionId, previousCounterpartyId: previous },
    });
    return { eventId, mentionId, status, previousCounterpartyId: previous };
  });
}

export async function closeOpenItemsOfMention(cs: ChangeSet, mentionId: number): Promise<void> {
  // Read ahead with the chunk's locks (batch-write.ts), those still open; else read now.
  const known = cs.prefetched.takeOpenItems(mentionId)?.filter((item) => cs.cached('review_item', item)?.status === 'open');
  for (const item of known ?? (await openItemsOfMention(cs.trx, mentionId))) {
    await cs.require('review_item', item);
    await cs.update('review_item', item, { status: 'obsolete' });
  }
}

/** Unlinks a mention from its counterparty and records that it is not that counterparty. */
export function unlinkMention(ctx: RegisterContext, mentionId: number, who: ActorInput): Promise<MentionChangeResult> {
  return changeMention(ctx, mentionId, who, 'unlinked', 'review');
}

/** Sets a mention aside: a person says it names no party. */
export function setAsideMention(ctx: RegisterContext, mentionId: number, who: ActorInput): Promise<MentionChangeResult> {
  return changeMention(ctx, mentionId, who, 'set_aside', 'set_aside');
}

/** Withdraws a mention deleted in its source system. */
export function withdrawMention(ctx: RegisterContext, mentionId: number, who: ActorInput): Promise<MentionChangeResult> {
  return changeMention(ctx, mentionId, who, 'withdrawn', 'withdrawn');
}

export async function withdrawMentionBySourceId(ctx: RegisterContext, source: string, externalId: string, who: ActorInput): Promise<MentionChangeResult> {
  const mention = await mentionByRef(ctx.db, { source, externalId });
  if (!mention) throw notFound('mention', `${source}/${externalId}`);
  return withdrawMention(ctx, Number(mention.id), who);
}

/** Withdraws a contract deleted in its source system, with every party mention it brought. */
export async function withdrawContract(
  ctx: RegisterContext,
  contractId: number,
  who: ActorInput,
): Promise<{ eventId: number | null; contractId: number; withdrawnMentionIds: number[] }> {
  return write(ctx, async (cs) => {
    const at = ctx.now();
    const contract = await cs.get('contract', contractId);
    if (!contract) throw notFound('contract', contractId);
    if (contract.status === 'withdrawn') return { eventId: null, contractId, withdrawnMentionIds: [] };
    const ids = (await partyMentionIdsOf(cs.trx, contractId)).sort((a, b) => a - b);
    await cs.lock('counterparty', await counterpartiesOfMentions(cs.trx, ids));
    const mentions = await cs.lock('mention', ids);
    for (const mention of mentions) {
      if (mention.status === 'withdrawn') continue;
      await detachMention(cs, mention, at, 'withdrawn');
      await closeOpenItemsOfMention(cs, mention.id);
      await cs.update('mention', mention.id, {
        status: 'withdrawn',
        own_entity_id: null,
        confirmed_by: who.actor,
        updated_at: at.toISOString(),
      });
    }
    await cs.update('contract', contractId, { status: 'withdrawn', updated_at: at.toISOString() });
    const eventId = await commitWritten(cs, {
      type: 'withdrawn',
      actor: who.actor,
      at,
      reason: who.reason,
      requestId: who.requestId,
      details: { entity: 'contract', contractId, mentionIds: ids },
    });
    return { eventId, contractId, withdrawnMentionIds: ids };
  });
}
