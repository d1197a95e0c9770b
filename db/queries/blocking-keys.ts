/**
 * Candidate lookup through blocking keys. Each key contributes at most `perKey` counterparties (an index range
 * scan on the primary key), so a very common key cannot flood the candidate list; counterparties sharing more
 * keys come first.
 */
import { sql } from 'kysely';
import type { Queryable } from './util.ts';
import { id } from './util.ts';

export async function candidatesByKeys(
  db: Queryable,
  keys: string[],
  options: { perKey?: number; limit?: number } = {},
): Promise<{ counterpartyId: number; sharedKeys: number }[]> {
  if (keys.length === 0) return [];
  const perKey = options.perKey ?? 200;
  const limit = options.limit ?? 50;
  const result = await sql<{ counterparty_id: string | number; shared: string | number }>`
    SELECT c.counterparty_id, count(*) AS shared
    FROM unnest(${sql.val(keys)}::text[]) AS k(key)
    CROSS JOIN LATERAL (
      SELECT DISTINCT b.counterparty_id FROM blocking_key b WHERE b.key = k.key LIMIT ${perKey}
    ) c
    GROUP BY c.counterparty_id
    ORDER BY shared DESC, c.counterparty_id
    LIMIT ${limit}`.execute(db);
  return result.rows.map((r) => ({ counterpartyId: id(r.counterparty_id), sharedKeys: Number(r.shared) }));
}

export async function keysOfCounterparty(db: Queryable, counterpartyId: number): Promise<string[]> {
  const rows = await db.selectFrom('blocking_key').select('key').distinct().where('counterparty_id', '=', counterpartyId).orderBy('key').execute();
  return rows.map((r) => r.key);
}

export interface CandidateDetail {
  counterpartyId: number;
  canonicalName: string;
  jurisdiction: string | null;
  names: { name: string; kind: string }[];
  identifiers: { scheme: string; value: string; label: string | null }[];
}

/**
 * Candidates by blocking keys and by identifiers, with their names and identifiers, in ONE statement (one round
 * trip, one consistent snapshot). Keys and identifiers only ever belong to active counterparties (a merge moves
 * them), so no merged counterparty comes back.
 */
export async function candidateDetails(
  db: Queryable,
  keys: string[],
  identifiers: { scheme: string; value: string }[],
  options: { perKey?: number; limit?: number } = {},
): Promise<CandidateDetail[]> {
  if (keys.length === 0 && identifiers.length === 0) return [];
  const result = await sql<{
    id: string | number;
    canonical_name: string;
    jurisdiction: string | null;
    names: [string, string][] | string;
    identifiers: [string, string, string | null][] | string;
  }>`
    WITH by_key AS (
      SELECT c.counterparty_id, count(*) AS shared
      FROM unnest(${sql.val(keys)}::text[]) AS k(key)
      CROSS JOIN LATERAL (
        SELECT DISTINCT b.counterparty_id FROM blocking_key b WHERE b.key = k.key LIMIT ${options.perKey ?? 200}
      ) c
      GROUP BY c.counterparty_id
      ORDER BY shared DESC, c.counterparty_id
      LIMIT ${options.limit ?? 50}
    ), ids AS (
      SELECT counterparty_id FROM by_key
      UNION
      SELECT i.counterparty_id FROM counterparty_identifier i
      JOIN unnest(${sql.val(identifiers.map((i) => i.scheme))}::text[], ${sql.val(identifiers.map((i) => i.value))}::text[]) AS p(scheme, value)
        ON i.scheme = p.scheme AND i.value = p.value
    )
    SELECT cp.id, cp.canonical_name, cp.jurisdiction,
      (SELECT coalesce(json_agg(json_build_array(n.name, n.kind) ORDER BY n.id), '[]'::json) FROM counterparty_name n WHERE n.counterparty_id = cp.id) AS names,
      (SELECT coalesce(json_agg(json_build_array(i.scheme, i.value, i.label) ORDER BY i.id), '[]'::json) FROM counterparty_identifier i WHERE i.counterparty_id = cp.id) AS identifiers
    FROM ids JOIN counterparty cp ON cp.id = ids.counterparty_id
    WHERE cp.status = 'active'
    ORDER BY cp.id`.execute(db);
  return result.rows.map((r) => {
    const names = (typeof r.names === 'string' ? JSON.parse(r.names) : r.names) as [string, string][];
    const ids = (typeof r.identifiers === 'string' ? JSON.parse(r.identifiers) : r.identifiers) as [string, string, string | null][];
    return {
      counterpartyId: id(r.id),
      canonicalName: r.canonical_name,
      jurisdiction: r.jurisdiction,
      names: names.map(([name, kind]) => ({ name, kind })),
      identifiers: ids.map(([scheme, value, label]) => ({ scheme, value, label })),
    };
  });
}
