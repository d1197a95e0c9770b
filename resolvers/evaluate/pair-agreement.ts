/**
 * Agreement of two clusterings of the same items, over the pairs either puts together: the Jaccard index of their
 * co-clustered pair sets, |A ∩ B| / |A ∪ B| (1 when neither joins anything). Unlike the Rand index, the many
 * pairs both keep apart do not count, so one differing pair among a few thousand shows. Also answers which pairs
 * differ, for a report (enumerated cluster by cluster: meant for clusterings of small clusters).
 */
import { contingency, pairsOf } from './contingency.ts';

export interface PairAgreement {
  agreement: number;
  /** Pairs together in both, in the first only, in the second only. */
  both: number;
  firstOnly: number;
  secondOnly: number;
}

export function pairAgreement(first: readonly (string | number)[], second: readonly (string | number)[]): PairAgreement {
  if (first.length !== second.length) throw new RangeError(`the clusterings label ${first.length} and ${second.length} items; they must label the same items`);
  const table = contingency(first, second);
  let both = 0;
  for (const cell of table.cells) both += pairsOf(cell.count);
  const inFirst = table.goldSizes.reduce((sum, size) => sum + pairsOf(size), 0);
  const inSecond = table.predictedSizes.reduce((sum, size) => sum + pairsOf(size), 0);
  const union = inFirst + inSecond - both;
  return { agreement: union === 0 ? 1 : both / union, both, firstOnly: inFirst - both, secondOnly: inSecond - both };
}

/** The item index pairs put together by one clustering and not by the other (each pair once, lower index first). */
export function differingPairs(
  first: readonly (string | number)[],
  second: readonly (string | number)[],
): { pair: [number, number]; together: 'first' | 'second' }[] {
  const out: { pair: [number, number]; together: 'first' | 'second' }[] = [];
  const scan = (a: readonly (string | number)[], b: readonly (string | number)[], together: 'first' | 'second'): void => {
    const groups = new Map<string | number, number[]>();
    a.forEach((label, i) => groups.set(label, [...(groups.get(label) ?? []), i]));
    for (const members of groups.values()) {
      for (let x = 0; x < members.length; x++) {
        for (let y = x + 1; y < members.length; y++) if (b[members[x]!] !== b[members[y]!]) out.push({ pair: [members[x]!, members[y]!], together });
      }
    }
  };
  scan(first, second, 'first');
  scan(second, first, 'second');
  return out;
}
