/**
 * One partition of an ingest job: its mentions go through the register's batch resolution together (so the
 * clusters inside the partition are found as the whole batch would find them), then the partition is marked done
 * with its counts. Running a partition again (a retry after its worker died) is harmless: mentions it had already
 * written are stored with the same content and count as already ingested, the rest are resolved against the
 * register as it now stands.
 */
import { finishPartition, readJob, readPartition, startPartition } from '../../db/queries/jobs.ts';
import { emptyCounts } from '../ingest/ingest-counts.ts';
import { storedHashes } from '../ingest/stored-hashes.ts';
import { resolveBatch, type BatchOptions } from '../register/batch.ts';
import { prepareMention } from '../register/resolve/prepare.ts';
import { MAX_LISTED_REJECTS, type JobDeps } from './deps.ts';
import { queueFinishWhenAllDone } from './finish-guard.ts';
import type { IngestPlan, PartitionItem } from './plan-ingest.ts';
import { mentionKey } from '../../resolvers/vocabulary.ts';

export interface PartitionResult {
  counts: Record<string, number>;
  rejected: { line: number; reason: string }[];
  elapsedMs: number;
  attempt: number;
  worker: string;
  /** The partition's mentions as (source, externalId): which partition a name fell in, for reports and audits. */
  members: [string, string][];
}

/** The plan's pairs of this partition by (source, externalId) key, or no option when the plan did not keep them. */
function plannedPairs(items: readonly PartitionItem[]): BatchOptions {
  if (!items.some((i) => i.compareWith !== undefined)) return {};
  const key = (i: PartitionItem): string => mentionKey(i.mention.source, i.mention.externalId);
  const comparePairs: [string, string][] = [];
  for (const item of items) for (const j of item.compareWith ?? []) comparePairs.push([key(item), key(items[j]!)]);
  return { comparePairs };
}

/**
 * The token counts the plan froze for this partition (register/matching/idf.ts): N over the register and the whole
 * job, and the counts of the partition's tokens that the job holds at least twice. Plans made before they were kept
 * leave the partition to count the register and itself.
 */
function frozenRarity(plan: Record<string, unknown> | null, items: readonly PartitionItem[]): BatchOptions {
  const documents = (plan as Partial<IngestPlan> | null)?.rarityDocuments;
  if (documents === undefined) return {};
  const frequencies: Record<string, number> = {};
  for (const item of items) Object.assign(frequencies, item.tokenCounts);
  return { rarity: { documents, frequencies } };
}

export async function runIngestPartition(deps: JobDeps, jobId: number, partitionNo: number): Promise<void> {
  const job = await readJob(deps.db, jobId);
  const part = await readPartition(deps.db, jobId, partitionNo);
  if (!job || !part) throw new Error(`job ${jobId} has no partition ${partitionNo}`);
  if (part.status !== 'done') {
    const started = performance.now();
    await startPartition(deps.db, jobId, partitionNo, deps.worker);
    const items = part.items as PartitionItem[];
    const counts = emptyCounts() as Record<string, number>;
    const rejected: { line: number; reason: string }[] = [];
    const stored = await storedHashes(
      deps.db,
      items.map((i) => i.mention),
    );
    const fresh = items.filter((i) => {
      const hash = stored.get(mentionKey(i.mention.source, i.mention.externalId));
      if (hash !== undefined && prepareMention(i.mention).contentHash === hash) {
        counts.read!++;
        counts.already_ingested!++;
        return false;
      }
      return true;
    });
    const results =
      fresh.length === 0
        ? []
        : await resolveBatch(
            deps.ctx,
            fresh.map((i) => i.mention),
            { actor: job.actor, reason: `job ${jobId} partition ${partitionNo}` },
            { ...plannedPairs(items), ...frozenRarity(job.plan, items) },
          );
    results.forEach((result, i) => {
      counts.read!++;
      if (result.status === 'rejected') {
        counts.rejected!++;
        if (rejected.length < MAX_LISTED_REJECTS) rejected.push({ line: fresh[i]!.line, reason: 'error' in result ? result.error.message : 'rejected' });
      } else if (result.alreadyIngested) counts.already_ingested!++;
      else counts[result.status] = (counts[result.status] ?? 0) + 1;
    });
    const result: PartitionResult = {
      counts,
      rejected,
      elapsedMs: Math.round(performance.now() - started),
      attempt: part.attempts + 1,
      worker: deps.worker,
      members: items.map((i) => [i.mention.source, i.mention.externalId]),
    };
    await deps.db.transaction().execute(async (trx) => {
      await readJob(trx, jobId, { forUpdate: true });
      await finishPartition(trx, jobId, partitionNo, result);
    });
    deps.log('info', { jobId, partition: partitionNo, mentions: items.length, elapsedMs: result.elapsedMs }, 'partition done');
  }
  await queueFinishWhenAllDone(deps, jobId);
}
