/**
 * Jaro (Jaro 1989) and Jaro–Winkler (Winkler 1990) similarity.
 *
 * Variant: the PLAIN Jaro–Winkler of Winkler 1990 — prefix scale p = 0.1, common prefix capped at 4,
 * match window floor(max(|a|, |b|) / 2) − 1, t = half the matched characters out of order, and the
 * prefix bonus applied whatever the Jaro value. None of the strcmp95 adjustments (no boost threshold
 * of 0.7, no similar-character credit, no long-string adjustment): those are the census program's, and
 * the published tables we test against reproduce only with the plain form (see the tests).
 *
 * natural's JaroWinklerDistance (natural 8.1.1, a dev dependency used as the test oracle) is the same plain
 * variant and agrees with this one on every pair of strings (property test on 100,000 pairs); it differs only by
 * options we do not offer (ignoreCase; dj, a caller-supplied Jaro value) and by returning 0 for non-strings.
 *
 * Characters are UTF-16 code units (as `charCodeAt` sees them), like most JavaScript implementations;
 * callers compare analysed, NFKC-folded names, where characters outside the BMP are rare.
 *
 * Speed: bit-parallel. When the second string has at most 32 code units one 32-bit mask per code unit
 * holds its positions; longer strings spread them over ⌈|b|/32⌉ words. The buffers are module-level typed
 * arrays grown as needed, so a call allocates nothing. Both kernels make the same greedy choice
 * (each character of `a`, left to right, takes the leftmost unmatched equal character of `b` inside
 * the window), so they return identical values.
 */

/** Positions (bit k = position k of `b`) of each UTF-16 code unit in `b`; reset after every call. Int32, not
 * Uint32: a set bit 31 must stay a small integer for V8, not become a heap double. */
const positionMasks = new Int32Array(65536);
/** Matched code units of `a`, in order. */
let matchedA = new Uint16Array(64);
function ensureBuffers(length: number): void {
  if (matchedA.length < length) matchedA = new Uint16Array(Math.max(length, matchedA.length * 2));
}

function jaroFromCounts(m: number, transposed: number, lengthA: number, lengthB: number): number {
  if (m === 0) return 0;
  const t = transposed / 2;
  // Same order of operations as the usual formula, so results agree bit for bit with other implementations.
  return (m / lengthA + m / lengthB + (m - t) / m) / 3;
}

/** Bit-parallel kernel: |b| ≤ 32. */
function jaroShort(a: string, b: string, lengthA: number, lengthB: number, window: number): number {
  // Local aliases: module-level `let` bindings cost a context load on every access.
  const masks = positionMasks;
  const matched = matchedA;
  for (let k = 0; k < lengthB; k++) masks[b.charCodeAt(k)]! |= 1 << k;
  let matchedB = 0;
  let m = 0;
  for (let i = 0; i < lengthA; i++) {
    const lo = i - window > 0 ? i - window : 0;
    if (lo >= lengthB) break;
    const hi = i + window + 1;
    const upTo = hi >= lengthB ? (lengthB === 32 ? -1 : (1 << lengthB) - 1) : (1 << hi) - 1;
    const c = a.charCodeAt(i);
    const candidates = masks[c]! & ~matchedB & upTo & ~((1 << lo) - 1);
    if (candidates !== 0) {
      matchedB |= candidates & -candidates;
      matched[m++] = c;
    }
  }
  for (let k = 0; k < lengthB; k++) masks[b.charCodeAt(k)] = 0;
  if (m === 0) return 0;
  let transposed = 0;
  let j = 0;
  let rest = matchedB;
  while (rest !== 0) {
    const bit = rest & -rest;
    if (b.charCodeAt(31 - Math.clz32(bit)) !== matched[j++]) transposed++;
    rest ^= bit;
  }
  return jaroFromCounts(m, transposed, lengthA, lengthB);
}

/** Slot (1-based) of each code unit of `b` in the multi-word kernel; 0 = not in `b`. Reset after every call. */
const slotOf = new Int32Array(65536);
/** Position masks of the multi-word kernel: slot s, word w at (s − 1) · words + w. */
let blockMasks = new Int32Array(256);
/** Matched positions of `b`, one bit per position, `words` words. */
let matchedWords = new Int32Array(8);

/** Bits lo..hi−1 of word w (positions 32w..32w+31), as an int32 mask. */
function wordWindow(w: number, lo: number, hi: number): number {
  const first = w << 5;
  const from = lo > first ? lo - first : 0;
  const to = hi - first >= 32 ? 32 : hi - first;
  const upTo = to >= 32 ? -1 : (1 << to) - 1;
  return upTo & ~((1 << from) - 1);
}

