/**
 * Batch resolution: many mentions at once, clustered together with the register, so that the outcome does not
 * depend on the order of the input.
 *
 *  1. Each mention is checked and decided on its own against the register as it stands (read-only). Outcomes
 *     that are not about matching (own_entity, not_a_party, unbound_term, collective_term, a link through a
 *     defined term or a decisive identifier) are final.
 *  2. The rest form a graph: mention–counterparty edges (the register candidates' scores) and mention–mention
 *     edges (pairs inside the batch that share a blocking key, scored by the same model). Register counterparties
 *     never join each other here (a cannot-link between every two of them: merging is a person's or the sweep's
 *     business). resolvers/cluster clusters the graph, best edge first, with ties broken by ids, so the clusters
 *     are the same for any input order.
 *  3. A cluster with one counterparty links all its mentions to it; a cluster without one becomes one new
 *     counterparty; a lone mention whose best score was between the thresholds goes to review, and so does a lone
 *     mention that would be new but that a person should judge against a mention of an earlier cluster, against
 *     that cluster's counterparty (batch-review.ts), as it would have been sent one at a time.
 *  4. Writes go cluster by cluster (one event per mention), in the order of each cluster's smallest
 *     (source, externalId), so even the new ids do not depend on the input order. Consecutive clusters share a
 *     transaction up to WRITE_CHUNK mentions (a retry runs the whole chunk again). A chunk reads in a few
 *     statements (its stored mentions, its counterparties and their names, locked in that order after the
 *     neighbourhood locks), draws the ids of its new rows at once, and writes through the ChangeSet's buffer:
 *     the rows and events of all its mentions in a few set-based statements (state/change-set.ts, flush).
 */
import type { MentionInput } from '../../resolvers/vocabulary.ts';
import type { ActorInput, RegisterContext } from './context.ts';
import { currentModel } from './matching/model.ts';
import type { FrozenRarity } from './matching/idf.ts';
import { checkInputs, type BatchItemResult } from './batch-check.ts';
import { readAndDecide } from './batch-decide.ts';
import { planBatch } from './batch-plan.ts';
import { writePlan } from './batch-write.ts';
import { timed, type StageTimes } from './stage-times.ts';

export type { BatchItemResult } from './batch-check.ts';
export { WRITE_CHUNK } from './batch-write.ts';

/** Options of resolveBatch. */
export interface BatchOptions {
  /**
   * The pairs of the batch's mentions to compare, by (source, externalId) sort key (mentionKey, resolvers/vocabulary.ts),
   * instead of the batch's own blocking: a partition of a job compares exactly the pairs its plan compared over the
   * whole job, so that a job cut into partitions clusters as the whole batch does. Default: the batch's blocking.
   */
  comparePairs?: readonly (readonly [string, string])[];
  /** A partition's token counts frozen by its job's plan (matching/idf.ts). Default: the register's and the batch's. */
  rarity?: FrozenRarity;
  /** Filled with the milliseconds each stage took (stage-times.ts), when given. */
  stages?: StageTimes;
}

/** The stages in order: check (batch-check.ts), read and decide (batch-decide.ts), cluster and plan (batch-plan.ts), write (batch-write.ts). */
export async function resolveBatch(ctx: RegisterContext, inputs: MentionInput[], who: ActorInput, options: BatchOptions = {}): Promise<BatchItemResult[]> {
  const results: BatchItemResult[] = new Array(inputs.length);
  const stages = options.stages;
  const { model } = await currentModel(ctx.db);
  const checked = await timed(stages, 'check', async () => checkInputs(inputs, results));
  const { pending, reads } = await readAndDecide(ctx, checked, results, model, options);
  const { plan, final } = await planBatch(ctx, pending, model, reads, options);
  await writePlan(ctx, plan, final, model, who, results, stages);
  return results;
}
