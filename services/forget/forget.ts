/**
 * Erasure of a natural person: every name, identifier value, mention text and address of one counterparty
 * (and of the ids merged into it) is replaced by a pseudonym in the register AND in the history, the one
 * permitted rewrite of the append-only history. Structure stays: ids, links, contracts, roles and counts are
 * untouched, so the register still adds up and `verify` (replay included) still passes.
 *
 * Why rewrite the history too: the history holds row images (names, identifiers) that would otherwise keep
 * the person readable forever. The same replacement is applied to the state rows and to the history
 * images, so that replaying the rewritten history gives the rewritten register exactly.
 *
 * Mentions that name the person without being linked to them — a review-queue mention with the person as its
 * candidate, an unlinked "J. Smith" — are erased with the linked ones (person-mentions.ts), with their history
 * events and review items.
 *
 * The erasure is recorded as a `forgotten` event carrying no personal data (the ids and how many rows and
 * events were rewritten); it cannot be undone (the register refuses to).
 */
import { randomBytes } from 'node:crypto';
import type { Transaction } from 'kysely';
import type { Database } from '../../db/types.ts';
import { write } from '../register/transaction.ts';
import { RegisterError } from '../register/errors.ts';
import type { ActorInput, RegisterContext } from '../register/context.ts';
import { analyse } from '../register/matching/analysis.ts';
import { insertNameKeys } from '../register/state/derived.ts';
import { STATE_TABLES, canonicalRow, toDbValues, type Row, type StateTable } from '../register/state/tables.ts';
import type { Op } from '../register/state/change-set.ts';
import { mentionsNamingPerson } from './person-mentions.ts';
import { counterpartyRedirects } from '../../db/queries/invariant-reads.ts';
import { insertHistoryEvent } from '../../db/queries/history.ts';
import { historyPageTouching, mentionIdsOfCounterparties, mentionRowsById, namesOfCounterparties, ownedStateRows } from '../../db/queries/erasure-reads.ts';
import {
  allowHistoryRewrite,
  deleteBlockingKeysOfName,
  lockHistoryToErase,
  lockIdempotencyAnswersToErase,
  lockJobChunksToErase,
  lockJobPartitionsToErase,
  lockJobsToErase,
  lockStateRowsToErase,
  lockExplanationsToErase,
  rewriteExplanation,
  rewriteHistoryEvent,
  rewriteIdempotencyAnswer,
  rewriteJobChunk,
  rewriteJobJson,
  rewriteJobPartition,
  rewriteStateRow,
} from '../../db/queries/erasure-writes.ts';

export interface ForgetOptions {
  /** Allow erasing a counterparty recorded as an organisation (default: refused; the right applies to persons). */
  allowOrganisation?: boolean;
}

export interface ForgetResult {
  eventId: number;
  counterpartyId: number;
  /** The counterparty ids erased: the one asked for, its survivor and every id merged into it. */
  counterpartyIds: number[];
  pseudonym: string;
  /** State rows rewritten per table. */
  rows: Record<string, number>;
  /** History events whose payload was rewritten. */
  events: number;
  /** Idempotency records and job rows whose stored answers were rewritten. */
  storedAnswers: number;
  /** Mentions erased that were not linked to the person (review-queue mentions naming them; person-mentions.ts). */
  unlinkedMentions: number;
}

/**
 * Values shorter than this are not replaced anywhere (a three-character value would hit unrelated text, and
 * timestamps inside row images); the rule is the same for state rows and history, so replay stays exact.
 */
const MIN_SECRET = 4;

