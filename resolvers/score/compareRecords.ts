/**
 * Compares two records feature by feature: the comparison vector EM learns from and scorePair weighs.
 * Identifier evidence is kept apart from the vector: a decisive identifier or a cannot-link overrides the sum.
 */
import type { MatchRecord } from '../block/matchRecord.ts';
import { compareIdentifiers, type IdentifierComparison } from '../identifiers/index.ts';
import { jaroWinkler, softTfIdfWeighted, weighTokens, type IdfTable, type WeightedTokens } from '../compare/index.ts';
import { nameLevel, type ComparisonLevels, type FeatureLevel } from './features.ts';
import { acronymLevel, jurisdictionLevel, legalFormLevel } from './contextLevels.ts';

export interface Comparison {
  levels: ComparisonLevels;
  softTfIdf: number;
  jaroWinkler: number;
  identifiers: IdentifierComparison | null;
}

export function compareRecords(a: MatchRecord, b: MatchRecord, idf: IdfTable): Comparison {
  return compareWeighted(a, b, weighTokens(a.analysis.tokens, idf), weighTokens(b.analysis.tokens, idf));
}

/**
 * compareRecords with each record's tokens weighed beforehand (weighTokens with the same IDF table): a batch
 * weighs every record once instead of once per pair. Same result as compareRecords.
 */
export function compareWeighted(a: MatchRecord, b: MatchRecord, weightedA: WeightedTokens, weightedB: WeightedTokens): Comparison {
  const coreA = a.analysis.core;
  const coreB = b.analysis.core;
  const soft = softTfIdfWeighted(weightedA, weightedB);
  const jw = coreA.length > 0 && coreB.length > 0 ? jaroWinkler(coreA, coreB) : 0;
  const identifiers = (a.identifiers?.length ?? 0) > 0 && (b.identifiers?.length ?? 0) > 0
    ? compareIdentifiers(a.identifiers ?? [], b.identifiers ?? [])
    : null;
  const levels: ComparisonLevels = {
    name: coreA.length === 0 || coreB.length === 0 ? null : nameLevel(coreA === coreB, soft, jw),
    legalForm: legalFormLevel(a, b),
    jurisdiction: jurisdictionLevel(a, b),
    acronym: acronymLevel(a, b),
    qualifier: qualifierLevel(a.analysis.qualifiers, b.analysis.qualifiers),
    sharedContact: identifiers === null ? null : identifiers.sharedWeak.length > 0 ? 'shared' : 'none_shared',
  };
  return { levels, softTfIdf: soft, jaroWinkler: jw, identifiers };
}

function qualifierLevel(a: readonly string[], b: readonly string[]): FeatureLevel<'qualifier'> | null {
  if (a.length === 0 || b.length === 0) return null;
  const setB = new Set(b);
  return a.some((q) => setB.has(q)) ? 'same' : 'different';
}
