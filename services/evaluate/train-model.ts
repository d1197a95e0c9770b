/**
 * How the built-in match model is made (`cpreg train-model`, docs/matching.md → 'Model'): labelled candidate pairs
 * from data that looks like the job, m and u counted per dataset and averaged so that each dataset weighs the same,
 * then the two thresholds derived from stated targets instead of a whole bit:
 *   linkAt  the lowest threshold at which the clusters the register's rules form (clusterRulesOf) reach the target
 *           pairwise precision in EVERY dataset (tried at every distinct pair score in a range, so no pattern sits on
 *           a cliff by chance);
 *   newAt   the lowest score such that, in EVERY dataset, at least the target share of the pairs a person would be
 *           asked about (between newAt and linkAt, names agreeing at least in part: decisionRules.worthReview) are
 *           true matches; never above linkAt − MIN_REVIEW_BAND.
 */
import { analyseName } from '../../resolvers/analyse/index.ts';
import { candidatePairs, type MatchRecord } from '../../resolvers/block/index.ts';
import { buildIdfTable } from '../../resolvers/compare/index.ts';
import {
  clusterRulesOf,
  compareCandidates,
  FEATURE_LEVELS,
  FEATURE_NAMES,
  indexedPairsOf,
  indexedRules,
  scoreCompared,
  worthReviewAt,
  type ComparedPairs,
  type MatchModel,
} from '../../resolvers/score/index.ts';
import { clusterIndexed, clustersToLabels } from '../../resolvers/cluster/index.ts';
import { pairwiseScores } from '../../resolvers/evaluate/index.ts';
import type { LabelledRow } from './load-labelled-csv.ts';

export interface TrainingSet {
  name: string;
  rows: readonly LabelledRow[];
}

export interface TrainingTargets {
  /** Pairwise precision of the clusters formed at linkAt, in every dataset. */
  linkPrecision: number;
  /** Share of true matches among the pairs a person is asked about, in every dataset. */
  reviewMatchShare: number;
}

interface LabelledPairs {
  name: string;
  /** The ground-truth id of every record, by record index. */
  gold: string[];
  compared: ComparedPairs;
  levels: Int8Array;
  matches: Uint8Array;
  count: number;
}

/** Every dataset's candidate pairs (the register's blocking) with their levels and labels. */
export function labelledPairsOf(set: TrainingSet): LabelledPairs {
  const records: MatchRecord[] = set.rows.map((row, i) => ({
    id: String(i),
    analysis: analyseName(row.name, row.country ? { country: row.country } : undefined),
    ...(row.country ? { country: row.country } : {}),
  }));
  const idf = buildIdfTable(records.map((r) => r.analysis.tokens));
  const pairs = candidatePairs(records, { idf });
  const compared = compareCandidates(records, pairs, idf);
  const matches = new Uint8Array(pairs.count);
  for (let k = 0; k < pairs.count; k++) matches[k] = set.rows[pairs.left[k] as number]!.id === set.rows[pairs.right[k] as number]!.id ? 1 : 0;
  return { name: set.name, gold: set.rows.map((r) => r.id), compared, levels: compared.levels, matches, count: pairs.count };
}

/** m and u of every feature from one dataset's labelled pairs, with add-one smoothing per level. */
function countLevels(data: LabelledPairs): { m: number[][]; u: number[][]; matchShare: number } {
  const width = FEATURE_NAMES.length;
  const m = FEATURE_NAMES.map((f) => FEATURE_LEVELS[f].map(() => 1));
  const u = FEATURE_NAMES.map((f) => FEATURE_LEVELS[f].map(() => 1));
  let matches = 0;
  for (let k = 0; k < data.count; k++) {
    const isMatch = data.matches[k] === 1;
    if (isMatch) matches++;
    for (let f = 0; f < width; f++) {
      const level = data.levels[k * width + f] as number;
      if (level < 0) continue;
      const row = (isMatch ? m : u)[f] as number[];
      row[level] = (row[level] as number) + 1;
    }
  }
  const norm = (rows: number[][]): number[][] => rows.map((row) => row.map((v) => v / row.reduce((s, x) => s + x, 0)));
  return { m: norm(m), u: norm(u), matchShare: matches / Math.max(1, data.count) };
}

/**
 * The review band is never narrower than this many bits under linkAt: where one dataset's doubtful pairs hold fewer
 * than half true matches at every floor, its floor would be linkAt itself and every near miss would silently become
 * a new counterparty (a duplicate nobody sees). One bit: pairs whose evidence is within a factor of two of a link.
 * Two bits overrode the review target itself: on the LEI dev data the floor that holds half true matches lay 1.06
 * bits under linkAt, and the wider band sent 466 records to review of which 23 % were true (`cpreg evaluate`).
 */
export const MIN_REVIEW_BAND = 1;

/** Bits below the lowest qualifying score at which linkAt is set, so rounding of stored weights cannot lift a pattern over it. */
const LINK_AT_MARGIN = 0.01;

