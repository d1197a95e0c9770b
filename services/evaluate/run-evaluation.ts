/**
 * Runs one matching method over labelled rows and measures it: pairwise / B-cubed / ARI against the ground-truth
 * ids, the same split into non-acronym pairs and pairs involving an acronym row, blocking quality per category
 * (cpreg only), and a sweep of linkAt. Pure computation over the loaded rows; the command does the I/O.
 */
import { analyseName } from '../../resolvers/analyse/index.ts';
import { candidatePairs, type CandidateOptions, type MatchRecord } from '../../resolvers/block/index.ts';
import { clusterIndexed, clustersToLabels } from '../../resolvers/cluster/index.ts';
import { buildIdfTable, type IdfTable } from '../../resolvers/compare/index.ts';
import {
  adjustedRandIndex,
  bcubed,
  blockingByCategory,
  pairwiseScores,
  type BlockingReport,
  type PairwiseScores,
  type PrecisionRecall,
  type SweepPoint,
} from '../../resolvers/evaluate/index.ts';
import { seededRandom } from '../../resolvers/prng.ts';
import {
  clusterRulesOf,
  compareCandidates,
  comparedVectors,
  decidePairAt,
  indexedRules,
  FEATURE_NAMES,
  estimateFromLabels,
  indexedPairsOf,
  randomPairVectors,
  scoreCompared,
  trainModel,
  type MatchModel,
} from '../../resolvers/score/index.ts';
import type { LabelledRow } from './load-labelled-csv.ts';
import { jwComponents, jwOverCandidates } from './jw-baselines.ts';

export { JW_BASELINE_THRESHOLD } from './jw-baselines.ts';
import { sweepThresholds } from './sweep-thresholds.ts';

/** jw: plain Jaro–Winkler over all pairs; jw-candidates: the same rule over cpreg's candidate pairs only. */
export type Method = 'cpreg' | 'exact' | 'jw' | 'jw-candidates';
export const METHODS: readonly Method[] = ['cpreg', 'exact', 'jw', 'jw-candidates'];

export interface EvaluationOptions {
  method: Method;
  /** cpreg: the model to score with (its linkAt / newAt are used unless overridden). */
  model: MatchModel;
  /** cpreg: re-estimate m and u by EM on this file's candidate pairs (labels are never used). */
  train?: boolean;
  fixU?: boolean;
  /** cpreg, for tuning only: estimate m and u from this file's ground truth over the candidate pairs (as from
   * reviewers' decisions). Never use on the split you report. */
  learnFromLabels?: boolean;
  linkAt?: number;
  newAt?: number;
  blocking?: CandidateOptions;
  /** Which rows are acronyms (reported separately). */
  isAcronym: (row: LabelledRow) => boolean;
  sweep?: boolean;
  /** Called with progress lines (stderr in the CLI). */
  log?: (line: string) => void;
}

export interface EvaluationReport {
  method: Method;
  rows: number;
  entities: number;
  acronymRows: number;
  pairwise: PairwiseScores;
  bcubed: PrecisionRecall;
  ari: number;
  /** Pairwise scores over non-acronym rows only, and over the pairs involving at least one acronym row. */
  nonAcronymPairwise: PairwiseScores;
  acronymPairwise: { truePositivePairs: number; predictedPairs: number; goldPairs: number; precision: number; recall: number };
  clusters: number;
  comparisons: number;
  blocking?: BlockingReport;
  model?: { linkAt: number; newAt: number; matchShare: number; provenance: MatchModel['provenance'] };
  trainedModel?: MatchModel;
  sweep?: SweepPoint[];
  /** cpreg: what the register's rules do with each record (decisionRules), and how good the review queue is. */
  outcomes?: Outcomes;
  seconds: Record<string, number>;
}

/**
 * The three outcomes of the register's rules over the batch: a record is linked when it joins a cluster with
 * another; sent to review when it stands alone and its best pair lies between newAt and linkAt with names a person
 * can judge; new otherwise. reviewTrueMatches: review records whose best candidate is truly the same entity.
 */
export interface Outcomes {
  linked: number;
  review: number;
  new: number;
  reviewShare: number;
  reviewTrueMatches: number;
  reviewTrueMatchShare: number;
}

