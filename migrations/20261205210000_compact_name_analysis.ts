/**
 * Stored name analyses in their compact form (resolvers/analyse/compact-analysis.ts, ANALYSIS_VERSION 3, issue 18):
 * a full analysis was ~0.5 KB, most of it the legal form's ELF code lists, read back with every candidate name.
 *
 * The column becomes json, not jsonb: the register never looks inside a stored analysis, and json keeps the text as
 * written (no per-key binary headers on disk) and passes it through json_build_array unchanged on the candidate
 * read. The rows already there are of an older version, so no code would use them (they are stale: re-analysed
 * where read, rewritten by `cpreg migrate reanalyse`); they are dropped rather than converted, which also makes
 * the type change a rewrite of an empty table. Down does the same the other way.
 */
import { sql, type Kysely } from 'kysely';

export async function up(db: Kysely<any>): Promise<void> {
  await sql`DELETE FROM counterparty_name_analysis`.execute(db);
  await sql`ALTER TABLE counterparty_name_analysis ALTER COLUMN analysis TYPE json USING analysis::json`.execute(db);
}

export async function down(db: Kysely<any>): Promise<void> {
  await sql`DELETE FROM counterparty_name_analysis`.execute(db);
  await sql`ALTER TABLE counterparty_name_analysis ALTER COLUMN analysis TYPE jsonb USING analysis::jsonb`.execute(db);
}
