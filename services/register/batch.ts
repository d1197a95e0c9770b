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
import type { MentionInput } from '../../resolvers/vocabulary.ts';
import { mentionsByKeys, type MentionKeyRow } from '../../db/queries/state-writes.ts';
import type { ActorInput, RegisterContext } from './context.ts';
import { RegisterError } from './errors.ts';
import { currentModel } from './matching/model.ts';
import { basisOf, type FrozenRarity } from './matching/idf.ts';
import { BatchReads } from './matching/batch-reads.ts';
import { jsonScore, MAX_CANDIDATES } from './matching/candidates.ts';
import { decide, type ContractContext, type Outcome } from './resolve/decide.ts';
import { prepareMention, type PreparedMention } from './resolve/prepare.ts';
import { contractContextFor, lockNameNeighbourhoods, resultOf, type ResolveResult } from './resolve/resolve-mention.ts';
import { writeMention } from './resolve/write-mention.ts';
import { write } from './transaction.ts';
import { ChangeSet } from './state/change-set.ts';
import { canonicalRow } from './state/tables.ts';
import { lockActive, survivorFor } from './records.ts';
import { clusterBatch, type Group, type Pending } from './batch-cluster.ts';
import { timed, type StageTimes } from './stage-times.ts';

export type BatchItemResult = ResolveResult | { status: 'rejected'; index: number; error: { code: string; message: string; field?: string } };

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
  /** Filled with the milliseconds each stage took (stage-times.ts), when given. */
  stages?: StageTimes;
}

type Checked = { index: number; prepared: PreparedMention; key: string };

/** Stage 1, check: each input checked and analysed; a bad one or a repeated (source, externalId) is rejected in place. */
function checkInputs(inputs: MentionInput[], results: BatchItemResult[]): Checked[] {
  const seen = new Map<string, number>();
  const checked: Checked[] = [];
  for (const [index, input] of inputs.entries()) {
    let prepared: PreparedMention;
    try {
      prepared = prepareMention(input);
    } catch (error) {
      if (!(error instanceof RegisterError)) throw error;
      const e = error;
      results[index] = {
        status: 'rejected',
        index,
        error: { code: e.code ?? 'INVALID_INPUT', message: e.message, ...(e.details?.field ? { field: String(e.details.field) } : {}) },
      };
      continue;
    }
    const key = sortKey(prepared);
    if (seen.has(key)) {
      results[index] = {
        status: 'rejected',
        index,
        error: {
          code: 'INVALID_INPUT',
          message: `the batch holds (source, externalId) ${prepared.input.source}/${prepared.input.externalId} twice (items ${seen.get(key)} and ${index})`,
        },
      };
      continue;
    }
    seen.set(key, index);
    checked.push({ index, prepared, key });
  }
  return checked;
}

