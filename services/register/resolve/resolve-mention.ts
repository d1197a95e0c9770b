/**
 * Resolving one mention: analyse → the contract's defined terms → candidates from the register (blocking keys and
 * identifier lookups) → score → decide → write, in one transaction with one history event.
 *
 * Idempotent: the same (source, externalId) with the same content answers the stored result and changes nothing;
 * with a different content the mention is updated, resolved again and the change recorded (`mention_changed`).
 */
import { lockAndReadDecisionBasics, lockNeighbourhoodKeys, partyMentionsByPosition } from '../../../db/queries/resolve-reads.ts';
import { contractByRef } from '../../../db/queries/contracts.ts';
import type { ParsedContract } from '../../../resolvers/terms/index.ts';
import type { MentionInput } from '../../../resolvers/vocabulary.ts';
import { mentionByRef } from '../../../db/queries/mentions-by-ref.ts';
import type { ActorInput, RegisterContext } from '../context.ts';
import { modelFromSettings } from '../matching/model.ts';
import { keysOfAnalysis } from '../matching/keys.ts';
import { BatchReads } from '../matching/batch-reads.ts';
import { MAX_CANDIDATES } from '../matching/candidates.ts';
import type { ChangeSet } from '../state/change-set.ts';
import { canonicalRow } from '../state/tables.ts';
import { write } from '../transaction.ts';
import { decide, type ContractContext, type PartyContext } from './decide.ts';
import { targetOf } from './apply.ts';
import { prepareMention, type PreparedMention } from './prepare.ts';
import { resultOf, type ResolveResult } from './result.ts';
import { writeMention } from './write-mention.ts';
import { earlierContractOf } from '../earlier-contract.ts';

export { resultOf, type ResolveResult } from './result.ts';

/**
 * The keys that serialise resolutions of look-alike names (same core or same 6-letter prefix, same strong
 * identifier) across instances, so that two concurrent mentions of one new company do not create it twice.
 */
function neighbourhoodKeys(many: readonly PreparedMention[]): string[] {
  const keys: string[] = [];
  for (const prepared of many) {
    for (const k of keysOfAnalysis(prepared.analysis)) if (k.startsWith('p:')) keys.push(k);
    keys.push(`core:${prepared.analysis.core}`);
    for (const identifier of prepared.identifiers) keys.push(`id:${identifier.scheme}:${identifier.value}`);
  }
  return keys;
}

/** The neighbourhood locks of many mentions in one statement (a batch chunk), taken in one sorted order. Transaction-scoped. */
export async function lockNameNeighbourhoods(cs: ChangeSet, many: PreparedMention[]): Promise<void> {
  await lockNeighbourhoodKeys(cs.trx, neighbourhoodKeys(many));
}

export async function contractContextFor(cs: ChangeSet, ref: { source: string; externalId: string } | undefined): Promise<ContractContext | null> {
  if (!ref) return null;
  const contract = await contractByRef(cs.trx, ref.source, ref.externalId);
  if (!contract || contract.status !== 'active') return null;
  const parsed = contract.parsed as unknown as ParsedContract;
  const context: ContractContext = { contractId: Number(contract.id), parsed, partyMentions: await partyMentionsOf(cs, Number(contract.id)) };
  // An amendment or side letter: the earlier agreement whose defined terms it uses, when the register holds it.
  const earlier = parsed.earlierAgreements ? await earlierContractOf(cs.trx, context.contractId, parsed) : null;
  if (earlier) context.earlier = { ...earlier, partyMentions: await partyMentionsOf(cs, earlier.contractId) };
  return context;
}

async function partyMentionsOf(cs: ChangeSet, contractId: number): Promise<Map<number, number>> {
  return partyMentionsByPosition(cs.trx, contractId);
}

export interface ResolveWithinOptions {
  party?: PartyContext;
  /** Why the mention is resolved again (kept in the event's details). */
  cause?: 'text_changed' | 'contract_arrived' | 'reresolve' | 'contract_changed';
  /** Resolve again even when the content is unchanged (contract arrived, reresolve); the stored hash is kept. */
  force?: boolean;
  /** Runs after the outcome is written and before the event is committed (its ops join the same event). */
  beforeCommit?: (mentionId: number) => Promise<void>;
  /** Counterparties the decision leaves out of the candidates (reresolve: the one a mention created). */
  exclude?: readonly number[];
}

/**
 * The whole resolution inside an open ChangeSet, as a batch of one: read → decide → the write stage shared with
 * the batch (resolve/write-mention.ts), buffered and written at one flush; commits one event when anything changed.
 * Used by the public resolveMention and by contracts, reresolve and review.
 */
