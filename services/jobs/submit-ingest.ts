/**
 * Submits an ingest file as a partitioned job: reads it (streamed, CSV or NDJSON, the same mapping as
 * `cpreg ingest`), stages the rows in job_chunk (each row as its line number with the mapped mention, or the
 * reason it cannot be read), records an ingest_run, and queues the planner. Answers the job id at once; the
 * resolution runs in whichever worker takes the steps (services/jobs/steps.ts).
 */
import { createReadStream } from 'node:fs';
import type { Kysely, Transaction } from 'kysely';
import type { JobQueue } from '../../db/job-queue.ts';
import { finishIngestRun, insertIngestRun } from '../../db/queries/ingest-runs.ts';
import { insertChunk, insertJob, updateJob } from '../../db/queries/jobs.ts';
import type { Database } from '../../db/types.ts';
import type { MentionInput } from '../../resolvers/vocabulary.ts';
import type { FieldMap } from '../ingest/mapping.ts';
import { formatOf, rowsOf, type IngestFormat } from '../ingest/rows-of.ts';
import { unstorableRowReason } from '../ingest/unstorable-text.ts';
import { JOB_STEPS, PARTITION_DEFAULTS, planningExpirySeconds, planningMsPerRow } from './deps.ts';

/** One staged row: the mention as mapped, or why the row could not be read. */
export type StagedRow = { line: number; mention: MentionInput } | { line: number; reason: string };

export interface SubmitIngestOptions {
  file: string;
  format?: IngestFormat;
  source: string;
  map?: FieldMap;
  actor: string;
  /** The input's name as the submitter knows it (default: the file's base name). */
  inputName?: string;
  /** Mentions per partition aimed at. Default PARTITION_DEFAULTS.partitionSize. */
  partitionSize?: number;
  chunkSize?: number;
  /** Told what the file's header leaves unread (services/ingest/mapping.ts columnWarnings). */
  onWarning?: (message: string) => void;
  /**
   * Runs inside the transaction that creates the job (the API stores its Idempotency-Key answer there, so that a
   * retry whose first answer was lost gets the same job, never a second one).
   */
  onJobCreated?: JobCreatedHook;
}

export type JobCreatedHook = (trx: Transaction<Database>, jobId: number) => Promise<void>;

export async function submitIngestJob(deps: { db: Kysely<Database>; queue: JobQueue }, options: SubmitIngestOptions): Promise<number> {
  const format = formatOf(options.file, options.format);
  const partitionSize = options.partitionSize ?? PARTITION_DEFAULTS.partitionSize;
  if (!Number.isInteger(partitionSize) || partitionSize < 1) throw new RangeError(`partitionSize must be a whole number of at least 1, got ${partitionSize}`);
  const chunkSize = options.chunkSize ?? PARTITION_DEFAULTS.chunkSize;
  // Read before the job exists: a bad setting fails the submission, not a job left staged with no planner queued.
  const planMsPerRow = planningMsPerRow();
  const inputName = options.inputName ?? options.file.split(/[\\/]/).pop() ?? options.file;
  const { ingestRunId, jobId } = await deps.db.transaction().execute(async (trx) => {
    const runId = await insertIngestRun(trx, { source: options.source, inputName, actor: options.actor });
    const created = await insertJob(trx, {
      kind: 'ingest',
      actor: options.actor,
      status: 'queued',
      params: { source: options.source, input: inputName, partitioned: true, partitionSize, ingestRunId: runId },
    });
    await options.onJobCreated?.(trx, created);
    return { ingestRunId: runId, jobId: created };
  });
  let staged = 0;
  try {
    let chunk: StagedRow[] = [];
    let chunkNo = 0;
    let rows = 0;
    const stream = createReadStream(options.file);
    const skipped: StagedRow[] = [];
    for await (const row of rowsOf(
      options.file,
      format,
      options.source,
      options.map ?? {},
      stream,
      (line, reason) => skipped.push({ line, reason }),
      options.onWarning,
    )) {
      chunk.push(...skipped.splice(0));
      const unstorable = row.result.ok ? unstorableRowReason(row.result.mention) : undefined;
      if (unstorable) chunk.push({ line: row.line, reason: unstorable });
      else chunk.push(row.result.ok ? { line: row.line, mention: row.result.mention } : { line: row.line, reason: row.result.reason });
      if (chunk.length >= chunkSize) {
        await insertChunk(deps.db, jobId, chunkNo++, chunk);
        rows += chunk.length;
        chunk = [];
        await updateJob(deps.db, jobId, { progress: { stage: 'staging', staged: rows } });
      }
    }
    chunk.push(...skipped.splice(0));
    if (chunk.length > 0) {
      await insertChunk(deps.db, jobId, chunkNo++, chunk);
      rows += chunk.length;
    }
    await updateJob(deps.db, jobId, { progress: { stage: 'planning', staged: rows } });
    staged = rows;
  } catch (error) {
    const message = `reading ${inputName} failed: ${(error as Error).message}`;
    await updateJob(deps.db, jobId, { status: 'failed', error: message });
    await finishIngestRun(deps.db, ingestRunId, { status: 'failed', error: message });
    throw error;
  }
  await deps.queue.send(JOB_STEPS.plan, { jobId }, { singletonKey: String(jobId), minExpireInSeconds: planningExpirySeconds(staged, planMsPerRow) });
  return jobId;
}
