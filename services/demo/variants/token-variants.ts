/**
 * Corruptions of the words of a name as a whole (Tran, Vatsalan & Christen 2013): a word dropped, two words swapped,
 * a space missing or doubled.
 */
import type { Random } from '../../../resolvers/prng.ts';
import type { NameParts } from '../render-name.ts';

/** Drops one word other than the first (Tran et al. 2013: missing tokens), or the legal form. */
export function tokenDrop(parts: NameParts, rnd: Random): NameParts | null {
  const words = parts.base.split(' ');
  if (words.length < 2) return parts.form ? { base: parts.base } : null;
  const i = 1 + rnd.int(words.length - 1);
  words.splice(i, 1);
  return { ...parts, base: words.join(' ') };
}

export function tokenSwap(parts: NameParts, rnd: Random): NameParts | null {
  const words = parts.base.split(' ');
  if (words.length < 2) return null;
  const i = rnd.int(words.length - 1);
  if (words[i] === words[i + 1]) return null;
  [words[i], words[i + 1]] = [words[i + 1]!, words[i]!];
  return { ...parts, base: words.join(' ') };
}

/** A missing space ("Brackenridge Fabrication" → "BrackenridgeFabrication") or a doubled one. */
export function whitespaceVariant(s: string, rnd: Random): string | null {
  const spaces: number[] = [];
  for (let i = 0; i < s.length; i++) if (s[i] === ' ') spaces.push(i);
  if (spaces.length === 0) return null;
  const i = rnd.pick(spaces);
  return rnd.chance(0.7) ? s.slice(0, i) + s.slice(i + 1) : s.slice(0, i) + '  ' + s.slice(i + 1);
}
