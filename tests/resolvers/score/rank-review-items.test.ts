/**
 * The review queue's order (resolvers/score/rank-review-items.ts). The rule is ours (no published source): groups
 * ranked by contracts affected × (0.5 + 0.5 × uncertainty), uncertainty 1 midway between newAt and linkAt.
 * The expected values below are worked by hand from that rule.
 */
import { describe, expect, it } from 'vitest';
import { groupKeyOf, rankReviewItems, uncertaintyOf, type ReviewItemFacts } from '../../../resolvers/score/index.ts';

const T = { linkAt: 10, newAt: 2 };

function item(id: number, over: Partial<ReviewItemFacts> = {}): ReviewItemFacts {
  return { id, groupKey: `g${id}`, score: 6, mentionContracts: 0, candidateContracts: 1, ...over };
}

describe('uncertaintyOf', () => {
  it('is 1 midway between the thresholds, 0 at either and beyond, 0.5 without a score', () => {
    expect(uncertaintyOf(6, T)).toBe(1);
    expect(uncertaintyOf(10, T)).toBe(0);
    expect(uncertaintyOf(2, T)).toBe(0);
    expect(uncertaintyOf(-5, T)).toBe(0);
    expect(uncertaintyOf(8, T)).toBe(0.5);
    expect(uncertaintyOf(null, T)).toBe(0.5);
  });
});

describe('rankReviewItems', () => {
  it('puts the item touching more contracts first, even when it is younger', () => {
    const ranked = rankReviewItems([item(1, { candidateContracts: 1 }), item(2, { candidateContracts: 4 })], T);
    expect(ranked.map((r) => r.id)).toEqual([2, 1]);
    // 4 contracts × (0.5 + 0.5 × 1) = 4; 1 × 1 = 1.
    expect(ranked.map((r) => r.priority)).toEqual([4, 1]);
  });

  it('at equal consequence, puts the item the model is least sure of first', () => {
    const ranked = rankReviewItems([item(1, { score: 9.5 }), item(2, { score: 6.5 }), item(3, { score: 2.2 })], T);
    expect(ranked.map((r) => r.id)).toEqual([2, 1, 3]);
  });

  it("keeps a group together, oldest first, and counts each mention's contract once and the candidate's once", () => {
    const ranked = rankReviewItems(
      [
        item(5, { groupKey: 'same', mentionContracts: 1, candidateContracts: 3 }),
        item(1, { groupKey: 'alone', candidateContracts: 4 }),
        item(3, { groupKey: 'same', mentionContracts: 1, candidateContracts: 3 }),
      ],
      T,
    );
    // group "same": 1 + 1 mention contracts + 3 of the candidate = 5 > 4.
    expect(ranked.map((r) => r.id)).toEqual([3, 5, 1]);
    expect(ranked[0]!.group).toEqual({ key: 'same', size: 2, itemIds: [3, 5], contracts: 5 });
    expect(ranked[1]!.group).toBe(ranked[0]!.group);
    expect(ranked[2]!.group.size).toBe(1);
  });

  it('breaks ties by more items, then by the oldest item, so the order is stable', () => {
    const ranked = rankReviewItems([item(4), item(2), item(9, { groupKey: 'g2' })], T);
    expect(ranked.map((r) => r.id)).toEqual([2, 9, 4]);
  });

  it('returns every item exactly once', () => {
    const items = Array.from({ length: 200 }, (_, i) => item(i + 1, { groupKey: `k${i % 17}`, score: (i * 7) % 13, candidateContracts: i % 5 }));
    const ids = rankReviewItems(items, T).map((r) => r.id);
    expect(new Set(ids).size).toBe(200);
    expect(ids).toHaveLength(200);
  });
});

describe('groupKeyOf', () => {
  const mention = { core: 'brackenridge fabrication', legalFormFamily: null, country: null };
  it('groups spellings a comparison cannot tell apart waiting on one candidate', () => {
    const a = groupKeyOf({ kind: 'mention_link', rightCounterpartyId: 7, leftCounterpartyId: null, mention });
    expect(groupKeyOf({ kind: 'mention_link', rightCounterpartyId: 7, leftCounterpartyId: null, mention: { ...mention } })).toBe(a);
    expect(groupKeyOf({ kind: 'mention_link', rightCounterpartyId: 8, leftCounterpartyId: null, mention })).not.toBe(a);
    expect(groupKeyOf({ kind: 'mention_link', rightCounterpartyId: 7, leftCounterpartyId: null, mention: { ...mention, legalFormFamily: 'inc' } })).not.toBe(a);
    expect(groupKeyOf({ kind: 'mention_link', rightCounterpartyId: 7, leftCounterpartyId: null, mention: { ...mention, country: 'US' } })).not.toBe(a);
  });
  it('keys a pair of counterparties by kind and the pair in either order', () => {
    const ab = groupKeyOf({ kind: 'duplicate', rightCounterpartyId: 3, leftCounterpartyId: 9, mention: null });
    expect(groupKeyOf({ kind: 'duplicate', rightCounterpartyId: 9, leftCounterpartyId: 3, mention: null })).toBe(ab);
    expect(groupKeyOf({ kind: 'affiliate', rightCounterpartyId: 9, leftCounterpartyId: 3, mention: null })).not.toBe(ab);
  });
});
