/**
 * counterparty_name_analysis: each stored name's analysis (resolvers/analyse, as JSON) with the analysis version
 * that made it and the country it was analysed under (its counterparty's jurisdiction), so that candidates read
 * from the register are scored on their stored analysis instead of being analysed again (issue 18).
 *
 * A table beside counterparty_name, not columns of it: like blocking_key it is derived (a pure function of the
 * name, its counterparty's jurisdiction and the analysis version), kept in step by every write, in undo and in
 * replay (services/register/state/derived.ts), and never part of a row image in the history, whose rows carry what
 * replay and undo need and no more. The version is per row, so one register can hold rows of several versions: a
 * name whose row is missing or of another version (or country) is stale, re-analysed where it is read and
 * rewritten with its blocking keys by `cpreg migrate reanalyse`. Existing registers start with no rows (all stale).
 */
import { sql, type Kysely } from 'kysely';

export async function up(db: Kysely<any>): Promise<void> {
  await sql`CREATE TABLE counterparty_name_analysis (
    name_id bigint PRIMARY KEY REFERENCES counterparty_name (id) ON DELETE CASCADE,
    analysis jsonb NOT NULL,
    analysis_version integer NOT NULL,
    country text
  )`.execute(db);
}

export async function down(db: Kysely<any>): Promise<void> {
  await sql`DROP TABLE IF EXISTS counterparty_name_analysis`.execute(db);
}
