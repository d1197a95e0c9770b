/**
 * Jobs that are split into partitions and run by any number of worker processes (services/jobs):
 *  - job.plan: what the planner decided (partition count, the pairs that cross partitions for the final pass);
 *  - job_chunk: the staged input of a job, as read (line, raw text, mapped mention or the reason it was refused),
 *    until the planner has turned it into partitions;
 *  - job_partition: one independently resolvable part of a job, its input, state and result.
 * The queue library's own tables live in their own schema (db/pg-boss-queue.ts), not here.
 */
import { sql, type Kysely } from 'kysely';

const STATEMENTS = [
  `ALTER TABLE job ADD COLUMN plan jsonb`,
  `CREATE TABLE job_chunk (
    job_id bigint NOT NULL REFERENCES job (id) ON DELETE CASCADE,
    chunk_no integer NOT NULL CHECK (chunk_no >= 0),
    rows jsonb NOT NULL,
    PRIMARY KEY (job_id, chunk_no)
  )`,
  `CREATE TABLE job_partition (
    job_id bigint NOT NULL REFERENCES job (id) ON DELETE CASCADE,
    partition_no integer NOT NULL CHECK (partition_no >= 0),
    status text NOT NULL DEFAULT 'queued' CHECK (status IN ('queued', 'running', 'done')),
    size integer NOT NULL CHECK (size >= 0),
    items jsonb NOT NULL,
    result jsonb,
    attempts integer NOT NULL DEFAULT 0,
    worker text,
    started_at timestamptz,
    finished_at timestamptz,
    PRIMARY KEY (job_id, partition_no)
  )`,
  `CREATE INDEX job_partition_status_idx ON job_partition (job_id, status)`,
];

export async function up(db: Kysely<any>): Promise<void> {
  for (const statement of STATEMENTS) await sql.raw(statement).execute(db);
}

export async function down(db: Kysely<any>): Promise<void> {
  await sql.raw('DROP TABLE job_partition').execute(db);
  await sql.raw('DROP TABLE job_chunk').execute(db);
  await sql.raw('ALTER TABLE job DROP COLUMN plan').execute(db);
}
