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
 */
import { mentionOutcome } from '../../../db/queries/mentions.ts';
import { resolveInContract, type DeclaredName, type InContractResolution, type ParsedContract } from '../../../resolvers/terms/index.ts';
import type { EarlierContract } from '../earlier-contract.ts';
import type { MatchModel } from '../../../resolvers/score/index.ts';
import { isStrongScheme, type NameKind, type ResolutionStatus } from '../../../resolvers/vocabulary.ts';
import type { Queryable } from '../../../db/queries/util.ts';
import { cannotLinksOf } from '../../../db/queries/review.ts';
import { survivorsOf } from '../../../db/queries/counterparties.ts';
import { analyse } from '../matching/analysis.ts';
import { jsonScore, scoredCandidatesWithFormer, type Probe, type ScoredCandidate } from '../matching/candidates.ts';
import type { BatchReads } from '../matching/batch-reads.ts';
import type { PreparedMention } from './prepare.ts';
import { throughFormerName } from './former-name.ts';
import { confirmedNameFor } from './confirmed-name.ts';
import { ownEntityMatch } from './own-entity-match.ts';
import { newSummary, reviewSummary } from './summaries.ts';

export interface ContractContext {
  contractId: number;
  parsed: ParsedContract;
  /** Mention id of each party, by position. */
  partyMentions: Map<number, number>;
  /** The earlier agreement whose defined terms this one uses (an amendment, a side letter), when the register holds it. */
  earlier?: EarlierContract & { partyMentions: Map<number, number> };
}

/**
 * A term this contract does not define, bound instead by the earlier agreement whose defined terms it says it uses
 * ("the Supplier" in a side letter to a supply agreement): that agreement's party, with the way it was found.
 */
