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
 *     counterparty; a lone mention whose best score was between the thresholds goes to review.
 *  4. Writes go cluster by cluster (one event per mention), in the order of each cluster's smallest
 *     (source, externalId), so even the new ids do not depend on the input order. Consecutive clusters share a
 *     transaction up to WRITE_CHUNK mentions (a retry runs the whole chunk again). A chunk reads in a few
 *     statements (its stored mentions, its counterparties and their names, locked in that order after the
 *     neighbourhood locks), draws the ids of its new rows at once, and writes through the ChangeSet's buffer:
 *     the rows and events of all its mentions in a few set-based statements (state/change-set.ts, flush).
 */
import { sql } from 'kysely';
import { candidatePairs, type MatchRecord } from '../../resolvers/block/index.ts';
import { clusterRecords, type ScoredEdge } from '../../resolvers/cluster/index.ts';
import { clusterRulesOf, scorePair } from '../../resolvers/score/index.ts';
import type { MentionInput } from '../../resolvers/vocabulary.ts';
import type { ActorInput, RegisterContext } from './context.ts';
import { RegisterError } from './errors.ts';
import { commitEvent } from './history/commit.ts';
import { currentModel } from './matching/model.ts';
import { basisOf, idfFor, type FrozenRarity } from './matching/idf.ts';
import { BatchReads } from './matching/batch-reads.ts';
import { askAgain, earlierDecisionOf } from './resolve/earlier-decision.ts';
import { jsonScore, MAX_CANDIDATES, scoredCandidates } from './matching/candidates.ts';
import { applyOutcome, canonicalNameIn, eventTypeFor } from './resolve/apply.ts';
import { decide, type ContractContext, type Outcome } from './resolve/decide.ts';
import { prepareMention, type PreparedMention } from './resolve/prepare.ts';
import { contractContextFor, lockNameNeighbourhoods, resultOf, type ResolveResult } from './resolve/resolve-mention.ts';
import { write } from './transaction.ts';
import { ChangeSet } from './state/change-set.ts';
import { canonicalRow, type StateTable } from './state/tables.ts';
import { lockActive, survivorFor } from './records.ts';
import { closeOpenItemsOfMention, detachMention } from './upkeep.ts';

export type BatchItemResult = ResolveResult | { status: 'rejected'; index: number; error: { code: string; message: string; field?: string } };

interface Pending {
  index: number;
  prepared: PreparedMention;
  key: string;
  outcome: Outcome;
  /** The read phase found the mention stored (with another content). */
  stored: boolean;
}

/** Mentions written per transaction (whole clusters; a cluster larger than this is one transaction alone). */
export const WRITE_CHUNK = 100;

function sortKey(p: PreparedMention): string {
  return `${p.input.source}\u0000${p.input.externalId}`;
}

/** Options of resolveBatch. */
export interface BatchOptions {
  /**
   * The pairs of the batch's mentions to compare, by (source, externalId) sort key (`${source}\u0000${externalId}`),
   * instead of the batch's own blocking: a partition of a job compares exactly the pairs its plan compared over the
   * whole job, so that a job cut into partitions clusters as the whole batch does. Default: the batch's blocking.
   */
  comparePairs?: readonly (readonly [string, string])[];
  /** A partition's token counts frozen by its job's plan (matching/idf.ts). Default: the register's and the batch's. */
  rarity?: FrozenRarity;
}

