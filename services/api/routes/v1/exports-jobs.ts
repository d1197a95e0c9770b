/**
 * GET /v1/exports/{kind} (streamed CSV or NDJSON; read) and the jobs: POST /v1/jobs/ingest (an NDJSON upload of
 * any size, answered 202; write), POST /v1/jobs/sweep and /v1/jobs/reresolve (admin), GET /v1/jobs/{id} (read).
 *
 * Ingest and sweep are partitioned jobs (services/jobs): queued in the job queue and run by whichever worker takes
 * their steps, so any instance answers GET /v1/jobs/{id} and none holds job state. A reresolve job runs in the
 * instance that accepted it; if that instance stops, the job stays `running` with its last progress: run it again
 * (it skips what is already done).
 */
import { createHash, randomBytes } from 'node:crypto';
import { createWriteStream } from 'node:fs';
import { rm } from 'node:fs/promises';
import { once } from 'node:events';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { Readable } from 'node:stream';
import type { Kysely } from 'kysely';
import type { Database } from '../../../../db/types.ts';
import { EXPORT_FORMATS, EXPORT_KINDS, exportChunks, type ExportFormat, type ExportKind } from '../../../export/exports.ts';
import type { Jobs } from '../../../jobs/start-jobs.ts';
import { jobsFor } from './job-queue.ts';
import { submitIngestJob, type JobCreatedHook } from '../../../jobs/submit-ingest.ts';
import { submitSweepJob } from '../../../jobs/steps.ts';
import { insertJob, partitionTally, readJob, updateJob, type JobRow } from '../../../../db/queries/jobs.ts';
import { reresolve } from '../../../register/reresolve.ts';
import { ApiError, problemResponses } from '../../errors.ts';
import type { RoutePlugin } from '../../types.ts';
import { claimIdempotencyKey, idempotencyKeyOf, releaseIdempotencyKey, sendStoredAnswer, storeIdempotentAnswer } from '../../auth/idempotency.ts';
import { ID_PARAM, SOURCE_ID, actorOf, v1Scope } from './common.ts';
import { NDJSON } from './mentions.ts';

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

/** Runs `work` after the answer has gone; failures end in the job row, never in an unhandled rejection. */
function runInBackground(
  db: Kysely<Database>,
  id: number,
  work: () => Promise<unknown>,
  log: { error: (o: object, m: string) => void },
  cleanup?: () => Promise<void>,
): void {
  setImmediate(() => {
    work()
      .then((result) => updateJob(db, id, { status: 'finished', result }))
      .catch(async (error: unknown) => {
        log.error({ err: error, jobId: id }, 'job failed');
        await updateJob(db, id, { status: 'failed', error: (error as Error).message }).catch(() => undefined);
      })
      .finally(() => void cleanup?.().catch(() => undefined));
  });
}

/**
 * The body of a job that takes no options: none, or an empty object. Declared so that anything else is refused
 * by name (422) instead of passing unread into the idempotency hash and the logs.
 */
const NO_OPTIONS = { type: 'object', nullable: true, additionalProperties: false, properties: {}, description: 'no options: send no body or {}' } as const;

