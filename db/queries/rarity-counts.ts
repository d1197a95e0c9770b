/**
 * Token rarity as the register counts it (services/register/matching/idf.ts): per token, the counterparties holding
 * its key (blocking_key_count, kept by triggers), or the capped names count for a key at the cap; and the register's
 * size, in ONE statement (a single resolve's round trips set its latency: issue 18).
 */
import { sql } from 'kysely';
import type { Queryable } from './util.ts';

/**
 * The cap of blocking_key_count: a key whose names reach it is no longer counted (the triggers of
 * migrations/20261205102000_blocking_key_count.ts and 20261205113000_blocking_key_counterparties.ts, which keep
 * their own copy of the value, as a landed migration must).
 */
export const KEY_COUNT_CAP = 1000;

/** Document frequencies of `tokens` (uncapped; a key at `cap` names answers its names count) and the register size. */
export async function tokenCountsAndSize(db: Queryable, tokens: readonly string[], cap: number): Promise<{ counts: Map<string, number>; size: number }> {
  const result = await sql<{ token: string | null; df: string | number | null }>`
    SELECT NULL::text AS token, ${registerSizeSql()} AS df
    UNION ALL
    SELECT t.token, ${tokenDf(cap)} AS df
    FROM unnest(${sql.val([...tokens])}::text[]) AS t(token)
    LEFT JOIN blocking_key_count c ON c.key = 't:' || t.token`.execute(db);
  const counts = new Map<string, number>();
  let size = 0;
  for (const row of result.rows) {
    if (row.token === null) size = Number(row.df ?? 0);
    else counts.set(row.token, Number(row.df ?? 0));
  }
  return { counts, size };
}

/** A token's count from its blocking_key_count row `c` (uncapped; a key at `cap` names answers its names count). */
export function tokenDf(cap: number) {
  return sql`CASE WHEN c.names >= ${cap} THEN c.names ELSE coalesce(c.counterparties, 0) END`;
}

/** The register's size: its highest counterparty id (services/register/matching/idf.ts says why). */
export function registerSizeSql() {
  return sql`(SELECT max(id) FROM counterparty)`;
}
