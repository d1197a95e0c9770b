/**
 * A sweep as a partitioned job. Each counterparty is looked up in the whole register on its own (the sweep files
 * a pair from its lower id, under row locks, and skips pairs already filed), so any cut of the ids is exact: the
 * planner cuts the active counterparties into id ranges, each partition sweeps its range against the whole
 * register, and the final pass adds up the summaries. No pair crosses partitions in the sense of the ingest plan.
 */
import { allActiveIds } from '../../db/queries/counterparties.ts';
import { finishPartition, insertPartitions, partitionResults, readJob, readPartition, startPartition, updateJob } from '../../db/queries/jobs.ts';
import { sweep, type SweepSummary } from '../register/sweep.ts';
import { PARTITION_DEFAULTS, type JobDeps } from './deps.ts';
import { queueFinishWhenAllDone, readyToFinish } from './finish-guard.ts';

interface SweepRange {
  afterId: number;
  throughId: number;
}

export async function planSweep(deps: JobDeps, jobId: number): Promise<{ partitions: number; alreadyPlanned: boolean }> {
  const job = await readJob(deps.db, jobId);
  if (!job) throw new Error(`job ${jobId} does not exist`);
  if (job.plan) return { partitions: Number(job.plan.partitions), alreadyPlanned: true };
  const size = Number(job.params.partitionSize ?? PARTITION_DEFAULTS.sweepPartitionSize);
  const ids = await allActiveIds(deps.db);
  const ranges: SweepRange[][] = [];
  for (let start = 0; start < ids.length; start += size) {
    const slice = ids.slice(start, start + size);
    ranges.push([{ afterId: start === 0 ? 0 : ids[start - 1]!, throughId: start + size >= ids.length ? Number.MAX_SAFE_INTEGER : slice[slice.length - 1]! }]);
  }
  await deps.db.transaction().execute(async (trx) => {
    await insertPartitions(trx, jobId, ranges);
    await updateJob(trx, jobId, {
      status: 'running',
      plan: { partitions: ranges.length, counterparties: ids.length },
      progress: { stage: 'resolving', partitions: ranges.length, counterparties: ids.length },
    });
  });
  return { partitions: ranges.length, alreadyPlanned: false };
}

export async function runSweepPartition(deps: JobDeps, jobId: number, partitionNo: number): Promise<void> {
  const job = await readJob(deps.db, jobId);
  const part = await readPartition(deps.db, jobId, partitionNo);
  if (!job || !part) throw new Error(`job ${jobId} has no partition ${partitionNo}`);
  if (part.status !== 'done') {
    await startPartition(deps.db, jobId, partitionNo, deps.worker);
    const [range] = part.items as SweepRange[];
    const started = performance.now();
    const summary = await sweep(
      deps.ctx,
      { actor: job.actor, reason: `duplicate sweep, job ${jobId}` },
      { afterId: range!.afterId, throughId: range!.throughId },
    );
    const { itemIds, ...counts } = summary;
    await deps.db.transaction().execute(async (trx) => {
      await readJob(trx, jobId, { forUpdate: true });
      await finishPartition(trx, jobId, partitionNo, {
        ...counts,
        items: itemIds.length,
        elapsedMs: Math.round(performance.now() - started),
        attempt: part.attempts + 1,
        worker: deps.worker,
      });
    });
  }
  await queueFinishWhenAllDone(deps, jobId);
}

export async function finishSweep(deps: JobDeps, jobId: number): Promise<void> {
  const job = await readyToFinish(deps, jobId);
  if (!job) return;
  const total: Omit<SweepSummary, 'itemIds'> = { scanned: 0, duplicateItems: 0, affiliateItems: 0, skippedCannotLink: 0, skippedExisting: 0 };
  for (const { result } of await partitionResults(deps.db, jobId)) {
    for (const key of Object.keys(total) as (keyof typeof total)[]) total[key] += Number(result[key] ?? 0);
  }
  await updateJob(deps.db, jobId, {
    status: 'finished',
    result: { ...total, partitions: Number(job.plan?.partitions ?? 0) },
    progress: { ...job.progress, stage: 'finished' },
  });
}
