/**
 * The serialisable Fellegi–Sunter model: per feature, the level names and their m and u distributions;
 * the two decision thresholds on the summed weight. Plain JSON: the register stores it in its database.
 */
import { levelWeight } from './weights.ts';

export interface FeatureModel {
  /** Level names, in the order the comparison vector indexes them. */
  levels: string[];
  /** P(level | match), one per level, summing to 1. */
  m: number[];
  /** P(level | non-match), one per level, summing to 1. */
  u: number[];
  /**
   * Bits added to each level's weight by reviewers' decisions (adjustFromDecisions), bounded; absent when no
   * decision moved the feature. m and u stay what training gave.
   */
  shift?: number[];
}

export interface MatchModel {
  version: 1;
  /** Features in comparison-vector order. */
  features: Record<string, FeatureModel>;
  /** Share of matches among the candidate pairs the model was estimated on (EM's p). */
  matchShare: number;
  /** Summed weight at or above which a pair links automatically. */
  linkAt: number;
  /** Summed weight at or below which a mention starts a new record; between the two: review. */
  newAt: number;
  /** How the parameters were obtained, for the explanation shown to reviewers. */
  provenance: { method: 'em' | 'labelled' | 'em+labelled' | 'prior'; pairs: number; note: string };
}

export type Decision = 'link' | 'review' | 'new';

/** The largest shift a stored model may carry (adjustFromDecisions keeps to its own, smaller bound). */
export const MAX_STORED_SHIFT = 8;

/** Weight of every level of one feature: log2(m_k / u_k). */
export function featureWeights(feature: FeatureModel): number[] {
  return feature.levels.map((_, k) => levelWeight(feature.m[k] as number, feature.u[k] as number) + (feature.shift?.[k] ?? 0));
}

export function decide(score: number, model: Pick<MatchModel, 'linkAt' | 'newAt'>): Decision {
  if (score >= model.linkAt) return 'link';
  if (score <= model.newAt) return 'new';
  return 'review';
}

/**
 * Checks a model read from storage: every feature's m and u are distributions over its levels, the
 * thresholds are ordered. Throws naming the first problem; returns the model typed.
 */
export function parseMatchModel(value: unknown): MatchModel {
  const fail = (what: string): never => {
    throw new Error(`match model: ${what}`);
  };
  if (typeof value !== 'object' || value === null) return fail('expected a JSON object');
  const model = value as Partial<MatchModel>;
  if (model.version !== 1) fail(`version must be 1, got ${String(model.version)}`);
  if (typeof model.linkAt !== 'number' || typeof model.newAt !== 'number') fail('linkAt and newAt must be numbers');
  if ((model.newAt as number) > (model.linkAt as number)) fail(`newAt (${model.newAt}) must not exceed linkAt (${model.linkAt})`);
  if (typeof model.features !== 'object' || model.features === null) fail('features must be an object');
  for (const [name, feature] of Object.entries(model.features as Record<string, FeatureModel>)) {
    // Stored values are rounded (6 significant digits), so a sum within 1e-4 of 1 is accepted.
    for (const side of ['m', 'u'] as const) {
      const row = feature[side];
      if (!Array.isArray(row) || !Array.isArray(feature.levels) || row.length !== feature.levels.length) {
        fail(`feature "${name}": ${side} must have one probability per level`);
      }
      const sum = row.reduce((s, v) => s + v, 0);
      if (row.some((v) => !(v > 0 && v < 1)) || Math.abs(sum - 1) > 1e-4) {
        fail(`feature "${name}": ${side} must be probabilities strictly between 0 and 1 summing to 1 (sum ${sum})`);
      }
    }
    const shift = feature.shift;
    if (
      shift !== undefined &&
      (!Array.isArray(shift) ||
        shift.length !== feature.levels.length ||
        shift.some((v) => typeof v !== 'number' || !Number.isFinite(v) || Math.abs(v) > MAX_STORED_SHIFT))
    ) {
      fail(`feature "${name}": shift must have one number per level, each within ±${MAX_STORED_SHIFT} bits`);
    }
  }
  return model as MatchModel;
}
