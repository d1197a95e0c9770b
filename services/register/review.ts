/**
 * The review queue. Items show both sides, the score and its explanation. A decision is one history event:
 *
 *   mention_link  same      → the mention is linked to the candidate (confirmed by the reviewer)
 *                 not_a_party → the mention names no party (a place, a document word, a signer): set aside as
 *                             not_a_party, confirmed by the reviewer; kept out of the labelled pairs, since it says
 *                             nothing about whether two names are one entity
 *                 different → cannot-link (mention, candidate); the mention becomes a new counterparty, and a
 *                             cannot-link (candidate, new counterparty) keeps the two apart in every later
 *                             resolution, sweep and clustering
 *   duplicate     same      → the two counterparties are merged (the older survives)
 *                 different → cannot-link between them
 *   affiliate     same      → an affiliate_of relation (never a merge)
 *                 different → cannot-link between them (not affiliated, and not one entity)
 *
 * Every "same" or "different" decision is also kept as a labelled pair (labelled_pair) for the scorer to learn from.
 */
import { evidenceOf } from './evidence.ts';
import { declaredNamesOfPartyMention } from '../../db/queries/contracts.ts';
import type { ActorInput, RegisterContext } from './context.ts';
import { RegisterError, invalid, notFound } from './errors.ts';
import { commitWritten } from './history/commit.ts';
import { addIdentifierRow } from './add-identifier-row.ts';
import { addNameSighting } from './add-name-sighting.ts';
import { createCounterpartyRow } from './create-counterparty-row.ts';
import { lockActive, survivorFor } from './lock-active.ts';
import { touchCounterparty } from './touch-counterparty.ts';
import { assertNoCannotLink } from './assert-no-cannot-link.ts';
import { mergeInto } from './merge-into.ts';
import { insertRelation } from './relations.ts';
import type { ChangeSet } from './state/change-set.ts';
import type { StateRow } from './state/tables.ts';
import { write } from './transaction.ts';
import { analyse } from './matching/analysis.ts';
import { getSummaries, type CounterpartySummary } from '../../db/queries/counterparties.ts';
import { getReviewItem, listReviewItemsWhere, type ReviewFilter, type ReviewItemView } from '../../db/queries/review.ts';
import { getMention, type MentionView } from '../../db/queries/mentions.ts';
import type { Identifier, NameKind } from '../../resolvers/vocabulary.ts';

export type ReviewDecisionInput = {
  decision: 'same' | 'different' | 'not_a_party';
  reason?: string;
  /**
   * `different` on a mention item only: link the mention to this counterparty (made by the same decision on an
   * earlier item of its group) instead of creating another one. Set by decideReviewGroup, not by callers.
   */
  joinCounterpartyId?: number;
};

export interface ReviewDecisionResult {
  eventId: number;
  reviewItemId: number;
  decision: 'same' | 'different' | 'not_a_party';
  /** The counterparty the mention or the pair ended in (the survivor of a merge, the new one of a `different`). */
  counterpartyId: number | null;
}

export interface ReviewItemDetail extends ReviewItemView {
  mention: MentionView | null;
  left: CounterpartySummary | null;
  right: CounterpartySummary | null;
}

/** Review items (open ones unless the filter says otherwise) oldest first (ids after `afterId`), with both sides. */
export async function listReviewItems(
  ctx: RegisterContext,
  page: { afterId?: number; limit?: number; filter?: ReviewFilter } = {},
): Promise<ReviewItemDetail[]> {
  return detailsOf(ctx, await listReviewItemsWhere(ctx.db, page.filter ?? {}, page));
}

/** The items with their mention and both sides' summaries, in the order given. */
export async function detailsOf(ctx: RegisterContext, items: readonly ReviewItemView[]): Promise<ReviewItemDetail[]> {
  const ids = items.flatMap((i) => [i.rightCounterpartyId, ...(i.leftCounterpartyId === null ? [] : [i.leftCounterpartyId])]);
  const summaries = await getSummaries(ctx.db, ids);
  const out: ReviewItemDetail[] = [];
  for (const item of items) {
    out.push({
      ...item,
      mention: item.mentionId === null ? null : ((await getMention(ctx.db, item.mentionId)) ?? null),
      left: item.leftCounterpartyId === null ? null : (summaries.get(item.leftCounterpartyId) ?? null),
      right: summaries.get(item.rightCounterpartyId) ?? null,
    });
  }
  return out;
}