export function runEvaluation(rows: readonly LabelledRow[], options: EvaluationOptions): EvaluationReport {
  const log = options.log ?? (() => undefined);
  const seconds: Record<string, number> = {};
  const timed = <T>(label: string, work: () => T): T => {
    const started = performance.now();
    const result = work();
    seconds[label] = Math.round(performance.now() - started) / 1000;
    log(`${label}: ${seconds[label]} s`);
    return result;
  };
  const records: MatchRecord[] = timed('analyse', () =>
    rows.map((row, i) => ({
      id: String(i),
      analysis: analyseName(row.name, row.country ? { country: row.country } : undefined),
      ...(row.country ? { country: row.country } : {}),
    })),
  );
  const gold = rows.map((r) => r.id);
  const acronym = rows.map(options.isAcronym);
  let predicted: string[];
  let comparisons = 0;
  const extra: Partial<EvaluationReport> = {};
  if (options.method === 'exact') {
    predicted = records.map((r) => `n:${r.analysis.normalised}`);
  } else if (options.method === 'jw-candidates') {
    const idf = buildIdfTable(records.map((r) => r.analysis.tokens));
    const pairs = timed('blocking', () => candidatePairs(records, { idf, ...options.blocking }));
    predicted = timed('jw over candidates', () => jwOverCandidates(records, pairs));
    comparisons = pairs.count;
  } else if (options.method === 'jw') {
    const result = timed('jw all pairs', () => jwComponents(records));
    predicted = result.labels;
    comparisons = result.comparisons;
  } else {
    const idf = timed('idf', () => buildIdfTable(records.map((r) => r.analysis.tokens)));
    const run = runCpreg(records, gold, acronym, idf, options, timed, log);
    predicted = run.labels;
    comparisons = run.comparisons;
    Object.assign(extra, run.extra);
  }
  const nonAcronym = rows.map((_, i) => i).filter((i) => !acronym[i]);
  const all = pairwiseScores(gold, predicted);
  const sub = pairwiseScores(
    nonAcronym.map((i) => gold[i] as string),
    nonAcronym.map((i) => predicted[i] as string),
  );
  const acr = {
    truePositivePairs: all.truePositivePairs - sub.truePositivePairs,
    predictedPairs: all.predictedPairs - sub.predictedPairs,
    goldPairs: all.goldPairs - sub.goldPairs,
    precision: 1,
    recall: 1,
  };
  acr.precision = acr.predictedPairs === 0 ? 1 : acr.truePositivePairs / acr.predictedPairs;
  acr.recall = acr.goldPairs === 0 ? 1 : acr.truePositivePairs / acr.goldPairs;
  return {
    method: options.method,
    rows: rows.length,
    entities: new Set(gold).size,
    acronymRows: acronym.filter(Boolean).length,
    pairwise: all,
    bcubed: bcubed(gold, predicted),
    ari: adjustedRandIndex(gold, predicted),
    nonAcronymPairwise: sub,
    acronymPairwise: acr,
    clusters: new Set(predicted).size,
    comparisons,
    ...extra,
    seconds,
  };
}

