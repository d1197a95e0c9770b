/**
 * The plan of a batch's writes: the mentions whose outcome is final go alone, the others by the clusters of the
 * cluster stage (batch-cluster.ts), all in the order of each group's smallest (source, externalId); and the outcome
 * each member of a group is written with.
 */
import type { RegisterContext } from './context.ts';
import type { Outcome } from './resolve/decide.ts';
import { clusterBatch, type Group, type Pending } from './batch-cluster.ts';
import type { WalkOptions } from './walk.ts';
import type { WalkReads } from './batch-decide.ts';
import { timed } from './stage-times.ts';
import { askAcrossGroups } from './batch-review.ts';
import { jsonScore } from './matching/candidates.ts';

/**
 * Stages 4 and 5, cluster and plan: the groups to write, in order, and the mentions whose outcome does not depend on
 * the rest of the batch. A single resolve's one outcome is final: nothing to cluster it with.
 */
export async function planBatch(
  ctx: RegisterContext,
  pending: Pending[],
  read: WalkReads,
  options: WalkOptions,
): Promise<{ plan: Group[]; final: Set<Pending> }> {
  const stages = options.stages;
  const { model, reads } = read;
  // Mentions whose outcome does not depend on the rest of the batch.
  const final = new Set(
    options.within
      ? pending
      : pending.filter(
          (p) =>
            !['linked', 'new', 'review'].includes(p.outcome.status) ||
            p.outcome.evidence.via !== 'register' ||
            p.outcome.evidence.override === 'decisive_identifier',
        ),
  );
  const matching = pending.filter((p) => !final.has(p));
  const { groups, reviewPairs } = await timed(stages, 'cluster', () => clusterBatch(ctx, matching, model, reads, options.comparePairs));
  const plan: Group[] = [...final].map((p) => ({ members: [p], counterpartyId: null }));
  for (const g of groups) plan.push(g);
  plan.sort((a, b) => (a.members[0]!.key < b.members[0]!.key ? -1 : a.members[0]!.key > b.members[0]!.key ? 1 : 0));
  askAcrossGroups(plan, reviewPairs, final);
  return { plan, final };
}

/**
 * The outcome written for each member of a cluster: the cluster's counterparty, one new counterparty for the
 * cluster (written by its first member, the others link to it), or a lone mention's review. `counterpartyId`
 * is unset for a link to the counterparty the cluster creates.
 */
export function planGroup(group: Group, fixed: boolean, linkAt: number): Outcome[] {
  const target = group.counterpartyId;
  return group.members.map((member, i) => {
    const outcome = member.outcome;
    if (fixed) return outcome;
    const lone = group.members.length === 1 && target === null;
    if (target !== null) return clusteredWith(outcome, target, linkAt);
    if (group.reviewAgainst) return reviewInBatch(outcome, group.reviewAgainst);
    if (lone && outcome.status === 'review') return outcome; // nothing in the batch or the register is close enough to decide
    if (i === 0) {
      return {
        ...outcome,
        status: 'new',
        counterpartyId: undefined,
        recordName: true,
        evidence: {
          ...outcome.evidence,
          summary:
            group.members.length > 1 ? `a new counterparty for ${group.members.length} mentions of this batch clustered together` : outcome.evidence.summary,
          via: 'batch',
        },
      };
    }
    // Linked to the counterparty the first member creates (writeGroup fills it in with clusteredWith).
    return { ...outcome, status: 'linked', counterpartyId: undefined };
  });
}

export function clusteredWith(outcome: Outcome, target: number, linkAt: number): Outcome {
  return {
    ...outcome,
    status: 'linked',
    counterpartyId: target,
    recordName: true,
    evidence: { ...outcome.evidence, summary: `clustered with counterparty ${target} in a batch (linkAt ${linkAt})`, via: 'batch' },
  };
}

/** A lone mention asking a person about a mention of an earlier group (batch-review.ts); its counterparty is filled in at the write. */
function reviewInBatch(outcome: Outcome, against: NonNullable<Group['reviewAgainst']>): Outcome {
  const { pair, otherText } = against;
  return {
    ...outcome,
    status: 'review',
    counterpartyId: undefined,
    score: jsonScore(pair.score),
    recordName: false,
    evidence: {
      ...outcome.evidence,
      summary: `close to "${otherText}", a mention of this batch (scored ${jsonScore(pair.score)}): one company or two, a person decides`,
      via: 'batch',
      matchedName: otherText,
      features: pair.explanation,
      identifierNotes: pair.identifierNotes,
      heldBackBy: pair.heldBackBy,
      distinguishingTokens: pair.distinguishingTokens,
    },
  };
}
