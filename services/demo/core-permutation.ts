/**
 * The core numbers of generated entities (a coined word and an activity word) and the seeded permutation they are
 * drawn in, so that no two entities of a run share a core and the order looks unordered.
 */
import { ENDINGS, INDUSTRIES, SYLLABLES } from './name-parts.ts';

/** Coined words (two syllables and an ending); a core number is a coined word and an activity word. */
export const COINED_WORDS = SYLLABLES.length * SYLLABLES.length * ENDINGS.length;
export const CORE_SPACE = COINED_WORDS * INDUSTRIES.length;

/**
 * A bijection of [0, CORE_SPACE) chosen by the seed, so entity cores never repeat and look unordered:
 * `coreOf(i)` is the i-th entity's core, `indexOf(core)` the position at which a core is drawn.
 */
export function corePermutation(seed: number): { coreOf: (i: number) => number; indexOf: (core: number) => number } {
  let a = 1_000_003 + 2 * (seed % 1000);
  while (gcd(a, CORE_SPACE) !== 1) a += 2;
  const b = (seed * 7919) % CORE_SPACE;
  const n = BigInt(CORE_SPACE);
  const inverse = modInverse(BigInt(a), n);
  return {
    coreOf: (i) => Number((BigInt(a) * BigInt(i) + BigInt(b)) % n),
    indexOf: (core) => Number(((((BigInt(core) - BigInt(b)) % n) + n) * inverse) % n),
  };
}

function gcd(x: number, y: number): number {
  while (y !== 0) [x, y] = [y, x % y];
  return x;
}

/** x⁻¹ mod n for x coprime to n (extended Euclid). */
function modInverse(x: bigint, n: bigint): bigint {
  let [r0, r1] = [x % n, n];
  let [s0, s1] = [1n, 0n];
  while (r1 !== 0n) {
    const q = r0 / r1;
    [r0, r1] = [r1, r0 - q * r1];
    [s0, s1] = [s1, s0 - q * s1];
  }
  return ((s0 % n) + n) % n;
}
