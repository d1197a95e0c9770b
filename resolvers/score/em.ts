/**
 * Expectation–maximisation for the Fellegi–Sunter mixture (latent class model with conditionally independent
 * features, Winkler 1988 / Jaro 1989): from unlabelled comparison vectors, estimates the match share p and, per
 * feature, the level distributions m (among matches) and u (among non-matches). A level may be null (the
 * feature could not be observed for this pair); it then contributes to neither side.
 *
 * u can be held fixed (estimated from random pairs, which are almost all non-matches): this anchors the
 * mixture and stops EM from splitting the data along some other axis than match/non-match.
 */
export type ComparisonVector = readonly (number | null)[];

export interface EmOptions {
  /** Number of levels of each feature, in vector order. */
  levels: readonly number[];
  /** Starting m per feature (a distribution over that feature's levels). */
  initialM: readonly (readonly number[])[];
  /** Starting u per feature; with fixU the final u too. */
  initialU: readonly (readonly number[])[];
  initialP: number;
  fixU?: boolean;
  maxIterations?: number;
  /** Stop when no parameter moves by more than this. */
  tolerance?: number;
  /** Added to every level count in the M step, so that no probability becomes 0 (a weight of ±Infinity). */
  smoothing?: number;
}

export interface EmResult {
  m: number[][];
  u: number[][];
  p: number;
  iterations: number;
  converged: boolean;
  logLikelihood: number;
}

interface Pattern {
  vector: ComparisonVector;
  count: number;
}

/** Distinct vectors with their counts: EM then costs O(patterns) per iteration, not O(pairs). */
export function countPatterns(vectors: Iterable<ComparisonVector>): Pattern[] {
  const byKey = new Map<string, Pattern>();
  for (const vector of vectors) {
    const key = vector.map((v) => (v === null ? '-' : String(v))).join(',');
    const seen = byKey.get(key);
    if (seen) seen.count++;
    else byKey.set(key, { vector: [...vector], count: 1 });
  }
  return [...byKey.values()];
}

export function estimateByEm(vectors: Iterable<ComparisonVector>, options: EmOptions): EmResult {
  const patterns = countPatterns(vectors);
  const { levels } = options;
  const smoothing = options.smoothing ?? 0.5;
  const maxIterations = options.maxIterations ?? 200;
  const tolerance = options.tolerance ?? 1e-7;
  let m = options.initialM.map((row) => [...row]);
  let u = options.initialU.map((row) => [...row]);
  let p = options.initialP;
  checkShape(levels, m, 'initialM');
  checkShape(levels, u, 'initialU');
  let iterations = 0;
  let converged = false;
  let logLikelihood = -Infinity;
  while (iterations < maxIterations) {
    iterations++;
    const mCounts = levels.map((k) => new Array<number>(k).fill(smoothing));
    const uCounts = levels.map((k) => new Array<number>(k).fill(smoothing));
    let matchMass = 0;
    let total = 0;
    logLikelihood = 0;
    for (const { vector, count } of patterns) {
      let likeMatch = p;
      let likeNon = 1 - p;
      vector.forEach((level, f) => {
        if (level === null) return;
        likeMatch *= (m[f] as number[])[level] as number;
        likeNon *= (u[f] as number[])[level] as number;
      });
      const g = likeMatch / (likeMatch + likeNon);
      logLikelihood += count * Math.log(likeMatch + likeNon);
      matchMass += g * count;
      total += count;
      vector.forEach((level, f) => {
        if (level === null) return;
        (mCounts[f] as number[])[level] = ((mCounts[f] as number[])[level] as number) + g * count;
        (uCounts[f] as number[])[level] = ((uCounts[f] as number[])[level] as number) + (1 - g) * count;
      });
    }
    const nextM = mCounts.map(normalise);
    const nextU = options.fixU ? u : uCounts.map(normalise);
    const nextP = total === 0 ? p : Math.min(Math.max(matchMass / total, 1e-9), 1 - 1e-9);
    const moved = Math.max(maxDelta(m, nextM), maxDelta(u, nextU), Math.abs(p - nextP));
    m = nextM;
    u = nextU;
    p = nextP;
    if (moved < tolerance) {
      converged = true;
      break;
    }
  }
  return { m, u, p, iterations, converged, logLikelihood };
}

/** Level frequencies among pairs known (or assumed) to be non-matches, e.g. random pairs: an estimate of u. */
export function levelFrequencies(vectors: Iterable<ComparisonVector>, levels: readonly number[], smoothing = 0.5): number[][] {
  const counts = levels.map((k) => new Array<number>(k).fill(smoothing));
  for (const vector of vectors) {
    vector.forEach((level, f) => {
      if (level !== null) (counts[f] as number[])[level] = ((counts[f] as number[])[level] as number) + 1;
    });
  }
  return counts.map(normalise);
}

function normalise(row: number[]): number[] {
  const sum = row.reduce((s, v) => s + v, 0);
  return sum === 0 ? row.map(() => 1 / row.length) : row.map((v) => v / sum);
}

function maxDelta(a: number[][], b: number[][]): number {
  let max = 0;
  a.forEach((row, i) => row.forEach((v, j) => (max = Math.max(max, Math.abs(v - ((b[i] as number[])[j] as number))))));
  return max;
}

function checkShape(levels: readonly number[], rows: number[][], name: string): void {
  if (rows.length !== levels.length) throw new Error(`estimateByEm: ${name} has ${rows.length} features, expected ${levels.length}`);
  rows.forEach((row, f) => {
    if (row.length !== levels[f]) throw new Error(`estimateByEm: ${name}[${f}] has ${row.length} levels, expected ${levels[f]}`);
  });
}
