/**
 * The confirmed-name rule: what a person decided about a name settles the next mention written the same way.
 *
 * A reviewer who answered "same" for "Priya Lorby" → counterparty #23 should not be asked again when the next
 * contract names "Priya Lorby" with nothing else to go on. A mention that would go to review links instead when:
 *   - its name, normalised, equals the text of a mention a person linked to the best candidate (a review decision
 *     "same", or a split: `confirmed_by` set, db/queries/confirmed-mention-texts.ts);
 *   - the pair's own score is above newAt (no conflict of country, legal form or identifier pulled it down) and
 *     nothing holds it back (a distinguishing word, names that disagree);
 *   - no other counterparty scores above newAt: two counterparties a person could confuse stay a question.
 * The explanation names the confirmed mention and who confirmed it. The rule needs the register's decisions, so
 * `cpreg evaluate` (which has none) is not affected by it.
 *
 * Why not re-estimate the weights from the same decisions (`cpreg adjust-weights`)? On the demo's scenario at 1,000
 * contracts (docs/matching.md, "Decisions and like cases") the first 50 review items were all equal names of five
 * people with nothing else known; "same" on all 50 shifts the exact-name level by +0.254 bits for every pair, which
 * would link any equal name with nothing else known, a company's bare name too. The decisions are about names, and
 * the rule uses them for those names only.
 */
import type { MatchModel } from '../../../resolvers/score/index.ts';
import type { Queryable } from '../../../db/queries/util.ts';
import { confirmedMentionTexts } from '../../../db/queries/confirmed-mention-texts.ts';
import { analyse } from '../matching/analysis.ts';
import type { ScoredCandidate } from '../matching/candidates.ts';

export interface ConfirmedName {
  mentionId: number;
  text: string;
  confirmedBy: string;
}

/** The mention a person confirmed that lets `best` link, or null when the rule does not apply. */
export async function confirmedNameFor(
  db: Queryable,
  normalised: string,
  best: ScoredCandidate,
  candidates: readonly ScoredCandidate[],
  model: Pick<MatchModel, 'newAt'>,
): Promise<ConfirmedName | null> {
  if (best.pair.heldBackBy || best.pair.override !== null || !(best.score > model.newAt)) return null;
  if (candidates.some((c) => c.counterpartyId !== best.counterpartyId && c.score > model.newAt)) return null;
  // A confirmed text is recorded as a name of the counterparty: unless the matched name is this very name, no
  // confirmed mention can be (and the register is not asked).
  if (normalised === '' || analyse(best.matchedName).normalised !== normalised) return null;
  for (const m of await confirmedMentionTexts(db, best.counterpartyId)) {
    if (analyse(m.text).normalised === normalised) return m;
  }
  return null;
}
