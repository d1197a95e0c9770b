/**
 * `cpreg contracts import`: every document found in a folder, a zip or one file (find-documents.ts) goes through
 * the register's contract path (store-document.ts), in the order found, with progress after each file, a rejects
 * file, and a summary whose counts reconcile (tally.ts).
 */
import type { Kysely } from 'kysely';
import type { Database } from '../../db/types.ts';
import type { FileLimits } from '../../resolvers/files/index.ts';
import { createRegisterContext } from '../register/context.ts';
import { DocumentFinder } from './find-documents.ts';
import { FileRejectsWriter } from './rejects-file.ts';
import { storeDocument } from './store-document.ts';
import { countOutcome, countRejected, emptyTally, unaccounted, type ImportTally, type ImportedContract } from './tally.ts';

export interface ImportFilesOptions {
  db: Kysely<Database>;
  target: string;
  source: string;
  actor: string;
  recursive?: boolean;
  rejectsFile: string;
  limits?: Partial<FileLimits>;
  onProgress?: (p: { done: number; total: number; tally: ImportTally }) => void;
  shouldStop?: () => boolean;
}

export interface ImportFilesSummary extends ImportTally {
  target: string;
  source: string;
  status: 'finished' | 'interrupted';
  skippedFolders: number;
  rejectsFile: string;
  elapsedMs: number;
  /** The contracts imported (new or changed) in this run, in the order found. */
  contracts: ImportedContract[];
}

export async function importContractFiles(options: ImportFilesOptions): Promise<ImportFilesSummary> {
  const started = performance.now();
  const ctx = createRegisterContext(options.db);
  const who = { actor: options.actor, reason: `contract files imported from ${options.target}` };
  const finder = new DocumentFinder(options.target, { recursive: options.recursive, limits: options.limits });
  const tally = emptyTally();
  const contracts: ImportedContract[] = [];
  const rejects = new FileRejectsWriter(options.rejectsFile);
  let status: ImportFilesSummary['status'] = 'finished';
  try {
    for await (const found of finder.documents()) {
      if (found.kind === 'rejected') {
        countRejected(tally, found.reason);
        rejects.write(found);
      } else {
        const outcome = await storeDocument(ctx, found, options.source, who);
        countOutcome(tally, outcome, found.fileType);
        if (outcome.kind === 'rejected') rejects.write({ path: found.path, reason: outcome.reason, detail: outcome.detail });
        if (outcome.kind === 'imported') contracts.push({ path: found.path, contractId: outcome.contractId, change: outcome.change, parties: outcome.parties });
      }
      options.onProgress?.({ done: tally.files.read, total: Math.max(finder.total, tally.files.read), tally });
      if (options.shouldStop?.()) {
        status = 'interrupted';
        break;
      }
    }
  } finally {
    await rejects.close();
  }
  const gap = unaccounted(tally.files);
  if (gap !== 0) throw new Error(`${gap} files read but not accounted for (a defect: please report it)`);
  return {
    target: options.target,
    source: options.source,
    status,
    ...tally,
    skippedFolders: finder.skippedFolders,
    rejectsFile: options.rejectsFile,
    elapsedMs: performance.now() - started,
    contracts,
  };
}
