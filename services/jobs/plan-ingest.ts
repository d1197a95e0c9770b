/**
 * The planner of an ingest job: reads the staged rows, settles what needs no matching (rows that could not be
 * read, repeats of a row identity, rows stored before with the same content), and cuts the rest into partitions
 * of whole components of linking pairs (resolvers/block/partitionRecords): every candidate pair of the batch
 * (resolvers/block/candidatePairs, the same blocking the batch resolution uses) is scored with the current model
 * and the register's IDF, and the pairs at or above linkAt decide which mentions must be resolved together.
 * Linking pairs that end up in different partitions (only when a component outgrew the partition size) are kept
 * in job.plan for the final pass. A job that fits one partition skips the scoring (nothing is left to cut) but keeps
 * its candidate pairs and frozen token counts, so it resolves exactly as when its pairs were scored. Writes the
 * partitions, the plan and the planning counts in one transaction.
 */
import { candidatePairs, partitionRecords, type CandidatePairs, type MatchRecord, type PartitionPlan } from '../../resolvers/block/index.ts';
import type { IdfTable } from '../../resolvers/compare/index.ts';
import { scorePair, type MatchModel } from '../../resolvers/score/index.ts';
import { chunksOf, deleteChunks, insertPartitions, readJob, updateJob } from '../../db/queries/jobs.ts';
import { emptyCounts } from '../ingest/ingest-counts.ts';
import { storedHashes } from '../ingest/stored-hashes.ts';
import { RegisterError } from '../register/errors.ts';
import { basisOf, documentFrequencies, freezeRarity, idfFromCounts, registerSize, type FrozenRarity } from '../register/matching/idf.ts';
import { currentModel } from '../register/matching/model.ts';
import { prepareMention, type PreparedMention } from '../register/resolve/prepare.ts';
import { mentionKey, type MentionInput } from '../../resolvers/vocabulary.ts';
import { MAX_LISTED_REJECTS, PARTITION_DEFAULTS, type JobDeps } from './deps.ts';
import type { StagedRow } from './submit-ingest.ts';

/** A mention handed to a partition: its line in the input and the mention as mapped. */
export interface PartitionItem {
  line: number;
  mention: MentionInput;
  /**
   * Items of the same partition (by index) this one is compared with: the plan's candidate pairs over the whole
   * job, kept so that the partition compares exactly those (register/batch.ts comparePairs). Absent in plans made
   * before it was kept: the partition then blocks by itself.
   */
  compareWith?: number[];
  /**
   * Counts frozen by the plan for this mention's tokens that the job holds at least twice (register/matching/idf.ts
   * freezeRarity), kept with the mention so that a partition reads only its own share.
   */
  tokenCounts?: Record<string, number>;
}

/** A linking pair across partitions: the two mentions' (source, externalId) and the pair's score. */
export type CrossPair = [[string, string], [string, string], number];

export interface IngestPlan {
  partitions: number;
  mentions: number;
  candidatePairs: number;
  /** Candidate pairs the planner scored: all of them, or none when the job fits one partition (absent in older plans). */
  scoredPairs?: number;
  /** Scored pairs at or above linkAt; null when none were scored. */
  linkingPairs: number | null;
  crossPairs: CrossPair[];
  refusedJoins: number;
  /** Names counted for token rarity: the register's at planning time and the whole job's (absent in older plans). */
  rarityDocuments?: number;
  counts: Record<string, number>;
  rejected: { line: number; reason: string }[];
  planningMs: number;
}

export interface PlanOptions {
  /** Score the pairs even when the job fits one partition (to compare with the shortcut; tests, measurements). */
  scoreAlways?: boolean;
}

