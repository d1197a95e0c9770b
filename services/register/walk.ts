/**
 * The walk: the one path of every resolution, a batch of many mentions and a single resolve alike (a single resolve
 * is a batch of one). The stages in order, each a function of its inputs:
 *
 *  1. check   (batch-check.ts)    inputs → prepared mentions, or a rejection in place
 *  2. read    (batch-decide.ts)   prepared → the stored mentions, the model, the candidates and token counts
 *  3. decide  (batch-decide.ts)   one prepared mention + the reads → an outcome (or its stored result)
 *  4. cluster (batch-plan.ts → batch-cluster.ts)  the outcomes that depend on the rest of the batch → groups
 *  5. plan    (batch-plan.ts)     the groups in order, and the outcome written for each member
 *  6. write   (batch-write.ts)    per chunk: locks, ids, each mention written (resolve/write-mention.ts)
 *  7. flush   (state/change-set.ts)  the chunk's rows and events in one statement
 *
 * Where it runs is its scope. A batch reads the register as it stands (read-only, outside any transaction), so
 * that it can cluster the whole batch, and writes each chunk in a transaction of its own (transaction.ts `write`).
 * A single resolve runs every stage inside the ChangeSet it is given (`within`: resolveMention's own transaction,
 * or a contract's, a reresolve's, a review's), its reads after its neighbourhood locks, so that it sees what a
 * concurrent resolve of a look-alike name committed; its one outcome is final (nothing to cluster it with).
 */
import type { MentionInput } from '../../resolvers/vocabulary.ts';
import type { ActorInput, RegisterContext } from './context.ts';
import type { FrozenRarity } from './matching/idf.ts';
import type { PartyContext } from './resolve/decide.ts';
import type { PreparedMention } from './resolve/prepare.ts';
import type { ChangeSet } from './state/change-set.ts';
import { checkInputs, type BatchItemResult } from './batch-check.ts';
import { readMentions, decideMentions } from './batch-decide.ts';
import { planBatch } from './batch-plan.ts';
import { writePlan } from './batch-write.ts';
import { timed, type StageTimes } from './stage-times.ts';

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

/** Options of a single resolve inside a caller's transaction (resolve/resolve-mention.ts resolveWithin). */
export interface ResolveWithinOptions {
  party?: PartyContext;
  /** Why the mention is resolved again (kept in the event's details). */
  cause?: 'text_changed' | 'contract_arrived' | 'reresolve' | 'contract_changed';
  /** Resolve again even when the content is unchanged (contract arrived, reresolve); the stored hash is kept. */
  force?: boolean;
  /** Runs after the outcome is written and before the event is committed (its ops join the same event). */
  beforeCommit?: (mentionId: number) => Promise<void>;
  /** Counterparties the decision leaves out of the candidates (reresolve: the one a mention created). */
  exclude?: readonly number[];
}

/** A single resolve's scope: the ChangeSet it runs in and the instant of its event. */
export interface Within extends ResolveWithinOptions {
  cs: ChangeSet;
  at: Date;
}

export interface WalkOptions extends BatchOptions {
  /** Run every stage inside this ChangeSet (a single resolve); without it, the walk is a batch's. */
  within?: Within;
}

/** An input of the walk: a mention as sent, checked by stage 1, or one its caller prepared (resolve/prepare.ts). */
export type WalkInput = MentionInput | { prepared: PreparedMention };

/** The walk (see the file header): one result per input, in the order of the inputs. */
export async function walk(ctx: RegisterContext, inputs: readonly WalkInput[], who: ActorInput, options: WalkOptions = {}): Promise<BatchItemResult[]> {
  const results: BatchItemResult[] = new Array(inputs.length);
  const stages = options.stages;
  const checked = await timed(stages, 'check', async () => checkInputs(inputs, results));
  const read = await timed(stages, 'read', () => readMentions(ctx, checked, options));
  const pending = await timed(stages, 'decide', () => decideMentions(ctx, checked, read, results, options));
  const { plan, final } = await planBatch(ctx, pending, read, options);
  await writePlan(ctx, plan, final, read.model, who, results, options);
  return results;
}