export async function resolveBatch(ctx: RegisterContext, inputs: MentionInput[], who: ActorInput, options: BatchOptions = {}): Promise<BatchItemResult[]> {
  const results: BatchItemResult[] = new Array(inputs.length);
  const pending: Pending[] = [];
  const seen = new Map<string, number>();
  const { model } = await currentModel(ctx.db);
  const checked: { index: number; prepared: PreparedMention; key: string }[] = [];
  for (const [index, input] of inputs.entries()) {
    let prepared: PreparedMention;
    try {
      prepared = prepareMention(input);
    } catch (error) {
      if (!(error instanceof RegisterError)) throw error;
      const e = error;
      results[index] = { status: 'rejected', index, error: { code: e.code ?? 'INVALID_INPUT', message: e.message, ...(e.details?.field ? { field: String(e.details.field) } : {}) } };
      continue;
    }
    const key = sortKey(prepared);
    if (seen.has(key)) {
      results[index] = { status: 'rejected', index, error: { code: 'INVALID_INPUT', message: `the batch holds (source, externalId) ${prepared.input.source}/${prepared.input.externalId} twice (items ${seen.get(key)} and ${index})` } };
      continue;
    }
    seen.set(key, index);
    checked.push({ index, prepared, key });
  }
  // The read-only phase reads in bulk: stored mentions in one statement, the candidates and token counts of every
  // mention in one statement each (matching/batch-reads.ts), each contract once.
  const stored = await storedMentions(ctx, checked.map((c) => c.prepared));
  const reads = new BatchReads(ctx.db);
  const toDecide = checked.filter((c) => stored.get(c.key)?.content_hash !== c.prepared.contentHash);
  reads.basis = basisOf(toDecide.map((c) => c.prepared.analysis.tokens), options.rarity);
  await reads.prefetch(toDecide.map((c) => c.prepared), MAX_CANDIDATES);
  const contracts = new Map<string, Promise<ContractContext | null>>();
  for (const { index, prepared, key } of checked) {
    const found = stored.get(key);
    if (found && found.content_hash === prepared.contentHash) {
      results[index] = await resultOf(ctx.db, canonicalRow('mention', found), { alreadyIngested: true, eventId: null });
      continue;
    }
    const ref = prepared.input.contract;
    let contract: ContractContext | null = null;
    if (ref) {
      const refKey = JSON.stringify([ref.source, ref.externalId]);
      if (!contracts.has(refKey)) contracts.set(refKey, ctx.db.transaction().execute((trx) => contractContextFor(new ChangeSet(trx, ctx.derived), ref)));
      contract = await contracts.get(refKey)!;
    }
    const outcome = await decide(ctx.db, prepared, model, {
      mentionId: found ? Number(found.id) : null,
      contract,
      party: null,
      contractAwaited: prepared.input.contract !== undefined && contract === null,
      reads,
    });
    pending.push({ index, prepared, key, outcome, stored: found !== undefined });
  }

  // Mentions whose outcome does not depend on the rest of the batch.
  const final = new Set(pending.filter((p) => !['linked', 'new', 'review'].includes(p.outcome.status) || p.outcome.evidence.via !== 'register' || p.outcome.evidence.override === 'decisive_identifier'));
  const matching = pending.filter((p) => !final.has(p));
  const groups = await clusterBatch(ctx, matching, model, reads, options.comparePairs);
  const plan: { members: Pending[]; counterpartyId: number | null }[] = [...final].map((p) => ({ members: [p], counterpartyId: null }));
  for (const g of groups) plan.push(g);
  plan.sort((a, b) => (a.members[0]!.key < b.members[0]!.key ? -1 : a.members[0]!.key > b.members[0]!.key ? 1 : 0));

  // Several clusters share one transaction (one commit, so one WAL flush, per chunk instead of per cluster);
  // each mention still records its own event, and a retried chunk re-reads everything it writes.
  for (let start = 0; start < plan.length; ) {
    const chunk: typeof plan = [];
    let size = 0;
    while (start < plan.length && (chunk.length === 0 || size + plan[start]!.members.length <= WRITE_CHUNK)) {
      size += plan[start]!.members.length;
      chunk.push(plan[start++]!);
    }
    let attempt = 0;
    const written = await write(ctx, async (cs) => {
      // The first attempt trusts the read phase about which mentions are not stored yet; if another request
      // stored one meanwhile, its INSERT fails on the unique key, and the retry re-reads all.
      const recheck = attempt++ > 0;
      // Every neighbourhood lock of the chunk in one statement, in one sorted order, before any row lock.
      await lockNameNeighbourhoods(cs, chunk.flatMap((g) => g.members.map((m) => m.prepared)));
      const members = chunk.flatMap((g) => g.members);
      const found = await mentionIdsIn(cs, members.filter((m) => recheck || m.stored).map((m) => m.prepared));
      const plans = chunk.map((group) => planGroup(group, final.has(group.members[0]!), model.linkAt));
      // Every counterparty the chunk writes, in one sorted statement (then the survivors of merged ones), and
      // the names of those it links to; then the ids of the rows it adds, drawn in one statement.
      const linkTargets = plans.flatMap((p) => p.filter((o) => o.status === 'linked' && o.counterpartyId !== undefined).map((o) => o.counterpartyId!));
      const targets = plans.flatMap((p) => p.filter((o) => (o.status === 'linked' || o.status === 'review') && o.counterpartyId !== undefined).map((o) => o.counterpartyId!));
      await cs.lock('counterparty', [...targets, ...[...found.values()].flatMap((f) => (f.counterpartyId === null ? [] : [f.counterpartyId]))]);
      await lockActive(cs, targets);
      await cs.loadNames(linkTargets.map((id) => survivorFor(cs, id)));
      const outcomes = plans.flat();
      cs.reserveIds(
        await reserveIds(cs, {
          counterparty: outcomes.filter((o) => o.status === 'new').length,
          mention: members.filter((m) => !found.has(m.key)).length,
          review_item: outcomes.filter((o) => o.status === 'review').length,
        }),
      );
      cs.startBuffering();
      const contracts = new Map<string, Promise<ContractContext | null>>();
      const out: ResolveResult[][] = [];
      for (const [g, group] of chunk.entries()) out.push(await writeGroup(ctx, cs, group, plans[g]!, who, found, contracts, model.linkAt));
      await cs.stopBuffering();
      // Events written from the buffer got their ids at the flush.
      return out.map((results) => results.map((r) => (r.eventId === null ? r : { ...r, eventId: cs.realId(r.eventId) })));
    });
    chunk.forEach((group, g) => {
      for (const [i, member] of group.members.entries()) results[member.index] = written[g]![i]!;
    });
  }
  return results;
}

