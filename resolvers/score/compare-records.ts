/**
 * Compares two records feature by feature: the comparison vector EM learns from and scorePair weighs.
 * Identifier evidence is kept apart from the vector: a decisive identifier or a cannot-link overrides the sum.
 */
import type { MatchRecord } from '../block/index.ts';
import { compareIdentifiers, type IdentifierComparison } from '../identifiers/index.ts';
import {
  compareNameTokens,
  jaroWinkler,
  jaroWinklerUpperBound,
  softTfIdfWeighted,
  weighTokens,
  type IdfTable,
  type NameDifference,
  type WeightedTokens,
} from '../compare/index.ts';
import { distinctLevelOf, isInformativeCore, rareIn, NAME_BANDS, nameLevel, nameLevelOfKind, type ComparisonLevels, type FeatureLevel } from './features.ts';
import { acronymLevel, jurisdictionLevel, legalFormLevel } from './context-levels.ts';

export interface Comparison {
  levels: ComparisonLevels;
  softTfIdf: number;
  jaroWinkler: number;
  identifiers: IdentifierComparison | null;
  /** The kind of name difference and the words that set the names apart (null when a core is empty). */
  difference: NameDifference | null;
}

export function compareRecords(a: MatchRecord, b: MatchRecord, idf: IdfTable): Comparison {
  return compareWeighted(a, b, weighTokens(a.analysis.tokens, idf), weighTokens(b.analysis.tokens, idf), idf);
}

/**
 * compareRecords with each record's tokens weighed beforehand (weighTokens with the same IDF table): a batch
 * weighs every record once instead of once per pair. Same result as compareRecords.
 */
export function compareWeighted(a: MatchRecord, b: MatchRecord, weightedA: WeightedTokens, weightedB: WeightedTokens, idf: IdfTable): Comparison {
  const coreA = a.analysis.core;
  const coreB = b.analysis.core;
  const soft = softTfIdfWeighted(weightedA, weightedB);
  const jw = coreA.length > 0 && coreB.length > 0 ? jaroWinkler(coreA, coreB) : 0;
  const name = nameLevels(a, b, idf, () => nameLevel(false, soft, jw));
  const identifiers =
    (a.identifiers?.length ?? 0) > 0 && (b.identifiers?.length ?? 0) > 0 ? compareIdentifiers(a.identifiers ?? [], b.identifiers ?? []) : null;
  const levels: ComparisonLevels = {
    name: name.name,
    legalForm: legalFormLevel(a, b),
    jurisdiction: jurisdictionLevel(a, b),
    acronym: acronymLevel(a, b),
    qualifier: qualifierLevelBeside(name.name, a.analysis.qualifiers, b.analysis.qualifiers),
    sharedContact: identifiers === null ? null : identifiers.sharedWeak.length > 0 ? 'shared' : 'none_shared',
    distinct: name.distinct,
  };
  return { levels, softTfIdf: soft, jaroWinkler: jw, identifiers, difference: name.difference };
}

/**
 * The name and distinct levels of a pair from the kind of difference of its cores (compare/compareNameTokens);
 * `band` gives the degree of two different cores. Null levels when a core is empty. Shared by compareRecords and
 * the batch comparison (compareCandidates), so both give the same levels.
 */
export function nameLevels(a: MatchRecord, b: MatchRecord, idf: IdfTable, band: () => FeatureLevel<'name'>): NameLevels {
  if (a.analysis.core.length === 0 || b.analysis.core.length === 0) return { name: null, distinct: null, difference: null };
  const isRare = rareIn(idf);
  const primary = levelsOf(a.analysis.tokens, b.analysis.tokens, a.analysis.qualifiers, b.analysis.qualifiers, idf, isRare, band);
  if (a.analysis.alternatives.length === 0 && b.analysis.alternatives.length === 0) return primary;
  // Other spellings (aliases, a Latin transliteration): the strongest agreement of any two spellings speaks.
  let best = primary;
  const spellings = (r: MatchRecord): { tokens: readonly string[]; core: string }[] => [r.analysis, ...r.analysis.alternatives];
  for (const x of spellings(a)) {
    for (const y of spellings(b)) {
      if (x === a.analysis && y === b.analysis) continue;
      const other = levelsOf(x.tokens, y.tokens, a.analysis.qualifiers, b.analysis.qualifiers, idf, isRare, () => bandOf(x, y, idf));
      if (strength(other.name) < strength(best.name)) best = other;
    }
  }
  return best;
}

