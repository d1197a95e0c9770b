export { jaro, jaroWinkler, commonPrefixLength, WINKLER_PREFIX_SCALE, WINKLER_MAX_PREFIX } from './jaroWinkler.ts';
export { buildIdfTable, idfTableFromFrequencies, smoothedIdf, type IdfTable } from './idfTable.ts';
export {
  softTfIdf,
  softTfIdfExplained,
  SOFT_TFIDF_DEFAULT_THRESHOLD,
  type SoftTfIdfOptions,
  type SoftTfIdfMatch,
  type SoftTfIdfResult,
} from './softTfIdf.ts';
