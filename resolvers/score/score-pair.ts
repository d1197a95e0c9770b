/**
 * Scores one pair under a Fellegi–Sunter model: the sum of the weights of each observed feature level, with
 * identifier evidence on top — an equal valid strong identifier links (score +Infinity) and a cannot-link
 * (different LEIs, different numbers in one register, a recorded reviewer decision) forbids (−Infinity).
 * The explanation lists every feature, its level and its weight, so every score can be read back.
 */
import type { MatchRecord } from '../block/index.ts';
import type { IdfTable } from '../compare/index.ts';
import { compareRecords, type Comparison } from './compare-records.ts';
import { FEATURE_NAMES, type ComparisonLevels } from './features.ts';
import { featureWeights, type Decision, type MatchModel } from './match-model.ts';
import { decidePair, linkHeldBackBy, ruledScore } from './decision-rules.ts';

export interface FeatureExplanation {
  feature: string;
  /** The level observed, or null when the pair cannot show it (weight 0). */
  level: string | null;
  weight: number;
}

export interface PairScore {
  /** The score decisions and clustering use: identifiers as ±Infinity, a held-back pair capped below linkAt. */
  score: number;
  /** The plain sum of the feature weights. */
  rawScore: number;
  /** Why the pair may not link automatically whatever its sum (decisionRules), or null. */
  heldBackBy: string | null;
  /** The words that set the names apart, when any (e.g. ["ii"] for a series number). */
  distinguishingTokens: string[];
  decision: Decision;
  /** Set when identifiers decided: 'decisive_identifier' links, 'cannot_link' forbids. */
  override: 'decisive_identifier' | 'cannot_link' | null;
  explanation: FeatureExplanation[];
  /** Identifier findings in words (equal LEI, different registration numbers, shared phone…). */
  identifierNotes: string[];
  softTfIdf: number;
  jaroWinkler: number;
}

export interface ScoreOptions {
  /** A recorded reviewer decision that these two are different entities. */
  cannotLink?: boolean;
}

export function scorePair(a: MatchRecord, b: MatchRecord, model: MatchModel, idf: IdfTable, options: ScoreOptions = {}): PairScore {
  return scoreComparison(compareRecords(a, b, idf), model, options);
}

export function scoreComparison(comparison: Comparison, model: MatchModel, options: ScoreOptions = {}): PairScore {
  const explanation = explainLevels(comparison.levels, model);
  const rawScore = explanation.reduce((sum, e) => sum + e.weight, 0);
  const ids = comparison.identifiers;
  let override: PairScore['override'] = null;
  if (options.cannotLink || ids?.cannotLink) override = 'cannot_link';
  else if (ids?.decisive) override = 'decisive_identifier';
  const score = ruledScore(rawScore, override, comparison.levels, model);
  const identifierNotes = [...(ids?.explanation ?? [])];
  if (options.cannotLink) identifierNotes.push('a reviewer recorded that these are different entities');
  return {
    score,
    rawScore,
    heldBackBy: override === null ? linkHeldBackBy(comparison.levels) : null,
    distinguishingTokens: comparison.difference?.distinguishing?.tokens ?? [],
    decision: decidePair(score, comparison.levels, model),
    override,
    explanation,
    identifierNotes,
    softTfIdf: comparison.softTfIdf,
    jaroWinkler: comparison.jaroWinkler,
  };
}

/** Weight of each feature level under the model; features the model does not know weigh 0 and say so. */
export function explainLevels(levels: ComparisonLevels, model: MatchModel): FeatureExplanation[] {
  return FEATURE_NAMES.map((feature) => {
    const level = levels[feature];
    const params = model.features[feature];
    if (level === null || !params) return { feature, level, weight: 0 };
    const k = params.levels.indexOf(level);
    // A model stored by an earlier version may lack a level added since: that level weighs 0 (no evidence).
    if (k < 0) return { feature, level, weight: 0 };
    return { feature, level, weight: featureWeights(params)[k] as number };
  });
}

/** The levels as indices into FEATURE_LEVELS, in FEATURE_NAMES order: EM's input. */
export function levelVector(levels: ComparisonLevels, model: MatchModel): (number | null)[] {
  return FEATURE_NAMES.map((feature) => {
    const level = levels[feature];
    if (level === null) return null;
    const params = model.features[feature];
    const k = params ? params.levels.indexOf(level) : -1;
    return k < 0 ? null : k;
  });
}