async function insertCannotLink(
  cs: ChangeSet,
  values: { counterpartyId: number; otherCounterpartyId?: number; mentionId?: number; reviewItemId: number; actor: string; reason: string | null; at: Date },
) {
  await cs.insert('cannot_link', {
    counterparty_id: values.counterpartyId,
    other_counterparty_id: values.otherCounterpartyId ?? null,
    mention_id: values.mentionId ?? null,
    review_item_id: values.reviewItemId,
    created_by: values.actor,
    reason: values.reason,
    created_at: values.at.toISOString(),
  });
}

/** The evidence without names recorded by an earlier link: the names recorded now replace them. */
function withoutRecordedAliases(evidence: unknown): Record<string, unknown> {
  const { recordedAliases: _earlier, ...rest } = (evidence ?? {}) as Record<string, unknown>;
  return rest;
}

/** The kind a person-confirmed mention's name is recorded with: a former name stays a former name. */
function confirmedNameKind(mention: StateRow<'mention'>): NameKind {
  const evidence = mention.evidence as { via?: string; declaredName?: { kind: NameKind } } | null;
  if (evidence?.via === 'former_name') return 'former';
  if (evidence?.declaredName) return evidence.declaredName.kind;
  return analyse(mention.text, mention.country).legalForm ? 'legal' : 'observed';
}

async function linkMentionByPerson(
  cs: ChangeSet,
  mention: StateRow<'mention'>,
  counterpartyId: number,
  actor: string,
  at: Date,
  status: 'linked' | 'new',
): Promise<void> {
  const recordedName = { name: mention.text, kind: confirmedNameKind({ ...mention, evidence: await evidenceOf(cs, mention) }) };
  await addNameSighting(cs, counterpartyId, { ...recordedName, source: mention.source, mentionId: mention.id }, at);
  // A contract party confirmed by a person brings the names its contract declares for it ("formerly X"), as a
  // party linked automatically does (resolve/apply.ts), kept in the evidence so that moving it takes them away.
  const recordedAliases = (await declaredNamesOfPartyMention(cs.trx, mention.id)).filter((a) => a.name !== recordedName.name || a.kind !== recordedName.kind);
  for (const alias of recordedAliases) {
    await addNameSighting(cs, counterpartyId, { ...alias, source: mention.source, mentionId: mention.id, contractId: mention.contract_id ?? null }, at);
  }
  for (const identifier of (mention.identifiers as Identifier[]) ?? []) {
    try {
      await addIdentifierRow(cs, counterpartyId, identifier, { source: mention.source, mentionId: mention.id }, at);
    } catch (error) {
      if (!(error instanceof RegisterError && error.code === 'IDENTIFIER_TAKEN')) throw error;
    }
  }
  await cs.update('mention', mention.id, {
    status,
    counterparty_id: counterpartyId,
    confirmed_by: actor,
    evidence: { ...withoutRecordedAliases(mention.evidence), recordedName, ...(recordedAliases.length > 0 ? { recordedAliases } : {}) },
    updated_at: at.toISOString(),
  });
  await touchCounterparty(cs, counterpartyId, at);
}