/** The stored mentions of a batch by (source, externalId) sort key, in one statement. */
async function storedMentions(ctx: RegisterContext, prepared: PreparedMention[]): Promise<Map<string, Record<string, unknown> & { id: unknown; content_hash: string }>> {
  const out = new Map<string, Record<string, unknown> & { id: unknown; content_hash: string }>();
  if (prepared.length === 0) return out;
  const result = await sql<Record<string, unknown> & { id: unknown; source: string; external_id: string; content_hash: string }>`
    SELECT m.* FROM mention m
    JOIN unnest(${sql.val(prepared.map((p) => p.input.source))}::text[], ${sql.val(prepared.map((p) => p.input.externalId))}::text[]) AS k(source, external_id)
      ON m.source = k.source AND m.external_id = k.external_id`.execute(ctx.db);
  for (const row of result.rows) out.set(`${row.source}\u0000${row.external_id}`, row);
  return out;
}

async function clusterBatch(
  ctx: RegisterContext,
  matching: Pending[],
  model: Awaited<ReturnType<typeof currentModel>>['model'],
  reads: BatchReads,
  comparePairs: BatchOptions['comparePairs'],
): Promise<{ members: Pending[]; counterpartyId: number | null }[]> {
  if (matching.length === 0) return [];
  const byKey = [...matching].sort((a, b) => (a.key < b.key ? -1 : 1));
  const records: MatchRecord[] = byKey.map((p) => ({
    id: `m:${p.key}`,
    analysis: p.prepared.analysis,
    ...(p.prepared.input.country ? { country: p.prepared.input.country } : {}),
    identifiers: p.prepared.identifiers,
  }));
  const idf = await idfFor(ctx.db, records.flatMap((r) => r.analysis.tokens), reads);
  const edges: ScoredEdge[] = [];
  const cannot: [string, string][] = [];
  const cps = new Set<string>();
  for (const p of byKey) {
    const candidates = await scoredCandidates(ctx.db, { analysis: p.prepared.analysis, country: p.prepared.input.country ?? null, identifiers: p.prepared.identifiers }, model, new Set(), reads);
    for (const c of candidates) {
      const cpNode = `cp:${c.counterpartyId}`;
      cps.add(cpNode);
      if (c.score === -Infinity) cannot.push([`m:${p.key}`, cpNode]);
      else edges.push({ a: `m:${p.key}`, b: cpNode, score: c.score });
    }
  }
  const pairs = comparePairs ? pairsByKey(byKey, comparePairs) : candidatePairs(records, { idf });
  for (let i = 0; i < pairs.count; i++) {
    const a = records[pairs.left[i]!]!;
    const b = records[pairs.right[i]!]!;
    const s = scorePair(a, b, model, idf);
    if (s.score === -Infinity) cannot.push([a.id, b.id]);
    else edges.push({ a: a.id, b: b.id, score: s.score });
  }
  const cpList = [...cps].sort();
  // Register counterparties never join each other: a cannot-link between every two of them. Only two that one
  // chain of linking edges (score ≥ linkAt) connects can ever meet in a merge, so the cannot-links are given
  // within each such component only (the clusters are the same; all pairs would grow with the square of the
  // counterparties in the batch).
  const root = new Map<string, string>();
  const find = (node: string): string => {
    let r = node;
    while (root.has(r) && root.get(r) !== r) r = root.get(r)!;
    let at = node;
    while (at !== r) {
      const next = root.get(at)!;
      root.set(at, r);
      at = next;
    }
    return r;
  };
  for (const e of edges) {
    if (!(e.score >= model.linkAt)) continue;
    const ra = find(e.a);
    const rb = find(e.b);
    if (ra !== rb) root.set(ra < rb ? rb : ra, ra < rb ? ra : rb);
  }
  const byComponent = new Map<string, string[]>();
  for (const cp of cpList) {
    const r = find(cp);
    if (!byComponent.has(r)) byComponent.set(r, []);
    byComponent.get(r)!.push(cp);
  }
  for (const group of byComponent.values()) for (let i = 0; i < group.length; i++) for (let j = i + 1; j < group.length; j++) cannot.push([group[i]!, group[j]!]);
  const ids = [...records.map((r) => r.id), ...cpList];
  const clusters = clusterRecords(ids, edges, cannot, clusterRulesOf(model));
  const byNode = new Map(byKey.map((p) => [`m:${p.key}`, p]));
  const out: { members: Pending[]; counterpartyId: number | null }[] = [];
  for (const cluster of clusters) {
    const members = cluster.filter((n) => n.startsWith('m:')).map((n) => byNode.get(n)!).sort((a, b) => (a.key < b.key ? -1 : 1));
    if (members.length === 0) continue;
    const cp = cluster.find((n) => n.startsWith('cp:'));
    out.push({ members, counterpartyId: cp ? Number(cp.slice(3)) : null });
  }
  return out;
}

