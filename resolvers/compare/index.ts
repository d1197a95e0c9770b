export { jaro, jaroWinkler, jaroWinklerUpperBound, commonPrefixLength, WINKLER_PREFIX_SCALE, WINKLER_MAX_PREFIX } from './jaro-winkler.ts';
export { buildIdfTable, idfTableFromFrequencies, smoothedIdf, type IdfTable } from './idf-table.ts';
export {
  softTfIdf,
  softTfIdfExplained,
  softTfIdfWeighted,
  weighTokens,
  type WeightedTokens,
  SOFT_TFIDF_DEFAULT_THRESHOLD,
  type SoftTfIdfOptions,
  type SoftTfIdfMatch,
  type SoftTfIdfResult,
} from './soft-tf-idf.ts';
export { levenshtein, levenshteinSimilarity } from './levenshtein.ts';
export { withinOneEdit } from './within-one-edit.ts';
export { compareAcronym, acronymTokens, initialsOf, ACRONYM_STOP_WORDS, type AcronymComparison, type AcronymLevel } from './acronym.ts';
export { compareLegalForms, type LegalFormComparison, type LegalFormLevel } from './legal-form.ts';
export { compareJurisdictions, jurisdictionsCompatible, parseJurisdiction, type JurisdictionComparison, type JurisdictionLevel } from './jurisdiction.ts';
export { compareNameTokens, type DistinguishingKind, type NameDifference, type NameDifferenceKind } from './name-difference.ts';
export { ACTIVITY_WORDS, BRANCH_WORDS, isNumberToken, isPlaceWord } from './distinguishing-words.ts';
