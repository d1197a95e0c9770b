/**
 * Contracts: store one (source, external id, title, text), read its parties and defined terms with
 * resolvers/terms, resolve each party into the register (as a mention of source `contract:<source>`), keep each
 * party's role and terms, then resolve again the mentions that named this contract before it arrived.
 * All in one transaction: one `created` event for the contract, one event per party mention.
 */
import { createHash } from 'node:crypto';
import { checkContractText, parseParties, type ParsedContract } from '../../resolvers/terms/index.ts';
import type { ActorInput, RegisterContext } from './context.ts';
import { RegisterError, invalid } from './errors.ts';
import { commitEvent } from './history/commit.ts';
import type { ChangeSet } from './state/change-set.ts';
import { write } from './transaction.ts';
import { detachMention } from './upkeep.ts';
import { prepareMention } from './resolve/prepare.ts';
import { resolveWithin, type ResolveResult } from './resolve/resolve-mention.ts';
import { mentionOutcome, mentionById, mentionsWaitingForContract } from '../../db/queries/mentions.ts';
import { earlierContractOf } from './earlier-contract.ts';
import { contractToStore, definedTermIdsOf, getContract, partiesFromPosition, partyOfMention, type ContractView } from '../../db/queries/contracts.ts';
import { analyse } from './matching/analysis.ts';
import { canonicalRow, type StateTable } from './state/tables.ts';
import { MAX_ID_LENGTH, MAX_TITLE_LENGTH, type MentionInput } from '../../resolvers/vocabulary.ts';

export interface ContractInput {
  source: string;
  externalId: string;
  title?: string;
  text: string;
}

export interface StoreContractResult {
  contractId: number;
  /** True when the same contract with the same text was stored before: nothing was done. */
  alreadyStored: boolean;
  /** True when a contract with this source and external id was stored before (with this text or another one). */
  previouslyStored: boolean;
  parties: (ResolveResult & { position: number; role: string | null; terms: string[] })[];
  /** Mentions that waited for this contract and were resolved again. */
  reresolved: ResolveResult[];
  contract: ContractView;
}

export const PARTY_SOURCE_PREFIX = 'contract:';

function check(input: ContractInput): void {
  for (const field of ['source', 'externalId'] as const) {
    if (typeof input[field] !== 'string' || input[field].trim() === '') throw invalid(field, 'must be a non-empty string');
    if (input[field].length > MAX_ID_LENGTH) throw invalid(field, `is longer than ${MAX_ID_LENGTH} characters`);
  }
  if (input.title !== undefined && (typeof input.title !== 'string' || input.title.length > MAX_TITLE_LENGTH)) {
    throw invalid('title', `must be a string of at most ${MAX_TITLE_LENGTH} characters`);
  }
  if (typeof input.text !== 'string') throw invalid('text', 'must be a string');
  const problem = checkContractText(input.text);
  if (problem) throw invalid('text', problem.message);
}

function partyMention(input: ContractInput, parsed: ParsedContract, index: number): MentionInput {
  const party = parsed.parties[index]!;
  return {
    source: `${PARTY_SOURCE_PREFIX}${input.source}`,
    externalId: `${input.externalId}#party-${index + 1}`,
    text: party.name,
    contract: { source: input.source, externalId: input.externalId },
    ...(party.role ? { role: party.role } : {}),
    ...(party.jurisdiction ? { country: party.jurisdiction } : {}),
    ...(party.address ? { address: party.address.slice(0, 2000) } : {}),
    identifiers: party.identifiers.filter((i) => !i.problem).map((i) => ({ scheme: i.scheme, value: i.value, ...(i.label ? { label: i.label } : {}) })),
  };
}

/** The defined terms of a parse as rows to store: each normalised term once, the parties' before the collective ones. */
function termRows(parsed: ParsedContract): { term: string; normalised: string; party_index: number | null; collective: boolean }[] {
  const seen = new Set<string>();
  const rows: ReturnType<typeof termRows> = [];
  const add = (term: string, partyIndex: number | null, collective: boolean) => {
    const normalised = analyse(term).normalised || term.toLowerCase();
    if (seen.has(normalised)) return;
    seen.add(normalised);
    rows.push({ term, normalised, party_index: partyIndex, collective });
  };
  for (const [index, party] of parsed.parties.entries()) for (const term of party.terms) add(term, index, false);
  for (const c of parsed.collectiveTerms) add(c.term, null, true);
  return rows;
}

