/**
 * The counts of an import, kept so that they reconcile: files read = imported + unchanged + rejected, imported =
 * new + changed, and rejected split by reason. Shared by `cpreg contracts import` and the contracts job.
 */
import type { RejectReason } from '../../resolvers/files/index.ts';
import type { DocumentOutcome, StoredParty } from './store-document.ts';

export interface ImportCounts {
  read: number;
  imported: number;
  new: number;
  changed: number;
  unchanged: number;
  rejected: number;
}

export interface ImportTally {
  files: ImportCounts;
  rejectedBy: Partial<Record<RejectReason, number>>;
  /** Parties of the imported contracts by resolution status (linked, review, new, own_entity, …). */
  parties: Record<string, number>;
  byType: Record<string, number>;
}

export function emptyTally(): ImportTally {
  return { files: { read: 0, imported: 0, new: 0, changed: 0, unchanged: 0, rejected: 0 }, rejectedBy: {}, parties: {}, byType: {} };
}

export function countRejected(tally: ImportTally, reason: RejectReason): void {
  tally.files.read++;
  tally.files.rejected++;
  tally.rejectedBy[reason] = (tally.rejectedBy[reason] ?? 0) + 1;
}

export function countOutcome(tally: ImportTally, outcome: DocumentOutcome, fileType: string): void {
  if (outcome.kind === 'rejected') {
    countRejected(tally, outcome.reason);
    return;
  }
  tally.files.read++;
  tally.byType[fileType] = (tally.byType[fileType] ?? 0) + 1;
  if (outcome.kind === 'unchanged') {
    tally.files.unchanged++;
    return;
  }
  tally.files.imported++;
  tally.files[outcome.change]++;
  for (const p of outcome.parties) tally.parties[p.status] = (tally.parties[p.status] ?? 0) + 1;
}

/** Adds one tally into another (the job's partitions). */
export function addTally(into: ImportTally, more: ImportTally): void {
  for (const k of Object.keys(into.files) as (keyof ImportCounts)[]) into.files[k] += more.files[k];
  for (const [k, v] of Object.entries(more.rejectedBy) as [RejectReason, number][]) into.rejectedBy[k] = (into.rejectedBy[k] ?? 0) + v;
  for (const [k, v] of Object.entries(more.parties)) into.parties[k] = (into.parties[k] ?? 0) + v;
  for (const [k, v] of Object.entries(more.byType)) into.byType[k] = (into.byType[k] ?? 0) + v;
}

/** Files read but counted nowhere: 0 unless there is a defect. */
export function unaccounted(files: ImportCounts): number {
  return Math.abs(files.read - files.imported - files.unchanged - files.rejected) + Math.abs(files.imported - files.new - files.changed);
}

export type ImportedContract = { path: string; contractId: number; change: 'new' | 'changed'; parties: StoredParty[] };
