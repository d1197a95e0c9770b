/**
 * Token rarity for soft TF-IDF, read from the register's blocking keys (t:<token>, one row per name holding the
 * token). Counting is capped at DF_CAP per token so that a very common word ("holdings") costs one short index
 * scan; every token at or above the cap counts as equally common. N is the number of names the register holds
 * (db/queries/name-count.ts), as in `cpreg evaluate` and the model's training: with a fixed reference N every word
 * under DF_CAP names counted as rare, so an equal core of common words ("Deutsche Bank Luxembourg"-like names)
 * weighed as a rare name in the register while the evaluation weighed it as a common one.
 *
 * Each token's weight depends on its own count only, so a table built from more tokens than a comparison uses
 * gives the same weights (what lets a batch read the counts of all its tokens once: matching/batch-reads.ts).
 */
import { sql } from 'kysely';
import { idfTableFromFrequencies, type IdfTable } from '../../../resolvers/compare/index.ts';
import type { Queryable } from '../../../db/queries/util.ts';
import { NAME_COUNT_SQL, registerNameCount } from '../../../db/queries/name-count.ts';

export const DF_CAP = 1000;

/** Capped document frequency of each distinct token. */
export async function documentFrequencies(db: Queryable, tokens: Iterable<string>): Promise<Map<string, number>> {
  return (await frequenciesAndNames(db, tokens)).frequencies;
}

/** The capped frequencies and the register's name count (db/queries/name-count.ts) in one round trip. */
async function frequenciesAndNames(db: Queryable, tokens: Iterable<string>): Promise<{ frequencies: Map<string, number>; names: number }> {
  const unique = [...new Set(tokens)];
  const frequencies = new Map<string, number>();
  if (unique.length === 0) return { frequencies, names: await registerNameCount(db) };
  const result = await sql<{ token: string; df: string | number; names: string | number | null }>`
    SELECT t.token, (SELECT count(*) FROM (SELECT 1 FROM blocking_key b WHERE b.key = 't:' || t.token LIMIT ${DF_CAP}) s) AS df,
      (${NAME_COUNT_SQL}) AS names
    FROM unnest(${sql.val(unique)}::text[]) AS t(token)`.execute(db);
  for (const row of result.rows) frequencies.set(row.token, Number(row.df));
  return { frequencies, names: Number(result.rows[0]?.names ?? 0) };
}

/** N is at least every count read (a row estimate can lag behind the table). */
export function idfFromFrequencies(frequencies: ReadonlyMap<string, number>, names: number): IdfTable {
  let n = Math.max(0, Math.round(names));
  for (const df of frequencies.values()) if (df > n) n = df;
  return idfTableFromFrequencies(frequencies, n);
}

export async function idfFor(
  db: Queryable,
  tokens: Iterable<string>,
  reads?: { frequencies(tokens: Iterable<string>): Promise<Map<string, number>>; nameCount(): Promise<number> },
): Promise<IdfTable> {
  if (reads) return idfFromFrequencies(await reads.frequencies(tokens), await reads.nameCount());
  const read = await frequenciesAndNames(db, tokens);
  return idfFromFrequencies(read.frequencies, read.names);
}
