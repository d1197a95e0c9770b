/**
 * Scores one pair under a Fellegi–Sunter model: the sum of the weights of each observed feature level, with
 * identifier evidence on top — an equal valid strong identifier links (score +Infinity) and a cannot-link
 * (different LEIs, different numbers in one register, a recorded reviewer decision) forbids (−Infinity).
 * The explanation lists every feature, its level and its weight, so every score can be read back.
 */
import type { MatchRecord } from '../block/matchRecord.ts';
import type { IdfTable } from '../compare/index.ts';
import { compareRecords, type Comparison } from './compareRecords.ts';
import { FEATURE_NAMES, type ComparisonLevels } from './features.ts';
import { decide, featureWeights, type Decision, type MatchModel } from './matchModel.ts';

export interface FeatureExplanation {
  feature: string;
  /** The level observed, or null when the pair cannot show it (weight 0). */
  level: string | null;
  weight: number;
}

export interface PairScore {
  score: number;
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
  let score = explanation.reduce((sum, e) => sum + e.weight, 0);
  const ids = comparison.identifiers;
  let override: PairScore['override'] = null;
  if (options.cannotLink || ids?.cannotLink) override = 'cannot_link';
  else if (ids?.decisive) override = 'decisive_identifier';
  if (override === 'cannot_link') score = -Infinity;
  if (override === 'decisive_identifier') score = Infinity;
  const identifierNotes = [...(ids?.explanation ?? [])];
  if (options.cannotLink) identifierNotes.push('a reviewer recorded that these are different entities');
  return {
    score,
    decision: guardNameEvidence(decide(score, model), override, comparison.levels),
    override,
    explanation,
    identifierNotes,
    softTfIdf: comparison.softTfIdf,
    jaroWinkler: comparison.jaroWinkler,
  };
}

/**
 * Precision first: without a decisive identifier, a pair whose names themselves disagree (name level low or
 * none) is never linked automatically, however much the other features add up — context features
 * (jurisdiction, legal form, a shared contact) support a name match, they cannot stand in for one.
 * Such a pair goes to a person instead.
 */
const NAME_LEVELS_THAT_CANNOT_LINK: ReadonlySet<string> = new Set(['low', 'none']);

function guardNameEvidence(decision: Decision, override: PairScore['override'], levels: ComparisonLevels): Decision {
  if (decision !== 'link' || override === 'decisive_identifier') return decision;
  const name = levels.name;
  return name !== null && NAME_LEVELS_THAT_CANNOT_LINK.has(name) ? 'review' : decision;
}

/** Weight of each feature level under the model; features the model does not know weigh 0 and say so. */
export function explainLevels(levels: ComparisonLevels, model: MatchModel): FeatureExplanation[] {
  return FEATURE_NAMES.map((feature) => {
    const level = levels[feature];
    const params = model.features[feature];
    if (level === null || !params) return { feature, level, weight: 0 };
    const k = params.levels.indexOf(level);
    if (k < 0) throw new Error(`match model: feature "${feature}" has no level "${level}" (levels: ${params.levels.join(', ')})`);
    return { feature, level, weight: featureWeights(params)[k] as number };
  });
}

/** The levels as indices into FEATURE_LEVELS, in FEATURE_NAMES order: EM's input. */
export function levelVector(levels: ComparisonLevels, model: MatchModel): (number | null)[] {
  return FEATURE_NAMES.map((feature) => {
    const level = levels[feature];
    if (level === null) return null;
    const params = model.features[feature];
    return params ? params.levels.indexOf(level) : null;
  });
}
