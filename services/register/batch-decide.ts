/**
 * The read and decide stages of the walk (walk.ts). A batch reads the stored mentions, the candidates and the token
 * counts of all its mentions in bulk on the register as it stands; a single resolve (`within`) reads in its own
 * transaction: its neighbourhood locks with its stored mention, the settings and our own entities in one statement,
 * then its contract and its candidates with their token counts, on a snapshot taken after the locks. Then each
 * mention is decided on its own; one stored with the same content answers its stored result and is not decided.
 */
import type { MatchModel } from '../../resolvers/score/index.ts';
import { mentionKey } from '../../resolvers/vocabulary.ts';
import { mentionsByRef, type StoredMentionRow } from '../../db/queries/mentions-by-ref.ts';
import { lockAndReadDecisionBasics } from '../../db/queries/resolve-reads.ts';
import type { Queryable } from '../../db/queries/util.ts';
import type { RegisterContext } from './context.ts';
import { basisOf } from './matching/idf.ts';
import { BatchReads } from './matching/batch-reads.ts';
import { MAX_CANDIDATES } from './matching/candidates.ts';
import { currentModel, modelFromSettings } from './matching/model.ts';
import { decide, type ContractContext, type PartyContext } from './resolve/decide.ts';
import { contractContextFor, contractContextsByRef, contractRefKey } from './resolve/contract-context.ts';
import type { PreparedMention } from './resolve/prepare.ts';
import { neighbourhoodKeys } from './resolve/neighbourhood.ts';
import { resultOf } from './resolve/result.ts';
import type { IdTable } from './state/change-set.ts';
import { canonicalRow } from './state/tables.ts';
import type { Pending } from './batch-cluster.ts';
import type { BatchItemResult, Checked } from './batch-check.ts';
import type { WalkOptions, Within } from './walk.ts';

/** What the read stage gives the later stages. */
export interface WalkReads {
  model: MatchModel;
  /** The settings' version, kept in a single resolve's explanation (a batch's explanations have none). */
  version: number | null;
  /** Where the decide stage reads (the register as it stands, or the single resolve's transaction). */
  db: Queryable;
  reads: BatchReads;
  /** Stored mentions by sort key. */
  stored: Map<string, StoredMentionRow>;
  /** A single resolve runs again though its content is unchanged (asked to, or its contract's declared names changed). */
  force: boolean;
  /** The contract a mention names, read once per contract. */
  contractOf: (ref: { source: string; externalId: string }) => Promise<ContractContext | null>;
}

/** Stage 2, read. */
export async function readMentions(ctx: RegisterContext, checked: Checked[], options: WalkOptions): Promise<WalkReads> {
  if (options.within) return readWithin(ctx, options.within, checked);
  // The read-only phase reads in bulk: stored mentions in one statement, the candidates and token counts of every
  // mention in one statement each (matching/batch-reads.ts), each contract once, in a read transaction of its own.
  const { model } = await currentModel(ctx.db);
  const stored = byKey(
    await mentionsByRef(
      ctx.db,
      checked.map((c) => c.prepared.input),
    ),
  );
  const reads = new BatchReads(ctx.db, ctx.stats);
  const toDecide = checked.filter((c) => stored.get(c.key)?.content_hash !== c.prepared.contentHash);
  reads.basis = basisOf(
    toDecide.map((c) => c.prepared.analysis.tokens),
    options.rarity,
  );
  await reads.prefetch(
    toDecide.map((c) => c.prepared),
    MAX_CANDIDATES,
  );
  // The cannot-links of the stored mentions decided again, and the contracts named, one statement per kind.
  await reads.prefetchCannotLinks(toDecide.flatMap((c) => (stored.has(c.key) ? [Number(stored.get(c.key)!.id)] : [])));
  const contracts = await contractContextsByRef(
    ctx.db,
    toDecide.flatMap((c) => (c.prepared.input.contract ? [c.prepared.input.contract] : [])),
  );
  const contractOf = async (ref: { source: string; externalId: string }) => contracts.get(contractRefKey(ref)) ?? null;
  return { model, version: null, db: ctx.db, reads, stored, force: false, contractOf };
}

