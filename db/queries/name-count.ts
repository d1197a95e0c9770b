/**
 * About how many names the register holds: N of the token rarity the register scores with, the role the row count
 * of a labelled file plays in `cpreg evaluate` and the model's training. Read as the highest name id (one step
 * down the primary key's index, whatever the register's size): ids are never reused, so it counts every name ever
 * recorded, an over-estimate by the ids drawn and not used and the names since removed, which moves a weight by
 * ln of that share only. Counting the rows would cost a scan of the table on every read.
 */
import { sql } from 'kysely';
import type { Queryable } from './util.ts';

/** The count as a scalar subquery, for statements that read it beside other things (matching/idf.ts). */
export const NAME_COUNT_SQL = sql`SELECT coalesce(max(id), 0) FROM counterparty_name`;

export async function registerNameCount(db: Queryable): Promise<number> {
  const result = await sql<{ n: string | number | null }>`SELECT (${NAME_COUNT_SQL}) AS n`.execute(db);
  return Number(result.rows[0]?.n ?? 0);
}