export async function resolveWithin(
  ctx: RegisterContext,
  cs: ChangeSet,
  preparedInput: PreparedMention,
  who: ActorInput,
  options: ResolveWithinOptions = {},
): Promise<ResolveResult> {
  const at = ctx.now();
  let prepared = preparedInput;
  // Its reads see what the caller wrote before (a no-op when nothing waits in the buffer).
  await cs.flush();
  const stored = await mentionByRef(cs.trx, prepared.input);
  const found = stored ? canonicalRow('mention', stored) : undefined;
  // A changed contract that keeps a party's name but declares other former or trade names for it resolves it again.
  if (found && !options.force && declaredNamesChanged(found, options.party)) options = { ...options, force: true };
  if (found && found.content_hash === prepared.contentHash && !options.force)
    return resultOf(cs.trx, found, { alreadyIngested: true, eventId: null, explanation: stored!.explanation_body });
  // The locks, the settings and our own entities in one round trip.
  const basics = await lockAndReadDecisionBasics(cs.trx, neighbourhoodKeys([prepared]));
  const textChanged = found !== undefined && found.content_hash !== prepared.contentHash && !options.force;
  // A forced re-resolution keeps the stored content hash: the source's own input is what idempotency compares.
  if (found && options.force) prepared = { ...prepared, contentHash: found.content_hash };
  const contract = options.party ? null : await contractContextFor(cs, prepared.input.contract);
  const { model, version } = modelFromSettings(basics.settings);
  // A batch of one: the register's reads shared by the own-entity check and the candidates (each read once), with
  // no batch basis, so the token weights are the register's alone as before. Prefetched when the mention goes to
  // the register as it stands (a contract's defined term may instead settle it or change what is matched).
  const reads = new BatchReads(cs.trx);
  reads.seedOwnEntities(basics.ownEntities);
  if (prepared.analysis.partyStatus === 'party' && (options.party !== undefined || contract === null)) await reads.prefetch([prepared], MAX_CANDIDATES);
  const outcome = await decide(cs.trx, prepared, model, {
    mentionId: found ? found.id : null,
    contract,
    party: options.party ?? null,
    contractAwaited: prepared.input.contract !== undefined && contract === null,
    reads,
    ...(options.exclude ? { alsoExclude: options.exclude } : {}),
  });
  if (options.party?.aliases && options.party.aliases.length > 0) outcome.declaredNames = options.party.aliases;
  outcome.evidence.modelVersion = version;
  // The ids of the rows it adds, in one statement (a person's earlier decision may still turn it into a review).
  const askable = textChanged && found?.confirmed_by !== null && found?.counterparty_id !== null;
  // The names are an upper bound (a name already there is one more sighting): an id left over is a harmless gap.
  const linking = outcome.status === 'linked' || outcome.status === 'new';
  // A new mention linked or sent to review changes that one counterparty (and, linked, its names): locked with the
  // ids in one round trip, in the order the write takes them (resolve/apply.ts). A stored mention locks its old
  // counterparty first (resolve/write-mention.ts), so it takes its locks there, as before.
  const target = !found && (outcome.status === 'linked' || outcome.status === 'review') ? [targetOf(outcome)] : [];
  await cs.reserveAndLock(
    {
      counterparty: outcome.status === 'new' ? 1 : 0,
      mention: found ? 0 : 1,
      review_item: outcome.status === 'review' || askable ? 1 : 0,
      explanation: 1,
      counterparty_name: linking ? 1 + (outcome.declaredNames?.length ?? 0) + prepared.analysis.aliases.length : 0,
    },
    { counterparties: target, namesOf: outcome.status === 'linked' ? target : [] },
  );
  // Not the event's id: it is drawn at the flush, after every lock, so that the events of two transactions that
  // change one row are numbered in the order they commit (replay applies them in id order).
  const result = await writeMention(
    cs,
    {
      prepared,
      outcome,
      stored: found ? { id: found.id, counterpartyId: found.counterparty_id } : null,
      textChanged,
      contractId: options.party?.contractId ?? contract?.contractId ?? null,
      beforeCommit: options.beforeCommit,
      details: (applied, previous) => ({
        ...(applied.createdCounterparty ? { createdCounterpartyId: applied.counterpartyId } : {}),
        ...(previous ? { previousStatus: previous.status, previousCounterpartyId: previous.counterparty_id, previousText: previous.text } : {}),
        ...(options.cause ? { cause: options.cause } : textChanged ? { cause: 'text_changed' } : {}),
      }),
    },
    who,
    at,
  );
  await cs.flush();
  return { ...result, eventId: result.eventId === null ? null : cs.realId(result.eventId) };
}

/** Whether a linked contract party's stored declared names (recordedAliases) differ from what its contract declares now. */
function declaredNamesChanged(found: { status?: unknown; evidence?: unknown }, party: PartyContext | undefined): boolean {
  if (party === undefined || (found.status !== 'linked' && found.status !== 'new')) return false;
  const stored = ((found.evidence as { recordedAliases?: { name: string; kind: string }[] } | null)?.recordedAliases ?? []).map((a) => `${a.kind}:${a.name}`);
  const now = [...new Set((party.aliases ?? []).map((a) => `${a.kind}:${a.name}`))];
  return stored.length !== now.length || now.some((k) => !stored.includes(k));
}

/** Resolves one mention (see the file header). */
export async function resolveMention(ctx: RegisterContext, input: MentionInput, who: ActorInput): Promise<ResolveResult> {
  const prepared = prepareMention(input);
  return write(ctx, (cs) => resolveWithin(ctx, cs, prepared, who));
}
