/**
 * Resolving one mention: analyse → the contract's defined terms → candidates from the register (blocking keys and
 * identifier lookups) → score → decide → write, in one transaction with one history event.
 *
 * Idempotent: the same (source, externalId) with the same content answers the stored result and changes nothing;
 * with a different content the mention is updated, resolved again and the change recorded (`mention_changed`).
 */
import { sql } from 'kysely';
import type { ParsedContract } from '../../../resolvers/terms/index.ts';
import type { MentionInput, ResolutionStatus } from '../../../resolvers/vocabulary.ts';
import type { ActorInput, RegisterContext } from '../context.ts';
import { commitEvent } from '../history/commit.ts';
import { currentModel } from '../matching/model.ts';
import { keysOfAnalysis } from '../matching/keys.ts';
import type { ChangeSet } from '../state/change-set.ts';
import { canonicalRow, type Row } from '../state/tables.ts';
import { write } from '../transaction.ts';
import { closeOpenItemsOfMention, detachMention } from '../upkeep.ts';
import { askAgain, earlierDecisionOf, type EarlierDecision } from './earlier-decision.ts';
import { applyOutcome, canonicalNameIn, eventTypeFor } from './apply.ts';
import { decide, type ContractContext, type PartyContext } from './decide.ts';
import { prepareMention, type PreparedMention } from './prepare.ts';
import { earlierContractOf } from '../earlier-contract.ts';

export interface ResolveResult {
  mentionId: number;
  source: string;
  externalId: string;
  status: ResolutionStatus;
  counterpartyId: number | null;
  canonicalName: string | null;
  ownEntityId: number | null;
  score: number | null;
  /** Why: summary sentence, per-feature weights, identifier notes, top candidates, thresholds. */
  explanation: Record<string, unknown>;
  reviewItemId: number | null;
  /** True when this exact mention was already stored: nothing was done. */
  alreadyIngested: boolean;
  eventId: number | null;
}

export async function resultOf(
  db: ChangeSet['trx'] | RegisterContext['db'],
  mention: Row,
  extra: { alreadyIngested: boolean; eventId: number | null; reviewItemId?: number | null; canonicalName?: string },
): Promise<ResolveResult> {
  const cpId = (mention.counterparty_id as number | null) ?? null;
  const cp =
    cpId === null
      ? undefined
      : extra.canonicalName !== undefined
        ? { canonical_name: extra.canonicalName }
        : await db.selectFrom('counterparty').select('canonical_name').where('id', '=', cpId).executeTakeFirst();
  let reviewItemId = extra.reviewItemId ?? null;
  if (reviewItemId === null && mention.status === 'review') {
    const item = await db.selectFrom('review_item').select('id').where('mention_id', '=', mention.id as number).where('status', '=', 'open').orderBy('id', 'desc').executeTakeFirst();
    reviewItemId = item ? Number(item.id) : null;
  }
  const evidence = { ...(mention.evidence as Record<string, unknown>) };
  delete evidence.recordedName;
  delete evidence.recordedAliases;
  return {
    mentionId: mention.id as number,
    source: mention.source as string,
    externalId: mention.external_id as string,
    status: mention.status as ResolutionStatus,
    counterpartyId: cpId,
    canonicalName: cp?.canonical_name ?? null,
    ownEntityId: (mention.own_entity_id as number | null) ?? null,
    score: (mention.score as number | null) ?? null,
    explanation: evidence,
    reviewItemId,
    alreadyIngested: extra.alreadyIngested,
    eventId: extra.eventId,
  };
}

/** Serialises resolutions of look-alike names (same core or same 6-letter prefix, same strong identifier) across
 * instances, so that two concurrent mentions of one new company do not create it twice. Transaction-scoped. */
export async function lockNameNeighbourhood(cs: ChangeSet, prepared: PreparedMention): Promise<void> {
  await lockNameNeighbourhoods(cs, [prepared]);
}

/** The neighbourhood locks of many mentions in one statement (a batch chunk), taken in one sorted order. */
export async function lockNameNeighbourhoods(cs: ChangeSet, many: PreparedMention[]): Promise<void> {
  const keys: string[] = [];
  for (const prepared of many) {
    for (const k of keysOfAnalysis(prepared.analysis)) if (k.startsWith('p:')) keys.push(k);
    keys.push(`core:${prepared.analysis.core}`);
    for (const identifier of prepared.identifiers) keys.push(`id:${identifier.scheme}:${identifier.value}`);
  }
  await sql`SELECT pg_advisory_xact_lock(h) FROM (SELECT DISTINCT hashtextextended(k, 0) AS h FROM unnest(${sql.val(keys)}::text[]) AS t(k) ORDER BY 1) s`.execute(
    cs.trx,
  );
}

export async function contractContextFor(cs: ChangeSet, ref: { source: string; externalId: string } | undefined): Promise<ContractContext | null> {
  if (!ref) return null;
  const contract = await cs.trx
    .selectFrom('contract')
    .select(['id', 'parsed', 'status'])
    .where('source', '=', ref.source)
    .where('external_id', '=', ref.externalId)
    .executeTakeFirst();
  if (!contract || contract.status !== 'active') return null;
  const parsed = contract.parsed as unknown as ParsedContract;
  const context: ContractContext = { contractId: Number(contract.id), parsed, partyMentions: await partyMentionsOf(cs, Number(contract.id)) };
  // An amendment or side letter: the earlier agreement whose defined terms it uses, when the register holds it.
  const earlier = parsed.earlierAgreements ? await earlierContractOf(cs.trx, context.contractId, parsed) : null;
  if (earlier) context.earlier = { ...earlier, partyMentions: await partyMentionsOf(cs, earlier.contractId) };
  return context;
}

