/**
 * The review queue in the order a person should work it (resolvers/score/rank-review-items.ts says how), and a
 * decision that settles a whole group: the same spelling of one name waiting on the same candidate in several
 * contracts is one question, answered once.
 */
import type { ActorInput, RegisterContext } from './context.ts';
import { RegisterError, notFound } from './errors.ts';
import { currentModel } from './matching/model.ts';
import { analyse } from './matching/analysis.ts';
import { decideReview, detailsOf, type ReviewDecisionInput, type ReviewDecisionResult, type ReviewItemDetail } from './review.ts';
import { openReviewFacts, reviewItemsByIds, type OpenReviewFacts } from '../../db/queries/review-queue-facts.ts';
import { toReviewView, type ReviewFilter } from '../../db/queries/review.ts';
import { groupKeyOf, rankReviewItems, type RankedReviewItem, type ReviewItemFacts } from '../../resolvers/score/index.ts';

export type RankedReviewItemDetail = ReviewItemDetail & Pick<RankedReviewItem, 'priority' | 'uncertainty' | 'group'>;

function factsOf(item: OpenReviewFacts): ReviewItemFacts {
  const mention = item.mention ? analyse(item.mention.text, item.mention.country) : null;
  return {
    id: item.id,
    score: item.score,
    mentionContracts: item.mention?.contractId ? 1 : 0,
    candidateContracts: item.candidateContracts,
    groupKey: groupKeyOf({
      ...item,
      mention: mention ? { core: mention.core, legalFormFamily: mention.legalForm?.family ?? null, country: item.mention!.country } : null,
    }),
  };
}

/** Every open item (narrowed by `filter`) ranked: ids and ranks only, cheap enough for the whole queue. */
export async function rankOpenReviewItems(ctx: RegisterContext, filter: Omit<ReviewFilter, 'status'> = {}): Promise<RankedReviewItem[]> {
  const [{ model }, facts] = await Promise.all([currentModel(ctx.db), openReviewFacts(ctx.db, filter)]);
  return rankReviewItems(facts.map(factsOf), model);
}

/** One page of the ranked queue, with both sides of each item. `offset` counts items already shown. */
export async function listRankedReviewItems(
  ctx: RegisterContext,
  page: { offset?: number; limit?: number; filter?: Omit<ReviewFilter, 'status'> } = {},
): Promise<RankedReviewItemDetail[]> {
  const ranked = await rankOpenReviewItems(ctx, page.filter);
  const start = page.offset ?? 0;
  const shown = ranked.slice(start, start + (page.limit ?? 100));
  const rows = await reviewItemsByIds(
    ctx.db,
    shown.map((r) => r.id),
  );
  const details = await detailsOf(ctx, rows.map(toReviewView));
  const rankOf = new Map(shown.map((r) => [r.id, r]));
  return details.map((d) => {
    const r = rankOf.get(d.id)!;
    return { ...d, priority: r.priority, uncertainty: r.uncertainty, group: r.group };
  });
}

export interface GroupDecisionResult extends ReviewDecisionResult {
  /** Every item the decision settled, the one asked about first. */
  settled: ReviewDecisionResult[];
  /** Items of the group that could not be settled (decided meanwhile, the mention moved on), with why. */
  skipped: { reviewItemId: number; code: string; detail: string }[];
}

/**
 * Decides a review item and every open item of its group. `same`: each mention is linked to the candidate.
 * `different`: the first mention becomes a new counterparty and the others join it (one spelling, one party),
 * each with its cannot-link against the candidate. Each item is its own history event, so each can be undone.
 */
export async function decideReviewGroup(ctx: RegisterContext, reviewItemId: number, input: ReviewDecisionInput, who: ActorInput): Promise<GroupDecisionResult> {
  const item = (await reviewItemsByIds(ctx.db, [reviewItemId]))[0];
  if (!item) throw notFound('review item', reviewItemId);
  const view = toReviewView(item);
  const facts =
    view.status === 'open'
      ? await openReviewFacts(ctx.db, { kind: view.kind as NonNullable<ReviewFilter['kind']>, rightCounterpartyId: view.rightCounterpartyId })
      : [];
  const keyed = facts.map((f) => ({ id: f.id, key: factsOf(f).groupKey }));
  const key = keyed.find((k) => k.id === reviewItemId)?.key;
  const others = key === undefined ? [] : keyed.filter((k) => k.key === key && k.id !== reviewItemId).map((k) => k.id);
  const first = await decideReview(ctx, reviewItemId, input, who);
  const settled = [first];
  const skipped: GroupDecisionResult['skipped'] = [];
  const joinNew = input.decision === 'different' && view.kind === 'mention_link' ? (first.counterpartyId ?? undefined) : undefined;
  for (const other of others) {
    try {
      settled.push(await decideReview(ctx, other, { ...input, ...(joinNew === undefined ? {} : { joinCounterpartyId: joinNew }) }, who));
    } catch (error) {
      if (!(error instanceof RegisterError)) throw error;
      skipped.push({ reviewItemId: other, code: error.code, detail: error.message });
    }
  }
  return { ...first, settled, skipped };
}
