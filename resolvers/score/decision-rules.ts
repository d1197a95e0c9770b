/**
 * The one decision logic for a scored pair, used alike by the register (single and batch resolution) and by
 * `cpreg evaluate`, so that the evaluation measures what the register does:
 *
 *   link    a decisive strong identifier, or a score at or above linkAt that no rule below holds back
 *   review  a score between newAt and linkAt that a person can judge: the names agree at least in part
 *           (name level above "low"), or the pair shares a contact (phone, domain, bank account); names that agree
 *           closely (equal, near-equal, one typo, an abbreviation) down to CONFLICT_BELOW
 *   new     a cannot-link, a score at or below newAt, or names with nothing in common: country and legal form
 *           alone never send a pair to a person
 *
 * Rules that hold a pair back, whatever the sum (precision first; each is named in the explanation):
 *   - the names themselves disagree (name level low or none): context supports a name match, it cannot stand in
 *     for one. The pair's score is capped just below linkAt: it never links (and, per the rule above, is not
 *     worth a person's time unless a contact is shared);
 *   - a distinguishing word differs: a series number ("Fund II" / "Fund III"), a branch ("… London Branch"), or
 *     another activity word of one group ("Alder Securities" / "Alder Bank"). Measured on the LEI names, such pairs
 *     are almost never one company, so the score is capped below newAt and below CONFLICT_BELOW: a strong
 *     negative, new, and a conflict that keeps a cluster from joining the two through a third name.
 */
import type { ComparisonLevels, FeatureLevel } from './features.ts';
import { FEATURE_LEVELS, FEATURE_NAMES } from './features.ts';
import type { Decision, MatchModel } from './match-model.ts';

export type Override = 'decisive_identifier' | 'cannot_link' | null;

const NAME_DISAGREES: ReadonlySet<FeatureLevel<'name'>> = new Set(['low', 'none']);
const DISTINCT_HOLDS_BACK: ReadonlySet<FeatureLevel<'distinct'>> = new Set(['number', 'branch', 'activity']);

/** How far below the threshold a held-back pair's score is capped. */
export const HELD_BACK_MARGIN = 1e-3;

/**
 * A pair scoring below this many bits is evidence that the two are different entities (the likelihood ratio favours
 * a non-match): a conflict that keeps their clusters apart. Not newAt: newAt marks where a person is no longer
 * asked, which can sit well above the point where the evidence turns against a match.
 */
export const CONFLICT_BELOW = 0;

/** What holds a pair back: its names disagree, or a distinguishing word differs; null when nothing does. */
export type Hold = 'names_disagree' | 'distinguishing_word' | null;

/**
 * A distinguishing word is looked at first: its cap is the stricter (below newAt and CONFLICT_BELOW), so two group
 * names whose other words also disagree ("Alder Bank (Asia)" / "Alder Securities (Asia)") stay a conflict.
 */
export function holdOf(levels: ComparisonLevels): Hold {
  if (levels.distinct !== null && DISTINCT_HOLDS_BACK.has(levels.distinct)) return 'distinguishing_word';
  if (levels.name !== null && NAME_DISAGREES.has(levels.name)) return 'names_disagree';
  return null;
}

/** Why this pair may not link automatically, in words, or null when nothing holds it back. */
export function linkHeldBackBy(levels: ComparisonLevels): string | null {
  const hold = holdOf(levels);
  if (hold === 'names_disagree') return `the names disagree (name level ${levels.name})`;
  if (hold === 'distinguishing_word') return `a distinguishing word differs (${levels.distinct})`;
  return null;
}

/** The highest score a held-back pair may keep (Infinity when nothing holds it back). */
export function capOf(hold: Hold, model: Pick<MatchModel, 'linkAt' | 'newAt'>): number {
  if (hold === 'names_disagree') return model.linkAt - HELD_BACK_MARGIN;
  if (hold === 'distinguishing_word') return Math.min(model.newAt, CONFLICT_BELOW) - HELD_BACK_MARGIN;
  return Infinity;
}

/** Whether a person can add something to this pair: the names agree at least in part, or a contact is shared. */
export function worthReview(levels: ComparisonLevels): boolean {
  if (levels.sharedContact === 'shared') return true;
  return levels.name === null || !NAME_DISAGREES.has(levels.name);
}

/** The score clustering and candidate ranking use: identifiers decide, a held-back pair is capped (capOf). */
export function ruledScore(raw: number, override: Override, levels: ComparisonLevels, model: Pick<MatchModel, 'linkAt' | 'newAt'>): number {
  if (override === 'cannot_link') return -Infinity;
  if (override === 'decisive_identifier') return Infinity;
  return Math.min(raw, capOf(holdOf(levels), model));
}

/**
 * How clusters are formed from ruled scores, the same in the register's batches and in `cpreg evaluate`: an edge at
 * or above linkAt joins two clusters unless some scored pair across them is below CONFLICT_BELOW (or newAt, when
 * that is lower): a conflict.
 */
