/**
 * Jobs and their partitions (services/jobs): the `job` row, its staged input (job_chunk) and its partitions
 * (job_partition). JSON columns are written as text and read back parsed on both backends.
 */
import { sql } from 'kysely';
import { id, type Queryable } from './util.ts';

export type JobStatus = 'queued' | 'running' | 'finished' | 'failed';

export interface JobRow {
  id: number;
  kind: string;
  status: JobStatus;
  actor: string;
  params: Record<string, unknown>;
  progress: Record<string, unknown>;
  result: unknown;
  error: string | null;
  plan: Record<string, unknown> | null;
  createdAt: Date;
  updatedAt: Date;
  finishedAt: Date | null;
}

const parsed = <T>(v: unknown): T => (typeof v === 'string' ? (JSON.parse(v) as T) : (v as T));

export async function insertJob(db: Queryable, job: { kind: string; actor: string; status: JobStatus; params: Record<string, unknown> }): Promise<number> {
  const row = await db
    .insertInto('job')
    .values({ kind: job.kind, actor: job.actor, status: job.status, params: JSON.stringify(job.params) })
    .returning('id')
    .executeTakeFirstOrThrow();
  return id(row.id);
}

export async function readJob(db: Queryable, jobId: number, options: { forUpdate?: boolean } = {}): Promise<JobRow | undefined> {
  let query = db.selectFrom('job').selectAll().where('id', '=', jobId);
  if (options.forUpdate) query = query.forUpdate();
  const row = await query.executeTakeFirst();
  if (!row) return undefined;
  return {
    id: id(row.id),
    kind: row.kind,
    status: row.status,
    actor: row.actor,
    params: parsed(row.params),
    progress: parsed(row.progress),
    result: parsed(row.result),
    error: row.error,
    plan: parsed(row.plan),
    createdAt: new Date(row.created_at),
    updatedAt: new Date(row.updated_at),
    finishedAt: row.finished_at === null ? null : new Date(row.finished_at),
  };
}

/** A job's status and error alone, for a caller that polls it (readJob parses the whole row, plan included). */
export async function jobStatus(db: Queryable, jobId: number): Promise<{ status: JobStatus; error: string | null } | undefined> {
  return db.selectFrom('job').select(['status', 'error']).where('id', '=', jobId).executeTakeFirst();
}

export async function updateJob(
  db: Queryable,
  jobId: number,
  values: { status?: JobStatus; progress?: unknown; result?: unknown; error?: string | null; plan?: unknown },
): Promise<void> {
  const finished = values.status === 'finished' || values.status === 'failed';
  await db
    .updateTable('job')
    .set({
      updated_at: new Date(),
      ...(values.status ? { status: values.status } : {}),
      ...(finished ? { finished_at: new Date() } : {}),
      ...(values.progress !== undefined ? { progress: JSON.stringify(values.progress) } : {}),
      ...(values.result !== undefined ? { result: JSON.stringify(values.result) } : {}),
      ...(values.error !== undefined ? { error: values.error } : {}),
      ...(values.plan !== undefined ? { plan: JSON.stringify(values.plan) } : {}),
    })
    .where('id', '=', jobId)
    .execute();
}

export async function insertChunk(db: Queryable, jobId: number, chunkNo: number, rows: unknown[]): Promise<void> {
  await db
    .insertInto('job_chunk')
    .values({ job_id: jobId, chunk_no: chunkNo, rows: JSON.stringify(rows) })
    .execute();
}

/** The staged rows of a job, chunk by chunk in order. */
export async function* chunksOf(db: Queryable, jobId: number): AsyncGenerator<unknown[]> {
  const numbers = await db.selectFrom('job_chunk').select('chunk_no').where('job_id', '=', jobId).orderBy('chunk_no').execute();
  for (const { chunk_no } of numbers) {
    const row = await db.selectFrom('job_chunk').select('rows').where('job_id', '=', jobId).where('chunk_no', '=', chunk_no).executeTakeFirstOrThrow();
    yield parsed<unknown[]>(row.rows);
  }
}

export async function deleteChunks(db: Queryable, jobId: number): Promise<void> {
  await db.deleteFrom('job_chunk').where('job_id', '=', jobId).execute();
}

export async function insertPartitions(db: Queryable, jobId: number, partitions: readonly unknown[][]): Promise<void> {
  for (let start = 0; start < partitions.length; start += 50) {
    const values = partitions
      .slice(start, start + 50)
      .map((items, i) => ({ job_id: jobId, partition_no: start + i, size: items.length, items: JSON.stringify(items) }));
    await db
      .insertInto('job_partition')
      .values(values)
      .onConflict((oc) => oc.columns(['job_id', 'partition_no']).doNothing())
      .execute();
  }
}

export interface PartitionRow {
  jobId: number;
  partitionNo: number;
  status: 'queued' | 'running' | 'done';
  size: number;
  items: unknown[];
  result: Record<string, unknown> | null;
  attempts: number;
}

export async function readPartition(db: Queryable, jobId: number, partitionNo: number): Promise<PartitionRow | undefined> {
  const row = await db.selectFrom('job_partition').selectAll().where('job_id', '=', jobId).where('partition_no', '=', partitionNo).executeTakeFirst();
  if (!row) return undefined;
  return { jobId, partitionNo, status: row.status, size: row.size, items: parsed(row.items), result: parsed(row.result), attempts: row.attempts };
}

