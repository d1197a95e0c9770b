/**
 * Character ranges of a matched name to highlight for a query: each word of the name whose folded form equals,
 * starts with, or is close (Jaro–Winkler ≥ 0.88) to a folded query word. Ranges are [start, end) offsets in
 * UTF-16 code units of the name (JavaScript string indices), merged and sorted. A hand-written scanner: no regex
 * over untrusted input.
 */
import { jaroWinkler } from '../../../../resolvers/compare/index.ts';

export const HIGHLIGHT_SIMILARITY = 0.88;

function fold(word: string): string {
  return word.normalize('NFKD').replace(/\p{M}/gu, '').toLowerCase();
}

function isWordChar(ch: string): boolean {
  return /[\p{L}\p{N}]/u.test(ch);
}

export function words(text: string): { start: number; end: number; folded: string }[] {
  const out: { start: number; end: number; folded: string }[] = [];
  let start = -1;
  for (let i = 0; i <= text.length; i++) {
    const inWord = i < text.length && isWordChar(text[i]!);
    if (inWord && start < 0) start = i;
    if (!inWord && start >= 0) {
      out.push({ start, end: i, folded: fold(text.slice(start, i)) });
      start = -1;
    }
  }
  return out;
}

export function highlightRanges(name: string, query: string): [number, number][] {
  const queryWords = words(query)
    .map((w) => w.folded)
    .filter((w) => w.length > 0);
  const ranges: [number, number][] = [];
  for (const word of words(name)) {
    const hit = queryWords.some(
      (q) => q === word.folded || (q.length >= 2 && word.folded.startsWith(q)) || (q.length >= 3 && jaroWinkler(q, word.folded) >= HIGHLIGHT_SIMILARITY),
    );
    if (hit) ranges.push([word.start, word.end]);
  }
  return ranges;
}
