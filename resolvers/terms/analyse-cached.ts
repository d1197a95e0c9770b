/**
 * resolvers/analyse's analyseName behind a bounded memo: one contract asks about the same candidate strings many
 * times (every definition tries several name starts). Pure: same input, same output; results are shared, so
 * callers copy before handing anything out.
 */
import { analyseName, type AnalyseHints, type NameAnalysis } from '../analyse/index.ts';

const MAX_ENTRIES = 20_000;
const cache = new Map<string, NameAnalysis>();

export function analyseCached(text: string, hints?: AnalyseHints): NameAnalysis {
  const key = hints?.country === undefined ? text : `${text}\u0000${hints.country}`;
  const hit = cache.get(key);
  if (hit !== undefined) return hit;
  const analysis = hints === undefined ? analyseName(text) : analyseName(text, hints);
  if (cache.size >= MAX_ENTRIES) cache.clear();
  cache.set(key, analysis);
  return analysis;
}
