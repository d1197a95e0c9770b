/**
 * The decision for one mention, read-only: contract terms first (the contract's own, then, for a term it does not
 * define, those of the earlier agreement it says it uses), then our own entities, then the register.
 *
 *   not_a_party      the name analysis (or the contract) says it names no party
 *   unbound_term     a pronoun or role word that its contract does not bind (or whose contract has not arrived)
 *   collective_term  a term of the contract for a set of parties ("the Parties")
 *   own_entity       one of our own legal entities (scored like a counterparty, linked at linkAt)
 *   linked           a decisive strong identifier, or the best candidate at or above linkAt and unambiguous, or a
 *                    declared former name under the rules of resolve/former-name.ts, or a name a person linked to
 *                    the best candidate before (resolve/confirmed-name.ts)
 *   review           the best candidate between newAt and linkAt, or two different candidates both above linkAt, or
 *                    a former name too uncertain to link
 *   new              nothing above newAt (on current or former names): a new counterparty
 *
 * One function per step: contract terms (resolve/contract-terms.ts), the name analysis, our own entities
 * (resolve/own-entity-match.ts), the register's candidates (resolve/register-candidates.ts, then former names).
 */
import type { DeclaredName, ParsedContract } from '../../../resolvers/terms/index.ts';
import type { EarlierContract } from '../earlier-contract.ts';
import type { MatchModel } from '../../../resolvers/score/index.ts';
import type { NameKind, ResolutionStatus } from '../../../resolvers/vocabulary.ts';
import type { Queryable } from '../../../db/queries/util.ts';
import { jsonScore, type Probe } from '../matching/candidates.ts';
import type { BatchReads } from '../matching/batch-reads.ts';
import type { PreparedMention } from './prepare.ts';
import { throughContractTerms } from './contract-terms.ts';
import { ownEntityMatch, type OwnEntityMatch } from './own-entity-match.ts';
import { fromRegisterCandidates } from './register-candidates.ts';

export interface ContractContext {
  contractId: number;
  parsed: ParsedContract;
  /** Mention id of each party, by position. */
  partyMentions: Map<number, number>;
  /** The earlier agreement whose defined terms this one uses (an amendment, a side letter), when the register holds it. */
  earlier?: EarlierContract & { partyMentions: Map<number, number> };
}

export interface PartyContext {
  contractId: number;
  position: number;
  ownEntity: boolean;
  /** Other names the contract declares for this party ("formerly X", "d/b/a X"): stored on its counterparty. */
  aliases?: DeclaredName[];
}

export interface Outcome {
  status: Extract<ResolutionStatus, 'linked' | 'new' | 'review' | 'own_entity' | 'not_a_party' | 'unbound_term' | 'collective_term'>;
  counterpartyId?: number;
  ownEntityId?: number;
  score: number | null;
  /** The explanation kept with the mention and answered to the caller. */
  evidence: Record<string, unknown>;
  /** Link through a strong identifier: the name is confirmed by it (canonical-value rule 1). */
  confirmedByIdentifier?: string;
  /** The mention's own name is recorded on the counterparty (false for terms bound through a contract). */
  recordName: boolean;
  /** The kind the recorded name gets when it is not the mention's own current name (a declared former name). */
  nameKind?: NameKind;
  /** Other names of the counterparty declared beside the mention (a contract party's "formerly X"): stored too. */
  declaredNames?: DeclaredName[];
}

export type DecideContext = {
  mentionId: number | null;
  contract: ContractContext | null;
  party: PartyContext | null;
  contractAwaited: boolean;
  reads?: BatchReads;
  alsoExclude?: readonly number[];
};

/** What every explanation carries: the thresholds it was decided under. */
export type DecisionBase = { thresholds: { linkAt: number; newAt: number } };

/**
 * What is looked up in the register (own entities, then counterparties): the mention's own name, or the name of the
 * contract party a defined term stands for while that party is not settled yet; `via` and `term` say which.
 */
export interface Lookup {
  probe: Probe;
  via: 'register' | 'defined_term_party_name';
  term?: string;
}

/** The steps in their order; each answers an outcome or hands on to the next. */
export async function decide(db: Queryable, prepared: PreparedMention, model: MatchModel, context: DecideContext): Promise<Outcome> {
  const base: DecisionBase = { thresholds: { linkAt: model.linkAt, newAt: model.newAt } };
  let lookup: Lookup = { probe: { analysis: prepared.analysis, country: prepared.input.country ?? null, identifiers: prepared.identifiers }, via: 'register' };
  // A contract party is its own name; any other mention may be a term of its contract first.
  if (!context.party) {
    const bound = context.contract
      ? await throughContractTerms(db, prepared, context.contract, base)
      : unboundWithoutContract(prepared, context.contractAwaited, base);
    if (bound && 'status' in bound) return bound;
    if (bound) lookup = bound;
  }
  if (prepared.analysis.partyStatus === 'not_a_party' && lookup.via === 'register') return notAParty(prepared.text, base);
  const own = await ownEntityMatch(db, lookup.probe, model, context.party?.ownEntity === true, context.reads);
  if (own) return ownEntityOutcome(prepared.text, own, base);
  return fromRegisterCandidates(db, prepared, model, context, lookup, base);
}

/** A pronoun or role word with no contract to bind it (none named, or the named one has not arrived yet). */
function unboundWithoutContract(prepared: PreparedMention, contractAwaited: boolean, base: DecisionBase): Outcome | null {
  if (prepared.analysis.partyStatus !== 'needs_binding') return null;
  const summary = contractAwaited
    ? `"${prepared.text}" needs its contract to bind it, and that contract has not arrived yet; it is resolved again when it does`
    : `"${prepared.text}" is a pronoun or role word and no contract was named to bind it`;
  return { status: 'unbound_term', score: null, recordName: false, evidence: { ...base, summary, via: 'analysis' } };
}

function notAParty(text: string, base: DecisionBase): Outcome {
  return {
    status: 'not_a_party',
    score: null,
    recordName: false,
    evidence: { ...base, summary: `"${text}" does not name a party (name analysis)`, via: 'analysis' },
  };
}

function ownEntityOutcome(text: string, own: OwnEntityMatch, base: DecisionBase): Outcome {
  return {
    status: 'own_entity',
    ownEntityId: own.id,
    score: jsonScore(own.score),
    recordName: false,
    evidence: {
      ...base,
      summary: `"${text}" is our own entity ${own.name}${own.via ? ` (declared ${own.via.kind.replace(/_/g, ' ')} name "${own.via.name}")` : ''}`,
      via: 'own_entities',
      ...(own.via ? { ownEntityName: own.via } : {}),
    },
  };
}
