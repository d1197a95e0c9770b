/**
 * A party's role in a contract: the defined term that names what it does ("Licensor", "Paying Agent"),
 * not a short form of its own name ("Larkspur", "TMG") nor a pronoun ("we").
 */
import type { NameAnalysis } from '../analyse/index.ts';
import { termKey } from './clean-term.ts';

export const PRONOUNS: ReadonlySet<string> = new Set([
  'we',
  'us',
  'our',
  'ours',
  'you',
  'your',
  'yours',
  'i',
  'me',
  'my',
  'nous',
  'wir',
  'uns',
  'noi',
  'nosotros',
]);

function nameWords(analysis: NameAnalysis): string[] {
  return analysis.input
    .toLowerCase()
    .split(/[^\p{L}\p{N}]+/u)
    .filter((w) => w.length > 0);
}

/** "Larkspur" for "Larkspur Analytics Ltd"; "TMG" for "Tamarack Media Group, Inc.". */
export function isShortFormOf(term: string, analysis: NameAnalysis): boolean {
  const words = nameWords(analysis);
  const termWords = termKey(term)
    .split(/[^\p{L}\p{N}]+/u)
    .filter((w) => w.length > 0);
  if (termWords.length > 0 && termWords.every((w) => words.includes(w))) return true;
  if (termWords.length !== 1 || !/^\p{Lu}{2,6}$/u.test(term.trim())) return false;
  const initials = words.map((w) => w[0]).join('');
  let k = 0;
  for (const ch of termWords[0] as string) {
    k = initials.indexOf(ch, k);
    if (k < 0) return false;
    k++;
  }
  return true;
}

export function pickRole(terms: string[], analysis: NameAnalysis, label?: string): string | null {
  for (const t of terms) {
    if (PRONOUNS.has(termKey(t)) || isShortFormOf(t, analysis)) continue;
    return t;
  }
  if (label !== undefined && label.length > 0) return label;
  return null;
}
