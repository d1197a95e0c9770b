/**
 * The register step of decide (resolve/decide.ts): the mention (or the contract party a term stands for) scored
 * against the counterparties it may join, then, in order, new (no candidate, or the pair decides new), linked by a
 * decisive strong identifier, linked at or above linkAt without a rival, linked below it through a name a person
 * confirmed (resolve/confirmed-name.ts), or review. A new or review outcome may still
 * become a link or a review through a declared former name (resolve/former-name.ts).
 */
import { cannotLinksOf } from '../../../db/queries/review.ts';
import { survivorsOf } from '../../../db/queries/counterparties.ts';
import type { Queryable } from '../../../db/queries/util.ts';
import type { MatchModel } from '../../../resolvers/score/index.ts';
import { isStrongScheme } from '../../../resolvers/vocabulary.ts';
import { jsonScore, scoredCandidatesWithFormer, type ScoredCandidate } from '../matching/candidates.ts';
import type { DecideContext, DecisionBase, Lookup, Outcome } from './decide.ts';
import { confirmedNameFor, type ConfirmedName } from './confirmed-name.ts';
import { throughFormerName } from './former-name.ts';
import type { PreparedMention } from './prepare.ts';
import type { BatchReads } from '../matching/batch-reads.ts';
import { newSummary, reviewSummary } from './summaries.ts';

/** What every register outcome's explanation carries: thresholds, how it was looked up, the top five candidates. */
type Common = DecisionBase & { via: Lookup['via']; term?: string; candidates: ReturnType<typeof summaryOf>[] };

export async function fromRegisterCandidates(
  db: Queryable,
  prepared: PreparedMention,
  model: MatchModel,
  context: DecideContext,
  lookup: Lookup,
  base: DecisionBase,
): Promise<Outcome> {
  const exclude = await excludedFor(db, context.mentionId, context.alsoExclude, context.reads);
  const { current: candidates, former } = await scoredCandidatesWithFormer(db, lookup.probe, model, exclude, context.reads);
  const best = candidates.find((c) => c.score !== -Infinity);
  const common: Common = { ...base, via: lookup.via, ...(lookup.term ? { term: lookup.term } : {}), candidates: candidates.slice(0, 5).map(summaryOf) };
  // No link on a current name: a former name a contract declared may still name the party (resolve/former-name.ts).
  const orFormerName = async (outcome: Outcome & { status: 'new' | 'review' }): Promise<Outcome> =>
    (await throughFormerName(db, { text: prepared.text, model, former, current: candidates, currentStatus: outcome.status, base })) ?? outcome;
  // The pair's own decision (resolvers/score/decisionRules): at or below newAt, or names with nothing in common.
  if (!best || best.pair.decision === 'new') return orFormerName(newOutcome(best, prepared, model, common));
  const detail = detailOf(best, prepared, common);
  if (best.pair.override === 'decisive_identifier') return decisiveLink(best, prepared, detail);
  const rival = candidates.find((c) => c !== best && c.counterpartyId !== best.counterpartyId && c.score >= model.linkAt);
  if (best.score >= model.linkAt && !rival) return scoreLink(best, prepared, model, detail);
  // What a person decided about this very name settles it (resolve/confirmed-name.ts).
  const confirmed = rival ? null : await confirmedNameFor(db, lookup.probe.analysis.normalised, best, candidates, model);
  if (confirmed) return confirmedLink(best, prepared, model, detail, confirmed);
  return orFormerName(reviewOutcome(best, rival, model, detail));
}

/** Counterparties this mention must not join: mention-level cannot-links, followed to their survivors, and `also` (decide's
 * `alsoExclude`: reresolve leaves out the counterparty a mention created, services/register/reresolve.ts). */
async function excludedFor(db: Queryable, mentionId: number | null, also: readonly number[] = [], reads?: BatchReads): Promise<Set<number>> {
  // A batch read them ahead for all its stored mentions (matching/batch-reads.ts); a single resolve reads them here.
  const ahead = mentionId === null ? undefined : reads?.cannotLinksOf(mentionId);
  if (ahead) return new Set([...ahead, ...also]);
  const links = mentionId === null ? [] : (await cannotLinksOf(db, [], mentionId)).filter((l) => l.mentionId === mentionId);
  if (links.length === 0) return new Set(also);
  const survivors = await survivorsOf(db, [...new Set(links.map((l) => l.counterpartyId))]);
  return new Set([...links.map((l) => survivors.get(l.counterpartyId) ?? l.counterpartyId), ...also]);
}

