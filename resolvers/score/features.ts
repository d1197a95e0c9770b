/**
 * The comparison features of a pair and their agreement levels. A feature the pair cannot show (no legal form on
 * one side, no country, no identifiers) has level null: it then weighs nothing, in EM and in scoring alike.
 *
 * The name bands are cut on the symmetric soft TF-IDF of the core tokens (compare/softTfIdf) and, to catch typos
 * that break a rare word, on Jaro–Winkler of the whole core. Cut points are placed where the dev split of the ROR
 * data shows the match share changing fastest (docs/matching.md); the weights themselves are learned (EM).
 */
export const FEATURE_LEVELS = {
  /** Core-name similarity. */
  name: ['exact', 'very_high', 'high', 'medium', 'low', 'none'],
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

export function nameLevel(coreEqual: boolean, soft: number, jw: number): FeatureLevel<'name'> {
  if (coreEqual) return 'exact';
  for (const band of NAME_BANDS) if (soft >= band.softTfIdf || jw >= band.jaroWinkler) return band.level;
  return 'none';
}

/** The levels as indices into FEATURE_LEVELS, in FEATURE_NAMES order (null stays null): EM's input. */
export function levelIndices(levels: ComparisonLevels): (number | null)[] {
  return FEATURE_NAMES.map((f) => {
    const level = levels[f];
    return level === null ? null : (FEATURE_LEVELS[f] as readonly string[]).indexOf(level);
  });
}