/** Marks a partition running (one more attempt, by `worker`). */
export async function startPartition(db: Queryable, jobId: number, partitionNo: number, worker: string): Promise<void> {
  await db
    .updateTable('job_partition')
    .set((eb) => ({ status: 'running', attempts: eb('attempts', '+', 1), worker, started_at: new Date() }))
    .where('job_id', '=', jobId)
    .where('partition_no', '=', partitionNo)
    .where('status', '<>', 'done')
    .execute();
}

/** Marks a partition done with its result and drops its input; answers whether it was not done before. */
export async function finishPartition(db: Queryable, jobId: number, partitionNo: number, result: unknown): Promise<boolean> {
  const rows = await db
    .updateTable('job_partition')
    .set({ status: 'done', result: JSON.stringify(result), items: '[]', finished_at: new Date() })
    .where('job_id', '=', jobId)
    .where('partition_no', '=', partitionNo)
    .where('status', '<>', 'done')
    .returning('partition_no')
    .execute();
  return rows.length > 0;
}

export interface PartitionTally {
  total: number;
  queued: number;
  running: number;
  done: number;
  mentions: number;
  mentionsDone: number;
}

export async function partitionTally(db: Queryable, jobId: number): Promise<PartitionTally> {
  const result = await sql<{ status: string; n: string | number; mentions: string | number | null }>`
    SELECT status, count(*) AS n, sum(size) AS mentions FROM job_partition WHERE job_id = ${jobId} GROUP BY status`.execute(db);
  const tally: PartitionTally = { total: 0, queued: 0, running: 0, done: 0, mentions: 0, mentionsDone: 0 };
  for (const row of result.rows) {
    const n = Number(row.n);
    const m = Number(row.mentions ?? 0);
    tally.total += n;
    tally.mentions += m;
    if (row.status === 'queued' || row.status === 'running' || row.status === 'done') tally[row.status] += n;
    if (row.status === 'done') tally.mentionsDone += m;
  }
  return tally;
}

/** The results of a job's finished partitions, in partition order. */
export async function partitionResults(db: Queryable, jobId: number): Promise<{ partitionNo: number; result: Record<string, unknown> }[]> {
  const rows = await db
    .selectFrom('job_partition')
    .select(['partition_no', 'result'])
    .where('job_id', '=', jobId)
    .where('status', '=', 'done')
    .orderBy('partition_no')
    .execute();
  return rows.map((r) => ({ partitionNo: r.partition_no, result: parsed(r.result) }));
}

/** Partitions of a job not done yet (a re-run of the planner queues them again). */
export async function unfinishedPartitions(db: Queryable, jobId: number): Promise<number[]> {
  const rows = await db
    .selectFrom('job_partition')
    .select('partition_no')
    .where('job_id', '=', jobId)
    .where('status', '<>', 'done')
    .orderBy('partition_no')
    .execute();
  return rows.map((r) => r.partition_no);
}

/** An unfinished (queued or running) job as the restart and the watchdog read it. */
export interface UnfinishedJob {
  id: number;
  params: Record<string, unknown>;
  plan: unknown;
  progress: Record<string, unknown>;
}

/** Jobs still queued or running, oldest first. */
export async function unfinishedJobs(db: Queryable): Promise<UnfinishedJob[]> {
  const rows = await db.selectFrom('job').select(['id', 'params', 'plan', 'progress']).where('status', 'in', ['queued', 'running']).orderBy('id').execute();
  return rows.map((r) => ({ id: id(r.id), params: parsed(r.params), plan: parsed(r.plan), progress: parsed(r.progress) }));
}

/** Marks a job failed only while it is still unfinished (another worker may have finished it); answers whether it did. */
export async function failJobIfUnfinished(db: Queryable, jobId: number, error: string): Promise<boolean> {
  const done = await db
    .updateTable('job')
    .set({ status: 'failed', error, updated_at: new Date(), finished_at: new Date() })
    .where('id', '=', jobId)
    .where('status', 'in', ['queued', 'running'])
    .executeTakeFirst();
  return Number(done.numUpdatedRows) > 0;
}

export interface JobTimes {
  createdAt: Date;
  finishedAt: Date | null;
  /** When the first partition started and the last one finished (null before any has). */
  firstPartitionStart: Date | null;
  lastPartitionDone: Date | null;
}

/** The instants that split a partitioned job into its phases (staging, waiting, partitions, final pass); undefined for no such job. */
export async function jobTimes(db: Queryable, jobId: number): Promise<JobTimes | undefined> {
  const row = await db
    .selectFrom('job as j')
    .leftJoin('job_partition as p', 'p.job_id', 'j.id')
    .select(['j.created_at', 'j.finished_at'])
    .select((eb) => [eb.fn.min('p.started_at').as('first_start'), eb.fn.max('p.finished_at').as('last_done')])
    .where('j.id', '=', jobId)
    .groupBy(['j.id', 'j.created_at', 'j.finished_at'])
    .executeTakeFirst();
  if (!row) return undefined;
  const at = (v: unknown): Date | null => (v === null || v === undefined ? null : new Date(v as string | Date));
  return { createdAt: at(row.created_at)!, finishedAt: at(row.finished_at), firstPartitionStart: at(row.first_start), lastPartitionDone: at(row.last_done) };
}
