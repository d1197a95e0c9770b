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
 *     transaction up to WRITE_CHUNK mentions (a retry runs the whole chunk again).
 */
import { sql } from 'kysely';
import { candidatePairs, type MatchRecord } from '../../resolvers/block/index.ts';
import { clusterRecords, type ScoredEdge } from '../../resolvers/cluster/index.ts';
import { scorePair } from '../../resolvers/score/index.ts';
import type { MentionInput } from '../../resolvers/vocabulary.ts';
import type { ActorInput, RegisterContext } from './context.ts';
import { RegisterError } from './errors.ts';
import { commitEvent } from './history/commit.ts';
import { currentModel } from './matching/model.ts';
import { idfFor } from './matching/idf.ts';
import { BatchReads } from './matching/batch-reads.ts';
import { jsonScore, MAX_CANDIDATES, scoredCandidates } from './matching/candidates.ts';
import { applyOutcome, canonicalNameIn, eventTypeFor } from './resolve/apply.ts';
import { decide, type ContractContext, type Outcome } from './resolve/decide.ts';
import { prepareMention, type PreparedMention } from './resolve/prepare.ts';
import { contractContextFor, lockNameNeighbourhoods, resultOf, type ResolveResult } from './resolve/resolve-mention.ts';
import { write } from './transaction.ts';
import { ChangeSet } from './state/change-set.ts';
import { canonicalRow } from './state/tables.ts';
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

export async function resolveBatch(ctx: RegisterContext, inputs: MentionInput[], who: ActorInput): Promise<BatchItemResult[]> {
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
  const groups = await clusterBatch(ctx, matching, model, reads);
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
      // The first attempt trusts the read phase about which mentions are not stored yet (one SELECT less each);
      // if another request stored one meanwhile, its INSERT fails on the unique key, and the retry re-reads all.
      const recheck = attempt++ > 0;
      // Every neighbourhood lock of the chunk in one statement, in one sorted order, before any row lock.
      await lockNameNeighbourhoods(cs, chunk.flatMap((g) => g.members.map((m) => m.prepared)));
      const out: ResolveResult[][] = [];
      for (const group of chunk) out.push(await writeGroup(ctx, cs, group, who, final.has(group.members[0]!), model.linkAt, recheck));
      return out;
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
  const pairs = candidatePairs(records, { idf });
  for (let i = 0; i < pairs.count; i++) {
    const a = records[pairs.left[i]!]!;
    const b = records[pairs.right[i]!]!;
    const s = scorePair(a, b, model, idf);
    if (s.score === -Infinity) cannot.push([a.id, b.id]);
    else edges.push({ a: a.id, b: b.id, score: s.score });
  }
  const cpList = [...cps].sort();
  for (let i = 0; i < cpList.length; i++) for (let j = i + 1; j < cpList.length; j++) cannot.push([cpList[i]!, cpList[j]!]);
  const ids = [...records.map((r) => r.id), ...cpList];
  const clusters = clusterRecords(ids, edges, cannot, { linkAt: model.linkAt });
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

async function writeGroup(
  ctx: RegisterContext,
  cs: ChangeSet,
  group: { members: Pending[]; counterpartyId: number | null },
  who: ActorInput,
  fixed: boolean,
  linkAt: number,
  recheck: boolean,
): Promise<ResolveResult[]> {
  const at = ctx.now();
  const out: ResolveResult[] = [];
  let target = group.counterpartyId;
  for (const [i, member] of group.members.entries()) {
    let outcome = member.outcome;
    if (!fixed) {
      const lone = group.members.length === 1 && target === null;
      if (target !== null) {
        outcome = { ...outcome, status: 'linked', counterpartyId: target, recordName: true, evidence: { ...outcome.evidence, summary: `clustered with counterparty ${target} in a batch (linkAt ${linkAt})`, via: 'batch' } };
      } else if (lone && outcome.status === 'review') {
        // keep review: nothing in the batch or the register is close enough to decide
      } else if (i === 0) {
        outcome = { ...outcome, status: 'new', counterpartyId: undefined, recordName: true, evidence: { ...outcome.evidence, summary: group.members.length > 1 ? `a new counterparty for ${group.members.length} mentions of this batch clustered together` : outcome.evidence.summary, via: 'batch' } };
      }
    }
    const found = !recheck && !member.stored ? undefined : await cs.trx.selectFrom('mention').select(['id', 'counterparty_id']).where('source', '=', member.prepared.input.source).where('external_id', '=', member.prepared.input.externalId).executeTakeFirst();
    let previous;
    if (found) {
      if (found.counterparty_id !== null) await cs.lock('counterparty', [Number(found.counterparty_id)]);
      previous = await cs.require('mention', Number(found.id));
      await detachMention(cs, previous, at);
      await closeOpenItemsOfMention(cs, previous.id as number);
    }
    const contract = await contractContextFor(cs, member.prepared.input.contract);
    const applied = await applyOutcome(cs, member.prepared, outcome, found ? await cs.require('mention', Number(found.id)) : undefined, { contractId: contract?.contractId ?? null, at });
    if (applied.createdCounterparty) target = applied.counterpartyId;
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
  }
  return out;
}
