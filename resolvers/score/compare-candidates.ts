/**
 * Compares every candidate pair of a batch once and keeps the result compactly (one byte per feature per pair),
 * so that EM, scoring and a threshold sweep reuse it without comparing again.
 */
import type { CandidatePairs, MatchRecord } from '../block/index.ts';
import { softTfIdfWeighted, weighTokens, type IdfTable } from '../compare/index.ts';
import { compareIdentifiers } from '../identifiers/index.ts';
import type { IndexedPairs, ScoredEdge } from '../cluster/index.ts';
import type { Random } from '../prng.ts';
import { compareRecords, nameLevelOf, nameLevels, qualifierLevelBeside } from './compare-records.ts';
import { acronymLevel, jurisdictionLevel, legalFormLevel } from './context-levels.ts';
import type { ComparisonVector } from './em.ts';
import { FEATURE_LEVELS, FEATURE_NAMES, levelIndices } from './features.ts';
import { featureWeights, type MatchModel } from './match-model.ts';
import { capOf, holdAt, indexedRules } from './decision-rules.ts';

const MISSING = -1;

export interface ComparedPairs {
  pairs: CandidatePairs;
  /** count × features level indices; −1 = not observed. */
  levels: Int8Array;
  /** Pair index → identifier override. */
  overrides: Map<number, 'decisive_identifier' | 'cannot_link'>;
}

/** Level name → index in FEATURE_LEVELS, per feature (levelIndices without its per-pair arrays). */
const levelIndex = Object.fromEntries(FEATURE_NAMES.map((f) => [f, new Map((FEATURE_LEVELS[f] as readonly string[]).map((level, k) => [level, k]))])) as Record<
  (typeof FEATURE_NAMES)[number],
  Map<string, number>
>;

const NAME = FEATURE_NAMES.indexOf('name');
const LEGAL_FORM = FEATURE_NAMES.indexOf('legalForm');
const JURISDICTION = FEATURE_NAMES.indexOf('jurisdiction');
const ACRONYM = FEATURE_NAMES.indexOf('acronym');
const QUALIFIER = FEATURE_NAMES.indexOf('qualifier');
const SHARED_CONTACT = FEATURE_NAMES.indexOf('sharedContact');
const DISTINCT = FEATURE_NAMES.indexOf('distinct');
if (FEATURE_NAMES.length !== 7) throw new Error('compareCandidates: a feature was added; write its level here too');

export function compareCandidates(records: readonly MatchRecord[], pairs: CandidatePairs, idf: IdfTable): ComparedPairs {
  const width = FEATURE_NAMES.length;
  const levels = new Int8Array(pairs.count * width);
  const overrides = new Map<number, 'decisive_identifier' | 'cannot_link'>();
  // Each record's weighted tokens once, not once per pair; levels written straight into the array (the same
  // levels as compareRecords, without its per-pair objects; a test checks they agree).
  const weighted = records.map((r) => weighTokens(r.analysis.tokens, idf));
  const index = FEATURE_NAMES.map((f) => levelIndex[f]);
  const put = (row: number, f: number, level: string | null): void => {
    levels[row + f] = level === null ? MISSING : (index[f] as Map<string, number>).get(level)!;
  };
  for (let k = 0; k < pairs.count; k++) {
    const i = pairs.left[k] as number;
    const j = pairs.right[k] as number;
    const a = records[i] as MatchRecord;
    const b = records[j] as MatchRecord;
    const row = k * width;
    const soft = softTfIdfWeighted(weighted[i]!, weighted[j]!);
    const name = nameLevels(a, b, idf, () => nameLevelOf(a.analysis.core, b.analysis.core, soft)!);
    put(row, NAME, name.name);
    put(row, DISTINCT, name.distinct);
    put(row, LEGAL_FORM, legalFormLevel(a, b));
    put(row, JURISDICTION, jurisdictionLevel(a, b));
    put(row, ACRONYM, acronymLevel(a, b));
    put(row, QUALIFIER, qualifierLevelBeside(name.name, a.analysis.qualifiers, b.analysis.qualifiers));
    const ids = (a.identifiers?.length ?? 0) > 0 && (b.identifiers?.length ?? 0) > 0 ? compareIdentifiers(a.identifiers ?? [], b.identifiers ?? []) : null;
    put(row, SHARED_CONTACT, ids === null ? null : ids.sharedWeak.length > 0 ? 'shared' : 'none_shared');
    if (ids?.cannotLink) overrides.set(k, 'cannot_link');
    else if (ids?.decisive) overrides.set(k, 'decisive_identifier');
  }
  return { pairs, levels, overrides };
}