export async function planIngest(deps: JobDeps, jobId: number, options: PlanOptions = {}): Promise<{ partitions: number; alreadyPlanned: boolean }> {
  const job = await readJob(deps.db, jobId);
  if (!job) throw new Error(`job ${jobId} does not exist`);
  if (job.plan) return { partitions: Number(job.plan.partitions), alreadyPlanned: true };
  const started = performance.now();
  await updateJob(deps.db, jobId, { status: 'running', progress: { ...job.progress, stage: 'planning' } });
  await deps.hooks?.planning?.(jobId);
  let staged: Staged;
  try {
    staged = await readStaged(deps, jobId);
  } catch (error) {
    // Another run of this step (delivered again by the queue) planned the job meanwhile and dropped its input.
    const now = await readJob(deps.db, jobId);
    if (now?.plan) return { partitions: Number(now.plan.partitions), alreadyPlanned: true };
    throw error;
  }
  const { counts, rejected, valid } = staged;
  // Rows stored before with the same content need no partition (a resumed or repeated upload).
  const stored = await storedHashes(
    deps.db,
    valid.map((v) => v.prepared.input),
  );
  const fresh = valid.filter((v) => {
    const same = stored.get(mentionKey(v.prepared.input.source, v.prepared.input.externalId)) === v.prepared.contentHash;
    if (same) {
      counts.read!++;
      counts.already_ingested!++;
    }
    return !same;
  });
  // Partitions are cut in (source, externalId) order, so the plan does not depend on the order of the input.
  fresh.sort((a, b) => compareIdentity(a.prepared, b.prepared));
  const records: MatchRecord[] = fresh.map((v, i) => ({
    id: String(i),
    analysis: v.prepared.analysis,
    ...(v.prepared.input.country ? { country: v.prepared.input.country } : {}),
    identifiers: v.prepared.identifiers,
  }));
  const { model } = await currentModel(deps.db);
  // Token rarity over the register and the whole job, frozen for the partitions (register/matching/idf.ts).
  const registerDf = await documentFrequencies(
    deps.db,
    records.flatMap((r) => r.analysis.tokens),
  );
  const registerCount = await registerSize(deps.db);
  const jobBasis = basisOf(records.map((r) => r.analysis.tokens));
  const idf = idfFromCounts(registerDf, registerCount, jobBasis);
  const rarity = freezeRarity(registerDf, registerCount, jobBasis, heldTwice(records.map((r) => r.analysis.tokens)));
  const pairs = candidatePairs(records, { idf });
  const partitionSize = Number(job.params.partitionSize ?? PARTITION_DEFAULTS.partitionSize);
  // A job that fits one partition is resolved as one batch: the scores would decide nothing (partitionRecords puts
  // up to targetSize records in one partition, with no pair across), and scoring every pair was most of the planning
  // time (2,000 generated names: 2.1-2.4 s with it, 1.2 s without). The pairs are still kept (compareWith), so the
  // batch compares the same pairs as when they were scored.
  const single = records.length <= partitionSize && !options.scoreAlways;
  const scores = single ? null : scorePairs(records, pairs, model, idf);
  const left = pairs.left.subarray(0, pairs.count);
  const right = pairs.right.subarray(0, pairs.count);
  const cut = scores
    ? partitionRecords(records.length, left, right, scores, { linkAt: model.linkAt, targetSize: partitionSize })
    : onePartition(records.length);
  const partitions: PartitionItem[][] = Array.from({ length: cut.count }, () => []);
  const at = new Int32Array(fresh.length);
  fresh.forEach((v, i) => {
    const partition = partitions[cut.partitionOf[i]!]!;
    at[i] = partition.length;
    partition.push({ ...v.item, ...frozenCountsOf(v.prepared.analysis.tokens, rarity) });
  });
  for (let k = 0; k < pairs.count; k++) {
    const i = pairs.left[k]!;
    const j = pairs.right[k]!;
    if (cut.partitionOf[i] !== cut.partitionOf[j]) continue;
    const item = partitions[cut.partitionOf[i]!]![at[i]!]!;
    (item.compareWith ??= []).push(at[j]!);
  }
  const identityOf = (i: number): [string, string] => [fresh[i]!.prepared.input.source, fresh[i]!.prepared.input.externalId];
  const plan: IngestPlan = {
    partitions: cut.count,
    mentions: fresh.length,
    candidatePairs: pairs.count,
    scoredPairs: scores ? pairs.count : 0,
    linkingPairs: scores ? linkingCount(scores, model.linkAt) : null,
    crossPairs: cut.crossPairs.map((k) => [identityOf(pairs.left[k]!), identityOf(pairs.right[k]!), scores![k]!]),
    refusedJoins: cut.refusedJoins,
    rarityDocuments: rarity.documents,
    counts,
    rejected,
    planningMs: Math.round(performance.now() - started),
  };
  const earlier = await deps.db.transaction().execute(async (trx) => {
    // A run of this step delivered again while this one went on may have planned the job first: its plan stands.
    const current = await readJob(trx, jobId, { forUpdate: true });
    if (current?.plan) return Number(current.plan.partitions);
    await insertPartitions(trx, jobId, partitions);
    await updateJob(trx, jobId, { plan, progress: { stage: cut.count > 0 ? 'resolving' : 'finishing', partitions: cut.count, mentions: fresh.length } });
    await deleteChunks(trx, jobId);
    return undefined;
  });
  if (earlier !== undefined) return { partitions: earlier, alreadyPlanned: true };
  deps.log('info', { jobId, partitions: cut.count, mentions: fresh.length, crossPairs: plan.crossPairs.length, planningMs: plan.planningMs }, 'job planned');
  return { partitions: cut.count, alreadyPlanned: false };
}

