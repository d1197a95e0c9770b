/**
 * Levenshtein edit distance through fast-levenshtein (insertions, deletions, substitutions; UTF-16 code
 * units), and the normalised similarity 1 − d / max(|a|, |b|) (the form strsim calls normalized_levenshtein).
 */
import fastLevenshtein from 'fast-levenshtein';

export function levenshtein(a: string, b: string): number {
  return fastLevenshtein.get(a, b);
}

/** 1 − d / max(|a|, |b|) in [0, 1]; two empty strings are identical (1). */
export function levenshteinSimilarity(a: string, b: string): number {
  const longest = Math.max(a.length, b.length);
  if (longest === 0) return 1;
  return 1 - fastLevenshtein.get(a, b) / longest;
}
