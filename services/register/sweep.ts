/**
 * Duplicate sweep: scans the active counterparties in id-ordered blocks, looks each one up in the register like a
 * mention (blocking keys, identifier holders, the match model) and files review items. It never merges.
 *
 *  - a pair whose names score above newAt, or that shares a strong identifier → `duplicate` item;
 *  - a pair whose only common evidence is a shared address, phone, e-mail/web domain or bank account (the names
 *    do not agree) → `affiliate` item (a proposed affiliate_of; affiliates share such details);
 *  - pairs under a cannot-link, and pairs that already have an item (open or decided), are skipped.
 */
import type { ActorInput, RegisterContext } from './context.ts';
import { activeIdsAfter, survivorsOf, sweepFacts } from '../../db/queries/counterparties.ts';
import { identifiersAsInput } from '../../db/queries/identifiers.ts';
import { cannotLinksOf, pairHasItem } from '../../db/queries/review.ts';
import { commitEvent } from './history/commit.ts';
import { analyse } from './matching/analysis.ts';
import { currentModel } from './matching/model.ts';
import { jsonScore, scoredCandidates, type ScoredCandidate } from './matching/candidates.ts';
import { write } from './transaction.ts';
import type { Identifier } from '../../resolvers/vocabulary.ts';

export interface SweepSummary {
  scanned: number;
  duplicateItems: number;
  affiliateItems: number;
  skippedCannotLink: number;
  skippedExisting: number;
  itemIds: number[];
}

const WEAK_NAME_LEVELS = new Set(['low', 'none', null]);

function classify(c: ScoredCandidate, newAt: number): 'duplicate' | 'affiliate' | null {
  if (c.pair.override === 'cannot_link') return null;
  if (c.pair.override === 'decisive_identifier') return 'duplicate';
  const name = c.pair.explanation.find((e) => e.feature === 'name')?.level ?? null;
  const shared = c.pair.explanation.find((e) => e.feature === 'sharedContact')?.level === 'shared';
  if (shared && WEAK_NAME_LEVELS.has(name)) return 'affiliate';
  // A shared contact detail must never be what pushes a pair over: judge the names without it.
  const contactWeight = shared ? (c.pair.explanation.find((e) => e.feature === 'sharedContact')?.weight ?? 0) : 0;
  if (c.score - contactWeight > newAt) return 'duplicate';
  return shared ? 'affiliate' : null;
}

export async function sweep(
  ctx: RegisterContext,
  who: ActorInput,
  options: {
    blockSize?: number;
    onProgress?: (summary: SweepSummary) => void;
    /** Only counterparties with an id above this (a partition of a sweep job). Default 0. */
    afterId?: number;
    /** Only counterparties with an id up to this. Default: no limit. */
    throughId?: number;
  } = {},
): Promise<SweepSummary> {
  const summary: SweepSummary = { scanned: 0, duplicateItems: 0, affiliateItems: 0, skippedCannotLink: 0, skippedExisting: 0, itemIds: [] };
  const { model } = await currentModel(ctx.db);
  let after = options.afterId ?? 0;
  const through = options.throughId ?? Infinity;
  for (;;) {
    const ids = (await activeIdsAfter(ctx.db, after, options.blockSize ?? 200)).filter((id) => id <= through);
    if (ids.length === 0) break;
    for (const id of ids) {
      summary.scanned++;
      const cp = await sweepFacts(ctx.db, id);
      if (!cp || cp.status !== 'active') continue;
      const identifiers: Identifier[] = await identifiersAsInput(ctx.db, id);
      const candidates = await scoredCandidates(ctx.db, { analysis: analyse(cp.canonicalName, cp.jurisdiction), country: cp.jurisdiction, identifiers }, model);
      const links = await cannotLinksOf(ctx.db, [id]);
      const survivors = await survivorsOf(
        ctx.db,
        links.flatMap((l) => [l.counterpartyId, l.otherCounterpartyId ?? l.counterpartyId]),
      );
      const apart = new Set(
        links.flatMap((l) => (l.otherCounterpartyId === null ? [] : [survivors.get(l.counterpartyId), survivors.get(l.otherCounterpartyId)])),
      );
      for (const c of candidates) {
        // Each pair once: from its lower id.
        if (c.counterpartyId <= id) continue;
        const kind = classify(c, model.newAt);
        if (!kind) continue;
        if (apart.has(c.counterpartyId)) {
          summary.skippedCannotLink++;
          continue;
        }
        const filed = await fileItem(ctx, who, id, c, kind);
        if (filed === null) summary.skippedExisting++;
        else {
          summary.itemIds.push(filed);
          if (kind === 'duplicate') summary.duplicateItems++;
          else summary.affiliateItems++;
        }
      }
    }
    after = ids[ids.length - 1]!;
    options.onProgress?.(summary);
  }
  return summary;
}

async function fileItem(ctx: RegisterContext, who: ActorInput, left: number, c: ScoredCandidate, kind: 'duplicate' | 'affiliate'): Promise<number | null> {
  return write(ctx, async (cs) => {
    const rows = await cs.lock('counterparty', [left, c.counterpartyId]);
    if (rows.length !== 2 || rows.some((r) => r.status !== 'active')) return null;
    if (await pairHasItem(cs.trx, left, c.counterpartyId)) return null;
    const at = ctx.now();
    const item = await cs.insert('review_item', {
      kind,
      mention_id: null,
      left_counterparty_id: left,
      right_counterparty_id: c.counterpartyId,
      score: jsonScore(c.score),
      evidence: {
        summary:
          kind === 'duplicate'
            ? `${String(rows[0]!.canonical_name)} and ${c.canonicalName} look like one entity (score ${jsonScore(c.score)})`
            : `${String(rows[0]!.canonical_name)} and ${c.canonicalName} share only contact or bank details: proposed affiliate_of`,
        features: c.pair.explanation,
        identifierNotes: c.pair.identifierNotes,
        override: c.pair.override,
        via: 'sweep',
      },
      status: 'open',
      decision: null,
      decided_by: null,
      decided_at: null,
      reason: null,
      created_at: at.toISOString(),
    });
    await commitEvent(cs, {
      type: 'created',
      actor: who.actor,
      at,
      reason: who.reason ?? 'duplicate sweep',
      requestId: who.requestId,
      details: { entity: 'review_item', reviewItemId: item.id, kind, leftCounterpartyId: left, rightCounterpartyId: c.counterpartyId },
    });
    return item.id;
  });
}