function throughEarlier(contract: ContractContext, text: string, r: InContractResolution): { r: InContractResolution; terms: ContractContext } | null {
  const earlier = contract.earlier;
  if (!earlier || r.status !== 'unbound_term' || r.term !== undefined) return null;
  const there = resolveInContract(earlier.parsed, text);
  if (there.status !== 'bound' || !there.party) return null;
  const found =
    earlier.how === 'reference' ? 'by its reference number' : earlier.how === 'title_and_date' ? 'by its title and date' : 'by its title and parties';
  const explanation = `"${text}" is not defined in this contract, which uses the defined terms of ${earlier.title ?? 'an earlier agreement'} (${earlier.source}/${earlier.externalId}, found ${found}); there it is the term for ${there.party.name}`;
  return { r: { ...there, explanation }, terms: { contractId: earlier.contractId, parsed: earlier.parsed, partyMentions: earlier.partyMentions } };
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

function summaryOf(c: ScoredCandidate) {
  return { counterpartyId: c.counterpartyId, name: c.canonicalName, matchedName: c.matchedName, score: jsonScore(c.score) };
}

/** Counterparties this mention must not join: mention-level cannot-links, followed to their survivors, and `also` (decide's
 * `alsoExclude`: reresolve leaves out the counterparty a mention created, services/register/reresolve.ts). */
async function excludedFor(db: Queryable, mentionId: number | null, also: readonly number[] = []): Promise<Set<number>> {
  const links = mentionId === null ? [] : (await cannotLinksOf(db, [], mentionId)).filter((l) => l.mentionId === mentionId);
  if (links.length === 0) return new Set(also);
  const survivors = await survivorsOf(db, [...new Set(links.map((l) => l.counterpartyId))]);
  return new Set([...links.map((l) => survivors.get(l.counterpartyId) ?? l.counterpartyId), ...also]);
}

type DecideContext = {
  mentionId: number | null;
  contract: ContractContext | null;
  party: PartyContext | null;
  contractAwaited: boolean;
  reads?: BatchReads;
  alsoExclude?: readonly number[];
};

export async function decide(db: Queryable, prepared: PreparedMention, model: MatchModel, context: DecideContext): Promise<Outcome> {
  const base = { thresholds: { linkAt: model.linkAt, newAt: model.newAt } };
  let probe: Probe = { analysis: prepared.analysis, country: prepared.input.country ?? null, identifiers: prepared.identifiers };
  let via = 'register';
  let term: string | undefined;

  if (!context.party) {
    if (context.contract) {
      const own = resolveInContract(context.contract.parsed, prepared.text);
      const earlier = throughEarlier(context.contract, prepared.text, own);
      const r = earlier?.r ?? own;
      const terms = earlier?.terms ?? context.contract;
      if (r.status === 'collective_term' || r.status === 'unbound_term' || r.status === 'not_a_party') {
        return { status: r.status, score: null, recordName: false, evidence: { ...base, summary: r.explanation, via: 'contract', term: r.term ?? null } };
      }
      if (r.party) {
        const partyMentionId = terms.partyMentions.get(r.party.index);
        const party = partyMentionId === undefined ? undefined : await mentionOutcome(db, partyMentionId);
        const evidence = {
          ...base,
          summary: r.explanation,
          via: r.alias ? 'declared_name' : earlier ? 'earlier_agreement_term' : 'defined_term',
          term: r.term ?? null,
          ...(r.alias ? { declaredName: r.alias } : {}),
          ...(earlier && context.contract.earlier
            ? {
                earlierAgreement: {
                  contractId: context.contract.earlier.contractId,
                  source: context.contract.earlier.source,
                  externalId: context.contract.earlier.externalId,
                  how: context.contract.earlier.how,
                  statement: context.contract.earlier.statement,
                },
              }
            : {}),
          contractId: terms.contractId,
          partyMentionId: partyMentionId ?? null,
        };
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
        // The party itself is not settled yet: match the party's own name against the register instead.
        const partyRecord = terms.parsed.parties[r.party.index];
        if (partyRecord) {
          probe = {
            analysis: analyse(partyRecord.name, partyRecord.jurisdiction ?? prepared.input.country),
            country: partyRecord.jurisdiction ?? prepared.input.country ?? null,
            identifiers: prepared.identifiers,
          };
          via = 'defined_term_party_name';
          term = r.term;
        }
      }
    } else if (prepared.analysis.partyStatus === 'needs_binding') {
      const summary = context.contractAwaited
        ? `"${prepared.text}" needs its contract to bind it, and that contract has not arrived yet; it is resolved again when it does`
        : `"${prepared.text}" is a pronoun or role word and no contract was named to bind it`;
      return { status: 'unbound_term', score: null, recordName: false, evidence: { ...base, summary, via: 'analysis' } };
    }
  }
  if (prepared.analysis.partyStatus === 'not_a_party' && via === 'register') {
    return {
      status: 'not_a_party',
      score: null,
      recordName: false,
      evidence: { ...base, summary: `"${prepared.text}" does not name a party (name analysis)`, via: 'analysis' },
    };
  }

  const own = await ownEntityMatch(db, probe, model, context.party?.ownEntity === true, context.reads);
  if (own || context.party?.ownEntity) {
    if (own) {
      return {
        status: 'own_entity',
        ownEntityId: own.id,
        score: jsonScore(own.score),
        recordName: false,
        evidence: {
          ...base,
          summary: `"${prepared.text}" is our own entity ${own.name}${own.via ? ` (declared ${own.via.kind.replace(/_/g, ' ')} name "${own.via.name}")` : ''}`,
          via: 'own_entities',
          ...(own.via ? { ownEntityName: own.via } : {}),
        },
      };
    }
  }

  const exclude = await excludedFor(db, context.mentionId, context.alsoExclude);
  const { current: candidates, former } = await scoredCandidatesWithFormer(db, probe, model, exclude, context.reads);
  const top = candidates.slice(0, 5).map(summaryOf);
  const best = candidates.find((c) => c.score !== -Infinity);
  const common = { ...base, via, ...(term ? { term } : {}), candidates: top };
  // No link on a current name: a former name a contract declared may still name the party (resolve/former-name.ts).
  const orFormerName = async (outcome: Outcome & { status: 'new' | 'review' }): Promise<Outcome> =>
    (await throughFormerName(db, { text: prepared.text, model, former, current: candidates, currentStatus: outcome.status, base })) ?? outcome;
  // The pair's own decision (resolvers/score/decisionRules): at or below newAt, or names with nothing in common.
  if (!best || best.pair.decision === 'new') {
    return orFormerName({
      status: 'new',
      score: best ? jsonScore(best.score) : null,
      recordName: true,
      evidence: {
        ...common,
        summary: newSummary(best, model),
        features: best?.pair.explanation ?? [],
        identifierNotes: best?.pair.identifierNotes ?? [],
        ...(best?.pair.heldBackBy ? { heldBackBy: best.pair.heldBackBy, distinguishingTokens: best.pair.distinguishingTokens } : {}),
        ignoredIdentifiers: prepared.ignoredIdentifiers,
      },
      confirmedByIdentifier: prepared.identifiers.find((i) => isStrongScheme(i.scheme))?.scheme,
    });
  }
  const detail = {
    ...common,
    matchedName: best.matchedName,
    features: best.pair.explanation,
    identifierNotes: best.pair.identifierNotes,
    override: best.pair.override,
    heldBackBy: best.pair.heldBackBy,
    distinguishingTokens: best.pair.distinguishingTokens,
    ignoredIdentifiers: prepared.ignoredIdentifiers,
  };
  if (best.pair.override === 'decisive_identifier') {
    return {
      status: 'linked',
      counterpartyId: best.counterpartyId,
      score: jsonScore(best.score),
      recordName: true,
      confirmedByIdentifier: prepared.identifiers.find((i) => isStrongScheme(i.scheme))?.scheme ?? 'identifier',
      evidence: { ...detail, summary: `a strong identifier equals that of ${best.canonicalName}: ${best.pair.identifierNotes.join('; ')}` },
    };
  }
  const rival = candidates.find((c) => c !== best && c.counterpartyId !== best.counterpartyId && c.score >= model.linkAt);
  if (best.score >= model.linkAt && !rival) {
    return {
      status: 'linked',
      counterpartyId: best.counterpartyId,
      score: jsonScore(best.score),
      recordName: true,
      evidence: {
        ...detail,
        summary: `"${prepared.text}" matches ${best.canonicalName} with score ${jsonScore(best.score)} (the link threshold is ${model.linkAt})`,
      },
    };
  }
  const confirmed = rival ? null : await confirmedNameFor(db, probe.analysis.normalised, best, candidates, model);
  if (confirmed) {
    return {
      status: 'linked',
      counterpartyId: best.counterpartyId,
      score: jsonScore(best.score),
      recordName: true,
      evidence: {
        ...detail,
        summary: `"${prepared.text}" is the name a person linked to ${best.canonicalName} before (mention ${confirmed.mentionId}, "${confirmed.text}", confirmed by ${confirmed.confirmedBy}); its score ${jsonScore(best.score)} is below the link threshold (${model.linkAt}) and no other counterparty comes close`,
        confirmedName: confirmed,
      },
    };
  }
  const why = rival
    ? `two counterparties score at or above the link threshold (${best.canonicalName}, ${rival.canonicalName}): a person decides`
    : best.pair.heldBackBy && best.pair.rawScore >= model.linkAt
      ? `best candidate ${best.canonicalName} scored ${jsonScore(best.pair.rawScore)} but is held back from a link: ${best.pair.heldBackBy}${best.pair.distinguishingTokens.length > 0 ? ` (${best.pair.distinguishingTokens.join(', ')})` : ''}; a person decides`
      : reviewSummary(best, model);
  return orFormerName({
    status: 'review',
    counterpartyId: best.counterpartyId,
    score: jsonScore(best.score),
    recordName: false,
    evidence: { ...detail, summary: why },
  });
}
