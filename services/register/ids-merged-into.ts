/** The counterparty ids a cannot-link may name for a set of counterparties: the ids and every id merged into them. */
import type { ChangeSet } from './state/change-set.ts';
import { mergedDirectlyInto } from '../../db/queries/counterparties.ts';

/** The ids plus every id ever merged into them (cannot-links may name an old id). */
export async function idsMergedInto(cs: ChangeSet, ids: number[]): Promise<number[]> {
  const all = new Set(ids);
  let frontier = [...ids];
  for (let depth = 0; frontier.length > 0 && depth < 1000; depth++) {
    frontier = (await mergedDirectlyInto(cs.trx, frontier)).filter((id) => !all.has(id));
    for (const id of frontier) all.add(id);
  }
  return [...all];
}