interface Staged {
  counts: Record<string, number>;
  rejected: { line: number; reason: string }[];
  valid: { item: PartitionItem; prepared: PreparedMention }[];
}

/** The staged rows, checked: the rows refused (counted and listed), repeats counted, the others prepared. */
async function readStaged(deps: JobDeps, jobId: number): Promise<Staged> {
  const counts = emptyCounts() as Record<string, number>;
  const rejected: { line: number; reason: string }[] = [];
  const reject = (line: number, reason: string): void => {
    counts.read!++;
    counts.rejected!++;
    if (rejected.length < MAX_LISTED_REJECTS) rejected.push({ line, reason });
  };
  const seen = new Map<string, { line: number; hash: string }>();
  const valid: { item: PartitionItem; prepared: PreparedMention }[] = [];
  for await (const chunk of chunksOf(deps.db, jobId)) {
    for (const row of chunk as StagedRow[]) {
      if ('reason' in row) {
        reject(row.line, row.reason);
        continue;
      }
      let prepared: PreparedMention;
      try {
        prepared = prepareMention(row.mention);
      } catch (error) {
        if (!(error instanceof RegisterError)) throw error;
        reject(row.line, error.message);
        continue;
      }
      const identity = mentionKey(prepared.input.source, prepared.input.externalId);
      const earlier = seen.get(identity);
      if (earlier) {
        // As in `cpreg ingest`: an exact repeat is already ingested; other content under the same id is refused.
        if (earlier.hash === prepared.contentHash) {
          counts.read!++;
          counts.already_ingested!++;
        } else reject(row.line, `same external id as line ${earlier.line} with other content`);
        continue;
      }
      seen.set(identity, { line: row.line, hash: prepared.contentHash });
      valid.push({ item: { line: row.line, mention: row.mention }, prepared });
    }
  }
  return { counts, rejected, valid };
}

/** The model's score of every candidate pair. */
function scorePairs(records: readonly MatchRecord[], pairs: CandidatePairs, model: MatchModel, idf: IdfTable): Float64Array {
  const scores = new Float64Array(pairs.count);
  for (let k = 0; k < pairs.count; k++) scores[k] = scorePair(records[pairs.left[k]!]!, records[pairs.right[k]!]!, model, idf).score;
  return scores;
}

function linkingCount(scores: Float64Array, linkAt: number): number {
  let n = 0;
  for (const score of scores) if (score >= linkAt) n++;
  return n;
}

/** What partitionRecords answers for records that fit one partition: all in partition 0, no pair across. */
function onePartition(n: number): PartitionPlan {
  return { partitionOf: new Int32Array(n), count: n > 0 ? 1 : 0, crossPairs: [], refusedJoins: 0 };
}

/** Tokens that two or more mentions hold (so that may fall in two partitions). */
function heldTwice(names: readonly (readonly string[])[]): Set<string> {
  const once = new Set<string>();
  const twice = new Set<string>();
  for (const tokens of names) for (const token of new Set(tokens)) (once.has(token) ? twice : once).add(token);
  return twice;
}

function frozenCountsOf(tokens: readonly string[], rarity: FrozenRarity): Pick<PartitionItem, 'tokenCounts'> {
  const counts: Record<string, number> = {};
  let any = false;
  for (const token of tokens) {
    const df = rarity.frequencies[token];
    if (df === undefined) continue;
    counts[token] = df;
    any = true;
  }
  return any ? { tokenCounts: counts } : {};
}

function compareIdentity(a: PreparedMention, b: PreparedMention): number {
  const x = mentionKey(a.input.source, a.input.externalId);
  const y = mentionKey(b.input.source, b.input.externalId);
  return x < y ? -1 : x > y ? 1 : 0;
}
