/**
 * Review inside a batch. Two mentions of one batch that a person should judge against each other (their pair's
 * decision is review: "Kestrel Tooling GmbH" / "Kestrel Tooling AG") land in different clusters, since review is no
 * link; each alone would then become a new counterparty, and the question would never reach a person. Sent one at a
 * time, the later one would have gone to review against the counterparty the earlier one created. So here: a lone
 * mention that would be new and whose batch pair with a mention of an earlier group (in write order) is a review
 * pair goes to review against that group's counterparty; the best such pair is taken (highest score, then the
 * earliest group). A group that goes to review creates no counterparty, so a later mention cannot ask against it.
 */
import type { Group, Pending, ReviewPair } from './batch-cluster.ts';

/** Marks each lone would-be-new group of `plan` (in write order) that a person should judge against an earlier one. */
export function askAcrossGroups(plan: readonly Group[], reviewPairs: readonly ReviewPair[], final: ReadonlySet<Pending>): void {
  if (reviewPairs.length === 0) return;
  const groupOf = new Map<Pending, number>();
  plan.forEach((group, g) => {
    for (const member of group.members) groupOf.set(member, g);
  });
  const pairsOf = new Map<Pending, ReviewPair[]>();
  for (const pair of reviewPairs) {
    for (const member of [pair.a, pair.b]) {
      if (!pairsOf.has(member)) pairsOf.set(member, []);
      pairsOf.get(member)!.push(pair);
    }
  }
  const ownsCounterparty = plan.map((group) => holdsCounterparty(group, final));
  plan.forEach((group, g) => {
    const member = group.members[0]!;
    if (group.members.length !== 1 || group.counterpartyId !== null || final.has(member) || member.outcome.status !== 'new') return;
    let best: { pair: ReviewPair; other: Pending; at: number } | null = null;
    for (const pair of pairsOf.get(member) ?? []) {
      const other = pair.a === member ? pair.b : pair.a;
      const at = groupOf.get(other);
      if (at === undefined || at >= g || !ownsCounterparty[at]) continue;
      if (!best || pair.pair.score > best.pair.pair.score || (pair.pair.score === best.pair.pair.score && at < best.at)) best = { pair, other, at };
    }
    if (!best) return;
    group.reviewAgainst = { group: plan[best.at]!, pair: best.pair.pair, otherText: best.other.prepared.text };
    ownsCounterparty[g] = false;
  });
}

/** Whether writing this group leaves a counterparty its mentions link to (joined or created). */
function holdsCounterparty(group: Group, final: ReadonlySet<Pending>): boolean {
  if (group.counterpartyId !== null) return true;
  const first = group.members[0]!;
  if (final.has(first)) return first.outcome.status === 'linked' || first.outcome.status === 'new';
  // Not final and not joined: a lone mention decided review stays review; anything else creates a counterparty.
  return !(group.members.length === 1 && first.outcome.status === 'review');
}
