/**
 * The neighbourhood of a mention: the keys that serialise resolutions of look-alike names (same core or same
 * 6-letter prefix, same strong identifier) across instances, so that two concurrent mentions of one new company do
 * not create it twice. A resolution takes their transaction-scoped advisory locks before it reads its candidates.
 */
import { lockNeighbourhoodKeys } from '../../../db/queries/resolve-reads.ts';
import { keysOfAnalysis } from '../matching/keys.ts';
import type { ChangeSet } from '../state/change-set.ts';
import type { PreparedMention } from './prepare.ts';

/** The neighbourhood keys of these mentions (duplicates kept: the lock statement takes each once, sorted). */
export function neighbourhoodKeys(many: readonly PreparedMention[]): string[] {
  const keys: string[] = [];
  for (const prepared of many) {
    for (const k of keysOfAnalysis(prepared.analysis)) if (k.startsWith('p:')) keys.push(k);
    keys.push(`core:${prepared.analysis.core}`);
    for (const identifier of prepared.identifiers) keys.push(`id:${identifier.scheme}:${identifier.value}`);
  }
  return keys;
}

/** The neighbourhood locks of many mentions in one statement (a batch chunk), taken in one sorted order. Transaction-scoped. */
export async function lockNameNeighbourhoods(cs: ChangeSet, many: PreparedMention[]): Promise<void> {
  await lockNeighbourhoodKeys(cs.trx, neighbourhoodKeys(many));
}