/** A changed contract's terms are replaced (a new one has none to read). Buffered: the inserts reach the database together. */
async function replaceTerms(cs: ChangeSet, contractId: number, terms: ReturnType<typeof termRows>, isNew: boolean): Promise<void> {
  if (!isNew) {
    const old = await definedTermIdsOf(cs.trx, contractId);
    await cs.lock('defined_term', old);
    for (const t of old) await cs.delete('defined_term', t);
  }
  for (const t of terms) await cs.insert('defined_term', { contract_id: contractId, ...t, evidence: {} });
}

/** Whether this write inserted the row (its op not yet in an event). False sends the caller to the database, as before. */
function insertedHere(cs: ChangeSet, table: StateTable, rowId: number): boolean {
  return cs.ops.some((op) => op.op === 'insert' && op.table === table && op.row.id === rowId);
}

/** A changed contract with fewer parties: the party mentions beyond the new count are withdrawn (not deleted). */
async function withdrawVanishedParties(cs: ChangeSet, contractId: number, count: number, who: ActorInput, at: Date): Promise<void> {
  const gone = await partiesFromPosition(await cs.flushed(), contractId, count);
  for (const party of gone) {
    const peek = await mentionOutcome(cs.trx, party.mentionId);
    if (!peek) throw new RegisterError('CONFLICT', `mention ${party.mentionId} of contract ${contractId} vanished`);
    if (peek.counterparty_id !== null) await cs.lock('counterparty', [peek.counterparty_id]);
    const mention = await cs.require('mention', party.mentionId);
    if (mention.status === 'withdrawn') continue;
    await detachMention(cs, mention, at, 'withdrawn');
    await cs.update('mention', mention.id, { status: 'withdrawn', own_entity_id: null, confirmed_by: who.actor, updated_at: at.toISOString() });
    await commitEvent(cs, {
      type: 'withdrawn',
      actor: who.actor,
      at,
      reason: who.reason ?? 'no longer a party of the changed contract',
      requestId: who.requestId,
      details: { entity: 'mention', mentionId: mention.id, contractId },
    });
  }
}

/** Resolves a stored mention again in its own contract (a contract it waited for has arrived); null when a person settled it. */
async function resolveAgain(ctx: RegisterContext, cs: ChangeSet, mentionId: number, who: ActorInput): Promise<ResolveResult | null> {
  const row = await mentionById(cs.trx, mentionId);
  if (!row) throw new RegisterError('CONFLICT', `mention ${mentionId} vanished while it was resolved again`);
  const m = canonicalRow('mention', row);
  if (m.status === 'withdrawn' || m.status === 'set_aside' || m.confirmed_by || !m.contract_source || !m.contract_external_id) return null;
  const again = prepareMention(
    {
      source: m.source,
      externalId: m.external_id,
      text: m.text,
      contract: { source: m.contract_source, externalId: m.contract_external_id },
      ...(m.role ? { role: m.role } : {}),
      ...(m.country ? { country: m.country } : {}),
      ...(m.address ? { address: m.address } : {}),
      identifiers: m.identifiers,
    },
    { lenientIdentifiers: true },
  );
  return resolveWithin(ctx, cs, again, who, { force: true, cause: 'contract_arrived' });
}

export interface StoreContractOptions {
  /**
   * Refuse (INVALID_INPUT, details.reason `no_parties_found`) a text in which the parser finds no party, instead of
   * storing a contract without parties: what a file import wants, where such a file is most likely no contract.
   */
  requireParties?: boolean;
}

