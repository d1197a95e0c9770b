/**
 * The comparison features of a pair and their agreement levels. A feature the pair cannot show (no legal form on
 * one side, no country, no identifiers) has level null: it then weighs nothing, in EM and in scoring alike.
 *
 * The name bands are cut on the symmetric soft TF-IDF of the core tokens (compare/softTfIdf) and, to catch typos
 * that break a rare word, on Jaro–Winkler of the whole core. Cut points are placed where the dev split of the ROR
 * data shows the match share changing fastest (docs/matching.md); the weights themselves are learned (EM).
 */
import { ACTIVITY_WORDS, type IdfTable, type NameDifference } from '../compare/index.ts';

export const FEATURE_LEVELS = {
  /**
   * Core names: the kind of difference first (compare/compareNameTokens), then its degree. exact_weak is an equal
   * core that says little (four letters or fewer, or only words common in the names compared): value-specific
   * agreement weights in two classes (frequency-based matching, Winkler 1989).
   */
  name: [
    'exact',
    'exact_weak',
    'near_exact',
    'typo',
    'abbreviation',
    'extra_words',
    'extra_activity',
    'extra_place',
    'very_high',
    'high',
    'medium',
    'low',
    'none',
  ],
  /** Legal-form compatibility (compare/compareLegalForms). */
  legalForm: ['same_family', 'compatible', 'conflicting', 'different_jurisdiction'],
  /** Jurisdiction / country agreement (compare/compareJurisdictions). */
  jurisdiction: ['same', 'compatible', 'conflicting'],
  /** One side a short acronym, the other not: does it fit the other's initials (compare/compareAcronym)? */
  acronym: ['initials', 'initials_with_stop_words', 'none'],
  /** Parenthesised place qualifiers on both sides ("(Europe)" vs "(Asia)"). */
  qualifier: ['same', 'different'],
  /** Shared weak identifiers (phone, domain, bank account): "same or affiliated". */
  sharedContact: ['shared', 'none_shared'],
  /**
   * Words that tell otherwise agreeing names apart (compare/compareNameTokens): a series number, a branch, another
   * activity word of one group. Not observed when there are none. (A place on one side only is a name level,
   * extra_place: it depends on how far the rest of the names agree.)
   */
  distinct: ['number', 'branch', 'activity'],
} as const;

export type FeatureName = keyof typeof FEATURE_LEVELS;
export type FeatureLevel<F extends FeatureName> = (typeof FEATURE_LEVELS)[F][number];
export const FEATURE_NAMES = Object.keys(FEATURE_LEVELS) as FeatureName[];

/** One pair's comparison: each feature's level name, or null when it cannot be observed. */
export type ComparisonLevels = { [F in FeatureName]: FeatureLevel<F> | null };

/** Name bands: soft TF-IDF cut points (a pair takes the highest band either score reaches). */
export const NAME_BANDS: readonly { level: FeatureLevel<'name'>; softTfIdf: number; jaroWinkler: number }[] = [
  { level: 'very_high', softTfIdf: 0.9, jaroWinkler: 0.97 },
  { level: 'high', softTfIdf: 0.75, jaroWinkler: 0.93 },
  { level: 'medium', softTfIdf: 0.55, jaroWinkler: 0.88 },
  { level: 'low', softTfIdf: 0.3, jaroWinkler: 0.8 },
];

/** The band of two different cores by degree: the highest band either score reaches. */
export function nameLevel(coreEqual: boolean, soft: number, jw: number): FeatureLevel<'name'> {
  if (coreEqual) return 'exact';
  for (const band of NAME_BANDS) if (soft >= band.softTfIdf || jw >= band.jaroWinkler) return band.level;
  return 'none';
}

/**
 * The name level from the kind of difference; `informative` is asked only of equal cores, `band` only of different
 * ones (both cost a little, and this runs for every candidate pair). Equal or
 * extra-word names whose only difference is a place on one side ("Halvard Capital" / "Halvard Capital (UK)") are
 * extra_place.
 */