/** The stored comparisons as EM vectors. */
export function comparedVectors(compared: ComparedPairs): ComparisonVector[] {
  const width = FEATURE_NAMES.length;
  const out: ComparisonVector[] = new Array(compared.pairs.count);
  for (let k = 0; k < compared.pairs.count; k++) {
    const row: (number | null)[] = new Array(width);
    for (let f = 0; f < width; f++) {
      const v = compared.levels[k * width + f] as number;
      row[f] = v === MISSING ? null : v;
    }
    out[k] = row;
  }
  return out;
}

/** Comparison vectors of `count` random distinct pairs (seeded): the sample u is estimated from. */
export function randomPairVectors(records: readonly MatchRecord[], idf: IdfTable, count: number, random: Random): ComparisonVector[] {
  const out: ComparisonVector[] = [];
  if (records.length < 2) return out;
  while (out.length < count) {
    const i = random.int(records.length);
    const j = random.int(records.length);
    if (i === j) continue;
    out.push(levelIndices(compareRecords(records[i] as MatchRecord, records[j] as MatchRecord, idf).levels));
  }
  return out;
}

/** Ruled scores (decisionRules.ruledScore) of every compared pair under a model: identifier overrides as ±Infinity, held-back pairs capped (decisionRules.capOf). */
export function scoreCompared(compared: ComparedPairs, model: MatchModel): Float64Array {
  const width = FEATURE_NAMES.length;
  const weights = FEATURE_NAMES.map((f) => {
    const params = model.features[f];
    if (!params) return (FEATURE_LEVELS[f] as readonly string[]).map(() => 0);
    // Map our level order onto the model's (a stored model may list levels in another order).
    const byName = featureWeights(params);
    return (FEATURE_LEVELS[f] as readonly string[]).map((level) => {
      const k = params.levels.indexOf(level);
      return k < 0 ? 0 : (byName[k] as number);
    });
  });
  const scores = new Float64Array(compared.pairs.count);
  const rules = indexedRules();
  for (let k = 0; k < compared.pairs.count; k++) {
    let s = 0;
    for (let f = 0; f < width; f++) {
      const v = compared.levels[k * width + f] as number;
      if (v !== MISSING) s += (weights[f] as number[])[v] as number;
    }
    const override = compared.overrides.get(k);
    if (override === undefined) s = Math.min(s, capOf(holdAt(compared.levels, k * width, rules), model));
    scores[k] = override === 'cannot_link' ? -Infinity : override === 'decisive_identifier' ? Infinity : s;
  }
  return scores;
}

/** Scored edges and cannot-links for clusterRecords, naming records by id. */
export function edgesOf(
  records: readonly MatchRecord[],
  compared: ComparedPairs,
  scores: Float64Array,
): { edges: ScoredEdge[]; cannotLinks: [string, string][] } {
  const edges: ScoredEdge[] = [];
  const cannotLinks: [string, string][] = [];
  for (let k = 0; k < compared.pairs.count; k++) {
    const a = (records[compared.pairs.left[k] as number] as MatchRecord).id;
    const b = (records[compared.pairs.right[k] as number] as MatchRecord).id;
    const score = scores[k] as number;
    if (score === -Infinity) cannotLinks.push([a, b]);
    else edges.push({ a, b, score });
  }
  return { edges, cannotLinks };
}

/** The compared pairs with their scores as index pairs for cluster/clusterIndexed (cannot-links stay −Infinity). */
export function indexedPairsOf(compared: ComparedPairs, scores: Float64Array): IndexedPairs {
  return { left: compared.pairs.left, right: compared.pairs.right, scores, count: compared.pairs.count };
}