function runCpreg(
  records: MatchRecord[],
  gold: string[],
  acronym: boolean[],
  idf: IdfTable,
  options: EvaluationOptions,
  timed: <T>(label: string, work: () => T) => T,
  log: (line: string) => void,
): { labels: string[]; comparisons: number; extra: Partial<EvaluationReport> } {
  const pairs = timed('blocking', () => candidatePairs(records, { idf, ...options.blocking }));
  log(`candidate pairs: ${pairs.count}`);
  const blocking = timed('blocking metrics', () => blockingByCategory(records, gold, acronym, pairs));
  const compared = timed('compare', () => compareCandidates(records, pairs, idf));
  let model = options.model;
  const extra: Partial<EvaluationReport> = { blocking };
  if (options.train) {
    model = timed('train (EM)', () => {
      const random = randomPairVectors(records, idf, Math.min(200_000, pairs.count * 2 + 1000), seededRandom(20260401));
      return trainModel(comparedVectors(compared), random, {
        linkAt: options.linkAt ?? options.model.linkAt,
        newAt: options.newAt ?? options.model.newAt,
        fixU: options.fixU ?? false,
        note: `${records.length} names`,
      });
    });
    extra.trainedModel = model;
  }
  if (options.learnFromLabels) {
    model = timed('estimate from labels', () => {
      const vectors = comparedVectors(compared);
      const labelled = vectors.map((vector, k) => ({ vector, isMatch: gold[pairs.left[k] as number] === gold[pairs.right[k] as number] }));
      const matches = labelled.filter((l) => l.isMatch).length;
      const learned = estimateFromLabels(model, labelled, 1);
      return {
        ...learned,
        matchShare: matches / Math.max(1, labelled.length),
        linkAt: options.linkAt ?? model.linkAt,
        newAt: options.newAt ?? model.newAt,
        provenance: {
          method: 'labelled' as const,
          pairs: labelled.length,
          note: `m and u from ${labelled.length} labelled candidate pairs (${matches} matches) of ${records.length} names`,
        },
      };
    });
    extra.trainedModel = model;
  }
  const linkAt = options.linkAt ?? model.linkAt;
  const newAt = options.newAt ?? model.newAt;
  // Held-back pairs are capped below the linkAt in force, so the override must reach the scores too.
  const scores = scoreCompared(compared, { ...model, linkAt, newAt });
  const indexed = indexedPairsOf(compared, scores);
  const ids = records.map((r) => r.id);
  const clusterAt = (threshold: number): string[] => {
    const labels = clustersToLabels(clusterIndexed(ids, indexed, clusterRulesOf({ linkAt: threshold, newAt })));
    return ids.map((id) => labels.get(id) as string);
  };
  const labels = timed('cluster', () => clusterAt(linkAt));
  extra.outcomes = outcomesOf(labels, gold, compared, scores, { linkAt, newAt });
  extra.model = { linkAt, newAt, matchShare: model.matchShare, provenance: model.provenance };
  if (options.sweep) {
    extra.sweep = timed('sweep', () =>
      sweepThresholds(scores).map((threshold) => {
        const p = pairwiseScores(gold, clusterAt(threshold));
        return { threshold, precision: p.precision, recall: p.recall, f1: p.f1 };
      }),
    );
  }
  return { labels, comparisons: pairs.count, extra };
}

function outcomesOf(
  labels: readonly string[],
  gold: readonly string[],
  compared: ReturnType<typeof compareCandidates>,
  scores: Float64Array,
  model: { linkAt: number; newAt: number },
): Outcomes {
  const size = new Map<string, number>();
  for (const label of labels) size.set(label, (size.get(label) ?? 0) + 1);
  // Each record's best pair (as the register takes a mention's best candidate) and what the rules decide for it.
  const bestScore = new Float64Array(labels.length).fill(-Infinity);
  const bestPair = new Int32Array(labels.length).fill(-1);
  for (let k = 0; k < compared.pairs.count; k++) {
    const s = scores[k] as number;
    for (const i of [compared.pairs.left[k]!, compared.pairs.right[k]!]) {
      if (s > bestScore[i]!) {
        bestScore[i] = s;
        bestPair[i] = k;
      }
    }
  }
  const rules = indexedRules();
  const width = FEATURE_NAMES.length;
  let linked = 0;
  let review = 0;
  let reviewTrue = 0;
  labels.forEach((label, i) => {
    if ((size.get(label) ?? 0) > 1) {
      linked++;
      return;
    }
    const k = bestPair[i]!;
    if (k < 0 || decidePairAt(bestScore[i]!, compared.levels, k * width, rules, model) !== 'review') return;
    review++;
    const other = compared.pairs.left[k] === i ? compared.pairs.right[k]! : compared.pairs.left[k]!;
    if (gold[other] === gold[i]) reviewTrue++;
  });
  const n = labels.length;
  return {
    linked,
    review,
    new: n - linked - review,
    reviewShare: n === 0 ? 0 : review / n,
    reviewTrueMatches: reviewTrue,
    reviewTrueMatchShare: review === 0 ? 1 : reviewTrue / review,
  };
}
