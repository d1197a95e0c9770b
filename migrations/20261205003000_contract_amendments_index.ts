/**
 * Amendments and side letters (issue 16 item 9): a contract whose parse holds `earlierAgreements` uses the defined
 * terms of an earlier agreement. Each stored contract asks which of them still have unbound terms it might bind
 * (db/queries/mentions.ts amendmentsWithUnboundMentions); this partial index keeps that question to the few
 * amendments instead of a scan of every contract. IF NOT EXISTS: running it again (a restored backup) is harmless.
 */
import { sql, type Kysely } from 'kysely';

export async function up(db: Kysely<any>): Promise<void> {
  await sql
    .raw(`CREATE INDEX IF NOT EXISTS contract_amendment_idx ON contract (id) WHERE (parsed -> 'earlierAgreements') IS NOT NULL AND status = 'active'`)
    .execute(db);
}

export async function down(db: Kysely<any>): Promise<void> {
  await sql.raw(`DROP INDEX IF EXISTS contract_amendment_idx`).execute(db);
}