/** A single resolve's reads, in its transaction (see the file header). */
async function readWithin(ctx: RegisterContext, within: Within, checked: Checked[]): Promise<WalkReads> {
  if (checked.length !== 1) throw new Error(`a single resolve walks one mention, not ${checked.length}`);
  const { prepared } = checked[0]!;
  const cs = within.cs;
  // Its reads see what the caller wrote before in this ChangeSet (a no-op when nothing waits in the buffer).
  await cs.flush();
  // The locks, the stored mention, the settings and our own entities in one round trip, with the ids of the rows the
  // write may add (an upper bound, kept by the ChangeSet: the write stage then draws none of them).
  const basics = await lockAndReadDecisionBasics(cs.trx, neighbourhoodKeys([prepared]), prepared.input, {
    counts: idsAhead(prepared, within.party),
    unlessContentHash: within.force ? null : prepared.contentHash,
  });
  cs.keepIds(basics.ids);
  const stored = byKey(basics.stored ? [basics.stored] : []);
  const found = basics.stored ? canonicalRow('mention', basics.stored) : undefined;
  // A changed contract that keeps a party's name but declares other former or trade names for it resolves it again.
  const force = (within.force ?? false) || (found !== undefined && declaredNamesChanged(found, within.party));
  const { model, version } = modelFromSettings(basics.settings);
  // A batch of one: the register's reads shared by the own-entity check and the candidates (each read once), with
  // no batch basis, so the token weights are the register's alone.
  const reads = new BatchReads(cs.trx, ctx.stats);
  reads.seedOwnEntities(basics.ownEntities);
  const settled = found !== undefined && found.content_hash === prepared.contentHash && !force;
  const contract = settled || within.party ? null : await contractContextFor(cs, prepared.input.contract);
  // Prefetched when the mention goes to the register as it stands (a contract's defined term may instead settle it
  // or change what is matched).
  if (!settled && prepared.analysis.partyStatus === 'party' && (within.party !== undefined || contract === null))
    await reads.prefetch([prepared], MAX_CANDIDATES);
  return { model, version, db: cs.trx, reads, stored, force, contractOf: async () => contract };
}

/** Stage 3, decide: every checked mention decided; those already stored with the same content get their result in `results`. */
export async function decideMentions(
  ctx: RegisterContext,
  checked: Checked[],
  read: WalkReads,
  results: BatchItemResult[],
  options: WalkOptions,
): Promise<Pending[]> {
  const within = options.within;
  const pending: Pending[] = [];
  for (const { index, prepared, key } of checked) {
    const found = read.stored.get(key);
    if (found && found.content_hash === prepared.contentHash && !read.force) {
      results[index] = await resultOf(read.db, canonicalRow('mention', found), { alreadyIngested: true, eventId: null, explanation: found.explanation_body });
      continue;
    }
    const ref = prepared.input.contract;
    const contract = ref ? await read.contractOf(ref) : null;
    const outcome = await decide(read.db, prepared, read.model, {
      mentionId: found ? Number(found.id) : null,
      contract,
      party: within?.party ?? null,
      contractAwaited: ref !== undefined && contract === null,
      reads: read.reads,
      ...(within?.exclude ? { alsoExclude: within.exclude } : {}),
    });
    if (within?.party?.aliases && within.party.aliases.length > 0) outcome.declaredNames = within.party.aliases;
    if (read.version !== null) outcome.evidence.modelVersion = read.version;
    if (!within) {
      pending.push({ index, prepared, key, outcome, stored: found !== undefined });
      continue;
    }
    // What a single resolve knows before its write: it read its stored mention with its locks, in this transaction.
    const textChanged = found !== undefined && found.content_hash !== prepared.contentHash && !read.force;
    pending.push({
      index,
      // A forced re-resolution keeps the stored content hash: the source's own input is what idempotency compares.
      prepared: found && read.force ? { ...prepared, contentHash: found.content_hash } : prepared,
      key,
      outcome,
      stored: found !== undefined,
      known: {
        textChanged,
        contractId: within.party?.contractId ?? contract?.contractId ?? null,
        stored: found
          ? {
              id: Number(found.id),
              counterpartyId: found.counterparty_id === null ? null : Number(found.counterparty_id),
              confirmed: found.confirmed_by !== null,
            }
          : null,
      },
    });
  }
  return pending;
}

/**
 * The most rows of each table a single resolve adds besides its counterparty (whose id the register's size is read
 * from, so none is drawn ahead: batch-write.ts, ChangeSet.reserveAndLock): its mention, its explanation, a review
 * item, and its name with its aliases and the names its contract declares (batch-write.ts namesUpperBound).
 */
function idsAhead(prepared: PreparedMention, party: PartyContext | undefined): Map<IdTable, number> {
  return new Map<IdTable, number>([
    ['mention', 1],
    ['explanation', 1],
    ['review_item', 1],
    ['counterparty_name', 1 + (party?.aliases?.length ?? 0) + prepared.analysis.aliases.length],
  ]);
}

function byKey(rows: StoredMentionRow[]): Map<string, StoredMentionRow> {
  return new Map(rows.map((row) => [mentionKey(row.source, row.external_id), row]));
}

/** Whether a linked contract party's stored declared names (recordedAliases) differ from what its contract declares now. */
function declaredNamesChanged(found: { status?: unknown; evidence?: unknown }, party: PartyContext | undefined): boolean {
  if (party === undefined || (found.status !== 'linked' && found.status !== 'new')) return false;
  const stored = ((found.evidence as { recordedAliases?: { name: string; kind: string }[] } | null)?.recordedAliases ?? []).map((a) => `${a.kind}:${a.name}`);
  const now = [...new Set((party.aliases ?? []).map((a) => `${a.kind}:${a.name}`))];
  return stored.length !== now.length || now.some((k) => !stored.includes(k));
}
