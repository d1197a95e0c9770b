/**
 * GET /v1/exports/{kind} (streamed CSV or NDJSON; read) and the jobs: POST /v1/jobs/ingest (an NDJSON upload of
 * any size, answered 202; write), POST /v1/jobs/sweep and /v1/jobs/reresolve (admin), GET /v1/jobs/{id} (read).
 *
 * A job runs in the instance that accepted it; its progress and result live in the `job` table, so any instance
 * answers GET /v1/jobs/{id}. If that instance stops, the job stays `running` with its last progress: run it
 * again (ingest is idempotent by row identity; sweep and reresolve skip what is already done).
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
import { ingestFile } from '../../../ingest/run-ingest.ts';
import { sweep } from '../../../register/sweep.ts';
import { reresolve } from '../../../register/reresolve.ts';
import { ApiError, problemResponses } from '../../errors.ts';
import type { RoutePlugin } from '../../types.ts';
import { claimIdempotencyKey, idempotencyKeyOf, releaseIdempotencyKey, sendStoredAnswer, storeIdempotentAnswer } from '../../auth/idempotency.ts';
import { ID_PARAM, SOURCE_ID, actorOf, v1Scope } from './common.ts';
import { NDJSON } from './mentions.ts';

const JOB_OUT = {
  type: 'object',
  properties: {
    id: { type: 'integer' },
    kind: { type: 'string', enum: ['ingest', 'sweep', 'reresolve'] },
    status: { type: 'string', enum: ['queued', 'running', 'finished', 'failed'] },
    actor: { type: 'string' },
    params: { type: 'object', additionalProperties: true },
    progress: { type: 'object', additionalProperties: true },
    result: { type: 'object', nullable: true, additionalProperties: true },
    error: { type: 'string', nullable: true },
    createdAt: { type: 'string' },
    updatedAt: { type: 'string' },
    finishedAt: { type: 'string', nullable: true },
  },
  example: { id: 7, kind: 'ingest', status: 'finished', actor: 'contract system', params: { source: 'erp' }, progress: { read: 120000 }, result: { counts: { read: 120000, linked: 90000, new: 25000, review: 4000, rejected: 1000 } }, error: null },
} as const;

async function createJob(db: Kysely<Database>, kind: string, actor: string, params: Record<string, unknown>): Promise<number> {
  const row = await db.insertInto('job').values({ kind, actor, status: 'running', params: JSON.stringify(params) }).returning('id').executeTakeFirstOrThrow();
  return Number(row.id);
}

async function updateJob(db: Kysely<Database>, id: number, values: { progress?: unknown; result?: unknown; status?: 'finished' | 'failed'; error?: string }): Promise<void> {
  await db
    .updateTable('job')
    .set({
      updated_at: new Date(),
      ...(values.progress !== undefined ? { progress: JSON.stringify(values.progress) } : {}),
      ...(values.result !== undefined ? { result: JSON.stringify(values.result) } : {}),
      ...(values.status ? { status: values.status, finished_at: new Date() } : {}),
      ...(values.error !== undefined ? { error: values.error } : {}),
    })
    .where('id', '=', id)
    .execute();
}

/** Runs `work` after the answer has gone; failures end in the job row, never in an unhandled rejection. */
function runInBackground(db: Kysely<Database>, id: number, work: () => Promise<unknown>, log: { error: (o: object, m: string) => void }, cleanup?: () => Promise<void>): void {
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

export const exportJobRoutes: RoutePlugin = (app, deps) => {
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
        description: 'CSV free-text cells that begin with =, +, -, @, tab or CR carry a leading apostrophe (formula-injection neutralisation; docs/api.md lists the columns).',
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

  app.post<{ Querystring: { source: string } }>(
    '/v1/jobs/ingest',
    {
      config: { scope: 'write' },
      schema: {
        summary: 'Upload mentions as NDJSON (any size): answered 202 with a job to poll',
        description: 'Content-Type application/x-ndjson, one mention per line. `source` names the source for lines without their own. Rows are accounted for as in `cpreg ingest` (the job result holds the counts and the rejected lines with their reasons, up to 1,000).',
        tags: ['jobs'],
        querystring: { type: 'object', required: ['source'], additionalProperties: false, properties: { source: SOURCE_ID } },
        response: { 202: JOB_OUT, ...problemResponses(415) },
      },
    },
    async (request, reply) => {
      const upload = request.body as Readable;
      if (!upload || typeof (upload as { pipe?: unknown }).pipe !== 'function') {
        throw new ApiError('UNSUPPORTED_MEDIA_TYPE', 'send the mentions as Content-Type application/x-ndjson, one JSON object per line');
      }
      const file = join(tmpdir(), `cpreg-upload-${randomBytes(8).toString('hex')}.ndjson`);
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
        if (result.kind === 'replay') {
          await rm(file, { force: true });
          return sendStoredAnswer(reply, result.answer);
        }
      }
      const who = actorOf(request);
      let id: number;
      try {
        id = await createJob(db, 'ingest', who.actor, { source: request.query.source });
      } catch (error) {
        if (claim) await releaseIdempotencyKey(db, claim);
        await rm(file, { force: true });
        throw error;
      }
      const rejectsFile = `${file}.rejects.csv`;
      runInBackground(
        db,
        id,
        async () => {
          const summary = await ingestFile({
            db,
            ctx,
            file,
            format: 'ndjson',
            source: request.query.source,
            rejectsFile,
            actor: who.actor,
            onProgress: (p) => void updateJob(db, id, { progress: { ...p.counts, bytesRead: p.bytesRead, totalBytes: p.totalBytes } }).catch(() => undefined),
          });
          const rejected = summary.rejectsFile ? await readRejects(summary.rejectsFile) : [];
          await updateJob(db, id, { progress: { ...summary.counts, bytesRead: summary.totalBytes, totalBytes: summary.totalBytes } });
          return { ingestRunId: summary.runId, counts: summary.counts, rejected };
        },
        request.log,
        async () => {
          await rm(file, { force: true });
          await rm(rejectsFile, { force: true });
        },
      );
      const job = await jobView(db, id);
      reply.code(202).header('location', `/v1/jobs/${id}`);
      if (claim) {
        await storeIdempotentAnswer(db, claim, { statusCode: 202, contentType: 'application/json; charset=utf-8', headers: { location: `/v1/jobs/${id}` }, body: JSON.stringify(job) });
      }
      return job;
    },
  );

  for (const kind of ['sweep', 'reresolve'] as const) {
    app.post(
      `/v1/jobs/${kind}`,
      {
        config: { scope: 'admin' },
        schema: {
          summary: kind === 'sweep' ? 'Start a duplicate sweep (files review items; never merges)' : 'Re-resolve every mention no person confirmed (after thresholds or weights changed)',
          tags: ['jobs'],
          response: { 202: JOB_OUT },
        },
      },
      async (request, reply) => {
        const who = actorOf(request);
        const id = await createJob(db, kind, who.actor, {});
        runInBackground(
          db,
          id,
          () =>
            kind === 'sweep'
              ? sweep(ctx, who, { onProgress: (s) => void updateJob(db, id, { progress: { scanned: s.scanned, duplicateItems: s.duplicateItems, affiliateItems: s.affiliateItems } }).catch(() => undefined) })
              : reresolve(ctx, who, { onProgress: (s) => void updateJob(db, id, { progress: { examined: s.examined, changed: s.changed } }).catch(() => undefined) }),
          request.log,
        );
        reply.code(202).header('location', `/v1/jobs/${id}`);
        return jobView(db, id);
      },
    );
  }

  app.get<{ Params: { id: number } }>(
    '/v1/jobs/:id',
    {
      config: { scope: 'read' },
      schema: { summary: 'A job: status, progress and, when finished, its result', tags: ['jobs'], params: ID_PARAM, response: { 200: JOB_OUT, ...problemResponses(404) } },
    },
    async (request) => jobView(db, request.params.id),
  );
};

async function jobView(db: Kysely<Database>, id: number): Promise<Record<string, unknown>> {
  const row = await db.selectFrom('job').selectAll().where('id', '=', id).executeTakeFirst();
  if (!row) throw new ApiError('NOT_FOUND', `job ${id} does not exist`);
  const parse = (v: unknown): unknown => (typeof v === 'string' ? JSON.parse(v) : v);
  const iso = (v: Date | null): string | null => (v === null ? null : new Date(v).toISOString());
  return {
    id: Number(row.id),
    kind: row.kind,
    status: row.status,
    actor: row.actor,
    params: parse(row.params),
    progress: parse(row.progress),
    result: parse(row.result) ?? null,
    error: row.error,
    createdAt: iso(row.created_at),
    updatedAt: iso(row.updated_at),
    finishedAt: iso(row.finished_at),
  };
}

async function readRejects(file: string): Promise<{ line: number; reason: string }[]> {
  const { readFile } = await import('node:fs/promises');
  const { parse } = await import('csv-parse/sync');
  const rows = parse(await readFile(file, 'utf8'), { columns: true }) as { line: string; reason: string }[];
  return rows.slice(0, 1000).map((r) => ({ line: Number(r.line), reason: r.reason }));
}