export async function forgetCounterparty(ctx: RegisterContext, counterpartyId: number, who: ActorInput, options: ForgetOptions = {}): Promise<ForgetResult> {
  return write(ctx, async (cs) => {
    const trx = cs.trx;
    const cluster = await clusterOf(trx, counterpartyId);
    const rows = await cs.lock('counterparty', cluster);
    const survivor = rows.find((r) => r.status === 'active');
    if (!survivor) throw new RegisterError('NOT_FOUND', `counterparty ${counterpartyId} does not exist`, { counterpartyId });
    if (survivor.kind === 'organisation' && !options.allowOrganisation) {
      throw new RegisterError(
        'CONFLICT',
        `counterparty ${counterpartyId} is recorded as an organisation; erasure is for natural persons (pass allowOrganisation / --organisation to erase it anyway)`,
        { counterpartyId },
      );
    }
    const token = randomBytes(4).toString('hex').toUpperCase();
    const pseudonym = `Forgotten Person ${token}`;
    const linkedIds = await mentionIdsOfCounterparties(trx, cluster);
    // Mentions that name the person without being linked to them (the review queue): erased with the rest.
    const namingIds = await mentionsNamingPerson(trx, cluster, await namesOfCounterparties(trx, cluster));
    const mentionIds = [...new Set([...linkedIds, ...namingIds])].sort((a, b) => a - b);
    const unlinkedMentions = mentionIds.length - linkedIds.length;
    const secrets = await collectSecrets(trx, cluster, mentionIds, pseudonym, token);
    const replace = replacer(secrets);

    const rowCounts: Record<string, number> = {};
    for (const table of STATE_TABLES) {
      const changed = await rewriteTable(trx, table, cluster, mentionIds, secrets, replace);
      if (changed.length > 0) rowCounts[table] = changed.length;
      if (table === 'counterparty_name') await rebuildKeys(trx, changed, ctx);
    }
    const events = await rewriteHistory(trx, cluster, mentionIds, secrets, replace);
    const explanations = await rewriteExplanations(trx, secrets, replace);
    if (explanations > 0) rowCounts.explanation = explanations;
    const storedAnswers = await rewriteStoredAnswers(trx, secrets, replace);

    const at = ctx.now();
    const details = { counterpartyId: Number(survivor.id), counterpartyIds: cluster, pseudonym, rows: rowCounts, events, storedAnswers, unlinkedMentions };
    const eventId = await insertHistoryEvent(trx, {
      type: 'forgotten',
      actor: who.actor,
      at: at.toISOString(),
      reason: who.reason ?? null,
      payload: JSON.stringify({ details, ops: [] satisfies Op[] }),
      counterparty_ids: cluster,
      mention_ids: [],
      undoes_event_id: null,
      request_id: who.requestId ?? null,
    });
    return { eventId, ...details };
  });
}

/** The survivor of `id` and every counterparty whose redirect chain ends in it. */
async function clusterOf(trx: Transaction<Database>, id: number): Promise<number[]> {
  const all = await counterpartyRedirects(trx);
  const next = new Map(all.map((r) => [r.id, r.mergedInto]));
  if (!next.has(id)) return [];
  const end = (start: number): number => {
    let at = start;
    for (let hops = 0; hops <= next.size; hops++) {
      const to = next.get(at);
      if (to === null || to === undefined) return at;
      at = to;
    }
    return at;
  };
  const survivor = end(id);
  return [...next.keys()].filter((k) => end(k) === survivor).sort((a, b) => a - b);
}

type Secrets = Map<string, string>;

