/**
 * How the built-in match model is made (`cpreg train-model`, docs/matching.md → 'Model'): labelled candidate pairs
 * from data that looks like the job, m and u counted per dataset and averaged so that each dataset weighs the same,
 * then the two thresholds derived from stated targets instead of a whole bit:
 *   linkAt  the lowest score at which the pairs scoring at or above it reach the target precision in EVERY dataset;
 *   newAt   linkAt less a review band of stated width: a person sees the pairs whose evidence is within that many
 *           bits of a link (and whose names agree at least in part: decisionRules.worthReview).
 */
import { analyseName } from '../../resolvers/analyse/index.ts';
import { candidatePairs, type MatchRecord } from '../../resolvers/block/index.ts';
import { buildIdfTable } from '../../resolvers/compare/index.ts';
import { compareCandidates, FEATURE_LEVELS, FEATURE_NAMES, scoreCompared, type ComparedPairs, type MatchModel } from '../../resolvers/score/index.ts';
import { heldBackAt, indexedRules } from '../../resolvers/score/decisionRules.ts';
import type { LabelledRow } from './loadLabelledCsv.ts';

export interface TrainingSet {
  name: string;
  rows: readonly LabelledRow[];
}

export interface TrainingTargets {
  /** Pair precision at or above linkAt, in every dataset. */
  linkPrecision: number;
  /** Width of the review band below linkAt, in bits: newAt = linkAt − reviewBandBits. */
  reviewBandBits: number;
}

interface LabelledPairs {
  name: string;
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
  return { name: set.name, compared, levels: compared.levels, matches, count: pairs.count };
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

/** Bits below the lowest qualifying score at which linkAt is set. */
const LINK_AT_MARGIN = 0.01;

export function estimateModel(sets: readonly LabelledPairs[], targets: TrainingTargets, note: string, prior: MatchModel): MatchModel {
  const counted = sets.map(countLevels);
  const features: MatchModel['features'] = {};
  FEATURE_NAMES.forEach((f, i) => {
    const mean = (side: 'm' | 'u'): number[] =>
      FEATURE_LEVELS[f].map((_, k) => counted.reduce((s, c) => s + (c[side][i]![k] as number), 0) / counted.length);
    const observed = sets.some((set) => hasLevel(set, i));
    const previous = prior.features[f];
    // A feature no dataset shows (shared contacts: the data has no identifiers) keeps the prior's values.
    if (!observed && previous) features[f] = { ...previous, levels: [...previous.levels], m: [...previous.m], u: [...previous.u] };
    else features[f] = { levels: [...FEATURE_LEVELS[f]], m: round(mean('m')), u: round(mean('u')) };
  });
  neutralise(features, 'jurisdiction', 'compatible');
  const matchShare = counted.reduce((s, c) => s + c.matchShare, 0) / counted.length;
  const draft: MatchModel = { version: 1, features, matchShare, linkAt: Infinity, newAt: 0, provenance: { method: 'labelled', pairs: 0, note: '' } };
  const scored = sets.map((set) => ({ set, scores: scoreCompared(set.compared, { ...draft, linkAt: Infinity }) }));
  const perSet = scored.map(({ set, scores }) => ({ name: set.name, linkAt: lowestThreshold(set, scores, targets.linkPrecision) }));
  // Just below the lowest pattern that reaches the target, so rounding of the stored weights cannot lift it over.
  const linkAt = Math.max(...perSet.map((p) => p.linkAt)) - LINK_AT_MARGIN;
  note = `${note}; linkAt per dataset: ${perSet.map((p) => `${p.name} ${p.linkAt.toFixed(3)}`).join(', ')}`;
  const newAt = linkAt - targets.reviewBandBits;
  const pairs = sets.reduce((s, set) => s + set.count, 0);
  return { ...draft, linkAt: round([linkAt])[0]!, newAt: round([newAt])[0]!, provenance: { method: 'labelled', pairs, note } };
}

/**
 * The lowest score t such that the pairs scoring ≥ t have at least `precision` true matches; pairs the rules hold
 * back (decisionRules.linkHeldBackBy) never link, so they do not count.
 */
function lowestThreshold(set: LabelledPairs, scores: Float64Array, precision: number): number {
  const rules = indexedRules();
  const width = FEATURE_NAMES.length;
  const matches = set.matches;
  const order = [...scores.keys()].filter((k) => Number.isFinite(scores[k]!) && !heldBackAt(set.levels, k * width, rules)).sort((a, b) => scores[b]! - scores[a]!);
  let best = Infinity;
  let tp = 0;
  for (let i = 0; i < order.length; i++) {
    tp += matches[order[i]!]!;
    const s = scores[order[i]!]!;
    if (i + 1 < order.length && scores[order[i + 1]!] === s) continue;
    if (tp / (i + 1) >= precision) best = s;
  }
  return best;
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