export function clusterRulesOf(model: Pick<MatchModel, 'linkAt' | 'newAt'>): { linkAt: number; conflictBelow: number } {
  return { linkAt: model.linkAt, conflictBelow: Math.min(model.newAt, CONFLICT_BELOW) };
}

/**
 * Names that agree closely: equal, or equal but for spacing, order, one typo or an abbreviation. Such a pair is worth a
 * person's time down to CONFLICT_BELOW even when context pulls its score under newAt ("Kestrel Tooling GmbH" /
 * "Kestrel Tooling AG": one company converted, or two; a person can tell). Other pairs are reviewed above newAt only,
 * and so are close names whose qualifiers differ on both sides ("Ardent Bank (Lao)" / "Ardent Bank (Samoa)",
 * "Merrow Fund Two (EUR)" / "… (SEK)"): among the candidate pairs of `cpreg evaluate` on the LEI dev names, 187 such
 * pairs are two companies and 1 is one, so a person would be asked about siblings. (On the ROR dev split 18 of 44
 * are one organisation, spelling variants of the qualifier such as "(Arizona)" / "(AZ)"; they are reviewed when
 * their score is above newAt.)
 */
const CLOSE_NAMES: ReadonlySet<FeatureLevel<'name'>> = new Set(['exact', 'near_exact', 'typo', 'abbreviation']);

/** The decision for one pair from its ruled score (ruledScore) and its levels. */
export function decidePair(score: number, levels: ComparisonLevels, model: Pick<MatchModel, 'linkAt' | 'newAt'>): Decision {
  if (score === Infinity) return 'link';
  if (score === -Infinity) return 'new';
  if (score >= model.linkAt) return 'link';
  const close = levels.name !== null && CLOSE_NAMES.has(levels.name) && levels.qualifier !== 'different';
  return reviewable(score, worthReview(levels), close, model) ? 'review' : 'new';
}

function reviewable(score: number, worth: boolean, close: boolean, model: Pick<MatchModel, 'newAt'>): boolean {
  if (!worth) return false;
  return score > model.newAt || (close && score > Math.min(model.newAt, CONFLICT_BELOW));
}

/**
 * The same rules over level indices (FEATURE_LEVELS order, −1 = not observed), for batches that keep only indices:
 * which name levels disagree and which distinct levels hold a link back.
 */
export interface IndexedRules {
  name: number;
  distinct: number;
  sharedContact: number;
  nameDisagrees: boolean[];
  nameClose: boolean[];
  distinctHoldsBack: boolean[];
  shared: number;
  qualifier: number;
  qualifierDiffers: number;
}

export function indexedRules(): IndexedRules {
  return {
    name: FEATURE_NAMES.indexOf('name'),
    distinct: FEATURE_NAMES.indexOf('distinct'),
    sharedContact: FEATURE_NAMES.indexOf('sharedContact'),
    nameDisagrees: FEATURE_LEVELS.name.map((l) => NAME_DISAGREES.has(l)),
    nameClose: FEATURE_LEVELS.name.map((l) => CLOSE_NAMES.has(l)),
    distinctHoldsBack: FEATURE_LEVELS.distinct.map((l) => DISTINCT_HOLDS_BACK.has(l)),
    shared: FEATURE_LEVELS.sharedContact.indexOf('shared'),
    qualifier: FEATURE_NAMES.indexOf('qualifier'),
    qualifierDiffers: FEATURE_LEVELS.qualifier.indexOf('different'),
  };
}

/** holdOf over one row of level indices. */
export function holdAt(levels: Int8Array, row: number, rules: IndexedRules): Hold {
  const distinct = levels[row + rules.distinct] as number;
  if (distinct >= 0 && rules.distinctHoldsBack[distinct] === true) return 'distinguishing_word';
  const name = levels[row + rules.name] as number;
  return name >= 0 && rules.nameDisagrees[name] === true ? 'names_disagree' : null;
}

/** worthReview over one row of level indices. */
export function worthReviewAt(levels: Int8Array, row: number, rules: IndexedRules): boolean {
  if ((levels[row + rules.sharedContact] as number) === rules.shared) return true;
  const name = levels[row + rules.name] as number;
  return name < 0 || rules.nameDisagrees[name] !== true;
}

/** decidePair over one row of level indices and its ruled score. */
export function decidePairAt(score: number, levels: Int8Array, row: number, rules: IndexedRules, model: Pick<MatchModel, 'linkAt' | 'newAt'>): Decision {
  if (score === Infinity) return 'link';
  if (score === -Infinity) return 'new';
  if (score >= model.linkAt) return 'link';
  const name = levels[row + rules.name] as number;
  const close = name >= 0 && rules.nameClose[name] === true && (levels[row + rules.qualifier] as number) !== rules.qualifierDiffers;
  return reviewable(score, worthReviewAt(levels, row, rules), close, model) ? 'review' : 'new';
}
