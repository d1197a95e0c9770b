/**
 * Stored name analyses (migrations/20261205180000_counterparty_name_analysis.ts): written with every name, in the
 * write buffer's flush (set-based, in the same statement as the names) and one name at a time (undo, replay,
 * forget); read with the candidates (db/queries/blocking-keys.ts); found stale and rewritten, with the names'
 * blocking keys, by the re-analysis upkeep (services/register/reanalyse-names.ts).
 */
import { sql } from 'kysely';
import type { Transaction } from 'kysely';
import type { Database } from '../types.ts';
import { rowsJson, type SetWrite } from './state-writes.ts';
import { id, type Queryable } from './util.ts';

export interface NameAnalysisRow {
  name_id: number;
  /** The analysis as JSON (an object). */
  analysis: unknown;
  analysis_version: number;
  country: string | null;
}

/** Writes (or replaces) stored analyses: a SetWrite, so that a flush writes them in the statement of its names. */
export function upsertNameAnalysesWrite(rows: readonly NameAnalysisRow[]): SetWrite {
  return sql`INSERT INTO counterparty_name_analysis (name_id, analysis, analysis_version, country)
    SELECT name_id, analysis, analysis_version, country
    FROM jsonb_populate_recordset(NULL::counterparty_name_analysis, ${rowsJson(rows)}::jsonb)
    ON CONFLICT (name_id) DO UPDATE SET
      analysis = excluded.analysis, analysis_version = excluded.analysis_version, country = excluded.country`;
}

export async function upsertNameAnalyses(db: Queryable, rows: readonly NameAnalysisRow[]): Promise<void> {
  if (rows.length > 0) await upsertNameAnalysesWrite(rows).execute(db);
}

/** The jurisdiction of one counterparty (null when it has none or is not there). */
export async function jurisdictionOf(db: Queryable, counterpartyId: number): Promise<string | null> {
  const row = await db.selectFrom('counterparty').select('jurisdiction').where('id', '=', counterpartyId).executeTakeFirst();
  return row?.jurisdiction ?? null;
}

/** The names of one counterparty (id and text), in id order. */
export async function namesOfCounterparty(db: Queryable, counterpartyId: number): Promise<{ id: number; name: string }[]> {
  const rows = await db.selectFrom('counterparty_name').select(['id', 'name']).where('counterparty_id', '=', counterpartyId).orderBy('id').execute();
  return rows.map((r) => ({ id: id(r.id), name: r.name }));
}

export interface StaleName {
  id: number;
  name: string;
  normalised: string;
  kind: string;
  counterpartyId: number;
  jurisdiction: string | null;
}

interface StaleRow {
  id: string | number;
  name: string;
  normalised: string;
  kind: string;
  counterparty_id: string | number;
  jurisdiction: string | null;
}

function staleName(r: StaleRow): StaleName {
  return { id: id(r.id), name: r.name, normalised: r.normalised, kind: r.kind, counterpartyId: id(r.counterparty_id), jurisdiction: r.jurisdiction };
}

/**
 * A name is stale when it has no stored analysis, one of another version, or one made under another country than
 * its counterparty's jurisdiction now. Its stored analysis is then not used, and its blocking keys may be those of
 * an older analysis.
 */
const STALE = (version: number) => sql`(a.name_id IS NULL OR a.analysis_version <> ${version} OR a.country IS DISTINCT FROM cp.jurisdiction)`;

/**
 * The next `limit` stale names after name id `afterId`, in id order, locked (FOR UPDATE) so that no writer changes
 * them until the rewrite commits.
 */
export async function lockStaleNames(trx: Transaction<Database>, version: number, afterId: number, limit: number): Promise<StaleName[]> {
  const result = await sql<StaleRow>`
    SELECT n.id, n.name, n.normalised, n.kind, n.counterparty_id, cp.jurisdiction
    FROM counterparty_name n
    JOIN counterparty cp ON cp.id = n.counterparty_id
    LEFT JOIN counterparty_name_analysis a ON a.name_id = n.id
    WHERE n.id > ${afterId} AND ${STALE(version)}
    ORDER BY n.id
    LIMIT ${limit}
    FOR UPDATE OF n`.execute(trx);
  return result.rows.map(staleName);
}

/** How many names are stale, and the first `sample` of them (id order). */
export async function staleNames(db: Queryable, version: number, sample: number): Promise<{ count: number; first: StaleName[] }> {
  const counted = await sql<{ n: string | number }>`
    SELECT count(*) AS n FROM counterparty_name n
    JOIN counterparty cp ON cp.id = n.counterparty_id
    LEFT JOIN counterparty_name_analysis a ON a.name_id = n.id
    WHERE ${STALE(version)}`.execute(db);
  const count = Number(counted.rows[0]?.n ?? 0);
  if (count === 0 || sample <= 0) return { count, first: [] };
  const result = await sql<StaleRow>`
    SELECT n.id, n.name, n.normalised, n.kind, n.counterparty_id, cp.jurisdiction
    FROM counterparty_name n
    JOIN counterparty cp ON cp.id = n.counterparty_id
    LEFT JOIN counterparty_name_analysis a ON a.name_id = n.id
    WHERE ${STALE(version)}
    ORDER BY n.id
    LIMIT ${sample}`.execute(db);
  return { count, first: result.rows.map(staleName) };
}

/** Whether the schema has the stored-analysis table (a database not yet migrated to it has not). */
export async function hasNameAnalysisTable(db: Queryable): Promise<boolean> {
  const result = await sql<{ present: boolean }>`SELECT to_regclass('counterparty_name_analysis') IS NOT NULL AS present`.execute(db);
  return result.rows[0]?.present === true;
}

/** Ids of every name (all stale when the schema has no stored analyses yet). */
export async function allNameIds(db: Queryable): Promise<Set<number>> {
  const rows = await db.selectFrom('counterparty_name').select('id').execute();
  return new Set(rows.map((r) => id(r.id)));
}

/** Ids of every stale name (for verify: their blocking keys are left out of the replay comparison). */
export async function staleNameIds(db: Queryable, version: number): Promise<Set<number>> {
  const result = await sql<{ id: string | number }>`
    SELECT n.id FROM counterparty_name n
    JOIN counterparty cp ON cp.id = n.counterparty_id
    LEFT JOIN counterparty_name_analysis a ON a.name_id = n.id
    WHERE ${STALE(version)}`.execute(db);
  return new Set(result.rows.map((r) => id(r.id)));
}

/**
 * Replaces the blocking keys of many names, set-based: one statement removes the old keys, one inserts the new.
 * Two statements, not two parts of one: the key-count triggers count a statement's changes per key and
 * counterparty after it ends (migrations/20261205113000_blocking_key_counterparties.ts).
 */
export async function replaceKeysOfNames(
  trx: Transaction<Database>,
  names: readonly { nameId: number; counterpartyId: number; keys: readonly string[] }[],
): Promise<void> {
  if (names.length === 0) return;
  await trx
    .deleteFrom('blocking_key')
    .where(
      'name_id',
      'in',
      names.map((n) => n.nameId),
    )
    .execute();
  const rows = names.flatMap((n) => [...new Set(n.keys)].map((key) => ({ key, counterparty_id: n.counterpartyId, name_id: n.nameId })));
  if (rows.length === 0) return;
  await sql`INSERT INTO blocking_key (key, counterparty_id, name_id)
    SELECT key, counterparty_id, name_id FROM jsonb_populate_recordset(NULL::blocking_key, ${rowsJson(rows)}::jsonb)
    ORDER BY key
    ON CONFLICT DO NOTHING`.execute(trx);
}
