/**
 * The cluster stage of a batch: the mentions whose outcome depends on the rest of the batch, with their register
 * candidates, become a graph (mention–counterparty edges from the candidates' scores, mention–mention edges from
 * pairs inside the batch that share a blocking key) clustered by resolvers/cluster, best edge first, ties broken
 * by ids, so that the clusters are the same for any input order.
 */
import { candidatePairs, type MatchRecord } from '../../resolvers/block/index.ts';
import { clusterRecords, UnionFind, type ScoredEdge } from '../../resolvers/cluster/index.ts';
import { clusterRulesOf, scorePair, type MatchModel, type PairScore } from '../../resolvers/score/index.ts';
import type { RegisterContext } from './context.ts';
import { idfFor } from './matching/idf.ts';
import type { BatchReads } from './matching/batch-reads.ts';
import { scoredCandidates } from './matching/candidates.ts';
import type { Outcome } from './resolve/decide.ts';
import type { StoredRef } from './batch-write.ts';
import type { PreparedMention } from './resolve/prepare.ts';

/** A mention of a batch after the decide stage. */
export interface Pending {
  index: number;
  prepared: PreparedMention;
  /** mentionKey(source, externalId) (resolvers/vocabulary.ts): the batch's order and identity of a mention. */
  key: string;
  outcome: Outcome;
  /** The read phase found the mention stored (with another content). */
  stored: boolean;
  /**
   * What a single resolve knows before its write, having read its stored mention in the transaction it writes in
   * (walk.ts `within`): whether the source sent another text, and the contract it writes. A batch finds both at
   * its write.
   */
  known?: { textChanged: boolean; contractId: number | null; stored: StoredRef | null };
}

/** Mentions written together: those of one cluster, with the register counterparty it joined (if any). */
export interface Group {
  members: Pending[];
  counterpartyId: number | null;
  /** A lone mention that would be new but is close to a mention of an earlier group: it asks a person (batch-review.ts). */
  reviewAgainst?: { group: Group; pair: PairScore; otherText: string };
}

/** A pair of the batch's mentions that a person should judge (decision review), with its score. */
export interface ReviewPair {
  a: Pending;
  b: Pending;
  pair: PairScore;
}

export async function clusterBatch(
  ctx: RegisterContext,
  matching: Pending[],
  model: MatchModel,
  reads: BatchReads,
  comparePairs: readonly (readonly [string, string])[] | undefined,
): Promise<{ groups: Group[]; reviewPairs: ReviewPair[] }> {
  if (matching.length === 0) return { groups: [], reviewPairs: [] };
  const byKey = [...matching].sort((a, b) => (a.key < b.key ? -1 : 1));
  const records: MatchRecord[] = byKey.map((p) => ({
    id: `m:${p.key}`,
    analysis: p.prepared.analysis,
    ...(p.prepared.input.country ? { country: p.prepared.input.country } : {}),
    identifiers: p.prepared.identifiers,
  }));
  const idf = await idfFor(
    ctx.db,
    records.flatMap((r) => r.analysis.tokens),
    reads,
  );
  const edges: ScoredEdge[] = [];
  const cannot: [string, string][] = [];
  const cps = new Set<string>();
  for (const p of byKey) {
    const candidates = await scoredCandidates(
      ctx.db,
      { analysis: p.prepared.analysis, country: p.prepared.input.country ?? null, identifiers: p.prepared.identifiers },
      model,
      new Set(),
      reads,
    );
    for (const c of candidates) {
      const cpNode = `cp:${c.counterpartyId}`;
      cps.add(cpNode);
      if (c.score === -Infinity) cannot.push([`m:${p.key}`, cpNode]);
      else edges.push({ a: `m:${p.key}`, b: cpNode, score: c.score });
    }
  }
  const pairs = comparePairs ? pairsByKey(byKey, comparePairs) : candidatePairs(records, { idf });
  const reviewPairs: ReviewPair[] = [];
  for (let i = 0; i < pairs.count; i++) {
    const a = records[pairs.left[i]!]!;
    const b = records[pairs.right[i]!]!;
    const s = scorePair(a, b, model, idf);
    if (s.score === -Infinity) cannot.push([a.id, b.id]);
    else edges.push({ a: a.id, b: b.id, score: s.score });
    if (s.decision === 'review') reviewPairs.push({ a: byKey[pairs.left[i]!]!, b: byKey[pairs.right[i]!]!, pair: s });
  }
  const cpList = [...cps].sort();
  const ids = [...records.map((r) => r.id), ...cpList];
  // concat, not push(...): a large component gives more pairs than a call takes arguments.
  const clusters = clusterRecords(ids, edges, cannot.concat(counterpartiesApart(ids, cpList, edges, model.linkAt)), clusterRulesOf(model));
  const byNode = new Map(byKey.map((p) => [`m:${p.key}`, p]));
  const out: Group[] = [];
  for (const cluster of clusters) {
    const members = cluster
      .filter((n) => n.startsWith('m:'))
      .map((n) => byNode.get(n)!)
      .sort((a, b) => (a.key < b.key ? -1 : 1));
    if (members.length === 0) continue;
    const cp = cluster.find((n) => n.startsWith('cp:'));
    out.push({ members, counterpartyId: cp ? Number(cp.slice(3)) : null });
  }
  return { groups: out, reviewPairs };
}

/**
 * Register counterparties never join each other: a cannot-link between every two of them. Only two that one chain of
 * linking edges (score ≥ linkAt) connects can ever meet in a merge, so the cannot-links are given within each such
 * component only (the clusters are the same; all pairs would grow with the square of the counterparties in the batch).
 */
function counterpartiesApart(ids: readonly string[], cpList: readonly string[], edges: readonly ScoredEdge[], linkAt: number): [string, string][] {
  const indexOf = new Map(ids.map((id, i) => [id, i]));
  const linked = new UnionFind(ids.length);
  for (const e of edges) if (e.score >= linkAt) linked.union(indexOf.get(e.a)!, indexOf.get(e.b)!);
  const byComponent = new Map<number, string[]>();
  for (const cp of cpList) {
    const r = linked.find(indexOf.get(cp)!);
    if (!byComponent.has(r)) byComponent.set(r, []);
    byComponent.get(r)!.push(cp);
  }
  const apart: [string, string][] = [];
  for (const group of byComponent.values())
    for (let i = 0; i < group.length; i++) for (let j = i + 1; j < group.length; j++) apart.push([group[i]!, group[j]!]);
  return apart;
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
