/**
 * The contract-terms step of decide (resolve/decide.ts), for a mention that is not itself a contract party: the
 * contract's own terms, then, for a term it does not define, those of the earlier agreement it says it uses. A term
 * for a set of parties, an unbound term or a non-party ends the decision; a term bound to a party takes that party's
 * settled outcome, or, while the party is not settled yet, hands the party's own name on to the register.
 */
import { mentionOutcome } from '../../../db/queries/mentions.ts';
import type { Queryable } from '../../../db/queries/util.ts';
import { resolveInContract, type InContractResolution } from '../../../resolvers/terms/index.ts';
import { analyse } from '../matching/analysis.ts';
import type { ContractContext, DecisionBase, Lookup, Outcome } from './decide.ts';
import type { PreparedMention } from './prepare.ts';

/** The contract whose terms bound the mention: its id, its parse and its parties' mentions. */
type TermsContract = Pick<ContractContext, 'contractId' | 'parsed' | 'partyMentions'>;

/** Where a term was bound: the resolution and the contract whose terms bound it (this one or the earlier agreement). */
interface Binding {
  r: InContractResolution;
  terms: TermsContract;
  /** Bound through the earlier agreement's terms. */
  throughEarlier: boolean;
}

/** An outcome that ends the decision, the party name the register is asked about instead, or null (the mention's own name). */
export async function throughContractTerms(
  db: Queryable,
  prepared: PreparedMention,
  contract: ContractContext,
  base: DecisionBase,
): Promise<Outcome | Lookup | null> {
  const { r, terms, throughEarlier } = bindingOf(contract, prepared.text);
  if (r.status === 'collective_term' || r.status === 'unbound_term' || r.status === 'not_a_party') {
    return { status: r.status, score: null, recordName: false, evidence: { ...base, summary: r.explanation, via: 'contract', term: r.term ?? null } };
  }
  if (!r.party) return null;
  const partyMentionId = terms.partyMentions.get(r.party.index);
  const party = partyMentionId === undefined ? undefined : await mentionOutcome(db, partyMentionId);
  const evidence = termEvidence({ r, terms, throughEarlier }, contract, partyMentionId, base);
  if (party?.status === 'own_entity' && party.own_entity_id !== null) {
    return { status: 'own_entity', ownEntityId: Number(party.own_entity_id), score: null, recordName: false, evidence };
  }
  if ((party?.status === 'linked' || party?.status === 'new') && party.counterparty_id !== null) {
    // A declared other name is recorded with its kind: a former name never competes as a current name.
    return {
      status: 'linked',
      counterpartyId: Number(party.counterparty_id),
      score: null,
      recordName: r.status === 'match',
      ...(r.alias ? { nameKind: r.alias.kind } : {}),
      evidence,
    };
  }
  return partyNameLookup(terms, r, prepared);
}

function bindingOf(contract: ContractContext, text: string): Binding {
  const own = resolveInContract(contract.parsed, text);
  const earlier = throughEarlier(contract, text, own);
  return earlier ? { ...earlier, throughEarlier: true } : { r: own, terms: contract, throughEarlier: false };
}

/**
 * A term this contract does not define, bound instead by the earlier agreement whose defined terms it says it uses
 * ("the Supplier" in a side letter to a supply agreement): that agreement's party, with the way it was found.
 */
function throughEarlier(contract: ContractContext, text: string, r: InContractResolution): { r: InContractResolution; terms: TermsContract } | null {
  const earlier = contract.earlier;
  if (!earlier || r.status !== 'unbound_term' || r.term !== undefined) return null;
  const there = resolveInContract(earlier.parsed, text);
  if (there.status !== 'bound' || !there.party) return null;
  const found =
    earlier.how === 'reference' ? 'by its reference number' : earlier.how === 'title_and_date' ? 'by its title and date' : 'by its title and parties';
  const explanation = `"${text}" is not defined in this contract, which uses the defined terms of ${earlier.title ?? 'an earlier agreement'} (${earlier.source}/${earlier.externalId}, found ${found}); there it is the term for ${there.party.name}`;
  return { r: { ...there, explanation }, terms: { contractId: earlier.contractId, parsed: earlier.parsed, partyMentions: earlier.partyMentions } };
}

/** The explanation of a term bound to a party: which term, how it was bound, and the party's contract and mention. */
function termEvidence({ r, terms, throughEarlier }: Binding, contract: ContractContext, partyMentionId: number | undefined, base: DecisionBase) {
  return {
    ...base,
    summary: r.explanation,
    via: r.alias ? 'declared_name' : throughEarlier ? 'earlier_agreement_term' : 'defined_term',
    term: r.term ?? null,
    ...(r.alias ? { declaredName: r.alias } : {}),
    ...(throughEarlier && contract.earlier
      ? {
          earlierAgreement: {
            contractId: contract.earlier.contractId,
            source: contract.earlier.source,
            externalId: contract.earlier.externalId,
            how: contract.earlier.how,
            statement: contract.earlier.statement,
          },
        }
      : {}),
    contractId: terms.contractId,
    partyMentionId: partyMentionId ?? null,
  };
}

/** The party itself is not settled yet: its own name (and jurisdiction) is matched against the register instead. */
function partyNameLookup(terms: TermsContract, r: InContractResolution, prepared: PreparedMention): Lookup | null {
  const partyRecord = r.party ? terms.parsed.parties[r.party.index] : undefined;
  if (!partyRecord) return null;
  return {
    probe: {
      analysis: analyse(partyRecord.name, partyRecord.jurisdiction ?? prepared.input.country),
      country: partyRecord.jurisdiction ?? prepared.input.country ?? null,
      identifiers: prepared.identifiers,
    },
    via: 'defined_term_party_name',
    term: r.term,
  };
}
