/**
 * The one replacement the OCR and phonetic corruptions make: one occurrence of one pair, chosen at random.
 */
import type { Random } from '../../../resolvers/prng.ts';

/** Replaces one occurrence (chosen at random among all matches of all pairs), or null if none match. */
export function replaceOne(s: string, pairs: ReadonlyArray<readonly [string, string]>, rnd: Random): string | null {
  const hits: Array<{ at: number; from: string; to: string }> = [];
  for (const [from, to] of pairs) {
    for (let at = s.indexOf(from, 1); at >= 0; at = s.indexOf(from, at + 1)) hits.push({ at, from, to });
  }
  if (hits.length === 0) return null;
  const h = rnd.pick(hits);
  return s.slice(0, h.at) + h.to + s.slice(h.at + h.from.length);
}
