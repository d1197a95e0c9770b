/**
 * Batch resolution: many mentions at once, clustered together with the register, so that the outcome does not
 * depend on the order of the input. A batch runs the walk (walk.ts), the path a single resolve runs too:
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
 *     transaction up to WRITE_CHUNK mentions (a retry runs the whole chunk again). A chunk takes its neighbourhood
 *     locks, reads its stored mentions, locks its counterparties and their names while drawing the ids of its new
 *     rows (one statement), and writes through the ChangeSet's buffer: the rows and events of all its mentions in a
 *     few set-based statements (state/change-set.ts, flush).
 */
import type { MentionInput } from '../../resolvers/vocabulary.ts';
import type { ActorInput, RegisterContext } from './context.ts';
import type { BatchItemResult } from './batch-check.ts';
import { walk, type BatchOptions } from './walk.ts';

export type { BatchItemResult } from './batch-check.ts';
export type { BatchOptions } from './walk.ts';
export { WRITE_CHUNK } from './batch-write.ts';

/** The walk over many mentions (walk.ts: check, read, decide, cluster, plan, write, flush). */
export async function resolveBatch(ctx: RegisterContext, inputs: MentionInput[], who: ActorInput, options: BatchOptions = {}): Promise<BatchItemResult[]> {
  return walk(ctx, inputs, who, options);
}