/** Every personal value of the cluster, now and in its history, with its replacement. */
async function collectSecrets(trx: Transaction<Database>, cluster: number[], mentionIds: number[], pseudonym: string, token: string): Promise<Secrets> {
  const secrets: Secrets = new Map();
  let identifierCount = 0;
  let nameCount = 0;
  // Each distinct name gets its own pseudonym (names are unique per counterparty and kind); its normalised
  // form gets the pseudonym's normalised form, so blocking keys and the name stay in step.
  const addName = (value: unknown, normalised?: unknown) => {
    if (typeof value !== 'string' || value.trim() === '') return;
    let replacement = secrets.get(value);
    if (replacement === undefined) {
      replacement = nameCount === 0 ? pseudonym : `${pseudonym} ${nameCount + 1}`;
      nameCount++;
      secrets.set(value, replacement);
    }
    if (typeof normalised === 'string' && normalised.trim() !== '' && !secrets.has(normalised)) secrets.set(normalised, analyse(replacement).normalised);
  };
  const addIdentifier = (value: unknown) => {
    if (typeof value === 'string' && value.trim() !== '' && !secrets.has(value)) secrets.set(value, `forgotten-${token}-${++identifierCount}`);
  };
  const addAddress = (value: unknown) => {
    if (typeof value === 'string' && value.trim() !== '' && !secrets.has(value)) secrets.set(value, `[address forgotten ${token}]`);
  };
  const inCluster = (value: unknown) => value !== null && value !== undefined && cluster.includes(Number(value));
  const mentionSet = new Set(mentionIds);
  const visit = (table: string, row: Row | undefined, refs: Row = {}) => {
    if (!row) return;
    const cp = row.counterparty_id ?? refs.counterparty_id;
    if (table === 'counterparty' && inCluster(row.id ?? refs.id)) addName(row.canonical_name);
    if (table === 'counterparty_name' && inCluster(cp)) {
      addName(row.name, row.normalised);
    }
    if (table === 'counterparty_identifier' && inCluster(cp)) addIdentifier(row.value);
    if (table === 'mention' && (inCluster(cp) || mentionSet.has(Number(row.id ?? refs.id)))) {
      addName(row.text);
      addAddress(row.address);
      for (const identifier of (Array.isArray(row.identifiers) ? row.identifiers : []) as { value?: unknown }[]) addIdentifier(identifier.value);
    }
  };
  // Current state first (identifier values stored normalised), then everything the history ever held.
  for (const table of ['counterparty', 'counterparty_name', 'counterparty_identifier'] as const) {
    for (const row of await ownedStateRows(trx, table, cluster)) visit(table, canonicalRow(table, row));
  }
  for (const row of await mentionRowsById(trx, mentionIds)) visit('mention', canonicalRow('mention', row));
  for await (const event of historyTouching(trx, cluster, mentionIds)) {
    for (const op of (event.payload as { ops?: Op[] }).ops ?? []) {
      if (op.op === 'update') {
        visit(op.table, { ...op.refs, ...op.before, id: op.id }, op.refs);
        visit(op.table, { ...op.refs, ...op.after, id: op.id }, op.refs);
      } else visit(op.table, op.row);
    }
  }
  return secrets;
}

async function* historyTouching(trx: Transaction<Database>, cluster: number[], mentionIds: number[]) {
  let after = 0;
  for (;;) {
    const page = await historyPageTouching(trx, cluster, mentionIds, after, 500);
    if (page.length === 0) return;
    yield* page;
    after = page[page.length - 1]!.id;
  }
}

/** A deep string replacement of every secret (longest first, so a full name goes before a part of it). */
function replacer(secrets: Secrets): (value: unknown) => unknown {
  const ordered = [...secrets.entries()].filter(([from]) => from.length >= MIN_SECRET).sort((a, b) => b[0].length - a[0].length);
  const inString = (text: string): string => {
    let out = text;
    for (const [from, to] of ordered) if (out.includes(from)) out = out.split(from).join(to);
    return out;
  };
  const deep = (value: unknown): unknown => {
    if (typeof value === 'string') return inString(value);
    if (Array.isArray(value)) return value.map(deep);
    if (value && typeof value === 'object') {
      const out: Record<string, unknown> = {};
      for (const [k, v] of Object.entries(value)) out[k] = deep(v);
      return out;
    }
    return value;
  };
  return deep;
}

/** The secrets as the searches look for them: long enough to replace, and written as JSON escapes them. */
function needlesOf(secrets: Secrets): string[] {
  return [...secrets.keys()].filter((s) => s.length >= MIN_SECRET).map((s) => JSON.stringify(s).slice(1, -1));
}

