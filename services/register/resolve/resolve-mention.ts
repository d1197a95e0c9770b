/**
 * Resolving one mention: a batch of one through the walk (walk.ts): check → read (the locks of its neighbourhood with
 * its stored mention, then its candidates) → decide → plan (its one outcome is final) → write → flush, in one
 * transaction with one history event.
 *
 * Idempotent: the same (source, externalId) with the same content answers the stored result and changes nothing;
 * with a different content the mention is updated, resolved again and the change recorded (`mention_changed`).
 */
import type { MentionInput } from '../../../resolvers/vocabulary.ts';
import type { ActorInput, RegisterContext } from '../context.ts';
import type { ChangeSet } from '../state/change-set.ts';
import { write } from '../transaction.ts';
import { walk, type ResolveWithinOptions } from '../walk.ts';
import { prepareMention, type PreparedMention } from './prepare.ts';
import type { ResolveResult } from './result.ts';

export { resultOf, type ResolveResult } from './result.ts';
export type { ResolveWithinOptions } from '../walk.ts';

/**
 * The whole resolution inside an open ChangeSet: the walk of one mention, its stages run in this ChangeSet, its rows
 * and its event written at one flush (after a flush of what the caller wrote before, so that its reads see it). Used by the
 * public resolveMention and by contracts, reresolve and review.
 */
export async function resolveWithin(
  ctx: RegisterContext,
  cs: ChangeSet,
  prepared: PreparedMention,
  who: ActorInput,
  options: ResolveWithinOptions = {},
): Promise<ResolveResult> {
  const [result] = await walk(ctx, [{ prepared }], who, { within: { ...options, cs, at: ctx.now() } });
  // A prepared mention is never rejected by the check stage (it is the only one of its walk).
  if (!result || result.status === 'rejected') throw new Error('a single resolve was rejected by its own check (a defect: please report it)');
  return result;
}

/** Resolves one mention (see the file header). */
export async function resolveMention(ctx: RegisterContext, input: MentionInput, who: ActorInput): Promise<ResolveResult> {
  const prepared = prepareMention(input);
  return write(ctx, (cs) => resolveWithin(ctx, cs, prepared, who));
}
