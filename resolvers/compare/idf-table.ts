/**
 * Inverse document frequency of name tokens, as an INPUT to soft TF-IDF: the register service builds
 * one from the register's names, `evaluate` from its labelled file. This module stays pure.
 */

export interface IdfTable {
  /** IDF weight of a token (> 0). Tokens never seen get the table's default (the weight of a token seen 0 times). */
  idf(token: string): number;
  /** Number of documents the table was built from. */
  readonly documentCount: number;
}

/**
 * Smoothed IDF: ln((1 + N) / (1 + df)) + 1, the smooth_idf form of scikit-learn's TfidfTransformer
 * (from memory). Smoothing keeps every weight positive, so a name made only of very common tokens
 * ("Holdings Group") still has a non-zero vector, and an unseen token (df = 0) weighs the most.
 */
export function smoothedIdf(documentCount: number, documentFrequency: number): number {
  return Math.log((1 + documentCount) / (1 + documentFrequency)) + 1;
}

/** An IdfTable over given document frequencies (e.g. loaded from the register's token counts). */
export function idfTableFromFrequencies(frequencies: ReadonlyMap<string, number>, documentCount: number): IdfTable {
  if (!Number.isInteger(documentCount) || documentCount < 0) {
    throw new RangeError(`idfTableFromFrequencies: documentCount must be a non-negative integer, got ${documentCount}`);
  }
  const weights = new Map<string, number>();
  for (const [token, df] of frequencies) {
    if (!Number.isInteger(df) || df < 0 || df > documentCount) {
      throw new RangeError(`idfTableFromFrequencies: frequency of token "${token}" must be an integer in 0..${documentCount}, got ${df}`);
    }
    weights.set(token, smoothedIdf(documentCount, df));
  }
  const unseen = smoothedIdf(documentCount, 0);
  return {
    documentCount,
    idf: (token: string): number => weights.get(token) ?? unseen,
  };
}

/** Builds an IdfTable from tokenised documents (one token list per name). A token counts once per document. */
export function buildIdfTable(documents: readonly (readonly string[])[]): IdfTable {
  const frequencies = new Map<string, number>();
  for (const tokens of documents) {
    for (const token of new Set(tokens)) frequencies.set(token, (frequencies.get(token) ?? 0) + 1);
  }
  return idfTableFromFrequencies(frequencies, documents.length);
}