/** The given pairs of sort keys as index pairs into `byKey` (pairs naming a mention not in it are left out). */
function pairsByKey(byKey: readonly Pending[], keys: readonly (readonly [string, string])[]): { left: Int32Array; right: Int32Array; count: number } {
  const index = new Map(byKey.map((p, i) => [p.key, i]));
  const left: number[] = [];
  const right: number[] = [];
  for (const [a, b] of keys) {
    const i = index.get(a);
    const j = index.get(b);
    if (i === undefined || j === undefined || i === j) continue;
    left.push(i);
    right.push(j);
  }
  return { left: Int32Array.from(left), right: Int32Array.from(right), count: left.length };
}

/** Ids of stored mentions (with their counterparty) by sort key, in one statement. */
async function mentionIdsIn(cs: ChangeSet, prepared: PreparedMention[]): Promise<Map<string, { id: number; counterpartyId: number | null }>> {
  const out = new Map<string, { id: number; counterpartyId: number | null }>();
  if (prepared.length === 0) return out;
  const result = await sql<{ id: unknown; source: string; external_id: string; counterparty_id: unknown }>`
    SELECT m.id, m.source, m.external_id, m.counterparty_id FROM mention m
    JOIN unnest(${sql.val(prepared.map((p) => p.input.source))}::text[], ${sql.val(prepared.map((p) => p.input.externalId))}::text[]) AS k(source, external_id)
      ON m.source = k.source AND m.external_id = k.external_id`.execute(cs.trx);
  for (const row of result.rows) out.set(`${row.source}\u0000${row.external_id}`, { id: Number(row.id), counterpartyId: row.counterparty_id === null ? null : Number(row.counterparty_id) });
  return out;
}

/** Ids for the rows a chunk adds, per table, in ascending order, drawn in one statement. */
async function reserveIds(cs: ChangeSet, counts: Partial<Record<StateTable, number>>): Promise<Map<StateTable, number[]>> {
  const tables = (Object.keys(counts) as StateTable[]).filter((t) => counts[t]! > 0);
  const out = new Map<StateTable, number[]>(tables.map((t) => [t, []]));
  if (tables.length === 0) return out;
  const drawn = await sql<{ t: StateTable; id: unknown }>`
    SELECT t, nextval(pg_get_serial_sequence(t, 'id')) AS id
    FROM unnest(${sql.val(tables)}::text[], ${sql.val(tables.map((t) => counts[t]!))}::int[]) AS k(t, n), generate_series(1, k.n)`.execute(cs.trx);
  for (const row of drawn.rows) out.get(row.t)!.push(Number(row.id));
  for (const ids of out.values()) ids.sort((a, b) => a - b);
  return out;
}

