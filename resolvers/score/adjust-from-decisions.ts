/**
 * Reviewers' decisions adjust the weights, within bounds.
 *
 * Decided review items are not a sample of all pairs: they are the pairs the model already found doubtful. Counting
 * them into m and u as if they were (estimateFromLabels) overturns the model: on the demo, 19 "different" decisions
 * on equal names took the exact-name weight from 8.75 to 0.24 bits. Here the model's own weights stay the prior and
 * the decisions only recalibrate them where they are: a penalised logistic regression of the decision on the
 * model's score, with one shift (in bits) per feature level (Platt's calibration of a score, 1999, with a Gaussian
 * prior on each shift as in Bayesian logistic regression, Gelman et al. 2008: the shifts start at 0 and a few
 * decisions cannot move them far). The intercept is not fitted but fixed where the thresholds were set: a pair at
 * linkAt is a match with probability `precisionAtLinkAt` (0.99, the target the built-in linkAt was derived from).
 * A fitted intercept would absorb what the decisions say into a constant no decision uses; fixed, it makes the
 * adjustment precision-first on its own: "different" on a pair the model nearly linked moves its levels down
 * quickly, while "same" moves a level up only as far as the decisions show a precision above 0.99 there (a run of
 * 12 confirmations does not; a few hundred do).
 *
 * Bounds: every level the decisions touch takes part in the fit (so that two "different" answers on names that
 * agree but whose legal forms conflict are put down to the legal forms, not to the equal names), but only a level
 * with `minDecisions` decisions or more keeps its shift; no shift exceeds `maxShift` bits; shifts are recomputed
 * from all decisions each time (not accumulated), so the same decisions give the same model.
 */
import type { ComparisonVector } from './em.ts';
import { featureWeights, type MatchModel } from './match-model.ts';

export interface DecidedVector {
  vector: ComparisonVector;
  isMatch: boolean;
}

export interface AdjustOptions {
  /** Standard deviation of the prior on each shift, in bits. Default 1. */
  priorSd?: number;
  /** No shift goes beyond ±maxShift bits. Default 2. */
  maxShift?: number;
  /** Decisions a level needs before it may move. Default 5. */
  minDecisions?: number;
  /** Gradient steps. Default 2000. */
  steps?: number;
  /** The probability that a pair scoring exactly linkAt is a match. Default 0.99. */
  precisionAtLinkAt?: number;
}

export interface LevelShift {
  feature: string;
  level: string;
  shift: number;
  decisions: number;
  same: number;
}

const LN2 = Math.LN2;

/** The model with each feature's `shift` set from the decisions; `shifts` lists every level that moved. */
export function adjustFromDecisions(
  model: MatchModel,
  decided: readonly DecidedVector[],
  options: AdjustOptions = {},
): { model: MatchModel; shifts: LevelShift[] } {
  const priorSd = options.priorSd ?? 1;
  const maxShift = options.maxShift ?? 2;
  const minDecisions = options.minDecisions ?? 5;
  const steps = options.steps ?? 2000;
  const names = Object.keys(model.features);
  const base = names.map((n) => featureWeights({ ...model.features[n]!, shift: undefined }));
  // Free parameters: the levels with enough decisions.
  const counts = names.map((n) => model.features[n]!.levels.map(() => ({ decisions: 0, same: 0 })));
  for (const d of decided) {
    d.vector.forEach((level, f) => {
      if (level === null || level === undefined || f >= names.length) return;
      const c = counts[f]![level];
      if (!c) return;
      c.decisions++;
      if (d.isMatch) c.same++;
    });
  }
  const free = counts.map((levels) => levels.map((c) => c.decisions > 0));
  const kept = counts.map((levels) => levels.map((c) => c.decisions >= minDecisions));
  const shift = names.map((n) => model.features[n]!.levels.map(() => 0));
  const baseScore = decided.map((d) =>
    d.vector.reduce<number>((s, level, f) => (level === null || level === undefined || f >= names.length ? s : s + (base[f]![level] ?? 0)), 0),
  );
  const target = options.precisionAtLinkAt ?? 0.99;
  const intercept = Math.log(target / (1 - target)) - LN2 * model.linkAt;
  const rate = 0.5 / Math.max(1, decided.length);
  for (let step = 0; step < steps; step++) {
    const gradShift = shift.map((row) => row.map(() => 0));
    decided.forEach((d, i) => {
      let bits = baseScore[i]!;
      d.vector.forEach((level, f) => {
        if (level !== null && level !== undefined && f < names.length) bits += shift[f]![level] ?? 0;
      });
      const p = 1 / (1 + Math.exp(-(LN2 * bits + intercept)));
      const residual = p - (d.isMatch ? 1 : 0);
      d.vector.forEach((level, f) => {
        if (level !== null && level !== undefined && f < names.length && free[f]![level]) gradShift[f]![level]! += residual * LN2;
      });
    });
    shift.forEach((row, f) =>
      row.forEach((value, k) => {
        if (!free[f]![k]) return;
        const grad = gradShift[f]![k]! + value / (priorSd * priorSd);
        row[k] = Math.max(-maxShift, Math.min(maxShift, value - rate * 4 * grad));
      }),
    );
  }
  const features: MatchModel['features'] = {};
  const shifts: LevelShift[] = [];
  names.forEach((name, f) => {
    const feature = model.features[name]!;
    const row = shift[f]!.map((v, k) => (kept[f]![k] ? Math.round(v * 1000) / 1000 : 0));
    features[name] = row.some((v) => v !== 0) ? { ...feature, shift: row } : { levels: feature.levels, m: feature.m, u: feature.u };
    row.forEach((v, k) => {
      if (v !== 0) shifts.push({ feature: name, level: feature.levels[k]!, shift: v, ...counts[f]![k]! });
    });
  });
  const note = model.provenance.note.replace(/; adjusted by \d+ reviewers' decisions.*$/, '');
  return {
    model: {
      ...model,
      features,
      provenance: {
        ...model.provenance,
        note: `${note}; adjusted by ${decided.length} reviewers' decisions (${shifts.length} levels moved, at most ${maxShift} bits)`,
      },
    },
    shifts,
  };
}
