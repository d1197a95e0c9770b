/** Counterparty reads: detail with names, identifiers, relations, mention count and contracts with roles. */
import { sql } from 'kysely';
import type { Queryable } from './util.ts';
import { id, idOrNull, iso } from './util.ts';
import { namesOf, type NameView } from './names.ts';
import { identifiersOf, type IdentifierView } from './identifiers.ts';
import { relationsOf, type RelationView } from './relations.ts';

export interface CounterpartySummary {
  id: number;
  canonicalName: string;
  kind: string;
  jurisdiction: string | null;
  status: string;
  mergedInto: number | null;
  nameLockedBy: string | null;
  version: number;
  createdAt: string;
  updatedAt: string;
}

export interface CounterpartyDetail extends CounterpartySummary {
  names: NameView[];
  identifiers: IdentifierView[];
  relations: RelationView[];
  mentionCount: number;
  contracts: { contractId: number; source: string; externalId: string; title: string | null; roles: string[] }[];
}

export function toSummary(r: Record<string, unknown>): CounterpartySummary {
  return {
    id: id(r.id),
    canonicalName: r.canonical_name as string,
    kind: r.kind as string,
    jurisdiction: (r.jurisdiction as string | null) ?? null,
    status: r.status as string,
    mergedInto: idOrNull(r.merged_into),
    nameLockedBy: (r.name_locked_by as string | null) ?? null,
    version: Number(r.version),
    createdAt: iso(r.created_at) as string,
    updatedAt: iso(r.updated_at) as string,
  };
}

export async function getSummaries(db: Queryable, ids: number[]): Promise<Map<number, CounterpartySummary>> {
  const out = new Map<number, CounterpartySummary>();
  if (ids.length === 0) return out;
  const rows = await db.selectFrom('counterparty').selectAll().where('id', 'in', ids).execute();
  for (const r of rows) out.set(id(r.id), toSummary(r));
  return out;
}

export async function getCounterpartyDetail(db: Queryable, counterpartyId: number): Promise<CounterpartyDetail | undefined> {
  const row = await db.selectFrom('counterparty').selectAll().where('id', '=', counterpartyId).executeTakeFirst();
  if (!row) return undefined;
  const [names, identifiers, relations, count, contracts] = await Promise.all([
    namesOf(db, [counterpartyId]),
    identifiersOf(db, [counterpartyId]),
    relationsOf(db, [counterpartyId]),
    db
      .selectFrom('mention')
      .select((eb) => eb.fn.countAll<string>().as('n'))
      .where('counterparty_id', '=', counterpartyId)
      .where('status', 'in', ['linked', 'new'])
      .executeTakeFirstOrThrow(),
    contractsOf(db, counterpartyId),
  ]);
  return {
    ...toSummary(row),
    names: names.get(counterpartyId) ?? [],
    identifiers: identifiers.get(counterpartyId) ?? [],
    relations,
    mentionCount: Number(count.n),
    contracts,
  };
}

/** The contracts a counterparty is party to, with its role(s) in each: role per (contract, counterparty). */
export async function contractsOf(db: Queryable, counterpartyId: number): Promise<CounterpartyDetail['contracts']> {
  const result = await sql<{ id: string | number; source: string; external_id: string; title: string | null; roles: (string | null)[] }>`
    SELECT c.id, c.source, c.external_id, c.title, array_agg(DISTINCT cp.role) AS roles
    FROM mention m
    JOIN contract_party cp ON cp.mention_id = m.id
    JOIN contract c ON c.id = cp.contract_id
    WHERE m.counterparty_id = ${counterpartyId} AND m.status IN ('linked', 'new') AND c.status = 'active'
    GROUP BY c.id, c.source, c.external_id, c.title
    ORDER BY c.id`.execute(db);
  return result.rows.map((r) => ({
    contractId: id(r.id),
    source: r.source,
    externalId: r.external_id,
    title: r.title,
    roles: (r.roles ?? []).filter((x): x is string => x !== null),
  }));
}

/** Active counterparties in id order after `afterId` (keyset paging: sweeps and exports). */
export async function activeIdsAfter(db: Queryable, afterId: number, limit: number): Promise<number[]> {
  const rows = await db.selectFrom('counterparty').select('id').where('status', '=', 'active').where('id', '>', afterId).orderBy('id').limit(limit).execute();
  return rows.map((r) => id(r.id));
}

/** Every active counterparty's id, in id order (a sweep job cuts them into ranges). */
export async function allActiveIds(db: Queryable): Promise<number[]> {
  const rows = await db.selectFrom('counterparty').select('id').where('status', '=', 'active').orderBy('id').execute();
  return rows.map((r) => id(r.id));
}

