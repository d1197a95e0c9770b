/**
 * Stages 6 and 7 of the walk (walk.ts), write and flush: the planned groups written chunk by chunk, one event per
 * mention. A batch writes each chunk in a transaction of its own; a single resolve writes its one chunk in the
 * ChangeSet it runs in. A chunk locks (a batch's neighbourhood locks here, a single resolve's were taken with its
 * reads), reads the stored mentions a batch rewrites, locks the counterparties it writes with their names while
 * drawing the ids of its new rows (one statement), writes each mention (resolve/write-mention.ts) into the
 * ChangeSet's buffer and flushes it (state/change-set.ts).
 */
import type { MatchModel } from '../../resolvers/score/index.ts';
import { mentionKey } from '../../resolvers/vocabulary.ts';
import { mentionsByRef, type StoredMentionRow } from '../../db/queries/mentions-by-ref.ts';
import type { ActorInput, RegisterContext } from './context.ts';
import { jsonScore } from './matching/candidates.ts';
import type { Outcome } from './resolve/decide.ts';
import { prefetchChunk } from './chunk-prefetch.ts';
import { lockNameNeighbourhoods } from './resolve/neighbourhood.ts';
import type { ResolveResult } from './resolve/result.ts';
import { writeMention, type MentionWrite } from './resolve/write-mention.ts';
import { write } from './transaction.ts';
import type { ChangeSet } from './state/change-set.ts';
import { lockActive, survivorFor } from './lock-active.ts';
import type { Group, Pending } from './batch-cluster.ts';
import type { BatchItemResult } from './batch-check.ts';
import { clusteredWith, planGroup } from './batch-plan.ts';
import { timed } from './stage-times.ts';
import type { WalkOptions, Within } from './walk.ts';

/** Mentions written per transaction (whole clusters; a cluster larger than this is one transaction alone). */
export const WRITE_CHUNK = 100;

/** A stored mention as the write takes it: its id, and the counterparty and confirmation it had when read. */
export type StoredRef = { id: number; counterpartyId: number | null; confirmed: boolean };

/** Writes the plan and puts each member's result in `results`. */
export async function writePlan(
  ctx: RegisterContext,
  plan: Group[],
  final: Set<Pending>,
  model: MatchModel,
  who: ActorInput,
  results: BatchItemResult[],
  options: WalkOptions,
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
    const run = (cs: ChangeSet) => {
      pending.clear();
      // The first attempt trusts the read phase about which mentions are not stored yet; if another request
      // stored one meanwhile, its INSERT fails on the unique key, and the retry re-reads all.
      return writeChunk(ctx, cs, chunk, { final, linkAt: model.linkAt, who, counterpartyOf, pending, recheck: attempt++ > 0, options });
    };
    const within = options.within;
    const written = await timed(options.stages, 'write', () => (within ? run(within.cs) : write(ctx, run)));
    // Kept only once the chunk has committed (a retried chunk starts again from the groups before it).
    for (const [group, id] of pending) counterpartyOf.set(group, id);
    chunk.forEach((group, g) => {
      for (const [i, member] of group.members.entries()) results[member.index] = written[g]![i]!;
    });
  }
}

interface ChunkContext {
  final: Set<Pending>;
  linkAt: number;
  who: ActorInput;
  /** Counterparties of the groups written by earlier chunks, and those of this chunk as it is written. */
  counterpartyOf: ReadonlyMap<Group, number>;
  pending: Map<Group, number>;
  recheck: boolean;
  options: WalkOptions;
}

/** One chunk of groups written in one ChangeSet: locks, ids, each mention, the flush (see the file header). */
async function writeChunk(ctx: RegisterContext, cs: ChangeSet, chunk: Group[], c: ChunkContext): Promise<ResolveResult[][]> {
  const within = c.options.within;
  const members = chunk.flatMap((g) => g.members);
  // A batch's neighbourhood locks: every one of the chunk in one statement, in one sorted order, before any row lock.
  if (!within)
    await lockNameNeighbourhoods(
      cs,
      members.map((m) => m.prepared),
    );
  const found = within
    ? knownStored(members)
    : storedRefs(
        await mentionsByRef(
          cs.trx,
          members.filter((m) => c.recheck || m.stored).map((m) => m.prepared.input),
        ),
      );
  const plans = chunk.map((group) => withReviewTarget(group, planGroup(group, c.final.has(group.members[0]!), c.linkAt), c.counterpartyOf));
  const outcomes = plans.flat();
  // Every counterparty the chunk writes and those its stored mentions leave, locked in one sorted statement with
  // the names of those it links to and the ids of the rows it adds (then the survivors of merged ones, if any).
  const linkTargets = outcomes.filter((o) => o.status === 'linked' && o.counterpartyId !== undefined).map((o) => o.counterpartyId!);
  const targets = outcomes.filter((o) => (o.status === 'linked' || o.status === 'review') && o.counterpartyId !== undefined).map((o) => o.counterpartyId!);
  const left = [...found.values()].flatMap((f) => (f.counterpartyId === null ? [] : [f.counterpartyId]));
  // A person's earlier decision may still turn a changed text into a review (resolve/earlier-decision.ts).
  const asked = members.filter((m, i) => {
    const f = found.get(m.key);
    return outcomes[i]!.status === 'review' || (f !== undefined && textChangedOf(m, f) && f.confirmed && f.counterpartyId !== null);
  }).length;
  await cs.reserveAndLock(
    {
      counterparty: outcomes.filter((o) => o.status === 'new').length,
      mention: members.filter((m) => !found.has(m.key)).length,
      review_item: asked,
      explanation: members.length,
      // A single resolve draws its names' ids here, as an upper bound (a name already there is one more sighting: an
      // id left over is a harmless gap, as a rollback leaves); a batch's are drawn at its flush, where their number is known.
      ...(within ? { counterparty_name: namesUpperBound(members, outcomes) } : {}),
    },
    { counterparties: [...targets, ...left], namesOf: linkTargets },
  );
  await lockActive(cs, targets);
  await cs.loadNames(linkTargets.map((id) => survivorFor(cs, id)));
  const contractIds = await prefetchChunk(cs, chunk, plans, found);
  const out: ResolveResult[][] = [];
  for (const [g, group] of chunk.entries()) {
    const planned = requireReviewTargets(withReviewTarget(group, plans[g]!, c.pending));
    const results = await writeGroup(ctx, cs, group, planned, { ...c, found, contractIds });
    const joined = results.find((r) => r.status === 'linked' || r.status === 'new')?.counterpartyId;
    if (joined !== undefined && joined !== null) c.pending.set(group, joined);
    out.push(results);
  }
  await timed(c.options.stages, 'flush', () => cs.flush());
  // Events written from the buffer got their ids at the flush, and so did a single resolve's new counterparty
  // (ChangeSet.reserveAndLock).
  for (const [group, id] of c.pending) c.pending.set(group, cs.realId(id));
  return out.map((results) =>
    results.map((r) => ({
      ...r,
      eventId: r.eventId === null ? null : cs.realId(r.eventId),
      counterpartyId: r.counterpartyId === null ? null : cs.realId(r.counterpartyId),
    })),
  );
}

