/**
 * Sightings of a counterparty's names, inside a ChangeSet: a name seen once more (a new row, or one more sighting of
 * the same name and kind) or once fewer (the row goes when nobody has seen it any more).
 */
import type { NameKind } from '../../resolvers/vocabulary.ts';
import type { ChangeSet } from './state/change-set.ts';
import type { StateRow, StateValues } from './state/tables.ts';
import { analyse } from './matching/analysis.ts';

export interface NameSighting {
  name: string;
  kind: NameKind;
  source?: string | null;
  mentionId?: number | null;
  contractId?: number | null;
  confirmedBy?: string | null;
}

/** The values of a new name row (without its id): what addNameSighting inserts, and the bulk loader's COPY. */
export function nameValues(counterpartyId: number, sighting: NameSighting, at: Date): StateValues<'counterparty_name'> {
  const analysis = analyse(sighting.name);
  return {
    counterparty_id: counterpartyId,
    name: sighting.name,
    normalised: analysis.normalised,
    kind: sighting.kind,
    legal_form: analysis.legalForm?.family ?? null,
    seen_count: 1,
    source: sighting.source ?? null,
    mention_id: sighting.mentionId ?? null,
    contract_id: sighting.contractId ?? null,
    confirmed_by: sighting.confirmedBy ?? null,
    created_at: at.toISOString(),
  };
}

/** Adds a sighting of a name: a new row, or one more sighting of the same (name, kind). */
export async function addNameSighting(cs: ChangeSet, counterpartyId: number, sighting: NameSighting, at: Date): Promise<StateRow<'counterparty_name'>> {
  // The counterparty's names as the ChangeSet holds them (locked on first use), the buffer's new ones with them.
  const existing = (await cs.namesOf(counterpartyId)).find((n) => n.name === sighting.name && n.kind === sighting.kind)?.id;
  if (existing !== undefined) {
    const row = await cs.require('counterparty_name', existing);
    const patch: StateValues<'counterparty_name'> = { seen_count: row.seen_count + 1 };
    if (sighting.confirmedBy && !row.confirmed_by) patch.confirmed_by = sighting.confirmedBy;
    return cs.update('counterparty_name', existing, patch);
  }
  return cs.insert('counterparty_name', nameValues(counterpartyId, sighting, at));
}

/** One fewer sighting of a name (a mention moved away); the row goes when nobody has seen it any more. */
export async function removeNameSighting(cs: ChangeSet, counterpartyId: number, name: string, kind: NameKind): Promise<void> {
  // The counterparty's names as the ChangeSet holds them (locked on first use).
  const held = await cs.namesOf(counterpartyId);
  const existing = held.find((n) => n.name === name && n.kind === kind)?.id;
  if (existing === undefined) return;
  const row = await cs.require('counterparty_name', existing);
  const count = row.seen_count - 1;
  // A counterparty keeps at least one name: the last one stays with a zero count.
  if (count <= 0 && !row.confirmed_by && held.length > 1) {
    await cs.delete('counterparty_name', existing);
    return;
  }
  await cs.update('counterparty_name', existing, { seen_count: Math.max(0, count) });
}
