/** Our own legal entities (never counterparties). */
import type { Queryable } from './util.ts';
import { id, iso } from './util.ts';
import type { OwnEntityOtherName } from '../tables/register-tables.ts';

export interface OwnEntityView {
  id: number;
  name: string;
  normalised: string;
  country: string | null;
  identifiers: { scheme: string; value: string; label?: string }[];
  /** Its other names (trading, former, …): recognised as ours like the legal name. */
  otherNames: OwnEntityOtherName[];
  createdAt: string;
  removedAt: string | null;
}

export async function listOwnEntities(db: Queryable, options: { includeRemoved?: boolean } = {}): Promise<OwnEntityView[]> {
  let query = db.selectFrom('own_entity').selectAll().orderBy('id');
  if (!options.includeRemoved) query = query.where('removed_at', 'is', null);
  const rows = await query.execute();
  return rows.map(ownEntityView);
}

/** The view of an own_entity row, as read by kysely or as JSON (row_to_json: timestamps as text). */
export function ownEntityView(r: {
  id: unknown;
  name: string;
  normalised: string;
  country: string | null;
  identifiers: OwnEntityView['identifiers'];
  other_names: OwnEntityOtherName[];
  created_at: unknown;
  removed_at: unknown;
}): OwnEntityView {
  return {
    id: id(r.id),
    name: r.name,
    normalised: r.normalised,
    country: r.country,
    identifiers: r.identifiers,
    otherNames: r.other_names,
    createdAt: iso(r.created_at) as string,
    removedAt: iso(r.removed_at),
  };
}

/** The id of the current (not removed) own entity with this normalised name, if there is one. */
export async function findOwnEntityId(db: Queryable, normalised: string): Promise<number | undefined> {
  const row = await db.selectFrom('own_entity').select('id').where('normalised', '=', normalised).where('removed_at', 'is', null).executeTakeFirst();
  return row ? id(row.id) : undefined;
}
