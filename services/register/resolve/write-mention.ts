/**
 * The write stage of a resolution, the same for a batch and for a single resolve: take the stored mention (if any)
 * off its counterparty and close its open review items, turn a person's earlier decision into a question again,
 * write the outcome (resolve/apply.ts), record one history event and answer the result. Runs inside a buffered
 * ChangeSet: the rows and the event reach the database at the caller's flush.
 */
import type { ActorInput } from '../context.ts';
import { commitEvent } from '../history/commit.ts';
import type { ChangeSet } from '../state/change-set.ts';
import type { StateRow } from '../state/tables.ts';
import { closeOpenItemsOfMention, detachMention } from '../upkeep.ts';
import { applyOutcome, canonicalNameIn, eventTypeFor, type Applied } from './apply.ts';
import type { Outcome } from './decide.ts';
import { askAgain, earlierDecisionOf } from './earlier-decision.ts';
import type { PreparedMention } from './prepare.ts';
import { resultOf, type ResolveResult } from './result.ts';

export interface MentionWrite {
  prepared: PreparedMention;
  outcome: Outcome;
  /** The stored mention this write replaces, with the counterparty it had when read (locked first). */
  stored: { id: number; counterpartyId: number | null } | null;
  /** The source sent another text for a stored mention (a person's decision on it is asked again). */
  textChanged: boolean;
  contractId: number | null;
  /** The event's details (what a person reads), from what was written. */
  details: (applied: Applied, previous: StateRow<'mention'> | undefined, outcome: Outcome) => Record<string, unknown>;
  /** Runs after the outcome is written and before the event is committed (its ops join the same event). */
  beforeCommit?: (mentionId: number) => Promise<void>;
}

export async function writeMention(cs: ChangeSet, w: MentionWrite, who: ActorInput, at: Date): Promise<ResolveResult> {
  let outcome = w.outcome;
  let previous: StateRow<'mention'> | undefined;
  if (w.stored) {
    // Lock order: counterparty, then mention (as everywhere); a mention moved since it was read locks its new one.
    if (w.stored.counterpartyId !== null) await cs.lock('counterparty', [w.stored.counterpartyId]);
    previous = await cs.require('mention', w.stored.id);
    if (previous.counterparty_id !== null && previous.counterparty_id !== w.stored.counterpartyId) await cs.lock('counterparty', [previous.counterparty_id]);
    // A person's decision on it turns the new text into a question for a person (resolve/earlier-decision.ts).
    const earlier = earlierDecisionOf(previous, w.textChanged);
    if (earlier) outcome = { ...askAgain(outcome, earlier), ...(outcome.declaredNames ? { declaredNames: outcome.declaredNames } : {}) };
    await detachMention(cs, previous, at);
    await closeOpenItemsOfMention(cs, previous.id);
  }
  const existing = w.stored ? await cs.require('mention', w.stored.id) : undefined;
  const applied = await applyOutcome(cs, w.prepared, outcome, existing, { contractId: w.contractId, at });
  if (w.beforeCommit) await w.beforeCommit(applied.mention.id);
  const eventId = await commitEvent(cs, {
    type: eventTypeFor(previous, applied, w.textChanged),
    actor: who.actor,
    at,
    reason: who.reason,
    requestId: who.requestId,
    details: {
      entity: 'mention',
      mentionId: applied.mention.id,
      status: outcome.status,
      counterpartyId: applied.counterpartyId,
      ...w.details(applied, previous, outcome),
    },
  });
  return resultOf(cs.trx, applied.mention, {
    alreadyIngested: false,
    eventId,
    reviewItemId: applied.reviewItemId,
    canonicalName: canonicalNameIn(cs, applied.mention.counterparty_id ?? null),
    // A mention written by a resolve always has its explanation (apply.ts).
    explanation: await cs.explanation(applied.mention.explanation_id!),
  });
}
