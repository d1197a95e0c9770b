/** Every change to a counterparty: its canonical name chosen again by the rules, its version (the ETag) bumped. */
import type { ChangeSet } from './state/change-set.ts';
import type { StateRow, StateValues } from './state/tables.ts';
import { chooseCanonicalName } from './canonical-name.ts';

/** Re-applies the canonical-value rules and bumps the version (every change to a counterparty changes its ETag). */
export async function touchCounterparty(cs: ChangeSet, counterpartyId: number, at: Date): Promise<StateRow<'counterparty'>> {
  const cp = await cs.require('counterparty', counterpartyId);
  const patch: StateValues<'counterparty'> = { version: cp.version + 1, updated_at: at.toISOString() };
  if (cp.status === 'active' && !cp.name_locked_by) {
    const names = await cs.namesOf(counterpartyId);
    const chosen = chooseCanonicalName(names, cp.canonical_name);
    if (chosen) patch.canonical_name = chosen.name;
  }
  return cs.update('counterparty', counterpartyId, patch);
}