async function rewriteTable(
  trx: Transaction<Database>,
  table: StateTable,
  cluster: number[],
  mentionIds: number[],
  secrets: Secrets,
  replace: (value: unknown) => unknown,
): Promise<Row[]> {
  const rows = await lockStateRowsToErase(trx, table, cluster, mentionIds, needlesOf(secrets));
  const changed: Row[] = [];
  for (const raw of rows) {
    const before = canonicalRow(table, raw);
    const after = replace(before) as Row;
    const patch: Row = {};
    for (const column of Object.keys(before)) if (JSON.stringify(before[column]) !== JSON.stringify(after[column])) patch[column] = after[column];
    if (Object.keys(patch).length === 0) continue;
    await rewriteStateRow(trx, table, before.id as number, toDbValues(table, patch));
    changed.push(after);
  }
  return changed;
}

async function rebuildKeys(trx: Transaction<Database>, names: Row[], ctx: RegisterContext): Promise<void> {
  for (const row of names) {
    await deleteBlockingKeysOfName(trx, row.id as number);
    await insertNameKeys(trx, row, ctx.derived);
  }
}

async function rewriteHistory(
  trx: Transaction<Database>,
  cluster: number[],
  mentionIds: number[],
  secrets: Secrets,
  replace: (value: unknown) => unknown,
): Promise<number> {
  const rows = await lockHistoryToErase(trx, cluster, mentionIds, needlesOf(secrets));
  let count = 0;
  await allowHistoryRewrite(trx);
  for (const row of rows) {
    const payload = row.payload;
    const rewritten = replace(payload);
    const reason = row.reason === null ? null : (replace(row.reason) as string);
    if (JSON.stringify(rewritten) === JSON.stringify(payload) && reason === row.reason) continue;
    await rewriteHistoryEvent(trx, row.id, JSON.stringify(rewritten), reason);
    count++;
  }
  return count;
}

/**
 * The explanations of decisions (stored once, referenced by mentions, review items and the history's row images)
 * quoting the person, rewritten like the history they belong to. Runs after rewriteHistory (which allows the rewrite).
 */
async function rewriteExplanations(trx: Transaction<Database>, secrets: Secrets, replace: (value: unknown) => unknown): Promise<number> {
  let count = 0;
  for (const row of await lockExplanationsToErase(trx, needlesOf(secrets))) {
    const rewritten = JSON.stringify(replace(row.body));
    if (rewritten === JSON.stringify(row.body)) continue;
    await rewriteExplanation(trx, row.id, rewritten);
    count++;
  }
  return count;
}

/** Answers kept for idempotent retries and job results may quote the person: rewritten too. */
async function rewriteStoredAnswers(trx: Transaction<Database>, secrets: Secrets, replace: (value: unknown) => unknown): Promise<number> {
  let count = 0;
  const needles = needlesOf(secrets);
  for (const r of await lockIdempotencyAnswersToErase(trx, needles)) {
    await rewriteIdempotencyAnswer(trx, r.keyId, r.key, JSON.stringify(replace(r.response)));
    count++;
  }
  for (const j of await lockJobsToErase(trx, needles)) {
    await rewriteJobJson(trx, j.id, {
      params: JSON.stringify(replace(j.params)),
      result: j.result === null ? null : JSON.stringify(replace(j.result)),
      plan: j.plan === null ? null : JSON.stringify(replace(j.plan)),
    });
    count++;
  }
  // A job still under way holds its input (staged rows, partition items): the same replacement applies there.
  for (const c of await lockJobChunksToErase(trx, needles)) {
    await rewriteJobChunk(trx, c.jobId, c.chunkNo, JSON.stringify(replace(c.rows)));
    count++;
  }
  for (const p of await lockJobPartitionsToErase(trx, needles)) {
    await rewriteJobPartition(trx, p.jobId, p.partitionNo, {
      items: JSON.stringify(replace(p.items)),
      result: p.result === null ? null : JSON.stringify(replace(p.result)),
    });
    count++;
  }
  return count;
}
