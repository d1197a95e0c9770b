/**
 * The one-line summaries of a decision that go into its explanation (what a reviewer and an integrator read first):
 * each says which rule decided and, when a word held the pair back, which word.
 */
import type { MatchModel } from '../../../resolvers/score/index.ts';
import { jsonScore, type ScoredCandidate } from '../matching/candidates.ts';

/** Why a mention became a new counterparty, given its best candidate (if any). */
export function newSummary(best: ScoredCandidate | undefined, model: Pick<MatchModel, 'newAt'>): string {
  if (!best) return 'no candidate in the register: a new counterparty';
  const scored = `best candidate ${best.canonicalName} scored ${jsonScore(best.score)}`;
  const { heldBackBy, distinguishingTokens } = best.pair;
  if (heldBackBy && distinguishingTokens.length > 0) {
    return `${scored}, held back: ${heldBackBy} (${distinguishingTokens.join(', ')}): a new counterparty`;
  }
  if (best.score <= model.newAt) return `${scored}, at or below the new-record threshold (${model.newAt}): a new counterparty`;
  return `${scored} but its name has nothing in common with this one: a new counterparty`;
}

/** Why a mention whose best candidate was not held back by a word goes to a person. */
export function reviewSummary(best: ScoredCandidate, model: Pick<MatchModel, 'newAt' | 'linkAt'>): string {
  const scored = `best candidate ${best.canonicalName} scored ${jsonScore(best.score)}`;
  if (best.score > model.newAt)
    return `${scored}, between the new-record threshold (${model.newAt}) and the link threshold (${model.linkAt}): a person decides`;
  // Below newAt a pair is reviewed only when its names agree closely (resolvers/score/decision-rules.ts).
  const level = best.pair.explanation.find((f) => f.feature === 'name')?.level;
  return `${scored}, at or below the new-record threshold (${model.newAt}), but the names agree closely${level ? ` (${level})` : ''}: one company or two, a person decides`;
}