export function estimateModel(sets: readonly LabelledPairs[], targets: TrainingTargets, note: string, prior: MatchModel): MatchModel {
  const counted = sets.map(countLevels);
  const features: MatchModel['features'] = {};
  FEATURE_NAMES.forEach((f, i) => {
    const mean = (side: 'm' | 'u'): number[] => FEATURE_LEVELS[f].map((_, k) => counted.reduce((s, c) => s + (c[side][i]![k] as number), 0) / counted.length);
    const observed = sets.some((set) => hasLevel(set, i));
    const previous = prior.features[f];
    // A feature no dataset shows (shared contacts: the data has no identifiers) keeps the prior's values.
    if (!observed && previous) features[f] = { ...previous, levels: [...previous.levels], m: [...previous.m], u: [...previous.u] };
    else features[f] = { levels: [...FEATURE_LEVELS[f]], m: round(mean('m')), u: round(mean('u')) };
  });
  neutralise(features, 'jurisdiction', 'compatible');
  const matchShare = counted.reduce((s, c) => s + c.matchShare, 0) / counted.length;
  const draft: MatchModel = { version: 1, features, matchShare, linkAt: Infinity, newAt: 0, provenance: { method: 'labelled', pairs: 0, note: '' } };
  const perSet = sets.map((set) => ({ name: set.name, linkAt: lowestClusterThreshold(set, draft, targets) }));
  const linkAt = Math.max(...perSet.map((p) => p.linkAt));
  note = `${note}; linkAt per dataset: ${perSet.map((p) => `${p.name} ${p.linkAt.toFixed(3)}`).join(', ')}`;
  const floors = sets.map((set) => ({ name: set.name, newAt: reviewFloor(set, { ...draft, linkAt }, targets.reviewMatchShare) }));
  const newAt = Math.min(Math.max(...floors.map((f) => f.newAt)), linkAt - MIN_REVIEW_BAND);
  note = `${note}; newAt per dataset: ${floors.map((f) => `${f.name} ${f.newAt.toFixed(3)}`).join(', ')}; newAt at most linkAt - ${MIN_REVIEW_BAND}`;
  const pairs = sets.reduce((s, set) => s + set.count, 0);
  return { ...draft, linkAt: round([linkAt])[0]!, newAt: round([newAt])[0]!, provenance: { method: 'labelled', pairs, note } };
}

/** Thresholds are tried in this range of bits (below it a link would rest on weak evidence; above, none is left). */
const THRESHOLD_RANGE = [6, 16] as const;

/**
 * The lowest threshold t, among the distinct pair scores in THRESHOLD_RANGE, at which clustering with linkAt t (and
 * the prior's newAt as the conflict floor) has pairwise precision ≥ target; just below that score, by LINK_AT_MARGIN.
 */
function lowestClusterThreshold(set: LabelledPairs, draft: MatchModel, targets: TrainingTargets): number {
  const probe = scoreCompared(set.compared, { ...draft, linkAt: Infinity });
  const candidates = [
    ...new Set(
      Array.from(probe)
        .filter((s) => s >= THRESHOLD_RANGE[0] && s <= THRESHOLD_RANGE[1])
        .map((s) => Math.round(s * 1e4) / 1e4),
    ),
  ].sort((x, y) => x - y);
  const ids = set.gold.map((_, i) => String(i));
  for (const score of candidates) {
    const linkAt = score - LINK_AT_MARGIN;
    const model = { ...draft, linkAt, newAt: Math.min(draft.newAt, linkAt) };
    const indexed = indexedPairsOf(set.compared, scoreCompared(set.compared, model));
    const labels = clustersToLabels(clusterIndexed(ids, indexed, clusterRulesOf(model)));
    if (
      pairwiseScores(
        set.gold,
        ids.map((id) => labels.get(id) as string),
      ).precision >= targets.linkPrecision
    )
      return linkAt;
  }
  return THRESHOLD_RANGE[1];
}

/**
 * The lowest newAt at which the worthReview pairs scoring in (newAt, linkAt) hold at least `share` true matches, read
 * from the best-scoring pair down; linkAt itself when even the best of them fall short.
 */
function reviewFloor(set: LabelledPairs, model: MatchModel, share: number): number {
  const scores = scoreCompared(set.compared, model);
  const rules = indexedRules();
  const width = FEATURE_NAMES.length;
  const band: number[] = [];
  for (let k = 0; k < set.count; k++) {
    const s = scores[k]!;
    if (s < model.linkAt && Number.isFinite(s) && worthReviewAt(set.levels, k * width, rules)) band.push(k);
  }
  band.sort((x, y) => scores[y]! - scores[x]!);
  let tp = 0;
  let floor = model.linkAt;
  for (let i = 0; i < band.length; i++) {
    tp += set.matches[band[i]!]!;
    const next = band[i + 1];
    if (next !== undefined && scores[next] === scores[band[i]!]) continue;
    if (tp / (i + 1) >= share) floor = scores[band[i]!]! - LINK_AT_MARGIN;
  }
  return floor;
}

function hasLevel(set: LabelledPairs, feature: number): boolean {
  const width = FEATURE_NAMES.length;
  for (let k = 0; k < set.count; k++) if ((set.levels[k * width + feature] as number) >= 0) return true;
  return false;
}

/**
 * A country against one of its subdivisions (US / US-DE) weighs 0: the datasets write jurisdictions in one style
 * per source, so the level measures how a source writes countries, not whether two names are one company.
 */
function neutralise(features: MatchModel['features'], feature: string, level: string): void {
  const params = features[feature];
  const k = params?.levels.indexOf(level) ?? -1;
  if (!params || k < 0) return;
  const target = params.m[k]!;
  const others = params.u.reduce((s, v, i) => (i === k ? s : s + v), 0);
  // u of the level set equal to its m, the other levels scaled to keep u a distribution.
  params.u = params.u.map((v, i) => (i === k ? target : Number(((v * (1 - target)) / others).toPrecision(6))));
}

function round(values: number[]): number[] {
  return values.map((v) => Number(v.toPrecision(6)));
}
