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
import { submitIngestJob } from '../../../jobs/submit-ingest.ts';
import { submitSweepJob } from '../../../jobs/steps.ts';
import { insertJob, updateJob } from '../../../../db/queries/jobs.ts';
import { reresolve } from '../../../register/reresolve.ts';
import { ApiError, problemResponses } from '../../errors.ts';
import type { RoutePlugin } from '../../types.ts';
import { claimIdempotencyKey, idempotencyKeyOf, releaseIdempotencyKey, sendStoredAnswer, storeIdempotentAnswer } from '../../auth/idempotency.ts';
import { ID_PARAM, SOURCE_ID } from './schemas.ts';
import { actorOf } from './actor-of.ts';
import { v1Scope } from './v1-scope.ts';
import { NDJSON } from './mentions.ts';
import { JOB_OUT, jobView } from './job-view.ts';
import { answerJobCreated } from './answer-job-created.ts';

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
        consumes: [NDJSON],
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
