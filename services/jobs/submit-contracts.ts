/**
 * Submits an uploaded zip of contract files as a partitioned job. The archive is checked first (a zip, within
 * the entry and size limits: refused at once otherwise, nothing staged); then the job is created and answered,
 * and its files are read and their text extracted (services/contract-files/find-documents.ts, as `cpreg contracts
 * import` does) into job_chunk, with progress on the job row, before the planner is queued. Reading runs in the
 * process that took the upload: if that process stops first, the job is marked failed when the embedded service
 * starts again (services/jobs/start-jobs.ts resumeUnfinishedJobs, stage `staging`); submit it again, and the files
 * already stored count as unchanged.
 */
import { open } from 'node:fs/promises';
import type { Kysely } from 'kysely';
import type { JobQueue } from '../../db/job-queue.ts';
import { insertChunk, insertJob, updateJob } from '../../db/queries/jobs.ts';
import type { Database } from '../../db/types.ts';
import { FILE_LIMIT_DEFAULTS, detectFileType, zipPackageKind, type FileLimits } from '../../resolvers/files/index.ts';
import { ArchiveRefusedError, DocumentFinder } from '../contract-files/find-documents.ts';
import { archiveProblem, surveyZip } from '../contract-files/zip-archive.ts';
import { CONTRACTS_PARTITION_SIZE, type StagedFile } from './contracts-job.ts';
import { JOB_STEPS } from './deps.ts';
import type { JobCreatedHook } from './submit-ingest.ts';

export interface SubmitContractsOptions {
  /**
   * The upload on disk (removed by the caller once `staged` settles): one zip archive, or a folder holding the
   * files of a multipart upload (documents and zips, read as `cpreg contracts import <folder>` reads them).
   */
  file: string;
  /** `file` is a folder of uploaded files, not one archive. */
  folder?: boolean;
  source: string;
  actor: string;
  inputName: string;
  partitionSize?: number;
  limits?: Partial<FileLimits>;
  /** Runs inside the transaction that creates the job (see submit-ingest.ts). */
  onJobCreated?: JobCreatedHook;
}

/** Staged rows per job_chunk, and the text a chunk holds at most before it is written (bytes). */
const CHUNK_ROWS = 50;
const CHUNK_TEXT_BYTES = 8 * 1024 * 1024;
const PROGRESS_EVERY_MS = 1000;

/** Refuses, before any job exists, an upload that is not a zip archive or is over the archive limits. */
export async function checkUploadedArchive(file: string, inputName: string, limits: FileLimits): Promise<void> {
  const handle = await open(file, 'r');
  const head = Buffer.alloc(1024);
  try {
    await handle.read(head, 0, head.length, 0);
  } finally {
    await handle.close();
  }
  if (detectFileType(head).kind !== 'zip') throw new ArchiveRefusedError(inputName, 'the body is not a zip archive');
  let survey;
  try {
    survey = await surveyZip({ file }, limits);
  } catch (error) {
    throw new ArchiveRefusedError(inputName, `not a readable zip archive: ${(error as Error).message}`);
  }
  if (zipPackageKind(survey.names) !== 'archive') throw new ArchiveRefusedError(inputName, 'a Word or Office document, not an archive of files: zip it');
  const problem = archiveProblem(survey, limits);
  if (problem) throw new ArchiveRefusedError(inputName, problem);
}

export async function submitContractsJob(
  deps: { db: Kysely<Database>; queue: JobQueue },
  options: SubmitContractsOptions,
): Promise<{ jobId: number; staged: Promise<void> }> {
  const limits = { ...FILE_LIMIT_DEFAULTS, ...options.limits };
  if (!options.folder) await checkUploadedArchive(options.file, options.inputName, limits);
  const partitionSize = options.partitionSize ?? CONTRACTS_PARTITION_SIZE;
  const jobId = await deps.db.transaction().execute(async (trx) => {
    const created = await insertJob(trx, {
      kind: 'contracts',
      actor: options.actor,
      status: 'queued',
      params: { source: options.source, input: options.inputName, partitioned: true, partitionSize },
    });
    await updateJob(trx, created, { progress: { stage: 'staging', filesRead: 0, filesTotal: 0 } });
    await options.onJobCreated?.(trx, created);
    return created;
  });
  const staged = stage(deps, jobId, options, limits).catch(async (error: unknown) => {
    await updateJob(deps.db, jobId, { status: 'failed', error: `reading ${options.inputName} failed: ${(error as Error).message}` }).catch(() => undefined);
  });
  return { jobId, staged };
}

async function stage(deps: { db: Kysely<Database>; queue: JobQueue }, jobId: number, options: SubmitContractsOptions, limits: FileLimits): Promise<void> {
  const finder = new DocumentFinder(options.file, { displayName: options.inputName, limits });
  let chunk: StagedFile[] = [];
  let chunkBytes = 0;
  let chunkNo = 0;
  let read = 0;
  let lastProgress = performance.now();
  const flush = async (): Promise<void> => {
    if (chunk.length > 0) await insertChunk(deps.db, jobId, chunkNo++, chunk);
    chunk = [];
    chunkBytes = 0;
  };
  for await (const found of finder.documents()) {
    read++;
    if (found.kind === 'rejected') chunk.push({ path: found.path, reason: found.reason, detail: found.detail });
    else {
      chunk.push({ path: found.path, title: found.title, fileType: found.fileType, text: found.text });
      chunkBytes += found.text.length;
    }
    if (chunk.length >= CHUNK_ROWS || chunkBytes >= CHUNK_TEXT_BYTES) await flush();
    if (performance.now() - lastProgress >= PROGRESS_EVERY_MS) {
      lastProgress = performance.now();
      await updateJob(deps.db, jobId, { progress: { stage: 'staging', filesRead: read, filesTotal: Math.max(finder.total, read) } });
    }
  }
  await flush();
  await updateJob(deps.db, jobId, { progress: { stage: 'planning', filesRead: read, filesTotal: read } });
  await deps.queue.send(JOB_STEPS.plan, { jobId }, { singletonKey: String(jobId) });
}