function summaryOf(c: ScoredCandidate) {
  return { counterpartyId: c.counterpartyId, name: c.canonicalName, matchedName: c.matchedName, score: jsonScore(c.score) };
}

function newOutcome(best: ScoredCandidate | undefined, prepared: PreparedMention, model: MatchModel, common: Common): Outcome & { status: 'new' } {
  return {
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
  };
}

/** The best candidate's explanation, shared by a link and a review. */
type Detail = ReturnType<typeof detailOf>;

function detailOf(best: ScoredCandidate, prepared: PreparedMention, common: Common) {
  return {
    ...common,
    matchedName: best.matchedName,
    features: best.pair.explanation,
    identifierNotes: best.pair.identifierNotes,
    override: best.pair.override,
    heldBackBy: best.pair.heldBackBy,
    distinguishingTokens: best.pair.distinguishingTokens,
    ignoredIdentifiers: prepared.ignoredIdentifiers,
  };
}

/** A strong identifier equal to the best candidate's decides the link, whatever the names' score. */
function decisiveLink(best: ScoredCandidate, prepared: PreparedMention, detail: Detail): Outcome {
  return {
    status: 'linked',
    counterpartyId: best.counterpartyId,
    score: jsonScore(best.score),
    recordName: true,
    confirmedByIdentifier: prepared.identifiers.find((i) => isStrongScheme(i.scheme))?.scheme ?? 'identifier',
    evidence: { ...detail, summary: `a strong identifier equals that of ${best.canonicalName}: ${best.pair.identifierNotes.join('; ')}` },
  };
}

/** The best candidate at or above linkAt with no other counterparty there too. */
function scoreLink(best: ScoredCandidate, prepared: PreparedMention, model: MatchModel, detail: Detail): Outcome {
  const summary = `"${prepared.text}" matches ${best.canonicalName} with score ${jsonScore(best.score)} (the link threshold is ${model.linkAt})`;
  return { status: 'linked', counterpartyId: best.counterpartyId, score: jsonScore(best.score), recordName: true, evidence: { ...detail, summary } };
}

/** Below linkAt, but the mention's name is one a person linked to the best candidate before. */
function confirmedLink(best: ScoredCandidate, prepared: PreparedMention, model: MatchModel, detail: Detail, confirmed: ConfirmedName): Outcome {
  const by = `mention ${confirmed.mentionId}, "${confirmed.text}", confirmed by ${confirmed.confirmedBy}`;
  const summary = `"${prepared.text}" is the name a person linked to ${best.canonicalName} before (${by}); its score ${jsonScore(best.score)} is below the link threshold (${model.linkAt}) and no other counterparty comes close`;
  return {
    status: 'linked',
    counterpartyId: best.counterpartyId,
    score: jsonScore(best.score),
    recordName: true,
    evidence: { ...detail, summary, confirmedName: confirmed },
  };
}

/** A person decides: a rival above linkAt, a candidate held back by a word, or a score between the thresholds. */
function reviewOutcome(best: ScoredCandidate, rival: ScoredCandidate | undefined, model: MatchModel, detail: Detail): Outcome & { status: 'review' } {
  const { heldBackBy, distinguishingTokens, rawScore } = best.pair;
  const why = rival
    ? `two counterparties score at or above the link threshold (${best.canonicalName}, ${rival.canonicalName}): a person decides`
    : heldBackBy && rawScore >= model.linkAt
      ? `best candidate ${best.canonicalName} scored ${jsonScore(rawScore)} but is held back from a link: ${heldBackBy}${distinguishingTokens.length > 0 ? ` (${distinguishingTokens.join(', ')})` : ''}; a person decides`
      : reviewSummary(best, model);
  return { status: 'review', counterpartyId: best.counterpartyId, score: jsonScore(best.score), recordName: false, evidence: { ...detail, summary: why } };
}