/**
 * The outcome written for each member of a cluster: the cluster's counterparty, one new counterparty for the
 * cluster (written by its first member, the others link to it), or a lone mention's review. `counterpartyId`
 * is unset for a link to the counterparty the cluster creates.
 */
function planGroup(group: { members: Pending[]; counterpartyId: number | null }, fixed: boolean, linkAt: number): Outcome[] {
  const target = group.counterpartyId;
  return group.members.map((member, i) => {
    const outcome = member.outcome;
    if (fixed) return outcome;
    const lone = group.members.length === 1 && target === null;
    if (target !== null) return clusteredWith(outcome, target, linkAt);
    if (lone && outcome.status === 'review') return outcome; // nothing in the batch or the register is close enough to decide
    if (i === 0) {
      return { ...outcome, status: 'new', counterpartyId: undefined, recordName: true, evidence: { ...outcome.evidence, summary: group.members.length > 1 ? `a new counterparty for ${group.members.length} mentions of this batch clustered together` : outcome.evidence.summary, via: 'batch' } };
    }
    // Linked to the counterparty the first member creates (writeGroup fills it in with clusteredWith).
    return { ...outcome, status: 'linked', counterpartyId: undefined };
  });
}

function clusteredWith(outcome: Outcome, target: number, linkAt: number): Outcome {
  return { ...outcome, status: 'linked', counterpartyId: target, recordName: true, evidence: { ...outcome.evidence, summary: `clustered with counterparty ${target} in a batch (linkAt ${linkAt})`, via: 'batch' } };
}

async function writeGroup(
  ctx: RegisterContext,
  cs: ChangeSet,
  group: { members: Pending[]; counterpartyId: number | null },
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
    const found = stored.get(member.key);
    // A stored mention or one with identifiers reads rows it may write (its old links, identifier holders):
    // the buffer is written first and the mention is written at once.
    const direct = found !== undefined || member.prepared.identifiers.length > 0;
    if (direct) await cs.stopBuffering();
    let previous;
    if (found) {
      if (found.counterpartyId !== null) await cs.lock('counterparty', [found.counterpartyId]);
      previous = await cs.require('mention', found.id);
      // Stored with another content (the read phase left same-content mentions out): a person's decision on it
      // turns the new text into a question for a person (resolve/earlier-decision.ts).
      const earlier = earlierDecisionOf(previous, true);
      if (earlier) outcome = askAgain(outcome, earlier);
      await detachMention(cs, previous, at);
      await closeOpenItemsOfMention(cs, previous.id as number);
    }
    const ref = member.prepared.input.contract;
    let contract: ContractContext | null = null;
    if (ref) {
      const refKey = JSON.stringify([ref.source, ref.externalId]);
      if (!contracts.has(refKey)) contracts.set(refKey, contractContextFor(cs, ref));
      contract = await contracts.get(refKey)!;
    }
    const applied = await applyOutcome(cs, member.prepared, outcome, found ? await cs.require('mention', found.id) : undefined, { contractId: contract?.contractId ?? null, at });
    if (applied.createdCounterparty) created = applied.counterpartyId;
    const eventId = await commitEvent(cs, {
      type: eventTypeFor(previous, applied, previous !== undefined),
      actor: who.actor,
      at,
      reason: who.reason,
      requestId: who.requestId,
      details: { entity: 'mention', mentionId: applied.mention.id, status: outcome.status, counterpartyId: applied.counterpartyId, batch: true, score: outcome.score === null ? null : jsonScore(outcome.score) },
    });
    out.push(
      await resultOf(cs.trx, applied.mention, {
        alreadyIngested: false,
        eventId,
        reviewItemId: applied.reviewItemId,
        canonicalName: canonicalNameIn(cs, (applied.mention.counterparty_id as number | null) ?? null),
      }),
    );
    if (direct) cs.startBuffering();
  }
  return out;
}
