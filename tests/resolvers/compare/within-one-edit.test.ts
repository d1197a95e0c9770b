import fastLevenshtein from 'fast-levenshtein';
import { describe, expect, it } from 'vitest';
import { withinOneEdit } from '../../../resolvers/compare/within-one-edit.ts';
import { seededRandom } from '../../../resolvers/prng.ts';

describe('withinOneEdit', () => {
  // Damerau (1964), "A technique for computer detection and correction of spelling errors": the four single errors
  // are one letter wrong, one missing, one extra, and two adjacent letters transposed. Words invented.
  it('accepts each of the four single errors of Damerau 1964', () => {
    expect(withinOneEdit('halselan', 'halsalan')).toBe(true); // one letter wrong
    expect(withinOneEdit('halselan', 'halseln')).toBe(true); // one letter missing
    expect(withinOneEdit('halselan', 'hallselan')).toBe(true); // one extra letter
    expect(withinOneEdit('halselan', 'haslelan')).toBe(true); // "ls" transposed to "sl"
    expect(withinOneEdit('', 'a')).toBe(true);
    expect(withinOneEdit('same', 'same')).toBe(true);
  });
  it('refuses two errors', () => {
    expect(withinOneEdit('purbach', 'peuerbach')).toBe(false);
    expect(withinOneEdit('tiberio', 'tiberius')).toBe(false);
    expect(withinOneEdit('abcd', 'badc')).toBe(false); // two transpositions
    expect(withinOneEdit('abc', 'cab')).toBe(false); // a rotation is two edits
    expect(withinOneEdit('a', 'abc')).toBe(false);
  });
  it('agrees with fast-levenshtein (distance <= 1) on random words, transpositions aside', () => {
    // Reference library: fast-levenshtein (insertions, deletions, substitutions). A transposition is distance 2
    // there and one edit here, so the oracle is: Levenshtein <= 1, or Levenshtein = 2 made by swapping two letters.
    const rng = seededRandom(20261205);
    const random = () => rng.next();
    const word = (n: number) => Array.from({ length: n }, () => 'abc'[Math.floor(random() * 3)]).join('');
    let checked = 0;
    for (let i = 0; i < 20_000; i++) {
      const a = word(Math.floor(random() * 7));
      const b = random() < 0.5 ? word(Math.floor(random() * 7)) : mutate(a, random);
      const distance = fastLevenshtein.get(a, b);
      const expected = distance <= 1 || (distance === 2 && isAdjacentSwap(a, b));
      expect(withinOneEdit(a, b), `${a} / ${b}`).toBe(expected);
      checked++;
    }
    expect(checked).toBe(20_000);
  });
});

function mutate(a: string, random: () => number): string {
  const i = Math.floor(random() * (a.length + 1));
  const kind = Math.floor(random() * 4);
  if (kind === 0) return a.slice(0, i) + 'b' + a.slice(i);
  if (kind === 1) return a.slice(0, i) + a.slice(i + 1);
  if (kind === 2) return a.slice(0, i) + 'c' + a.slice(i + 1);
  return i + 1 < a.length ? a.slice(0, i) + a[i + 1] + a[i] + a.slice(i + 2) : a;
}

function isAdjacentSwap(a: string, b: string): boolean {
  if (a.length !== b.length) return false;
  for (let i = 0; i + 1 < a.length; i++) if (a.slice(0, i) + a[i + 1] + a[i] + a.slice(i + 2) === b) return true;
  return false;
}
