/** The merge's guard against a recorded "different" (a cannot-link); the review decisions use it too (review.ts). */
import { RegisterError } from './errors.ts';
import { idsMergedInto } from './ids-merged-into.ts';
import type { ChangeSet } from './state/change-set.ts';
import { cannotLinksOf } from '../../db/queries/review.ts';
import { survivorsOf } from '../../db/queries/counterparties.ts';

/** Refuses when a cannot-link separates any two of the counterparties (after following merges). */
export async function assertNoCannotLink(cs: ChangeSet, ids: number[]): Promise<void> {
  const links = await cannotLinksOf(cs.trx, await idsMergedInto(cs, ids));
  const survivors = await survivorsOf(
    cs.trx,
    links.flatMap((l) => [l.counterpartyId, l.otherCounterpartyId ?? l.counterpartyId]),
  );
  const set = new Set(ids);
  for (const link of links) {
    if (link.otherCounterpartyId === null) continue;
    const a = survivors.get(link.counterpartyId) ?? link.counterpartyId;
    const b = survivors.get(link.otherCounterpartyId) ?? link.otherCounterpartyId;
    if (a !== b && set.has(a) && set.has(b)) {
      throw new RegisterError('CANNOT_LINK', `counterparties ${a} and ${b} were recorded as different entities; undo that review decision first`, {
        counterpartyIds: [a, b],
      });
    }
  }
}