export interface NameLevels {
  name: FeatureLevel<'name'> | null;
  distinct: FeatureLevel<'distinct'> | null;
  difference: NameDifference | null;
}

function levelsOf(
  x: readonly string[],
  y: readonly string[],
  qx: readonly string[],
  qy: readonly string[],
  idf: IdfTable,
  isRare: (token: string) => boolean,
  band: () => FeatureLevel<'name'>,
): NameLevels {
  const difference = compareNameTokens(x, y, qx, qy, isRare);
  return { name: nameLevelOfKind(difference, () => isInformativeCore(x, idf), band), distinct: distinctLevelOf(difference), difference };
}

function bandOf(x: { tokens: readonly string[]; core: string }, y: { tokens: readonly string[]; core: string }, idf: IdfTable): FeatureLevel<'name'> {
  const soft = softTfIdfWeighted(weighTokens(x.tokens, idf), weighTokens(y.tokens, idf));
  return nameLevel(false, soft, x.core.length > 0 && y.core.length > 0 ? jaroWinkler(x.core, y.core) : 0);
}

/**
 * Name levels from the strongest agreement to the weakest, to pick among spellings (the order of the built-in
 * model's weights; an exact core outranks the rest).
 */
export const NAME_STRENGTH: readonly FeatureLevel<'name'>[] = [
  'exact',
  'near_exact',
  'typo',
  'abbreviation',
  'extra_words',
  'very_high',
  'extra_activity',
  'high',
  'exact_weak',
  'extra_place',
  'medium',
  'low',
  'none',
];

function strength(level: FeatureLevel<'name'> | null): number {
  return level === null ? NAME_STRENGTH.length : NAME_STRENGTH.indexOf(level);
}

/**
 * The band by degree of two cores (nameLevel), computing Jaro–Winkler of the cores only when it can change
 * the level: when the soft TF-IDF band already beats every band the cores' lengths allow JW to reach
 * (jaroWinklerUpperBound), the level is the soft band's. For batches, where only levels are kept.
 */
export function nameLevelOf(coreA: string, coreB: string, soft: number): FeatureLevel<'name'> | null {
  if (coreA.length === 0 || coreB.length === 0) return null;
  if (coreA === coreB) return 'exact';
  let softBand = 0;
  while (softBand < NAME_BANDS.length && soft < NAME_BANDS[softBand]!.softTfIdf) softBand++;
  // JW matters only if it reaches the cut of a better band; the lowest such cut is the band just above.
  if (softBand === 0) return NAME_BANDS[0]!.level;
  const cut = NAME_BANDS[softBand - 1]!.jaroWinkler;
  if (jaroWinklerUpperBound(coreA.length, coreB.length) < cut - 1e-9) return softBand < NAME_BANDS.length ? NAME_BANDS[softBand]!.level : 'none';
  return nameLevel(false, soft, jaroWinkler(coreA, coreB));
}

/**
 * The qualifier level beside the name level. Companies of one group share their place qualifier ("Alder Securities
 * (Asia)" / "Alder (Asia)"): beside names where one side only adds words, an equal qualifier is the group's and says
 * nothing more about one company, so it is not observed (the two features are not independent there).
 */
export function qualifierLevelBeside(name: FeatureLevel<'name'> | null, a: readonly string[], b: readonly string[]): FeatureLevel<'qualifier'> | null {
  const level = qualifierLevel(a, b);
  return level === 'same' && (name === 'extra_words' || name === 'extra_activity') ? null : level;
}

export function qualifierLevel(a: readonly string[], b: readonly string[]): FeatureLevel<'qualifier'> | null {
  if (a.length === 0 || b.length === 0) return null;
  const setB = new Set(b);
  return a.some((q) => setB.has(q)) ? 'same' : 'different';
}