export async function resolveBatch(ctx: RegisterContext, inputs: MentionInput[], who: ActorInput, options: BatchOptions = {}): Promise<BatchItemResult[]> {
  const results: BatchItemResult[] = new Array(inputs.length);
  const pending: Pending[] = [];
  const stages = options.stages;
  const { model } = await currentModel(ctx.db);
  const checked = await timed(stages, 'check', async () => checkInputs(inputs, results));
  // The read-only phase reads in bulk: stored mentions in one statement, the candidates and token counts of every
  // mention in one statement each (matching/batch-reads.ts), each contract once.
  const { stored, reads } = await timed(stages, 'read', async () => {
    const stored = new Map(
      (
        await mentionsByKeys(
          ctx.db,
          checked.map((c) => c.prepared.input),
        )
      ).map((row) => [`${row.source}\u0000${row.external_id}`, row]),
    );
    const reads = new BatchReads(ctx.db);
    const toDecide = checked.filter((c) => stored.get(c.key)?.content_hash !== c.prepared.contentHash);
    reads.basis = basisOf(
      toDecide.map((c) => c.prepared.analysis.tokens),
      options.rarity,
    );
    await reads.prefetch(
      toDecide.map((c) => c.prepared),
      MAX_CANDIDATES,
    );
    return { stored, reads };
  });
  const contracts = new Map<string, Promise<ContractContext | null>>();
  await timed(stages, 'decide', async () => {
    for (const { index, prepared, key } of checked) {
      const found = stored.get(key);
      if (found && found.content_hash === prepared.contentHash) {
        results[index] = await resultOf(ctx.db, canonicalRow('mention', found), { alreadyIngested: true, eventId: null, explanation: found.explanation_body });
        continue;
      }
      const ref = prepared.input.contract;
      let contract: ContractContext | null = null;
      if (ref) {
        const refKey = JSON.stringify([ref.source, ref.externalId]);
        if (!contracts.has(refKey))
          contracts.set(
            refKey,
            ctx.db.transaction().execute((trx) => contractContextFor(new ChangeSet(trx, ctx.derived), ref)),
          );
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
  });

  // Mentions whose outcome does not depend on the rest of the batch.
  const final = new Set(
    pending.filter(
      (p) =>
        !['linked', 'new', 'review'].includes(p.outcome.status) ||
        p.outcome.evidence.via !== 'register' ||
        p.outcome.evidence.override === 'decisive_identifier',
    ),
  );
  const matching = pending.filter((p) => !final.has(p));
  const groups = await timed(stages, 'cluster', () => clusterBatch(ctx, matching, model, reads, options.comparePairs));
  const plan: Group[] = [...final].map((p) => ({ members: [p], counterpartyId: null }));
  for (const g of groups) plan.push(g);
  plan.sort((a, b) => (a.members[0]!.key < b.members[0]!.key ? -1 : a.members[0]!.key > b.members[0]!.key ? 1 : 0));

  // Several clusters share one transaction (one commit, so one WAL flush, per chunk instead of per cluster);
  // each mention still records its own event, and a retried chunk re-reads everything it writes.
  for (let start = 0; start < plan.length;) {
    const chunk: typeof plan = [];
    let size = 0;
    while (start < plan.length && (chunk.length === 0 || size + plan[start]!.members.length <= WRITE_CHUNK)) {
      size += plan[start]!.members.length;
      chunk.push(plan[start++]!);
    }
    let attempt = 0;
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
          await mentionsByKeys(
            cs.trx,
            members.filter((m) => recheck || m.stored).map((m) => m.prepared.input),
          ),
        );
        const plans = chunk.map((group) => planGroup(group, final.has(group.members[0]!), model.linkAt));
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
        cs.startBuffering();
        const contracts = new Map<string, Promise<ContractContext | null>>();
        const out: ResolveResult[][] = [];
        for (const [g, group] of chunk.entries()) out.push(await writeGroup(ctx, cs, group, plans[g]!, who, found, contracts, model.linkAt));
        await timed(stages, 'flush', () => cs.flush());
        // Events written from the buffer got their ids at the flush.
        return out.map((results) => results.map((r) => (r.eventId === null ? r : { ...r, eventId: cs.realId(r.eventId) })));
      }),
    );
    chunk.forEach((group, g) => {
      for (const [i, member] of group.members.entries()) results[member.index] = written[g]![i]!;
    });
  }
  return results;
}

/** Ids of stored mentions (with their counterparty) by sort key. */
function storedIds(rows: MentionKeyRow[]): Map<string, { id: number; counterpartyId: number | null }> {
  return new Map(
    rows.map((row) => [
      `${row.source}\u0000${row.external_id}`,
      { id: Number(row.id), counterpartyId: row.counterparty_id === null ? null : Number(row.counterparty_id) },
    ]),
  );
}

/**
 * The outcome written for each member of a cluster: the cluster's counterparty, one new counterparty for the
 * cluster (written by its first member, the others link to it), or a lone mention's review. `counterpartyId`
 * is unset for a link to the counterparty the cluster creates.
 */
function planGroup(group: Group, fixed: boolean, linkAt: number): Outcome[] {
  const target = group.counterpartyId;
  return group.members.map((member, i) => {
    const outcome = member.outcome;
    if (fixed) return outcome;
    const lone = group.members.length === 1 && target === null;
    if (target !== null) return clusteredWith(outcome, target, linkAt);
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

function clusteredWith(outcome: Outcome, target: number, linkAt: number): Outcome {
  return {
    ...outcome,
    status: 'linked',
    counterpartyId: target,
    recordName: true,
    evidence: { ...outcome.evidence, summary: `clustered with counterparty ${target} in a batch (linkAt ${linkAt})`, via: 'batch' },
  };
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
