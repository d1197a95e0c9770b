/** Ingest runs: one row per file ingested (by `cpreg ingest` or a partitioned job), with its counts and outcome. */
import { id, type Queryable } from './util.ts';

export type IngestRunStatus = 'running' | 'finished' | 'failed' | 'interrupted';

/** Starts a run (status running); answers its id. */
export async function insertIngestRun(db: Queryable, run: { source: string; inputName: string; actor: string }): Promise<number> {
  const row = await db
    .insertInto('ingest_run')
    .values({ source: run.source, input_name: run.inputName, actor: run.actor, status: 'running', started_at: new Date() })
    .returning('id')
    .executeTakeFirstOrThrow();
  return id(row.id);
}

/** Records the counts so far of a running run. */
export async function updateIngestRunCounts(db: Queryable, runId: number, counts: Record<string, number>): Promise<void> {
  await db
    .updateTable('ingest_run')
    .set({ counts: JSON.stringify(counts) })
    .where('id', '=', runId)
    .execute();
}

/** Ends a run with its outcome (counts when known, the error when it did not finish cleanly). */
export async function finishIngestRun(
  db: Queryable,
  runId: number,
  outcome: { status: Exclude<IngestRunStatus, 'running'>; counts?: Record<string, number>; error: string | null },
): Promise<void> {
  await db
    .updateTable('ingest_run')
    .set({ status: outcome.status, ...(outcome.counts ? { counts: JSON.stringify(outcome.counts) } : {}), finished_at: new Date(), error: outcome.error })
    .where('id', '=', runId)
    .execute();
}
