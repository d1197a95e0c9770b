/**
 * Token rarity for soft TF-IDF, read from the count of the register's blocking keys t:<token> (one per name
 * holding the token). Counting is capped at DF_CAP per token so that a very common word ("holdings") is never
 * written again once common; every token at or above the cap counts as equally common. N is a fixed reference size, so the weights
 * depend only on the register's contents, never on an estimate that differs between instances.
 *
 * Each token's weight depends on its own count only, so a table built from more tokens than a comparison uses
 * gives the same weights (what lets a batch read the counts of all its tokens once: matching/batch-reads.ts).
 */
import { sql } from 'kysely';
import { idfTableFromFrequencies, type IdfTable } from '../../../resolvers/compare/index.ts';
import type { Queryable } from '../../../db/queries/util.ts';

export const DF_CAP = 1000;
export const REFERENCE_DOCUMENTS = 1_000_000;

/**
 * Capped document frequency of each distinct token: one primary-key lookup per token in blocking_key_count, which
 * triggers on blocking_key keep current (migrations/20261205102000_blocking_key_count.ts). Below the cap it is the
 * number of names holding the token, as counting the t: keys gives; a token that once reached the cap stays there.
 */
export async function documentFrequencies(db: Queryable, tokens: Iterable<string>): Promise<Map<string, number>> {
  const unique = [...new Set(tokens)];
  const frequencies = new Map<string, number>();
  if (unique.length > 0) {
    const result = await sql<{ token: string; df: string | number | null }>`
      SELECT t.token, c.names AS df
      FROM unnest(${sql.val(unique)}::text[]) AS t(token)
      LEFT JOIN blocking_key_count c ON c.key = 't:' || t.token`.execute(db);
    for (const row of result.rows) frequencies.set(row.token, Math.min(DF_CAP, Number(row.df ?? 0)));
  }
  return frequencies;
}

export function idfFromFrequencies(frequencies: ReadonlyMap<string, number>): IdfTable {
  return idfTableFromFrequencies(frequencies, REFERENCE_DOCUMENTS);
}

export async function idfFor(db: Queryable, tokens: Iterable<string>, reads?: { frequencies(tokens: Iterable<string>): Promise<Map<string, number>> }): Promise<IdfTable> {
  return idfFromFrequencies(reads ? await reads.frequencies(tokens) : await documentFrequencies(db, tokens));
}