export async function decideReview(ctx: RegisterContext, reviewItemId: number, input: ReviewDecisionInput, who: ActorInput): Promise<ReviewDecisionResult> {
  if (input.decision !== 'same' && input.decision !== 'different' && input.decision !== 'not_a_party') {
    throw invalid('decision', 'must be "same", "different" or "not_a_party"');
  }
  return write(ctx, async (cs) => {
    const at = ctx.now();
    const reason = input.reason ?? who.reason ?? null;
    const peek = await getReviewItem(cs.trx, reviewItemId);
    if (!peek) throw notFound('review item', reviewItemId);
    const sides = [
      peek.rightCounterpartyId,
      ...(peek.leftCounterpartyId === null ? [] : [peek.leftCounterpartyId]),
      ...(input.joinCounterpartyId === undefined ? [] : [input.joinCounterpartyId]),
    ];
    await lockActive(cs, sides);
    const item = await cs.require('review_item', reviewItemId);
    if (item.status !== 'open') {
      throw new RegisterError(
        'CONFLICT',
        `review item ${reviewItemId} is ${String(item.status)}${item.decision ? ` (${String(item.decision)} by ${String(item.decided_by)})` : ''}`,
        {
          reviewItemId,
        },
      );
    }
    const right = survivorFor(cs, item.right_counterparty_id);
    const left = item.left_counterparty_id === null ? null : survivorFor(cs, item.left_counterparty_id);
    let resultId: number | null = right;
    let leftText = '';
    const rightCp = await cs.require('counterparty', right);
    if (item.kind === 'mention_link') {
      // A mention_link item always names its mention.
      const mention = await cs.require('mention', item.mention_id!);
      leftText = mention.text;
      if (mention.status !== 'review' || mention.counterparty_id !== null) {
        throw new RegisterError('CONFLICT', `mention ${String(mention.id)} is no longer waiting for review (status ${String(mention.status)})`);
      }
      if (input.decision === 'not_a_party') {
        await cs.update('mention', mention.id, {
          status: 'not_a_party',
          counterparty_id: null,
          confirmed_by: who.actor,
          evidence: { ...mention.evidence, notAPartyBy: 'review' },
          updated_at: at.toISOString(),
        });
        resultId = null;
      } else if (input.decision === 'same') {
        await linkMentionByPerson(cs, mention, right, who.actor, at, 'linked');
      } else if (input.joinCounterpartyId !== undefined) {
        // The group's first mention already became a new counterparty, kept apart from this candidate.
        const join = survivorFor(cs, input.joinCounterpartyId);
        await insertCannotLink(cs, { counterpartyId: right, mentionId: mention.id, reviewItemId, actor: who.actor, reason, at });
        await linkMentionByPerson(cs, mention, join, who.actor, at, 'linked');
        resultId = join;
      } else {
        await insertCannotLink(cs, { counterpartyId: right, mentionId: mention.id, reviewItemId, actor: who.actor, reason, at });
        const cp = await createCounterpartyRow(cs, {
          name: mention.text,
          kind: 'organisation',
          jurisdiction: mention.country ?? null,
          at,
        });
        resultId = cp.id;
        await linkMentionByPerson(cs, mention, resultId, who.actor, at, 'new');
        await insertCannotLink(cs, { counterpartyId: right, otherCounterpartyId: resultId, reviewItemId, actor: who.actor, reason, at });
      }
    } else {
      if (input.decision === 'not_a_party')
        throw invalid('decision', `"not_a_party" answers a mention's item only; item ${reviewItemId} pairs two counterparties`);
      if (left === null) throw new Error(`review item ${reviewItemId} has no left counterparty`);
      leftText = (await cs.require('counterparty', left)).canonical_name;
      if (left === right) {
        throw new RegisterError('CONFLICT', `the two sides of review item ${reviewItemId} are already one counterparty (${right})`);
      }
      if (input.decision === 'same' && item.kind === 'duplicate') {
        await assertNoCannotLink(cs, [left, right]);
        const survivor = Math.min(left, right);
        await mergeInto(cs, survivor, Math.max(left, right), at);
        await touchCounterparty(cs, survivor, at);
        resultId = survivor;
      } else if (input.decision === 'same') {
        await insertRelation(
          cs,
          left,
          right,
          { fromId: left, toId: right, type: 'affiliate_of', origin: 'person', status: 'confirmed', evidence: { reviewItemId } },
          who.actor,
          at,
        );
        await touchCounterparty(cs, left, at);
        await touchCounterparty(cs, right, at);
      } else {
        await insertCannotLink(cs, { counterpartyId: left, otherCounterpartyId: right, reviewItemId, actor: who.actor, reason, at });
      }
    }
    await cs.update('review_item', reviewItemId, {
      status: 'decided',
      decision: input.decision,
      decided_by: who.actor,
      decided_at: at.toISOString(),
      reason,
    });
    if (input.decision !== 'not_a_party') {
      await cs.insert('labelled_pair', {
        review_item_id: reviewItemId,
        left_text: leftText,
        right_text: rightCp.canonical_name,
        label: input.decision,
        features: await evidenceOf(cs, item),
        decided_by: who.actor,
        created_at: at.toISOString(),
      });
    }
    const eventId = await commitWritten(cs, {
      type: 'review_decided',
      actor: who.actor,
      at,
      reason,
      requestId: who.requestId,
      details: { reviewItemId, kind: item.kind, decision: input.decision, counterpartyId: resultId, mentionId: item.mention_id ?? null },
    });
    return { eventId, reviewItemId, decision: input.decision, counterpartyId: resultId };
  });
}
