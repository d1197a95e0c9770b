/**
 * One entry per person who signs: the same signer is often read twice (a "/s/" line inside a "By:" block, a
 * "Signed by" line and its "on behalf of" line); the reading that says more (title, party) is kept.
 */
import { termKey } from './clean-term.ts';
import type { ContractSigner } from './types.ts';

/** No real contract has more signers; the bound keeps adversarial input linear. */
export const MAX_SIGNERS = 200;

export function mergeSigners(groups: readonly ContractSigner[][]): ContractSigner[] {
  const byKey = new Map<string, ContractSigner>();
  for (const group of groups) {
    for (const s of group) {
      const key = `${s.capacity}\u0000${termKey(s.name)}`;
      const seen = byKey.get(key);
      if (seen === undefined) {
        if (byKey.size < MAX_SIGNERS) byKey.set(key, { ...s });
        continue;
      }
      if (seen.title === undefined && s.title !== undefined) seen.title = s.title;
      if (seen.signsFor === undefined && s.signsFor !== undefined) seen.signsFor = s.signsFor;
    }
  }
  // A notary's or witness's "/s/" line is read as a signature too: the person signs as notary or witness only.
  const attests = new Set([...byKey.values()].filter((s) => s.capacity !== 'signatory').map((s) => termKey(s.name)));
  return [...byKey.values()].filter((s) => s.capacity !== 'signatory' || s.signsFor !== undefined || !attests.has(termKey(s.name)));
}
