/**
 * The lookup baseline of the register bench (issue 8): PostgreSQL's own trigram top-10 over counterparty names,
 * `ORDER BY normalised <-> probe LIMIT 10`. The schema's trigram index is GIN, which cannot order by distance, so
 * the bench builds a GiST trigram index in its throw-away database for the measurement and drops it after (the
 * register's writes would otherwise maintain it). PostgreSQL with pg_trgm only.
 */
import { sql, type RawBuilder } from 'kysely';
import type { Queryable } from './util.ts';

export const TRIGRAM_GIST_INDEX = 'bench_counterparty_name_trgm_gist';

/** Builds the GiST trigram index on counterparty_name.normalised and refreshes the table's statistics. */
export async function createTrigramGistIndex(db: Queryable): Promise<void> {
  await sql`CREATE INDEX ${sql.id(TRIGRAM_GIST_INDEX)} ON counterparty_name USING gist (normalised public.gist_trgm_ops)`.execute(db);
  await sql`ANALYZE counterparty_name`.execute(db);
}

export async function dropTrigramGistIndex(db: Queryable): Promise<void> {
  await sql`DROP INDEX IF EXISTS ${sql.id(TRIGRAM_GIST_INDEX)}`.execute(db);
}

function top10(text: string): RawBuilder<{ id: string }> {
  return sql<{ id: string }>`SELECT id FROM counterparty_name ORDER BY normalised OPERATOR(public.<->) ${text} LIMIT 10`;
}

/** The ids of the 10 names nearest to `normalised` by trigram distance. */
export async function trigramTop10(db: Queryable, normalised: string): Promise<string[]> {
  return (await top10(normalised).execute(db)).rows.map((r) => r.id);
}

/** Whether the planner walks the GiST index for the lookup (a sequential scan would make the baseline a strawman). */
export async function trigramTop10UsesIndex(db: Queryable, normalised: string): Promise<boolean> {
  const plan = await sql<{ 'QUERY PLAN': string }>`EXPLAIN ${top10(normalised)}`.execute(db);
  return plan.rows.some((r) => r['QUERY PLAN'].includes(TRIGRAM_GIST_INDEX));
}
