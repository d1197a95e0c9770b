/**
 * Contract files as a partitioned job (POST /v1/jobs/contracts): the upload's documents, extracted and staged by
 * submit-contracts.ts, are cut into partitions of whole documents; each partition stores its documents through the
 * register's contract path (services/contract-files/store-document.ts, what `cpreg contracts import` calls), on
 * any worker; the final pass adds the partitions' tallies to the staging's rejects. Contracts of different
 * partitions are stored concurrently as concurrent POST /v1/contracts calls are: each in its own register
 * transaction, under the register's row locks and retries. A partition run again (a retry after its worker died)
 * finds the documents it had stored unchanged: the counts still reconcile.
 */
import {
  chunksOf,
  deleteChunks,
  finishPartition,
  insertPartitions,
  partitionResults,
  readJob,
  readPartition,
  startPartition,
  updateJob,
} from '../../db/queries/jobs.ts';
import type { FileReject } from '../../resolvers/files/index.ts';
import { storeDocument } from '../contract-files/store-document.ts';
import { addTally, countOutcome, countRejected, emptyTally, unaccounted, type ImportTally, type ImportedContract } from '../contract-files/tally.ts';
import { MAX_LISTED_REJECTS, type JobDeps } from './deps.ts';
import { queueFinishWhenAllDone, readyToFinish } from './finish-guard.ts';

/** One staged file: a document with its text, or the reason it was not read. */
export type StagedFile = { path: string; title: string; fileType: string; text: string } | FileReject;

/** Documents per partition. Default 25 (a partition of PDFs stays under a minute on a loaded machine). */
export const CONTRACTS_PARTITION_SIZE = 25;

/** Contracts listed in a job's result (the counts hold them all). */
export const MAX_LISTED_CONTRACTS = 1000;

interface PartitionResult {
  tally: ImportTally;
  contracts: ImportedContract[];
  rejected: FileReject[];
  elapsedMs: number;
  attempt: number;
  worker: string;
}

export async function planContracts(deps: JobDeps, jobId: number): Promise<{ partitions: number; alreadyPlanned: boolean }> {
  const job = await readJob(deps.db, jobId);
  if (!job) throw new Error(`job ${jobId} does not exist`);
  if (job.plan) return { partitions: Number(job.plan.partitions), alreadyPlanned: true };
  const size = Number(job.params.partitionSize ?? CONTRACTS_PARTITION_SIZE);
  const tally = emptyTally();
  const rejected: FileReject[] = [];
  const partitions: StagedFile[][] = [];
  let current: StagedFile[] = [];
  for await (const chunk of chunksOf(deps.db, jobId)) {
    for (const row of chunk as StagedFile[]) {
      if ('reason' in row) {
        countRejected(tally, row.reason);
        if (rejected.length < MAX_LISTED_REJECTS) rejected.push(row);
        continue;
      }
      current.push(row);
      if (current.length >= size) {
        partitions.push(current);
        current = [];
      }
    }
  }
  if (current.length > 0) partitions.push(current);
  const documents = partitions.reduce((n, p) => n + p.length, 0);
  await deps.db.transaction().execute(async (trx) => {
    await insertPartitions(trx, jobId, partitions);
    await updateJob(trx, jobId, {
      status: 'running',
      plan: { partitions: partitions.length, documents, staged: { tally, rejected } },
      progress: { ...job.progress, stage: 'storing', partitions: partitions.length, documents },
    });
    await deleteChunks(trx, jobId);
  });
  return { partitions: partitions.length, alreadyPlanned: false };
}

export async function runContractsPartition(deps: JobDeps, jobId: number, partitionNo: number): Promise<void> {
  const job = await readJob(deps.db, jobId);
  const part = await readPartition(deps.db, jobId, partitionNo);
  if (!job || !part) throw new Error(`job ${jobId} has no partition ${partitionNo}`);
  if (part.status !== 'done') {
    await startPartition(deps.db, jobId, partitionNo, deps.worker);
    const started = performance.now();
    const source = String(job.params.source);
    const who = { actor: job.actor, reason: `contract files of job ${jobId}` };
    const tally = emptyTally();
    const contracts: ImportedContract[] = [];
    const rejected: FileReject[] = [];
    for (const doc of part.items as Extract<StagedFile, { text: string }>[]) {
      const outcome = await storeDocument(deps.ctx, doc, source, who);
      countOutcome(tally, outcome, doc.fileType);
      if (outcome.kind === 'rejected') rejected.push({ path: doc.path, reason: outcome.reason, detail: outcome.detail });
      if (outcome.kind === 'imported') contracts.push({ path: doc.path, contractId: outcome.contractId, change: outcome.change, parties: outcome.parties });
    }
    const result: PartitionResult = {
      tally,
      contracts,
      rejected,
      elapsedMs: Math.round(performance.now() - started),
      attempt: part.attempts + 1,
      worker: deps.worker,
    };
    await deps.db.transaction().execute(async (trx) => {
      await readJob(trx, jobId, { forUpdate: true });
      await finishPartition(trx, jobId, partitionNo, result);
    });
  }
  await queueFinishWhenAllDone(deps, jobId);
}

export async function finishContracts(deps: JobDeps, jobId: number): Promise<void> {
  const job = await readyToFinish(deps, jobId);
  if (!job) return;
  const staged = (job.plan?.staged ?? { tally: emptyTally(), rejected: [] }) as { tally: ImportTally; rejected: FileReject[] };
  const tally = emptyTally();
  addTally(tally, staged.tally);
  const rejected = [...staged.rejected];
  const contracts: ImportedContract[] = [];
  let retried = 0;
  for (const { result } of await partitionResults(deps.db, jobId)) {
    const r = result as unknown as PartitionResult;
    addTally(tally, r.tally);
    for (const item of r.rejected) if (rejected.length < MAX_LISTED_REJECTS) rejected.push(item);
    for (const c of r.contracts) if (contracts.length < MAX_LISTED_CONTRACTS) contracts.push(c);
    if (r.attempt > 1) retried++;
  }
  const gap = unaccounted(tally.files);
  const result = { ...tally, rejected, contracts, partitions: Number(job.plan?.partitions ?? 0), retriedPartitions: retried };
  if (gap !== 0) {
    await updateJob(deps.db, jobId, { status: 'failed', result, error: `${gap} files read but not accounted for (a defect: please report it)` });
    return;
  }
  await updateJob(deps.db, jobId, { status: 'finished', result, progress: { ...job.progress, stage: 'finished' } });
  deps.log('info', { jobId, partitions: result.partitions, files: tally.files.read }, 'contracts job finished');
}
