/**
 * idempotency_record.work_committed_at: set inside the transaction that commits a request's work (register writes,
 * key creation), so that a retry of a request whose process died after that commit and before its answer was
 * stored is never done a second time (services/api/auth/idempotency.ts). IF NOT EXISTS: running it again changes
 * nothing (the readiness test re-applies the latest migration).
 */
import { sql, type Kysely } from 'kysely';

export async function up(db: Kysely<any>): Promise<void> {
  await sql`ALTER TABLE idempotency_record ADD COLUMN IF NOT EXISTS work_committed_at timestamptz`.execute(db);
}

export async function down(db: Kysely<any>): Promise<void> {
  await sql`ALTER TABLE idempotency_record DROP COLUMN IF EXISTS work_committed_at`.execute(db);
}
