/**
 * A mention that matches no current name may be a counterparty's former name, as a contract declared it
 * ("Tollaby Logistics Limited (formerly Tollaby Cold Storage Ltd)": the name is stored on the counterparty with kind
 * `former`). Precision first, because a company's old name can later be registered by an unrelated company:
 *
 *   linked   the former name is the same name (equal core, no conflicting legal form), its pair decides `link`, no
 *            other counterparty bears a similar current name (scoring above newAt) and no other counterparty declared
 *            the same former name;
 *   review   any other former-name score above newAt: a person decides, told that the match is a former name.
 *
 * The explanation names the former name, the counterparty and the contract that declared it.
 */
import type { MatchModel } from '../../../resolvers/score/index.ts';
import type { Queryable } from '../../../db/queries/util.ts';
import { nameOrigin } from '../../../db/queries/names.ts';
import { jsonScore, type ScoredCandidate } from '../matching/candidates.ts';
import type { Outcome } from './decide.ts';

export interface FormerNameInput {
  text: string;
  model: MatchModel;
  /** The candidates scored on their former names only (matching/candidates.ts scoredCandidatesWithFormer). */
  former: readonly ScoredCandidate[];
  /** The candidates on current names, already scored: a similar current name elsewhere forbids a link. */
  current: readonly ScoredCandidate[];
  /** Whether matching on current names ended in review (then a former name never turns it into a new record). */
  currentStatus: 'new' | 'review';
  base: Record<string, unknown>;
}

function levelOf(c: ScoredCandidate, feature: string): string | null {
  return c.pair.explanation.find((e) => e.feature === feature)?.level ?? null;
}

function sameName(c: ScoredCandidate): boolean {
  return levelOf(c, 'name') === 'exact' && levelOf(c, 'legalForm') !== 'conflicting';
}

async function declaredIn(db: Queryable, c: ScoredCandidate): Promise<string> {
  const origin = await nameOrigin(db, c.counterpartyId, c.matchedName, 'former');
  if (origin?.contractExternalId) return `contract ${origin.contractSource ?? ''}/${origin.contractExternalId}`;
  return origin?.source ? `source ${origin.source}` : 'the register';
}

/** The outcome through a declared former name, or null when no former name scores above newAt. */
export async function throughFormerName(db: Queryable, input: FormerNameInput): Promise<Outcome | null> {
  const { model, text } = input;
  const former = input.former.filter((c) => c.score !== -Infinity && c.score > model.newAt);
  const best = former[0];
  if (best === undefined) return null;
  const bearers = input.current.filter((c) => c.counterpartyId !== best.counterpartyId && c.score !== -Infinity && c.score > model.newAt);
  // Matching on current names already put another counterparty up for review: that review stands.
  if (input.currentStatus === 'review' && bearers.length > 0) return null;
  const rival = former.find((c) => c.counterpartyId !== best.counterpartyId && c.score >= model.linkAt);
  const where = await declaredIn(db, best);
  const declared = `"${best.matchedName}" is a former name of ${best.canonicalName}, declared in ${where}`;
  const evidence = {
    ...input.base,
    via: 'former_name',
    formerName: best.matchedName,
    declaredIn: where,
    candidates: [...former, ...input.current]
      .slice(0, 5)
      .map((c) => ({ counterpartyId: c.counterpartyId, name: c.canonicalName, matchedName: c.matchedName, score: jsonScore(c.score) })),
    matchedName: best.matchedName,
    features: best.pair.explanation,
    identifierNotes: best.pair.identifierNotes,
    heldBackBy: best.pair.heldBackBy,
  };
  if (best.pair.decision === 'link' && sameName(best) && bearers.length === 0 && rival === undefined) {
    return {
      status: 'linked',
      counterpartyId: best.counterpartyId,
      score: jsonScore(best.score),
      recordName: true,
      nameKind: 'former',
      evidence: {
        ...evidence,
        summary: `${declared}: "${text}" is linked through that declared former name (score ${jsonScore(best.score)}, the link threshold is ${model.linkAt})`,
      },
    };
  }
  const why = rival
    ? `another counterparty, ${rival.canonicalName}, declared the same former name`
    : bearers.length > 0
      ? `${(bearers[0] as ScoredCandidate).canonicalName} bears a similar name today`
      : !sameName(best)
        ? 'the name is only close to that former name, not the same'
        : `the score ${jsonScore(best.score)} is below the link threshold (${model.linkAt})${best.pair.heldBackBy ? ` or held back: ${best.pair.heldBackBy}` : ''}`;
  return {
    status: 'review',
    counterpartyId: best.counterpartyId,
    score: jsonScore(best.score),
    recordName: false,
    evidence: { ...evidence, summary: `${declared}; not linked automatically because ${why}: a person decides` },
  };
}