async function partyMentionsOf(cs: ChangeSet, contractId: number): Promise<Map<number, number>> {
  const parties = await cs.trx.selectFrom('contract_party').select(['position', 'mention_id']).where('contract_id', '=', contractId).execute();
  return new Map(parties.map((p) => [p.position, Number(p.mention_id)]));
}

export interface ResolveWithinOptions {
  party?: PartyContext;
  /** Why the mention is resolved again (kept in the event's details). */
  cause?: 'text_changed' | 'contract_arrived' | 'reresolve' | 'contract_changed';
  /** Resolve again even when the content is unchanged (contract arrived, reresolve); the stored hash is kept. */
  force?: boolean;
  /** Runs after the outcome is written and before the event is committed (its ops join the same event). */
  beforeCommit?: (mentionId: number) => Promise<void>;
}

/**
 * The whole resolution inside an open ChangeSet; commits one event when anything changed. Used by the public
 * resolveMention and by contracts, reresolve and review.
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
  const found = await cs.trx
    .selectFrom('mention')
    .select(['id', 'content_hash', 'counterparty_id', 'status', 'evidence'])
    .where('source', '=', prepared.input.source)
    .where('external_id', '=', prepared.input.externalId)
    .executeTakeFirst();
  // A changed contract that keeps a party's name but declares other former or trade names for it resolves it again.
  if (found && !options.force && declaredNamesChanged(found, options.party)) options = { ...options, force: true };
  if (found && found.content_hash === prepared.contentHash && !options.force) {
    const row = await cs.trx.selectFrom('mention').selectAll().where('id', '=', found.id).executeTakeFirstOrThrow();
    return resultOf(cs.trx, canonicalRow('mention', row), { alreadyIngested: true, eventId: null });
  }
  await lockNameNeighbourhood(cs, prepared);
  let previous: Row | undefined;
  let earlier: EarlierDecision | null = null;
  if (found) {
    // Lock order: counterparty, then mention (as everywhere).
    if (found.counterparty_id !== null) await cs.lock('counterparty', [Number(found.counterparty_id)]);
    previous = await cs.require('mention', Number(found.id));
    earlier = earlierDecisionOf(previous, found.content_hash !== prepared.contentHash && !options.force);
    if (previous.counterparty_id !== null && Number(found.counterparty_id) !== previous.counterparty_id) {
      await cs.lock('counterparty', [previous.counterparty_id as number]);
    }
    await detachMention(cs, previous, at);
    await closeOpenItemsOfMention(cs, previous.id as number);
    previous = { ...previous };
  }
  const textChanged = found !== undefined && found.content_hash !== prepared.contentHash && !options.force;
  // A forced re-resolution keeps the stored content hash: the source's own input is what idempotency compares.
  if (found && options.force) prepared = { ...prepared, contentHash: found.content_hash };
  const contract = options.party ? null : await contractContextFor(cs, prepared.input.contract);
  const { model, version } = await currentModel(cs.trx);
  const decided = await decide(cs.trx, prepared, model, {
    mentionId: found ? Number(found.id) : null,
    contract,
    party: options.party ?? null,
    contractAwaited: prepared.input.contract !== undefined && contract === null,
  });
  const outcome = earlier ? askAgain(decided, earlier) : decided;
  if (options.party?.aliases && options.party.aliases.length > 0) outcome.declaredNames = options.party.aliases;
  outcome.evidence.modelVersion = version;
  const existing = found ? await cs.require('mention', Number(found.id)) : undefined;
  const applied = await applyOutcome(cs, prepared, outcome, existing, {
    contractId: options.party?.contractId ?? contract?.contractId ?? null,
    at,
  });
  if (options.beforeCommit) await options.beforeCommit(applied.mention.id as number);
  const type = eventTypeFor(previous, applied, textChanged);
  const eventId = await commitEvent(cs, {
    type,
    actor: who.actor,
    at,
    reason: who.reason,
    requestId: who.requestId,
    details: {
      entity: 'mention',
      mentionId: applied.mention.id,
      status: outcome.status,
      counterpartyId: applied.counterpartyId,
      ...(applied.createdCounterparty ? { createdCounterpartyId: applied.counterpartyId } : {}),
      ...(previous ? { previousStatus: previous.status, previousCounterpartyId: previous.counterparty_id, previousText: previous.text } : {}),
      ...(options.cause ? { cause: options.cause } : textChanged ? { cause: 'text_changed' } : {}),
    },
  });
  return resultOf(cs.trx, applied.mention, {
    alreadyIngested: false,
    eventId,
    reviewItemId: applied.reviewItemId,
    canonicalName: canonicalNameIn(cs, (applied.mention.counterparty_id as number | null) ?? null),
  });
}

/** Whether a linked contract party's stored declared names (recordedAliases) differ from what its contract declares now. */
function declaredNamesChanged(found: { status: string; evidence: unknown }, party: PartyContext | undefined): boolean {
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