export async function storeContract(
  ctx: RegisterContext,
  input: ContractInput,
  who: ActorInput,
  options: StoreContractOptions = {},
): Promise<StoreContractResult> {
  check(input);
  const contentHash = createHash('sha256')
    .update(JSON.stringify([input.title ?? null, input.text]))
    .digest('hex');
  return write(ctx, async (cs) => {
    const at = ctx.now();
    const iso = at.toISOString();
    // The stored contract and our own entities in one round trip; the text is parsed with the entities as they are
    // in this transaction (parsing takes no lock: nothing is held while it runs).
    const { existing, ownNames } = await contractToStore(cs.trx, input.source, input.externalId);
    const parsed = parseParties(input.text, { ownEntities: ownNames });
    if (options.requireParties && parsed.parties.length === 0) {
      throw new RegisterError('INVALID_INPUT', `text: ${parsed.reason?.message ?? 'no party was recognised'}`, { field: 'text', reason: 'no_parties_found' });
    }
    const prepared = parsed.parties.map((_, i) => prepareMention(partyMention(input, parsed, i), { lenientIdentifiers: true }));
    if (existing && existing.contentHash === contentHash) {
      const contract = (await getContract(cs.trx, existing.id))!;
      return { contractId: contract.id, alreadyStored: true, previouslyStored: true, parties: [], reresolved: [], contract };
    }
    const terms = termRows(parsed);
    // The ids of the rows it adds in one statement, and the contract, its terms and its event in one more (buffered).
    // A new contract's parties are new rows; an id left over (a party mention linked before) is a harmless gap.
    await cs.reserveIds({ contract: existing ? 0 : 1, defined_term: terms.length, contract_party: existing ? 0 : parsed.parties.length });
    let contractId: number;
    const values = { title: input.title ?? null, text: input.text, content_hash: contentHash, parsed, status: 'active' as const, updated_at: iso };
    if (existing) {
      contractId = existing.id;
      await cs.require('contract', contractId);
      await cs.update('contract', contractId, values);
    } else {
      const row = await cs.insert('contract', { source: input.source, external_id: input.externalId, ...values, created_at: iso });
      contractId = row.id;
    }
    await replaceTerms(cs, contractId, terms, !existing);
    await commitEvent(cs, {
      type: existing ? 'mention_changed' : 'created',
      actor: who.actor,
      at,
      reason: who.reason,
      requestId: who.requestId,
      details: { entity: 'contract', contractId, source: input.source, externalId: input.externalId, parties: parsed.parties.length },
    });
    await cs.flush();
    const parties: StoreContractResult['parties'] = [];
    for (const [index, p] of prepared.entries()) {
      const party = parsed.parties[index]!;
      const keepParty = async (mentionId: number) => {
        // A mention inserted by this write is no contract's party yet: nothing to look up.
        const link = insertedHere(cs, 'mention', mentionId) ? undefined : await partyOfMention(cs.trx, mentionId);
        const row = { contract_id: contractId, mention_id: mentionId, position: index, role: party.role, terms: party.terms };
        if (link) {
          await cs.require('contract_party', link.id);
          await cs.update('contract_party', link.id, row);
        } else {
          await cs.insert('contract_party', row);
        }
      };
      const result = await resolveWithin(ctx, cs, p, who, {
        party: { contractId, position: index, ownEntity: party.ownEntity, aliases: party.aliases },
        cause: existing ? 'contract_changed' : undefined,
        beforeCommit: keepParty,
      });
      if (result.alreadyIngested) {
        await keepParty(result.mentionId);
        if (cs.ops.length > 0) {
          await commitEvent(cs, {
            type: 'mention_changed',
            actor: who.actor,
            at,
            reason: who.reason,
            requestId: who.requestId,
            details: { entity: 'contract_party', contractId, mentionId: result.mentionId, position: index },
          });
        }
      }
      parties.push({ ...result, position: index, role: party.role, terms: party.terms });
    }
    // The parties' rows are read below (which ones vanished, which mentions wait, the contract answered): written first.
    if (existing) await withdrawVanishedParties(cs, contractId, parsed.parties.length, who, at);
    const reresolved: ResolveResult[] = [];
    const waiting = await mentionsWaitingForContract(await cs.flushed(), input.source, input.externalId, contractId);
    for (const mentionId of waiting.awaiting) {
      const again = await resolveAgain(ctx, cs, mentionId, who);
      if (again) reresolved.push(again);
    }
    // Amendments and side letters that arrived first: their unbound terms may be this contract's (issue 16 item 9).
    for (const amendment of waiting.amendments) {
      const earlier = await earlierContractOf(cs.trx, amendment.contractId, amendment.parsed as ParsedContract);
      if (earlier?.contractId !== contractId) continue;
      for (const mentionId of amendment.mentionIds) {
        const again = await resolveAgain(ctx, cs, mentionId, who);
        if (again) reresolved.push(again);
      }
    }
    const contract = await getContract(await cs.flushed(), contractId);
    if (!contract) throw new RegisterError('CONFLICT', `contract ${contractId} vanished while it was stored`);
    return { contractId, alreadyStored: false, previouslyStored: existing !== undefined, parties, reresolved, contract };
  });
}
