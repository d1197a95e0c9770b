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
