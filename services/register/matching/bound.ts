/**
 * An upper bound on a pair's score (resolvers/score scorePair) from the features that cost next to nothing to
 * observe: jurisdiction, legal form, acronym and qualifier are observed exactly; the name and distinct features,
 * the costly part of a comparison (soft TF-IDF, Jaro–Winkler, the kind of difference), are taken at their best
 * weight under the model. The score is the sum of the seven feature weights, capped (ruledScore never raises it),
 * so score ≤ bound. A pair with identifiers on both sides may be decided by them (+∞): its bound is +∞.
 *
 * What it buys: a candidate whose bound is below both the best score already found and newAt cannot be the best,
 * a rival or a candidate worth a person's look, so it need not be scored for a decision (matching/candidates.ts).
 */
import type { MatchRecord } from '../../../resolvers/block/index.ts';
import {
  acronymLevel,
  featureWeights,
  FEATURE_NAMES,
  jurisdictionLevel,
  legalFormLevel,
  qualifierLevel,
  type MatchModel,
} from '../../../resolvers/score/index.ts';

/** Weight of one observed level under the model (an unobserved or unknown level weighs 0, as in explainLevels). */
function weightOf(model: MatchModel, feature: string, level: string | null): number {
  if (level === null) return 0;
  const params = model.features[feature];
  const k = params ? params.levels.indexOf(level) : -1;
  return k < 0 || !params ? 0 : (featureWeights(params)[k] ?? 0);
}

/** The largest weight a feature can add: its best level, or 0 (not observed). */
function bestWeight(model: MatchModel, feature: string): number {
  const params = model.features[feature];
  return params ? Math.max(0, ...featureWeights(params)) : 0;
}

const bestCostly = new WeakMap<MatchModel, number>();

/** Best name weight plus best distinct weight: what the costly comparison can add at most. */
function costlyBest(model: MatchModel): number {
  let value = bestCostly.get(model);
  if (value === undefined) {
    value = bestWeight(model, 'name') + bestWeight(model, 'distinct');
    bestCostly.set(model, value);
  }
  return value;
}

/** The cheap features this bound observes exactly; every other feature is bounded by costlyBest. */
const CHEAP = ['legalForm', 'jurisdiction', 'acronym', 'qualifier'] as const;
const OTHERS = FEATURE_NAMES.filter((f) => f !== 'name' && f !== 'distinct' && !(CHEAP as readonly string[]).includes(f));

export function scoreUpperBound(a: MatchRecord, b: MatchRecord, model: MatchModel): number {
  if ((a.identifiers?.length ?? 0) > 0 && (b.identifiers?.length ?? 0) > 0) return Infinity;
  let bound = costlyBest(model);
  bound += weightOf(model, 'legalForm', legalFormLevel(a, b));
  bound += weightOf(model, 'jurisdiction', jurisdictionLevel(a, b));
  bound += weightOf(model, 'acronym', acronymLevel(a, b));
  bound += weightOf(model, 'qualifier', qualifierLevel(a.analysis.qualifiers, b.analysis.qualifiers));
  // sharedContact needs identifiers on both sides (handled above): not observed here. Any feature added to the
  // model later is bounded by its best weight, so the bound stays a bound.
  for (const feature of OTHERS) if (feature !== 'sharedContact') bound += bestWeight(model, feature);
  return bound;
}
