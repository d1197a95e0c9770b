/**
 * POST /v1/jobs/contracts (write): a zip of PDF, Word and text contracts, as the body (application/zip) or as the
 * file parts of a multipart/form-data upload (@fastify/multipart: one zip, or documents and zips as the files of a
 * folder), at most CONTRACTS_UPLOAD_LIMIT bytes in all (413 over it). The upload is streamed to a temporary file, checked (a zip within the archive limits; 422 ARCHIVE_REFUSED
 * otherwise), and answered 202 with the job; its files are then read, their text extracted, and the job runs as
 * partitions of documents on whichever worker takes them (services/jobs/contracts-job.ts), exactly the import of
 * `cpreg contracts import`. GET /v1/jobs/{id} shows the progress and, when finished, the result.
 */
import { createHash, randomBytes, type Hash } from 'node:crypto';
import { createWriteStream } from 'node:fs';
import { mkdtemp, rm } from 'node:fs/promises';
import { once } from 'node:events';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import type { Readable } from 'node:stream';
import multipart from '@fastify/multipart';
import type { FastifyRequest } from 'fastify';
import { REJECT_REASONS } from '../../../../resolvers/files/index.ts';
import { ArchiveRefusedError } from '../../../contract-files/find-documents.ts';
import { submitContractsJob } from '../../../jobs/submit-contracts.ts';
import { ApiError, problemResponses } from '../../errors.ts';
import type { RoutePlugin } from '../../types.ts';
import { SOURCE_ID } from './schemas.ts';
import { actorOf } from './actor-of.ts';
import { JOB_OUT, jobView } from './job-view.ts';
import { answerJobCreated } from './answer-job-created.ts';
import { jobsFor } from './job-queue.ts';
import { claimIdempotencyKey, idempotencyKeyOf, releaseIdempotencyKey, sendStoredAnswer, storeIdempotentAnswer } from '../../auth/idempotency.ts';

/** An upload saved on disk: one archive, or a folder of files; `cleanup` is what to remove afterwards. */
interface Upload {
  path: string;
  folder: boolean;
  inputName: string;
  cleanup: string;
}

/** The most files one multipart upload holds (more go in a zip). */
const MAX_UPLOAD_FILES = 10_000;
/** The largest upload: 100 MiB. */
export const CONTRACTS_UPLOAD_LIMIT = 100 * 1024 * 1024;
const ZIP = 'application/zip';

const tooLarge = (): ApiError =>
  new ApiError(
    'PAYLOAD_TOO_LARGE',
    `the upload is over the limit of ${CONTRACTS_UPLOAD_LIMIT} bytes (100 MiB): split the archive, or import it with \`cpreg contracts import\``,
    {
      extensions: { limitBytes: CONTRACTS_UPLOAD_LIMIT },
    },
  );

/**
 * Streams one upload to `file`, counting on from `before` bytes (over the limit it stops and answers 413) and
 * feeding `hash` (the request's fingerprint for Idempotency-Key).
 */
async function saveUpload(upload: Readable, file: string, hash: Hash, before = 0): Promise<number> {
  const out = createWriteStream(file);
  let size = before;
  try {
    for await (const chunk of upload) {
      size += (chunk as Buffer).length;
      hash.update(chunk as Buffer);
      if (size > CONTRACTS_UPLOAD_LIMIT) throw tooLarge();
      if (!out.write(chunk)) await once(out, 'drain');
    }
  } catch (error) {
    if ((error as { code?: string }).code === 'FST_REQ_FILE_TOO_LARGE') throw tooLarge();
    throw error;
  } finally {
    out.end();
    await once(out, 'finish').catch(() => undefined);
  }
  return size;
}

/** A file name of a multipart part made safe as a file name in the upload folder (and unique there). */
function uploadName(filename: string | undefined, taken: Set<string>): string {
  const last = (filename ?? '').split(/[\\/]/).pop()!;
  const base = [...last]
    .filter((ch) => ch.charCodeAt(0) >= 0x20 && ch.charCodeAt(0) !== 0x7f)
    .join('')
    .slice(0, 200);
  let name = base === '' || base === '.' || base === '..' ? `file-${taken.size + 1}` : base;
  for (let n = 2; taken.has(name); n++) name = `${n}-${base}`;
  taken.add(name);
  return name;
}

/**
 * The files of a multipart upload into a new folder: answers that folder and its names, or, when the upload is one
 * zip archive, that file (read as the application/zip body is, so both give the same external ids).
 */