export const exportJobRoutes: RoutePlugin = async (app, deps) => {
  const ctx = v1Scope(app, deps);
  const db = deps.db;
  // The upload is streamed to a temporary file, never held in memory: any size is accepted.
  app.addContentTypeParser(NDJSON, (_request, payload, done) => done(null, payload));

  app.get<{ Params: { kind: ExportKind }; Querystring: { format: ExportFormat } }>(
    '/v1/exports/:kind',
    {
      config: { scope: 'read' },
      schema: {
        summary: 'Export the register, links, history or review items (streamed CSV or NDJSON)',
        description:
          'CSV free-text cells that begin with =, +, -, @, tab or CR carry a leading apostrophe (formula-injection neutralisation; docs/api.md lists the columns).',
        tags: ['exports'],
        params: { type: 'object', required: ['kind'], properties: { kind: { type: 'string', enum: [...EXPORT_KINDS] } } },
        querystring: { type: 'object', additionalProperties: false, properties: { format: { type: 'string', enum: [...EXPORT_FORMATS], default: 'csv' } } },
        response: { 200: { description: 'text/csv or application/x-ndjson, streamed', type: 'string' } },
      },
    },
    async (request, reply) => {
      const { kind } = request.params;
      const { format } = request.query;
      reply
        .type(format === 'csv' ? 'text/csv; charset=utf-8' : `${NDJSON}; charset=utf-8`)
        .header('content-disposition', `attachment; filename="cpreg-${kind}.${format}"`);
      return reply.send(Readable.from(exportChunks(db, kind, format)));
    },
  );

  // Ingest and sweep run as partitioned jobs through the job queue (services/jobs): on PostgreSQL any worker
  // process takes the steps, so this instance keeps no job state; on the embedded database they run here.
  const jobsReady = (): Promise<Jobs> => jobsFor(app, deps);
  if (!deps.jobs) await jobsReady();

  app.post<{ Querystring: { source: string; partitionSize?: number } }>(
    '/v1/jobs/ingest',
    {
      config: { scope: 'write' },
      schema: {
        summary: 'Upload mentions as NDJSON (any size): answered 202 with a job to poll',
        description:
          'Content-Type application/x-ndjson, one mention per line. `source` names the source for lines without their own. The upload is staged, then planned into partitions that workers resolve (GET /v1/jobs/{id} shows the partitions done). Rows are accounted for as in `cpreg ingest` (the job result holds the counts and the rejected lines with their reasons, up to 1,000).',
        tags: ['jobs'],
        querystring: {
          type: 'object',
          required: ['source'],
          additionalProperties: false,
          properties: {
            source: SOURCE_ID,
            partitionSize: { type: 'integer', minimum: 1, maximum: 1_000_000, default: 2000, description: 'Mentions per partition aimed at (whole clusters)' },
          },
        },
        response: { 202: JOB_OUT, ...problemResponses(415) },
      },
    },
    async (request, reply) => {
      const upload = request.body as Readable;
      if (!upload || typeof (upload as { pipe?: unknown }).pipe !== 'function') {
        throw new ApiError('UNSUPPORTED_MEDIA_TYPE', 'send the mentions as Content-Type application/x-ndjson, one JSON object per line');
      }
      const file = join(tmpdir(), `cpreg-upload-${randomBytes(8).toString('hex')}.ndjson`);
      try {
        const hash = createHash('sha256');
        const out = createWriteStream(file);
        for await (const chunk of upload) {
          hash.update(chunk as Buffer);
          if (!out.write(chunk)) await once(out, 'drain');
        }
        out.end();
        await once(out, 'finish');
        const key = idempotencyKeyOf(request);
        const claim = key && request.apiKey ? { keyId: request.apiKey.id, key } : undefined;
        if (claim) {
          const result = await claimIdempotencyKey(db, { ...claim, method: 'POST', path: request.url, hash: hash.digest('hex') });
          if (result.kind === 'replay') return sendStoredAnswer(reply, result.answer);
        }
        const who = actorOf(request);
        let id: number;
        try {
          id = await submitIngestJob(
            { db, queue: (await jobsReady()).queue },
            {
              file,
              format: 'ndjson',
              source: request.query.source,
              actor: who.actor,
              inputName: 'upload',
              ...(request.query.partitionSize ? { partitionSize: request.query.partitionSize } : {}),
              ...(claim ? { onJobCreated: answerJobCreated(claim) } : {}),
            },
          );
        } catch (error) {
          if (claim) await releaseIdempotencyKey(db, claim, { answered: true });
          throw error;
        }
        const job = await jobView(db, id);
        reply.code(202).header('location', `/v1/jobs/${id}`);
        if (claim) {
          await storeIdempotentAnswer(db, claim, {
            statusCode: 202,
            contentType: 'application/json; charset=utf-8',
            headers: { location: `/v1/jobs/${id}` },
            body: JSON.stringify(job),
          });
        }
        return job;
      } finally {
        await rm(file, { force: true });
      }
    },
  );

  app.post(
    '/v1/jobs/sweep',
    {
      config: { scope: 'admin' },
      schema: {
        summary: 'Start a duplicate sweep (files review items; never merges), partitioned over the workers',
        tags: ['jobs'],
        body: NO_OPTIONS,
        response: { 202: JOB_OUT },
      },
    },
    async (request, reply) => {
      const id = await submitSweepJob({ db, queue: (await jobsReady()).queue }, { actor: actorOf(request).actor });
      reply.code(202).header('location', `/v1/jobs/${id}`);
      return jobView(db, id);
    },
  );

  app.post(
    '/v1/jobs/reresolve',
    {
      config: { scope: 'admin' },
      schema: {
        summary: 'Re-resolve every mention no person confirmed (after thresholds or weights changed)',
        tags: ['jobs'],
        body: NO_OPTIONS,
        response: { 202: JOB_OUT },
      },
    },
    async (request, reply) => {
      const who = actorOf(request);
      const id = await insertJob(db, { kind: 'reresolve', actor: who.actor, status: 'running', params: {} });
      runInBackground(
        db,
        id,
        () =>
          reresolve(ctx, who, { onProgress: (s) => void updateJob(db, id, { progress: { examined: s.examined, changed: s.changed } }).catch(() => undefined) }),
        request.log,
      );
      reply.code(202).header('location', `/v1/jobs/${id}`);
      return jobView(db, id);
    },
  );

  app.get<{ Params: { id: number } }>(
    '/v1/jobs/:id',
    {
      config: { scope: 'read' },
      schema: {
        summary: 'A job: status, progress and, when finished, its result',
        tags: ['jobs'],
        params: ID_PARAM,
        response: { 200: JOB_OUT, ...problemResponses(404) },
      },
    },
    async (request) => jobView(db, request.params.id),
  );
};

/**
 * A job submission's Idempotency-Key answer, stored in the transaction that creates the job: a retry whose first
 * answer was lost (the process stopped while the upload was read, or before it answered) is answered with the same
 * job, never a second one. The answer stored once the submission is done replaces it with the job as it then is.
 */
export function answerJobCreated(claim: { keyId: string; key: string }): JobCreatedHook {
  return async (trx, jobId) =>
    storeIdempotentAnswer(trx, claim, {
      statusCode: 202,
      contentType: 'application/json; charset=utf-8',
      headers: { location: `/v1/jobs/${jobId}` },
      body: JSON.stringify(await jobView(trx, jobId)),
    });
}

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
