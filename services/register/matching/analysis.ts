/**
 * The register's one door to name analysis (resolvers/analyse). Analyses are pure, so a bounded in-process cache
 * is safe: it can be dropped at any time and another instance computes the same values.
 */
import { analyseName, type NameAnalysis } from '../../../resolvers/analyse/index.ts';

const CACHE_LIMIT = 50_000;
const cache = new Map<string, NameAnalysis>();

export function analyse(text: string, country?: string | null): NameAnalysis {
  const key = `${country ?? ''}\u0000${text}`;
  const hit = cache.get(key);
  if (hit) return hit;
  const analysis = analyseName(text, country ? { country } : undefined);
  if (cache.size >= CACHE_LIMIT) cache.delete(cache.keys().next().value as string);
  cache.set(key, analysis);
  return analysis;
}
