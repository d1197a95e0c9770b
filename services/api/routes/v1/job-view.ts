/** A job as GET /v1/jobs/{id} answers it, and the schema of that answer. */
import type { Kysely } from 'kysely';
import type { Database } from '../../../../db/types.ts';
import { partitionTally, readJob, type JobRow } from '../../../../db/queries/jobs.ts';
import { ApiError } from '../../errors.ts';

export const JOB_OUT = {
  type: 'object',
  required: ['id', 'kind', 'status'],
  properties: {
    id: { type: 'integer' },
    kind: { type: 'string', enum: ['ingest', 'sweep', 'reresolve', 'contracts'] },
    status: { type: 'string', enum: ['queued', 'running', 'finished', 'failed'] },
    actor: { type: 'string' },
    params: { type: 'object', additionalProperties: true },
    progress: { type: 'object', additionalProperties: true },
    result: { type: 'object', nullable: true, additionalProperties: true },
    error: { type: 'string', nullable: true },
    createdAt: { type: 'string' },
    updatedAt: { type: 'string' },
    finishedAt: { type: 'string', nullable: true },
    partitions: {
      type: 'object',
      nullable: true,
      description:
        'For a partitioned job (ingest, sweep, contracts): its partitions by state (total 0 until it is planned); null for a job that runs in one piece (reresolve)',
      properties: {
        total: { type: 'integer' },
        queued: { type: 'integer' },
        running: { type: 'integer' },
        done: { type: 'integer' },
        fractionDone: { type: 'number' },
      },
    },
  },
  example: {
    id: 7,
    kind: 'ingest',
    status: 'finished',
    actor: 'contract system',
    params: { source: 'erp' },
    progress: { read: 120000 },
    result: { counts: { read: 120000, linked: 90000, new: 25000, review: 4000, rejected: 1000 } },
    error: null,
  },
} as const;

export async function jobView(db: Kysely<Database>, id: number): Promise<Record<string, unknown>> {
  const row = await readJob(db, id);
  if (!row) throw new ApiError('NOT_FOUND', `job ${id} does not exist`);
  const iso = (v: Date | null): string | null => (v === null ? null : v.toISOString());
  return {
    id: row.id,
    kind: row.kind,
    status: row.status,
    actor: row.actor,
    params: row.params,
    progress: row.progress,
    result: row.result ?? null,
    error: row.error,
    createdAt: iso(row.createdAt),
    updatedAt: iso(row.updatedAt),
    finishedAt: iso(row.finishedAt),
    partitions: await partitionsOf(db, row),
  };
}

/** A partitioned job's partitions by state, and the share of its mentions (or counterparties) done. */
async function partitionsOf(db: Kysely<Database>, row: JobRow): Promise<Record<string, number> | null> {
  if (row.params.partitioned !== true) return null;
  const t = await partitionTally(db, row.id);
  return { total: t.total, queued: t.queued, running: t.running, done: t.done, fractionDone: t.total === 0 ? 0 : t.done / t.total };
}
