/**
 * Jaro (Jaro 1989) and Jaro–Winkler (Winkler 1990) similarity.
 *
 * Variant: the PLAIN Jaro–Winkler of Winkler 1990 — prefix scale p = 0.1, common prefix capped at 4,
 * match window floor(max(|a|, |b|) / 2) − 1, t = half the matched characters out of order, and the
 * prefix bonus applied whatever the Jaro value. None of the strcmp95 adjustments (no boost threshold
 * of 0.7, no similar-character credit, no long-string adjustment): those are the census program's, and
 * the published tables we test against reproduce only with the plain form (see the tests).
 *
 * Characters are UTF-16 code units (as `charCodeAt` sees them), like most JavaScript implementations;
 * callers compare analysed, NFKC-folded names, where characters outside the BMP are rare.
 *
 * Speed: a bit-parallel kernel when the second string has at most 32 code units (one 32-bit mask holds
 * its positions), otherwise a char-code kernel over a reused flag buffer. Both buffers are module-level
 * typed arrays grown as needed, so a call allocates nothing. Both kernels make the same greedy choice
 * (each character of `a`, left to right, takes the leftmost unmatched equal character of `b` inside
 * the window), so they return identical values.
 */

/** Positions (bit k = position k of `b`) of each UTF-16 code unit in `b`; reset after every call. */
const positionMasks = new Uint32Array(65536);
/** Matched code units of `a`, in order. */
let matchedA = new Uint16Array(64);
/** Matched flags of `b` (long-string kernel only). */
let flagsB = new Uint8Array(64);

function ensureBuffers(length: number): void {
  if (matchedA.length < length) matchedA = new Uint16Array(Math.max(length, matchedA.length * 2));
  if (flagsB.length < length) flagsB = new Uint8Array(Math.max(length, flagsB.length * 2));
}

function jaroFromCounts(m: number, transposed: number, lengthA: number, lengthB: number): number {
  if (m === 0) return 0;
  const t = transposed / 2;
  // Same order of operations as the usual formula, so results agree bit for bit with other implementations.
  return (m / lengthA + m / lengthB + (m - t) / m) / 3;
}

/** Bit-parallel kernel: |b| ≤ 32. */
function jaroShort(a: string, b: string, lengthA: number, lengthB: number, window: number): number {
  for (let k = 0; k < lengthB; k++) positionMasks[b.charCodeAt(k)] |= 1 << k;
  let matchedB = 0;
  let m = 0;
  for (let i = 0; i < lengthA; i++) {
    const lo = i - window > 0 ? i - window : 0;
    if (lo >= lengthB) break;
    const hi = i + window + 1 < lengthB ? i + window + 1 : lengthB;
    const upTo = hi >= 32 ? -1 : (1 << hi) - 1;
    const windowMask = upTo & ~((1 << lo) - 1);
    const candidates = positionMasks[a.charCodeAt(i)]! & ~matchedB & windowMask;
    if (candidates !== 0) {
      matchedB |= candidates & -candidates;
      matchedA[m++] = a.charCodeAt(i);
    }
  }
  for (let k = 0; k < lengthB; k++) positionMasks[b.charCodeAt(k)] = 0;
  if (m === 0) return 0;
  let transposed = 0;
  let j = 0;
  let rest = matchedB;
  while (rest !== 0) {
    const bit = rest & -rest;
    const k = 31 - Math.clz32(bit);
    if (b.charCodeAt(k) !== matchedA[j++]) transposed++;
    rest ^= bit;
  }
  return jaroFromCounts(m, transposed, lengthA, lengthB);
}

/** Char-code kernel for |b| > 32. */
function jaroLong(a: string, b: string, lengthA: number, lengthB: number, window: number): number {
  flagsB.fill(0, 0, lengthB);
  let m = 0;
  for (let i = 0; i < lengthA; i++) {
    const lo = i - window > 0 ? i - window : 0;
    if (lo >= lengthB) break;
    const hi = i + window + 1 < lengthB ? i + window + 1 : lengthB;
    const c = a.charCodeAt(i);
    for (let k = lo; k < hi; k++) {
      if (flagsB[k] === 0 && b.charCodeAt(k) === c) {
        flagsB[k] = 1;
        matchedA[m++] = c;
        break;
      }
    }
  }
  if (m === 0) return 0;
  let transposed = 0;
  let j = 0;
  for (let k = 0; k < lengthB; k++) {
    if (flagsB[k] === 1 && b.charCodeAt(k) !== matchedA[j++]) transposed++;
  }
  return jaroFromCounts(m, transposed, lengthA, lengthB);
}

/**
 * Jaro similarity in [0, 1]. Identical strings (including two empty strings) give 1; an empty string
 * against a non-empty one gives 0.
 */
export function jaro(a: string, b: string): number {
  if (a === b) return 1;
  const lengthA = a.length;
  const lengthB = b.length;
  if (lengthA === 0 || lengthB === 0) return 0;
  const half = Math.floor((lengthA > lengthB ? lengthA : lengthB) / 2) - 1;
  const window = half > 0 ? half : 0;
  ensureBuffers(lengthA > lengthB ? lengthA : lengthB);
  return lengthB <= 32
    ? jaroShort(a, b, lengthA, lengthB, window)
    : jaroLong(a, b, lengthA, lengthB, window);
}

/** Prefix scale p of Winkler 1990. */
export const WINKLER_PREFIX_SCALE = 0.1;
/** Longest common prefix that earns the bonus (Winkler 1990). */
export const WINKLER_MAX_PREFIX = 4;

/** Length of the common prefix of `a` and `b`, capped at WINKLER_MAX_PREFIX. */
export function commonPrefixLength(a: string, b: string): number {
  const limit = Math.min(WINKLER_MAX_PREFIX, a.length, b.length);
  let l = 0;
  while (l < limit && a.charCodeAt(l) === b.charCodeAt(l)) l++;
  return l;
}

/** Plain Jaro–Winkler similarity in [0, 1]: jaro + l · 0.1 · (1 − jaro), l ≤ 4. */
export function jaroWinkler(a: string, b: string): number {
  if (a === b) return 1;
  const j = jaro(a, b);
  const l = commonPrefixLength(a, b);
  return j + l * WINKLER_PREFIX_SCALE * (1 - j);
}
