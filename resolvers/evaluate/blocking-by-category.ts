/**
 * Blocking quality per category of true pair (the categories issue 5 asks for): a pair involving a non-Latin
 * name; else one involving an acronym; else Latin-script names sharing at least one core word; else sharing none.
 * Translations and most acronyms cannot be found by name keys at all, so one overall PC would hide the figure
 * that matters: PC on Latin-script pairs that share a word.
 */
import { nameScript, type MatchRecord } from '../block/index.ts';
import { blockingMetrics, type BlockingMetrics } from './blocking-metrics.ts';

export const PAIR_CATEGORIES = ['latin_shared_word', 'latin_no_shared_word', 'acronym', 'non_latin'] as const;
export type PairCategory = (typeof PAIR_CATEGORIES)[number];

export interface CategoryCompleteness {
  truePairs: number;
  found: number;
  pairsCompleteness: number;
}

export interface BlockingReport {
  overall: BlockingMetrics;
  byCategory: Record<PairCategory, CategoryCompleteness>;
}

export function pairCategory(a: MatchRecord, b: MatchRecord, aIsAcronym: boolean, bIsAcronym: boolean): PairCategory {
  if (nameScript(a.analysis.normalised) !== 'latin' || nameScript(b.analysis.normalised) !== 'latin') return 'non_latin';
  if (aIsAcronym || bIsAcronym) return 'acronym';
  const tokensB = new Set(b.analysis.tokens);
  return a.analysis.tokens.some((t) => tokensB.has(t)) ? 'latin_shared_word' : 'latin_no_shared_word';
}

/**
 * @param gold   ground-truth entity label per record
 * @param left/right/count  candidate pairs as record indices
 */
export function blockingByCategory(
  records: readonly MatchRecord[],
  gold: readonly string[],
  isAcronym: readonly boolean[],
  candidates: { left: Int32Array; right: Int32Array; count: number },
): BlockingReport {
  const n = records.length;
  // True pairs, keyed i * n + j (exact in a double up to n ≈ 9.4e7).
  const members = new Map<string, number[]>();
  gold.forEach((label, i) => {
    const list = members.get(label);
    if (list) list.push(i);
    else members.set(label, [i]);
  });
  const truePairs = new Map<number, PairCategory>();
  for (const list of members.values()) {
    for (let x = 0; x < list.length; x++) {
      for (let y = x + 1; y < list.length; y++) {
        const i = list[x] as number;
        const j = list[y] as number;
        const [lo, hi] = i < j ? [i, j] : [j, i];
        truePairs.set(lo * n + hi, pairCategory(records[lo] as MatchRecord, records[hi] as MatchRecord, isAcronym[lo] === true, isAcronym[hi] === true));
      }
    }
  }
  const byCategory = Object.fromEntries(PAIR_CATEGORIES.map((c) => [c, { truePairs: 0, found: 0, pairsCompleteness: 1 }])) as Record<
    PairCategory,
    CategoryCompleteness
  >;
  for (const category of truePairs.values()) byCategory[category].truePairs++;
  let trueCandidatePairs = 0;
  for (let k = 0; k < candidates.count; k++) {
    const i = candidates.left[k] as number;
    const j = candidates.right[k] as number;
    const category = truePairs.get(i < j ? i * n + j : j * n + i);
    if (category === undefined) continue;
    trueCandidatePairs++;
    byCategory[category].found++;
  }
  for (const c of PAIR_CATEGORIES) {
    const entry = byCategory[c];
    entry.pairsCompleteness = entry.truePairs === 0 ? 1 : entry.found / entry.truePairs;
  }
  return {
    overall: blockingMetrics({ records: n, candidatePairs: candidates.count, truePairs: truePairs.size, trueCandidatePairs }),
    byCategory,
  };
}