/** A batch's stored mentions (with their counterparty) by sort key, as read at its write. */
function storedRefs(rows: StoredMentionRow[]): Map<string, StoredRef> {
  return new Map(
    rows.map((row) => [
      mentionKey(row.source, row.external_id),
      { id: Number(row.id), counterpartyId: row.counterparty_id === null ? null : Number(row.counterparty_id), confirmed: row.confirmed_by !== null },
    ]),
  );
}

/** A single resolve's stored mention, read with its locks in the ChangeSet it writes in. */
function knownStored(members: Pending[]): Map<string, StoredRef> {
  return new Map(members.flatMap((m) => (m.known?.stored ? [[m.key, m.known.stored] as const] : [])));
}

/** Whether the source sent another text for a stored mention (a batch's read phase left same-content mentions out). */
function textChangedOf(member: Pending, found: StoredRef | null): boolean {
  return member.known ? member.known.textChanged : found !== null;
}

/** The most names a chunk's links and new counterparties add: its name, its aliases, the names its contract declares. */
function namesUpperBound(members: Pending[], outcomes: Outcome[]): number {
  return members.reduce((n, m, i) => {
    const o = outcomes[i]!;
    return o.status === 'linked' || o.status === 'new' ? n + 1 + (o.declaredNames?.length ?? 0) + m.prepared.analysis.aliases.length : n;
  }, 0);
}

async function writeGroup(
  ctx: RegisterContext,
  cs: ChangeSet,
  group: Group,
  planned: Outcome[],
  c: ChunkContext & { found: Map<string, StoredRef>; contractIds: Map<string, number> },
): Promise<ResolveResult[]> {
  const within = c.options.within;
  const at = within?.at ?? ctx.now();
  const out: ResolveResult[] = [];
  let created: number | null = null;
  for (const [i, member] of group.members.entries()) {
    let outcome = planned[i]!;
    if (outcome.status === 'linked' && outcome.counterpartyId === undefined) outcome = clusteredWith(member.outcome, created!, c.linkAt);
    const found = c.found.get(member.key) ?? null;
    const textChanged = textChangedOf(member, found);
    const result = await writeMention(
      cs,
      {
        prepared: member.prepared,
        outcome,
        stored: found,
        textChanged,
        contractId: member.known ? member.known.contractId : contractIdOf(member, c.contractIds),
        ...(within?.beforeCommit ? { beforeCommit: within.beforeCommit } : {}),
        details: within ? singleDetails(within, textChanged) : batchDetails,
      },
      c.who,
      at,
    );
    if (result.counterpartyId !== null && result.status === 'new') created = result.counterpartyId;
    out.push(result);
  }
  return out;
}

/** The active contract a batch's mention names, as the chunk read it in its transaction (null: none, or withdrawn). */
function contractIdOf(member: Pending, contractIds: ReadonlyMap<string, number>): number | null {
  const ref = member.prepared.input.contract;
  return ref ? (contractIds.get(JSON.stringify([ref.source, ref.externalId])) ?? null) : null;
}

/** The details of a batch's event. */
const batchDetails: MentionWrite['details'] = (_applied, _previous, written) => ({
  batch: true,
  score: written.score === null ? null : jsonScore(written.score),
});

/** The details of a single resolve's event: what it created, what the mention was, why it was resolved again. */
function singleDetails(within: Within, textChanged: boolean): MentionWrite['details'] {
  return (applied, previous) => ({
    ...(applied.createdCounterparty ? { createdCounterpartyId: applied.counterpartyId } : {}),
    ...(previous ? { previousStatus: previous.status, previousCounterpartyId: previous.counterparty_id, previousText: previous.text } : {}),
    ...(within.cause ? { cause: within.cause } : textChanged ? { cause: 'text_changed' } : {}),
  });
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