export function nameLevelOfKind(difference: NameDifference, informative: () => boolean, band: () => FeatureLevel<'name'>): FeatureLevel<'name'> {
  const kind = difference.kind;
  if (
    difference.distinguishing?.kind === 'place' &&
    (kind === 'equal' || kind === 'near_equal' || kind === 'typo' || kind === 'abbreviation' || kind === 'extra_words')
  )
    return 'extra_place';
  switch (kind) {
    case 'equal':
      return informative() ? 'exact' : 'exact_weak';
    case 'near_equal':
      // "FirstBank" / "First Bank": the same letters, but common words say as little as an equal common core.
      return informative() ? 'near_exact' : 'exact_weak';
    case 'typo':
      return 'typo';
    case 'abbreviation':
      return 'abbreviation';
    case 'extra_words':
      // "Wirecard Bank AG" / "Wirecard AG": an added activity word names another company of the group as often as not.
      return difference.extra.some((t) => ACTIVITY_WORDS.has(t)) ? 'extra_activity' : 'extra_words';
    default:
      return band();
  }
}

/** An equal core this short (letters and digits, spaces not counted) is weak evidence however rare. */
export const WEAK_CORE_MAX_LENGTH = 4;
/** A token in at least this share of the names compared (and in at least COMMON_MIN_NAMES of them) is common. */
export const COMMON_TOKEN_SHARE = 0.001;
export const COMMON_MIN_NAMES = 5;

/**
 * Whether an equal core is informative: longer than WEAK_CORE_MAX_LENGTH and holding at least one token that is
 * not common among the names the IDF table was built from. The document frequency is read back from the smoothed
 * IDF (compare/smoothedIdf): df = (1 + N) / e^(idf − 1) − 1.
 */
export function isInformativeCore(tokens: readonly string[], idf: IdfTable): boolean {
  let letters = 0;
  for (const t of tokens) letters += t.length;
  if (letters <= WEAK_CORE_MAX_LENGTH) return false;
  return tokens.some(rareIn(idf)) || expectedNamesWith(tokens, idf) < RARE_COMBINATION_BELOW;
}

/**
 * Common words can still make a rare name together ("Deutsche Bank Luxembourg"): an equal core whose words would,
 * falling independently, meet in fewer than one name of those compared is informative. The value-specific
 * agreement weight of frequency-based matching (Winkler 1989) uses the frequency of the whole value; the product
 * of word frequencies estimates it when the value itself is not counted. Measured on the LEI dev data (0.1 … 3):
 * below 1, recall rises by 2.6 points at unchanged precision; at 3 precision drops.
 */
export const RARE_COMBINATION_BELOW = 1;

/** How many of the names compared would hold every one of these tokens if tokens fell independently: N·Π(df/N). */
export function expectedNamesWith(tokens: readonly string[], idf: IdfTable): number {
  const n = idf.documentCount;
  if (n === 0) return 0;
  let expected = n;
  for (const token of new Set(tokens)) expected *= documentFrequency(idf, token) / n;
  return expected;
}

function documentFrequency(idf: IdfTable, token: string): number {
  const n = idf.documentCount;
  return Math.max(1, (1 + n) / Math.exp(idf.idf(token) - 1) - 1);
}

/** Whether a token is rare among the names the IDF table was built from (not common: see COMMON_TOKEN_SHARE). */
export function rareIn(idf: IdfTable): (token: string) => boolean {
  const n = idf.documentCount;
  const commonAt = Math.max(COMMON_MIN_NAMES, COMMON_TOKEN_SHARE * n);
  return (token) => (1 + n) / Math.exp(idf.idf(token) - 1) - 1 < commonAt - 1e-9;
}

/** The distinct level of a difference: a place is not one (see extra_place). */
export function distinctLevelOf(difference: NameDifference | null): FeatureLevel<'distinct'> | null {
  const kind = difference?.distinguishing?.kind;
  return kind === undefined || kind === 'place' ? null : kind;
}

/** The levels as indices into FEATURE_LEVELS, in FEATURE_NAMES order (null stays null): EM's input. */
export function levelIndices(levels: ComparisonLevels): (number | null)[] {
  return FEATURE_NAMES.map((f) => {
    const level = levels[f];
    return level === null ? null : (FEATURE_LEVELS[f] as readonly string[]).indexOf(level);
  });
}