/**
 * Multi-word bit-parallel kernel for |b| > 32: the same greedy choice as the one-word kernel, with b's
 * positions spread over ⌈|b|/32⌉ words and b's distinct code units mapped to dense slots.
 */
function jaroLong(a: string, b: string, lengthA: number, lengthB: number, window: number): number {
  const words = (lengthB + 31) >> 5;
  if (matchedWords.length < words) matchedWords = new Int32Array(words * 2);
  matchedWords.fill(0, 0, words);
  let slots = 0;
  const slotTable = slotOf;
  const matched = matchedA;
  for (let k = 0; k < lengthB; k++) {
    const c = b.charCodeAt(k);
    let slot = slotTable[c]!;
    if (slot === 0) {
      slot = ++slots;
      slotTable[c] = slot;
      const needed = slot * words;
      if (blockMasks.length < needed) {
        const grown = new Int32Array(Math.max(needed, blockMasks.length * 2));
        grown.set(blockMasks);
        blockMasks = grown;
      }
      blockMasks.fill(0, (slot - 1) * words, needed);
    }
    blockMasks[(slot - 1) * words + (k >> 5)]! |= 1 << (k & 31);
  }
  const masks = blockMasks;
  const matchedB = matchedWords;
  let m = 0;
  for (let i = 0; i < lengthA; i++) {
    const lo = i - window > 0 ? i - window : 0;
    if (lo >= lengthB) break;
    const c = a.charCodeAt(i);
    const slot = slotTable[c]!;
    if (slot === 0) continue;
    const hi = i + window + 1 < lengthB ? i + window + 1 : lengthB;
    const base = (slot - 1) * words;
    const lastWord = (hi - 1) >> 5;
    for (let w = lo >> 5; w <= lastWord; w++) {
      const candidates = masks[base + w]! & ~matchedB[w]! & wordWindow(w, lo, hi);
      if (candidates !== 0) {
        matchedB[w]! |= candidates & -candidates;
        matched[m++] = c;
        break;
      }
    }
  }
  for (let k = 0; k < lengthB; k++) slotTable[b.charCodeAt(k)] = 0;
  if (m === 0) return 0;
  let transposed = 0;
  let j = 0;
  for (let w = 0; w < words; w++) {
    let rest = matchedB[w]!;
    while (rest !== 0) {
      const bit = rest & -rest;
      const k = (w << 5) + 31 - Math.clz32(bit);
      if (b.charCodeAt(k) !== matched[j++]) transposed++;
      rest ^= bit;
    }
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
  const half = ((lengthA > lengthB ? lengthA : lengthB) >> 1) - 1;
  const window = half > 0 ? half : 0;
  ensureBuffers(lengthA > lengthB ? lengthA : lengthB);
  return lengthB <= 32 ? jaroShort(a, b, lengthA, lengthB, window) : jaroLong(a, b, lengthA, lengthB, window);
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

/**
 * The largest Jaro–Winkler similarity two DIFFERENT strings of these lengths can reach, from their lengths alone.
 *
 * Derivation (plain variant above): let s ≤ l be the two lengths and m the matched characters, m ≤ s. Then
 *   Jaro = (m/s + m/l + (m − t)/m) / 3 ≤ (1 + s/l + 1) / 3 = J*,
 * and JW = 1 − (1 − Jaro)(1 − ℓ·p) grows with Jaro and with the common prefix ℓ ≤ min(4, s), so
 *   JW ≤ 1 − (1 − J*)(1 − min(4, s)·0.1) = 1 − (1 − s/l)/3 · (1 − min(4, s)·0.1).
 * For θ = 0.9 and s ≥ 4 this says a pair can pass only when s/l ≥ 0.5. Used to skip token pairs that cannot
 * reach a similarity threshold; the test checks the bound against the kernel on random strings.
 */
export function jaroWinklerUpperBound(lengthA: number, lengthB: number): number {
  const s = lengthA < lengthB ? lengthA : lengthB;
  const l = lengthA < lengthB ? lengthB : lengthA;
  if (s === 0) return 0;
  const prefix = s < WINKLER_MAX_PREFIX ? s : WINKLER_MAX_PREFIX;
  return 1 - ((1 - s / l) / 3) * (1 - prefix * WINKLER_PREFIX_SCALE);
}
