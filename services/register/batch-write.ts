/**
 * The write stage of a batch: the planned groups written chunk by chunk, one transaction per chunk, one event per
 * mention. A chunk reads in a few statements (its stored mentions, its counterparties and their names, locked in
 * that order after the neighbourhood locks), draws the ids of its new rows at once, and writes through the
 * ChangeSet's buffer (state/change-set.ts, flush).
 */
import type { MatchModel } from '../../resolvers/score/index.ts';
import { mentionKey } from '../../resolvers/vocabulary.ts';
import { mentionsByRef, type StoredMentionRow } from '../../db/queries/mentions-by-ref.ts';
import type { ActorInput, RegisterContext } from './context.ts';
import { jsonScore } from './matching/candidates.ts';
import type { ContractContext, Outcome } from './resolve/decide.ts';
import { contractContextFor, lockNameNeighbourhoods, type ResolveResult } from './resolve/resolve-mention.ts';
import { writeMention } from './resolve/write-mention.ts';
import { write } from './transaction.ts';
import type { ChangeSet } from './state/change-set.ts';
import { lockActive, survivorFor } from './records.ts';
import type { Group, Pending } from './batch-cluster.ts';
import type { BatchItemResult } from './batch-check.ts';
import { clusteredWith, planGroup } from './batch-plan.ts';
import { timed, type StageTimes } from './stage-times.ts';

/** Mentions written per transaction (whole clusters; a cluster larger than this is one transaction alone). */
export const WRITE_CHUNK = 100;

/** Writes the plan and puts each member's result in `results`. */
export async function writePlan(
  ctx: RegisterContext,
  plan: Group[],
  final: Set<Pending>,
  model: MatchModel,
  who: ActorInput,
  results: BatchItemResult[],
  stages: StageTimes | undefined,
): Promise<void> {
  // Several clusters share one transaction (one commit, so one WAL flush, per chunk instead of per cluster);
  // each mention still records its own event, and a retried chunk re-reads everything it writes.
  // The counterparty each written group joined or created, for the in-batch reviews of later groups (batch-review.ts).
  const counterpartyOf = new Map<Group, number>();
  for (let start = 0; start < plan.length;) {
    const chunk: typeof plan = [];
    let size = 0;
    while (start < plan.length && (chunk.length === 0 || size + plan[start]!.members.length <= WRITE_CHUNK)) {
      size += plan[start]!.members.length;
      chunk.push(plan[start++]!);
    }
    let attempt = 0;
    const pending = new Map<Group, number>();
    const written = await timed(stages, 'write', () =>
      write(ctx, async (cs) => {
        // The first attempt trusts the read phase about which mentions are not stored yet; if another request
        // stored one meanwhile, its INSERT fails on the unique key, and the retry re-reads all.
        const recheck = attempt++ > 0;
        // Every neighbourhood lock of the chunk in one statement, in one sorted order, before any row lock.
        await lockNameNeighbourhoods(
          cs,
          chunk.flatMap((g) => g.members.map((m) => m.prepared)),
        );
        const members = chunk.flatMap((g) => g.members);
        const found = storedIds(
          await mentionsByRef(
            cs.trx,
            members.filter((m) => recheck || m.stored).map((m) => m.prepared.input),
          ),
        );
        const plans = chunk.map((group) => withReviewTarget(group, planGroup(group, final.has(group.members[0]!), model.linkAt), counterpartyOf));
        // Every counterparty the chunk writes, in one sorted statement (then the survivors of merged ones), and
        // the names of those it links to; then the ids of the rows it adds, drawn in one statement.
        const linkTargets = plans.flatMap((p) => p.filter((o) => o.status === 'linked' && o.counterpartyId !== undefined).map((o) => o.counterpartyId!));
        const targets = plans.flatMap((p) =>
          p.filter((o) => (o.status === 'linked' || o.status === 'review') && o.counterpartyId !== undefined).map((o) => o.counterpartyId!),
        );
        await cs.lock('counterparty', [...targets, ...[...found.values()].flatMap((f) => (f.counterpartyId === null ? [] : [f.counterpartyId]))]);
        await lockActive(cs, targets);
        await cs.loadNames(linkTargets.map((id) => survivorFor(cs, id)));
        const outcomes = plans.flat();
        await cs.reserveIds({
          counterparty: outcomes.filter((o) => o.status === 'new').length,
          mention: members.filter((m) => !found.has(m.key)).length,
          review_item: outcomes.filter((o) => o.status === 'review').length,
          explanation: members.length,
        });
        const contracts = new Map<string, Promise<ContractContext | null>>();
        const out: ResolveResult[][] = [];
        pending.clear();
        for (const [g, group] of chunk.entries()) {
          const planned = requireReviewTargets(withReviewTarget(group, plans[g]!, pending));
          const results = await writeGroup(ctx, cs, group, planned, who, found, contracts, model.linkAt);
          const joined = results.find((r) => r.status === 'linked' || r.status === 'new')?.counterpartyId;
          if (joined !== undefined && joined !== null) pending.set(group, joined);
          out.push(results);
        }
        await timed(stages, 'flush', () => cs.flush());
        // Events written from the buffer got their ids at the flush.
        return out.map((results) => results.map((r) => (r.eventId === null ? r : { ...r, eventId: cs.realId(r.eventId) })));
      }),
    );
    // Kept only once the chunk has committed (a retried chunk starts again from the groups before it).
    for (const [group, id] of pending) counterpartyOf.set(group, id);
    chunk.forEach((group, g) => {
      for (const [i, member] of group.members.entries()) results[member.index] = written[g]![i]!;
    });
  }
}

