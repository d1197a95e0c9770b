/**
 * Estimates a MatchModel from unlabelled data: comparison vectors of the candidate pairs (EM's sample) and of
 * random pairs (almost all non-matches: the starting u, or the fixed u with `fixU`).
 */
import { estimateByEm, levelFrequencies, type ComparisonVector } from './em.ts';
import { FEATURE_LEVELS, FEATURE_NAMES } from './features.ts';
import type { MatchModel } from './match-model.ts';

export interface TrainOptions {
  linkAt: number;
  newAt: number;
  /** Hold u at the random-pair frequencies instead of re-estimating it on the candidates. */
  fixU?: boolean;
  note?: string;
}

/** Starting m: matches mostly agree (the top level most likely, falling off). Common practice for EM starts. */
function initialM(levels: number): number[] {
  const raw = Array.from({ length: levels }, (_, k) => Math.pow(0.35, k));
  const sum = raw.reduce((s, v) => s + v, 0);
  return raw.map((v) => v / sum);
}

export function trainModel(candidates: readonly ComparisonVector[], randomPairs: readonly ComparisonVector[], options: TrainOptions): MatchModel {
  const levels = FEATURE_NAMES.map((f) => FEATURE_LEVELS[f].length);
  const u = levelFrequencies(randomPairs, levels);
  const result = estimateByEm(candidates, {
    levels,
    initialM: levels.map(initialM),
    initialU: u,
    initialP: 0.1,
    fixU: options.fixU ?? false,
  });
  const features: MatchModel['features'] = {};
  FEATURE_NAMES.forEach((f, i) => {
    features[f] = { levels: [...FEATURE_LEVELS[f]], m: result.m[i] as number[], u: result.u[i] as number[] };
  });
  return {
    version: 1,
    features,
    matchShare: result.p,
    linkAt: options.linkAt,
    newAt: options.newAt,
    provenance: {
      method: 'em',
      pairs: candidates.length,
      note:
        `EM on ${candidates.length} candidate pairs (${result.iterations} iterations, ${result.converged ? 'converged' : 'NOT converged'}), ` +
        `u ${options.fixU ? 'fixed at' : 'started from'} ${randomPairs.length} random pairs` +
        (options.note ? `; ${options.note}` : ''),
    },
  };
}