/** Status and creation time of these counterparties (ids that do not exist are left out). */
export async function counterpartyStates(db: Queryable, ids: readonly number[]): Promise<{ id: number; status: string; createdAt: Date }[]> {
  if (ids.length === 0) return [];
  const rows = await db
    .selectFrom('counterparty')
    .select(['id', 'status', 'created_at'])
    .where('id', 'in', [...ids])
    .execute();
  return rows.map((r) => ({ id: id(r.id), status: r.status, createdAt: new Date(r.created_at) }));
}

export async function countActive(db: Queryable): Promise<number> {
  const row = await db
    .selectFrom('counterparty')
    .select((eb) => eb.fn.countAll<string>().as('n'))
    .where('status', '=', 'active')
    .executeTakeFirstOrThrow();
  return Number(row.n);
}

/** The longest merge chain followed (links): a longer one (a cycle?) has no active end. */
export const MAX_MERGE_CHAIN = 1000;

/**
 * The one walk of merge chains, in one statement: each id that exists mapped to the active end of its chain and the
 * number of links to it (0: the id is active), or to null when the chain is longer than MAX_MERGE_CHAIN links.
 * Ids that do not exist are left out. A merged counterparty always names its survivor (the schema's CHECK:
 * status 'merged' exactly when merged_into is set), so the end of a chain is its one row without merged_into.
 */
export async function mergeChainEnds(db: Queryable, ids: readonly number[]): Promise<Map<number, { id: number; links: number } | null>> {
  const out = new Map<number, { id: number; links: number } | null>();
  const unique = [...new Set(ids)];
  if (unique.length === 0) return out;
  const result = await sql<{ start: string | number; id: string | number; depth: number; ended: boolean }>`
    WITH RECURSIVE chain(start, id, merged_into, depth) AS (
      SELECT c.id, c.id, c.merged_into, 0 FROM counterparty c WHERE c.id = ANY(${sql.val(unique)}::bigint[])
      UNION ALL
      SELECT ch.start, c.id, c.merged_into, ch.depth + 1
      FROM chain ch JOIN counterparty c ON c.id = ch.merged_into
      WHERE ch.depth < ${MAX_MERGE_CHAIN}
    )
    SELECT start, id, depth, merged_into IS NULL AS ended FROM chain WHERE merged_into IS NULL OR depth = ${MAX_MERGE_CHAIN}`.execute(db);
  for (const r of result.rows) out.set(id(r.start), r.ended ? { id: id(r.id), links: Number(r.depth) } : null);
  return out;
}

/** Each id mapped to the active end of its merge chain (ids that do not exist, or whose chain is too long, are left out). */
export async function survivorsOf(db: Queryable, ids: number[]): Promise<Map<number, number>> {
  const out = new Map<number, number>();
  for (const [start, end] of await mergeChainEnds(db, ids)) if (end) out.set(start, end.id);
  return out;
}

/** Active counterparties mapped to the number of active contracts their linked or new mentions are parties of. */
export async function activeContractCounts(db: Queryable): Promise<Map<number, number>> {
  const result = await sql<{ counterparty_id: string | number; n: string | number }>`
    SELECT m.counterparty_id, count(DISTINCT p.contract_id) AS n
    FROM mention m JOIN contract_party p ON p.mention_id = m.id JOIN contract c ON c.id = p.contract_id AND c.status = 'active'
    JOIN counterparty cp ON cp.id = m.counterparty_id AND cp.status = 'active'
    WHERE m.status IN ('linked', 'new')
    GROUP BY m.counterparty_id`.execute(db);
  return new Map(result.rows.map((r) => [id(r.counterparty_id), Number(r.n)]));
}

/** A counterparty's canonical name, whatever its status; undefined when no such counterparty exists. */
export async function canonicalNameOf(db: Queryable, counterpartyId: number): Promise<string | undefined> {
  const row = await db.selectFrom('counterparty').select('canonical_name').where('id', '=', counterpartyId).executeTakeFirst();
  return row?.canonical_name;
}

/** The counterparties merged directly into any of these (one step of a merge chain, followed backwards). */
export async function mergedDirectlyInto(db: Queryable, ids: number[]): Promise<number[]> {
  const rows = await db.selectFrom('counterparty').select('id').where('merged_into', 'in', ids).execute();
  return rows.map((r) => id(r.id));
}

/** What a duplicate sweep compares a counterparty by: its canonical name, jurisdiction and status. */
export async function sweepFacts(
  db: Queryable,
  counterpartyId: number,
): Promise<{ canonicalName: string; jurisdiction: string | null; status: string } | undefined> {
  const row = await db.selectFrom('counterparty').select(['canonical_name', 'jurisdiction', 'status']).where('id', '=', counterpartyId).executeTakeFirst();
  return row ? { canonicalName: row.canonical_name, jurisdiction: row.jurisdiction, status: row.status } : undefined;
}