/** Ids of stored mentions (with their counterparty) by sort key. */
function storedIds(rows: StoredMentionRow[]): Map<string, { id: number; counterpartyId: number | null }> {
  return new Map(
    rows.map((row) => [
      mentionKey(row.source, row.external_id),
      { id: Number(row.id), counterpartyId: row.counterparty_id === null ? null : Number(row.counterparty_id) },
    ]),
  );
}

async function writeGroup(
  ctx: RegisterContext,
  cs: ChangeSet,
  group: Group,
  planned: Outcome[],
  who: ActorInput,
  stored: Map<string, { id: number; counterpartyId: number | null }>,
  contracts: Map<string, Promise<ContractContext | null>>,
  linkAt: number,
): Promise<ResolveResult[]> {
  const at = ctx.now();
  const out: ResolveResult[] = [];
  let created: number | null = null;
  for (const [i, member] of group.members.entries()) {
    let outcome = planned[i]!;
    if (outcome.status === 'linked' && outcome.counterpartyId === undefined) outcome = clusteredWith(member.outcome, created!, linkAt);
    const ref = member.prepared.input.contract;
    let contract: ContractContext | null = null;
    if (ref) {
      const refKey = JSON.stringify([ref.source, ref.externalId]);
      if (!contracts.has(refKey)) contracts.set(refKey, contractContextFor(cs, ref));
      contract = await contracts.get(refKey)!;
    }
    const found = stored.get(member.key) ?? null;
    const result = await writeMention(
      cs,
      {
        prepared: member.prepared,
        outcome,
        stored: found,
        // Stored with another content: the read phase left same-content mentions out.
        textChanged: found !== null,
        contractId: contract?.contractId ?? null,
        details: (_applied, _previous, written) => ({ batch: true, score: written.score === null ? null : jsonScore(written.score) }),
      },
      who,
      at,
    );
    if (result.counterpartyId !== null && result.status === 'new') created = result.counterpartyId;
    out.push(result);
  }
  return out;
}

/**
 * A group asking about an earlier group's counterparty (batch-review.ts) gets that counterparty once it is known:
 * from an earlier chunk before the chunk's locks, from this chunk as its groups are written.
 */
function withReviewTarget(group: Group, planned: Outcome[], known: ReadonlyMap<Group, number>): Outcome[] {
  const against = group.reviewAgainst?.group;
  const target = against ? known.get(against) : undefined;
  if (target === undefined) return planned;
  return planned.map((o) => (o.status === 'review' && o.counterpartyId === undefined ? { ...o, counterpartyId: target } : o));
}

/** A review asked within the batch must have found its counterparty by the time it is written (a defect otherwise). */
function requireReviewTargets(planned: Outcome[]): Outcome[] {
  if (planned.some((o) => o.status === 'review' && o.counterpartyId === undefined)) {
    throw new Error('a review within the batch has no counterparty to ask about (a defect: please report it)');
  }
  return planned;
}
