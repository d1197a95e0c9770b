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
  return result.rows.map(detailOf);
}

/**
 * candidateDetails for many probes in ONE statement: the answer for probe i is exactly what candidateDetails
 * answers for it alone (same per-key cap, same ranking by shared keys then id, same limit per probe, identifier
 * holders added, active only, ordered by id). Each distinct key is looked up once, and each candidate's names and
 * identifiers are read once however many probes share it.
 */
export async function candidateDetailsBatch(
  db: Queryable,
  probes: { keys: string[]; identifiers: { scheme: string; value: string }[] }[],
  options: { perKey?: number; limit?: number } = {},
): Promise<CandidateDetail[][]> {
  const out: CandidateDetail[][] = probes.map(() => []);
  const keyProbe: number[] = [];
  const keys: string[] = [];
  const idProbe: number[] = [];
  const schemes: string[] = [];
  const values: string[] = [];
  probes.forEach((probe, p) => {
    for (const key of probe.keys) {
      keyProbe.push(p);
      keys.push(key);
    }
    for (const identifier of probe.identifiers) {
      idProbe.push(p);
      schemes.push(identifier.scheme);
      values.push(identifier.value);
    }
  });
  if (keys.length === 0 && schemes.length === 0) return out;
  const result = await sql<{
    ps: (string | number)[] | string;
    id: string | number;
    canonical_name: string;
    jurisdiction: string | null;
    names: [string, string][] | string;
    identifiers: [string, string, string | null][] | string;
  }>`
    WITH q AS (
      SELECT p, key FROM unnest(${sql.val(keyProbe)}::int[], ${sql.val(keys)}::text[]) AS q(p, key)
    ), hits AS (
      SELECT dk.key, c.counterparty_id
      FROM (SELECT DISTINCT key FROM q) dk
      CROSS JOIN LATERAL (
        SELECT DISTINCT b.counterparty_id FROM blocking_key b WHERE b.key = dk.key LIMIT ${options.perKey ?? 200}
      ) c
    ), by_key AS (
      SELECT p, counterparty_id FROM (
        SELECT q.p, h.counterparty_id, row_number() OVER (PARTITION BY q.p ORDER BY count(*) DESC, h.counterparty_id) AS rn
        FROM q JOIN hits h ON h.key = q.key
        GROUP BY q.p, h.counterparty_id
      ) r
      WHERE rn <= ${options.limit ?? 50}
    ), pairs AS (
      SELECT p, counterparty_id FROM by_key
      UNION
      SELECT ip.p, i.counterparty_id FROM counterparty_identifier i
      JOIN unnest(${sql.val(idProbe)}::int[], ${sql.val(schemes)}::text[], ${sql.val(values)}::text[]) AS ip(p, scheme, value)
        ON i.scheme = ip.scheme AND i.value = ip.value
    ), cps AS (
      SELECT counterparty_id, array_agg(p ORDER BY p) AS ps FROM pairs GROUP BY counterparty_id
    )
    SELECT cps.ps, cp.id, cp.canonical_name, cp.jurisdiction,
      (SELECT coalesce(json_agg(json_build_array(n.name, n.kind) ORDER BY n.id), '[]'::json) FROM counterparty_name n WHERE n.counterparty_id = cp.id) AS names,
      (SELECT coalesce(json_agg(json_build_array(i.scheme, i.value, i.label) ORDER BY i.id), '[]'::json) FROM counterparty_identifier i WHERE i.counterparty_id = cp.id) AS identifiers
    FROM cps JOIN counterparty cp ON cp.id = cps.counterparty_id
    WHERE cp.status = 'active'
    ORDER BY cp.id`.execute(db);
  for (const r of result.rows) {
    const detail = detailOf(r);
    for (const p of parseIntArray(r.ps)) out[p]!.push(detail);
  }
  return out;
}

/** int[] as both drivers answer it (an array, or PostgreSQL's text form '{1,2}'). */
function parseIntArray(value: (string | number)[] | string): number[] {
  if (Array.isArray(value)) return value.map(Number);
  const inner = value.replace(/^\{|\}$/g, '');
  return inner.length === 0 ? [] : inner.split(',').map(Number);
}

function detailOf(r: {
  id: string | number;
  canonical_name: string;
  jurisdiction: string | null;
  names: [string, string][] | string;
  identifiers: [string, string, string | null][] | string;
}): CandidateDetail {
  const names = (typeof r.names === 'string' ? JSON.parse(r.names) : r.names) as [string, string][];
  const ids = (typeof r.identifiers === 'string' ? JSON.parse(r.identifiers) : r.identifiers) as [string, string, string | null][];
  return {
    counterpartyId: id(r.id),
    canonicalName: r.canonical_name,
    jurisdiction: r.jurisdiction,
    names: names.map(([name, kind]) => ({ name, kind })),
    identifiers: ids.map(([scheme, value, label]) => ({ scheme, value, label })),
  };
}