async function saveParts(request: FastifyRequest, hash: Hash): Promise<Upload> {
  const dir = await mkdtemp(join(tmpdir(), 'cpreg-contracts-'));
  try {
    const taken = new Set<string>();
    let total = 0;
    for await (const part of request.files()) {
      const name = uploadName(part.filename, taken);
      hash.update(`\u0000file:${name}\u0000`);
      total = await saveUpload(part.file, join(dir, name), hash, total);
    }
    if (taken.size === 0) throw new ApiError('UNSUPPORTED_MEDIA_TYPE', 'the multipart upload holds no file part: send the zip or the documents as file parts');
    const [only] = [...taken];
    if (taken.size === 1 && only!.toLowerCase().endsWith('.zip')) return { path: join(dir, only!), folder: false, inputName: only!, cleanup: dir };
    return { path: dir, folder: true, inputName: `${taken.size} uploaded files`, cleanup: dir };
  } catch (error) {
    await rm(dir, { recursive: true, force: true });
    throw multipartProblem(error);
  }
}

/**
 * A multipart body the parser cannot read, or one over its limits, as the problem it is: these once answered 500
 * (no boundary, a part cut short, bytes that are not multipart) or 413 with the parser's own words ("reach fields
 * limit") for a plain form field. Errors of our own (ApiError) and of the system (a code such as ENOSPC) pass.
 */
function multipartProblem(error: unknown): unknown {
  if (error instanceof ApiError) return error;
  const code = (error as { code?: unknown }).code;
  if (code === 'FST_FIELDS_LIMIT') {
    return new ApiError(
      'VALIDATION_FAILED',
      'the multipart upload holds a form field: only file parts are read; give the source as the query parameter ?source=',
      {
        errors: [{ pointer: '', message: 'holds a form field; only file parts are read', in: 'body' }],
      },
    );
  }
  if (code === 'FST_PARTS_LIMIT' || code === 'FST_FILES_LIMIT') {
    return new ApiError('PAYLOAD_TOO_LARGE', `the multipart upload holds more than ${MAX_UPLOAD_FILES} files: put them in a zip, or split the upload`, {
      extensions: { limitFiles: MAX_UPLOAD_FILES },
    });
  }
  if (code === undefined || code === 'FST_PROTO_VIOLATION' || code === 'FST_MP_PREMATURE_CLOSE') {
    // The parser's message names what is wrong in general terms ("Malformed part header"); it repeats no input.
    return new ApiError(
      'BAD_REQUEST',
      `the multipart body cannot be read (${(error as Error).message}): send the files as multipart/form-data parts with a boundary, or the zip as ${ZIP}`,
    );
  }
  return error;
}

