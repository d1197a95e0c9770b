/**
 * Re-estimation of m and u from labelled pairs (reviewers' decisions). Each labelled pair adds one count to
 * its level on the match side (m) or the non-match side (u); the current model acts as a prior worth
 * `priorWeight` pairs per side, so a handful of decisions nudges the weights instead of overturning them.
 */
import type { ComparisonVector } from './em.ts';
import type { MatchModel } from './match-model.ts';

export interface LabelledVector {
  vector: ComparisonVector;
  isMatch: boolean;
}

export function estimateFromLabels(model: MatchModel, labelled: readonly LabelledVector[], priorWeight = 20): MatchModel {
  const names = Object.keys(model.features);
  const features: MatchModel['features'] = {};
  names.forEach((name, f) => {
    const feature = model.features[name] as MatchModel['features'][string];
    const mCounts = feature.m.map((v) => v * priorWeight);
    const uCounts = feature.u.map((v) => v * priorWeight);
    for (const { vector, isMatch } of labelled) {
      const level = vector[f];
      if (level === null || level === undefined) continue;
      if (level < 0 || level >= feature.levels.length) {
        throw new Error(`estimateFromLabels: level ${level} out of range for feature "${name}"`);
      }
      const counts = isMatch ? mCounts : uCounts;
      counts[level] = (counts[level] as number) + 1;
    }
    features[name] = { levels: [...feature.levels], m: normalise(mCounts), u: normalise(uCounts) };
  });
  const matches = labelled.filter((l) => l.isMatch).length;
  return {
    ...model,
    features,
    provenance: {
      method: model.provenance.method === 'prior' ? 'labelled' : 'em+labelled',
      pairs: model.provenance.pairs + labelled.length,
      note: `${model.provenance.note}; re-estimated from ${labelled.length} labelled pairs (${matches} matches), prior weight ${priorWeight}`,
    },
  };
}

function normalise(row: number[]): number[] {
  const sum = row.reduce((s, v) => s + v, 0);
  return row.map((v) => v / sum);
}
