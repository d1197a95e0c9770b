/**
 * The final pass of an ingest job. Partitions were resolved apart, so two mentions of one entity that fell in
 * different partitions (a linking pair across partitions, job.plan.crossPairs) may each have made a new
 * counterparty. Their counterparties are clustered by those pairs (resolvers/cluster, best pair first, the
 * model's linkAt) and each cluster is merged, as the whole batch resolved at once would have made one
 * counterparty: only counterparties created since the job was submitted are merged away, two counterparties
 * that existed before are never joined (that is a person's or the sweep's business), and a merge the register
 * refuses (a cannot-link, conflicting identifiers) is listed in the result, not forced. Then the counts of the
 * planner and of every partition are added up and must reconcile.
 */
import { clusterRecords, type ScoredEdge } from '../../resolvers/cluster/index.ts';
import { clusterRulesOf } from '../../resolvers/score/index.ts';
import { counterpartyStates } from '../../db/queries/counterparties.ts';
import { finishIngestRun } from '../../db/queries/ingest-runs.ts';
import { partitionResults, updateJob, type JobRow } from '../../db/queries/jobs.ts';
import { mentionsByRef } from '../../db/queries/mentions-by-ref.ts';
import { emptyCounts, unaccounted, type IngestCounts } from '../ingest/ingest-counts.ts';
import { RegisterError } from '../register/errors.ts';
import { mergeCounterparties } from '../register/merge-counterparties.ts';
import { currentModel } from '../register/matching/model.ts';
import { MAX_LISTED_REJECTS, type JobDeps } from './deps.ts';
import { readyToFinish } from './finish-guard.ts';
import type { CrossPair, IngestPlan } from './plan-ingest.ts';
import type { PartitionResult } from './run-ingest-partition.ts';
import { mentionKey } from '../../resolvers/vocabulary.ts';

export interface CrossMerge {
  survivorId: number;
  mergedIds: number[];
  eventId?: number;
  refused?: string;
}

export async function finishIngest(deps: JobDeps, jobId: number): Promise<void> {
  const job = await readyToFinish(deps, jobId);
  if (!job) return;
  const plan = job.plan as unknown as IngestPlan;
  await updateJob(deps.db, jobId, { progress: { ...job.progress, stage: 'finishing' } });
  const merges = await mergeAcrossPartitions(deps, job, plan.crossPairs);
  const counts = emptyCounts();
  const rejected = [...plan.rejected];
  const add = (more: Record<string, number>): void => {
    for (const [key, value] of Object.entries(more)) counts[key] = (counts[key] ?? 0) + value;
  };
  add(plan.counts);
  const parts = await partitionResults(deps.db, jobId);
  let slowestMs = 0;
  let retried = 0;
  for (const { result } of parts) {
    const r = result as unknown as PartitionResult;
    add(r.counts);
    for (const item of r.rejected) if (rejected.length < MAX_LISTED_REJECTS) rejected.push(item);
    slowestMs = Math.max(slowestMs, r.elapsedMs);
    if (r.attempt > 1) retried++;
  }
  rejected.sort((a, b) => a.line - b.line);
  const gap = unaccounted(counts as IngestCounts);
  const ingestRunId = Number(job.params.ingestRunId);
  await finishIngestRun(deps.db, ingestRunId, { status: gap === 0 ? 'finished' : 'failed', counts, error: gap === 0 ? null : `${gap} rows unaccounted` });
  const result = {
    ingestRunId,
    counts,
    rejected,
    partitions: plan.partitions,
    retriedPartitions: retried,
    crossPairs: plan.crossPairs.length,
    merges,
    planningMs: plan.planningMs,
    slowestPartitionMs: slowestMs,
  };
  if (gap !== 0) {
    await updateJob(deps.db, jobId, { status: 'failed', result, error: `${gap} rows read but not accounted for (a defect: please report it)` });
    return;
  }
  await updateJob(deps.db, jobId, { status: 'finished', result, progress: { ...job.progress, stage: 'finished' } });
  deps.log('info', { jobId, partitions: plan.partitions, merges: merges.length }, 'job finished');
}

async function mergeAcrossPartitions(deps: JobDeps, job: JobRow, crossPairs: readonly CrossPair[]): Promise<CrossMerge[]> {
  if (crossPairs.length === 0) return [];
  const refs = crossPairs.flatMap(([a, b]) => [a, b].map(([source, externalId]) => ({ source, externalId })));
  const cpOf = new Map(
    (await mentionsByRef(deps.db, refs)).flatMap((m) =>
      m.counterparty_id === null ? [] : [[mentionKey(m.source, m.external_id), Number(m.counterparty_id)] as const],
    ),
  );
  const best = new Map<string, ScoredEdge>();
  for (const [a, b, score] of crossPairs) {
    const x = cpOf.get(mentionKey(a[0], a[1]));
    const y = cpOf.get(mentionKey(b[0], b[1]));
    if (x === undefined || y === undefined || x === y) continue;
    const [lo, hi] = x < y ? [x, y] : [y, x];
    const key = `${lo}:${hi}`;
    if ((best.get(key)?.score ?? -Infinity) < score) best.set(key, { a: `cp:${lo}`, b: `cp:${hi}`, score });
  }
  if (best.size === 0) return [];
  const ids = [...new Set([...best.values()].flatMap((e) => [Number(e.a.slice(3)), Number(e.b.slice(3))]))].sort((x, y) => x - y);
  const rows = await counterpartyStates(deps.db, ids);
  const createdByJob = new Set(rows.filter((r) => r.status === 'active' && r.createdAt >= job.createdAt).map((r) => r.id));
  const older = ids.filter((id) => !createdByJob.has(id));
  const cannot: [string, string][] = [];
  for (let i = 0; i < older.length; i++) for (let j = i + 1; j < older.length; j++) cannot.push([`cp:${older[i]}`, `cp:${older[j]}`]);
  const { model } = await currentModel(deps.db);
  const clusters = clusterRecords(
    ids.map((id) => `cp:${id}`),
    [...best.values()],
    cannot,
    clusterRulesOf(model),
  );
  const out: CrossMerge[] = [];
  for (const cluster of clusters) {
    if (cluster.length < 2) continue;
    const members = cluster.map((n) => Number(n.slice(3))).sort((x, y) => x - y);
    const survivorId = members.find((id) => !createdByJob.has(id)) ?? members[0]!;
    const mergedIds = members.filter((id) => id !== survivorId);
    try {
      const merged = await mergeCounterparties(
        deps.ctx,
        { ids: members, survivorId, reason: `job ${job.id}: one entity's mentions were resolved in different partitions` },
        { actor: job.actor },
      );
      out.push({ survivorId, mergedIds: merged.mergedIds, eventId: merged.eventId });
    } catch (error) {
      if (!(error instanceof RegisterError)) throw error;
      out.push({ survivorId, mergedIds, refused: error.message });
    }
  }
  return out;
}