export const contractsJobRoutes: RoutePlugin = async (app, deps) => {
  const db = deps.db;
  // The zip body is streamed to a temporary file, never held in memory.
  app.addContentTypeParser(ZIP, (_request, payload, done) => done(null, payload));
  await app.register(multipart, { limits: { fileSize: CONTRACTS_UPLOAD_LIMIT, files: MAX_UPLOAD_FILES, parts: MAX_UPLOAD_FILES, fields: 0 } });

  app.post<{ Querystring: { source: string; partitionSize?: number } }>(
    '/v1/jobs/contracts',
    {
      config: { scope: 'write', ownIdempotency: true },
      schema: {
        summary: 'Upload a zip of PDF, Word and text contracts: answered 202 with a job to poll',
        description: [
          `Content-Type ${ZIP} (the body is the archive), or multipart/form-data whose file parts are one zip (read as the ${ZIP} body is) or documents and zips (read as the files of a folder, each named by its file name); at most ${CONTRACTS_UPLOAD_LIMIT} bytes (100 MiB) in all, 413 over it.`,
          'Each .pdf, .docx, .txt and .md file (type read from the content) is stored as a contract through the same path as POST /v1/contracts, under `source`, with its path inside the zip as external id: a second upload of the same files finds them unchanged, a changed file is a new version of its contract.',
          'The archive is refused whole (422 ARCHIVE_REFUSED) when it is not a zip, lists over 50,000 entries or expands to over 4 GiB; single entries are refused with a reason (path outside the archive, symbolic link, encrypted, a compression ratio over 200 for an entry over 1 MiB, a zip inside a zip inside the zip) while the rest is read.',
          'GET /v1/jobs/{id}: progress.stage is staging (files read and their text extracted; filesRead of filesTotal), then storing (partitions.fractionDone), then finished; result.files reconciles (read = imported + unchanged + rejected), result.rejectedBy counts the reasons, result.rejected and result.contracts list up to 1,000 each (contracts with their parties, each with its counterparty or review item).',
          `Reasons: ${Object.keys(REJECT_REASONS).join(', ')}. No OCR is attempted: a scan without a text layer is rejected as no_text_layer. Extraction and party parsing are proposals; the signed document stands.`,
        ].join(' '),
        tags: ['jobs'],
        consumes: [ZIP, 'multipart/form-data'],
        querystring: {
          type: 'object',
          additionalProperties: false,
          properties: {
            source: { ...SOURCE_ID, default: 'files', description: 'The source the contracts are stored under' },
            partitionSize: { type: 'integer', minimum: 1, maximum: 10_000, default: 25, description: 'Documents per partition' },
          },
        },
        response: {
          202: {
            ...JOB_OUT,
            example: {
              id: 12,
              kind: 'contracts',
              status: 'queued',
              actor: 'legal-ops',
              params: { source: 'files', input: 'upload.zip', partitioned: true, partitionSize: 25 },
              progress: { stage: 'staging', filesRead: 0, filesTotal: 0 },
              result: null,
              error: null,
            },
          },
          ...problemResponses(422),
        },
      },
    },
    async (request, reply) => {
      const declared = Number(request.headers['content-length'] ?? 0);
      if (declared > CONTRACTS_UPLOAD_LIMIT + 64 * 1024) throw tooLarge();
      const hash = createHash('sha256').update(`POST ${request.url} ${request.isMultipart() ? 'multipart' : 'zip'}\u0000`);
      let upload: Upload;
      if (request.isMultipart()) upload = await saveParts(request, hash);
      else {
        const body = request.body as Readable;
        if (!body || typeof (body as { pipe?: unknown }).pipe !== 'function') {
          throw new ApiError(
            'UNSUPPORTED_MEDIA_TYPE',
            `send the zip as Content-Type ${ZIP}, or the zip or the documents as the file parts of a multipart/form-data upload`,
          );
        }
        const file = join(tmpdir(), `cpreg-contracts-${randomBytes(8).toString('hex')}.zip`);
        upload = { path: file, folder: false, inputName: 'upload.zip', cleanup: file };
        try {
          await saveUpload(body, file, hash);
        } catch (error) {
          await rm(file, { force: true });
          throw error;
        }
      }
      const removeUpload = () => rm(upload.cleanup, { recursive: true, force: true });
      // Idempotency-Key: a retry of the same upload answers the first job instead of importing it again.
      const key = idempotencyKeyOf(request);
      const claim = key && request.apiKey ? { keyId: request.apiKey.id, key } : undefined;
      if (claim) {
        const claimed = await claimIdempotencyKey(db, { ...claim, method: 'POST', path: request.url, hash: hash.digest('hex') }).catch(
          async (error: unknown) => {
            await removeUpload();
            throw error;
          },
        );
        if (claimed.kind === 'replay') {
          await removeUpload();
          return sendStoredAnswer(reply, claimed.answer);
        }
      }
      let submitted;
      try {
        const jobs = await jobsFor(app, deps);
        submitted = await submitContractsJob(
          { db, queue: jobs.queue },
          {
            file: upload.path,
            folder: upload.folder,
            source: request.query.source,
            actor: actorOf(request).actor,
            inputName: upload.inputName,
            partitionSize: request.query.partitionSize,
            ...(claim ? { onJobCreated: answerJobCreated(claim) } : {}),
          },
        );
      } catch (error) {
        await removeUpload();
        if (claim) await releaseIdempotencyKey(db, claim, { answered: true });
        if (error instanceof ArchiveRefusedError) throw new ApiError('ARCHIVE_REFUSED', error.message);
        throw error;
      }
      void submitted.staged.finally(removeUpload);
      const job = await jobView(db, submitted.jobId);
      if (claim) {
        await storeIdempotentAnswer(db, claim, {
          statusCode: 202,
          contentType: 'application/json; charset=utf-8',
          headers: { location: `/v1/jobs/${submitted.jobId}` },
          body: JSON.stringify(job),
        });
      }
      reply.code(202).header('location', `/v1/jobs/${submitted.jobId}`);
      return job;
    },
  );
};
