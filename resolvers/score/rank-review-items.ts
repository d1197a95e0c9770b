/**
 * The order of the review queue: what a person should decide first.
 *
 * Glossary:
 * - group: open items one decision settles together. Mentions that spell the same name the same way (same core,
 *   same legal-form family, same country) and wait on the same candidate are one question asked several times:
 *   "BRACKENRIDGE FABRICATION INC" in five contracts against one counterparty. A pair of counterparties is a
 *   group of its own.
 * - contracts: how many contracts the answer touches: the contracts of the group's mentions and those of the
 *   counterparties on the other side. A wrong or missing link there is what sends a notice or a payment astray.
 * - uncertainty: 1 where the score sits midway between newAt and linkAt, falling to 0 at either threshold. There
 *   the model knows least, so a person's answer adds the most; an item just under linkAt or just over newAt is
 *   one the model nearly settled on its own.
 *
 * priority = contracts × (0.5 + 0.5 × uncertainty), per group; groups in descending priority, then by more
 * items, then by the oldest item; items of a group stay together, oldest first. The weights are ours (no
 * published source): consequence counts fully, uncertainty can at most halve it, so a contract-heavy item is
 * never buried under many single-contract coin tosses.
 */

/** One open review item, as the ranking needs it. */
export interface ReviewItemFacts {
  id: number;
  /** Items with the same key are one question (see groupKeyOf). */
  groupKey: string;
  /** The item's score in bits, or null when the item was raised without one. */
  score: number | null;
  /** Contracts of the item's mention (0 or 1). */
  mentionContracts: number;
  /** Contracts of the counterparty or counterparties on the other side. */
  candidateContracts: number;
}

export interface RankedReviewItem {
  id: number;
  priority: number;
  uncertainty: number;
  group: { key: string; size: number; itemIds: number[]; contracts: number };
}

export interface ReviewThresholds {
  linkAt: number;
  newAt: number;
}

/** 1 midway between the thresholds, 0 at or beyond either; 0.5 when the item has no score. */
export function uncertaintyOf(score: number | null, t: ReviewThresholds): number {
  if (score === null || !Number.isFinite(score)) return 0.5;
  const half = (t.linkAt - t.newAt) / 2;
  if (half <= 0) return 0.5;
  const mid = (t.linkAt + t.newAt) / 2;
  return Math.max(0, 1 - Math.abs(score - mid) / half);
}

interface Group {
  key: string;
  items: ReviewItemFacts[];
  contracts: number;
  uncertainty: number;
  priority: number;
}

function groupOf(key: string, items: ReviewItemFacts[], t: ReviewThresholds): Group {
  const ordered = [...items].sort((a, b) => a.id - b.id);
  // Every mention of the group is its own contract at most once; the other side's contracts are the same
  // counterparty for every item of a group, so they count once.
  const contracts = ordered.reduce((n, i) => n + i.mentionContracts, 0) + Math.max(...ordered.map((i) => i.candidateContracts));
  const uncertainty = Math.max(...ordered.map((i) => uncertaintyOf(i.score, t)));
  const priority = Math.max(1, contracts) * (0.5 + 0.5 * uncertainty);
  return { key, items: ordered, contracts, uncertainty, priority };
}

/** Orders open review items by priority, each group's items together (see the header). Pure; ties by id. */
export function rankReviewItems(items: readonly ReviewItemFacts[], thresholds: ReviewThresholds): RankedReviewItem[] {
  const byKey = new Map<string, ReviewItemFacts[]>();
  for (const item of items) {
    const list = byKey.get(item.groupKey);
    if (list) list.push(item);
    else byKey.set(item.groupKey, [item]);
  }
  const groups = [...byKey].map(([key, list]) => groupOf(key, list, thresholds));
  groups.sort((a, b) => b.priority - a.priority || b.items.length - a.items.length || a.items[0]!.id - b.items[0]!.id);
  return groups.flatMap((g) => {
    const group = { key: g.key, size: g.items.length, itemIds: g.items.map((i) => i.id), contracts: g.contracts };
    return g.items.map((i) => ({ id: i.id, priority: round3(g.priority), uncertainty: round3(uncertaintyOf(i.score, thresholds)), group }));
  });
}

/**
 * The group key of an item. A mention item: the candidate, then the mention's core name, legal-form family and
 * country, so that only spellings a comparison cannot tell apart share a key. A pair of counterparties: the
 * kind and the pair in either order.
 */
export function groupKeyOf(item: {
  kind: string;
  rightCounterpartyId: number;
  leftCounterpartyId: number | null;
  mention: { core: string; legalFormFamily: string | null; country: string | null } | null;
}): string {
  if (item.mention) {
    const m = item.mention;
    return `${item.kind}:${item.rightCounterpartyId}:${m.core}|${m.legalFormFamily ?? ''}|${m.country ?? ''}`;
  }
  const [a, b] = [item.leftCounterpartyId ?? 0, item.rightCounterpartyId].sort((x, y) => x - y);
  return `${item.kind}:${a}:${b}`;
}

function round3(x: number): number {
  return Math.round(x * 1000) / 1000;
}
