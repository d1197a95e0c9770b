/** Who a collective term ("each a Fund", "the Parties") covers. */
import { locateName, locateNameAt } from './locate-name.ts';
import { NAME_WINDOW } from './name-starts.ts';
import { wordsOf } from './text-scan.ts';
import type { Collector } from './collector.ts';
import { type Draft } from './collector.ts';

/** Words that may stand between the last party and a collective definition without naming anyone. */
const FILLER = new Set([
  'and',
  'or',
  'are',
  'is',
  'be',
  'will',
  'shall',
  'hereto',
  'herein',
  'hereinafter',
  'the',
  'a',
  'an',
  'as',
  'each',
  'together',
  'collectively',
  'individually',
  'jointly',
  'referred',
  'to',
  'both',
  'all',
  'of',
  'them',
  'they',
  'parties',
  'party',
  'above',
  'named',
  'said',
]);

/**
 * Who a collective term covers: parties named just before it ("Alder Fund I LP and Alder Fund II LP (each a
 * "Fund")"), or parties whose terms are named there ("Licensor and Licensee are each a "Party""), or every
 * party so far when nothing stands between; an unnamed set ("the lenders party hereto") covers no named party.
 */
export function collectiveMembers(c: Collector, from: number, to: number): Draft[] | null {
  const named = namesBefore(c, from, to);
  if (named.length > 0) return named;
  const segment = c.text.slice(Math.max(from, to - NAME_WINDOW), to);
  const words = wordsOf(segment);
  const byTerm = c.drafts.filter((d) => d.terms.some((t) => includesPhrase(words, wordsOf(t))));
  if (byTerm.length > 0) return byTerm;
  if (words.every((w) => FILLER.has(w))) return c.drafts.length > 0 ? [...c.drafts] : null;
  return [];
}

function includesPhrase(words: string[], phrase: string[]): boolean {
  if (phrase.length === 0) return false;
  for (let i = 0; i + phrase.length <= words.length; i++) {
    if (phrase.every((w, k) => words[i + k] === w)) return true;
  }
  return false;
}

/** Parties listed before a collective definition: "Alder Fund I LP and Alder Fund II LP (each a "Fund")". */
function namesBefore(c: Collector, from: number, to: number): Draft[] {
  const found: Draft[] = [];
  const first = locateName(c.text, from, to);
  let pos = first === null ? to : first.nameStart;
  for (let guard = 0; pos < to && guard < 50; guard++) {
    const loc = locateNameAt(c.text, pos, to, first?.partyCue ?? false, true);
    if (loc === null) break;
    const d = c.addParty(loc, [], '');
    if (d !== null && !found.includes(d)) found.push(d);
    pos = nextSeparator(c.text, Math.max(loc.nameEnd, loc.fullEnd), to);
  }
  return found;
}

function nextSeparator(text: string, from: number, to: number): number {
  for (let i = from; i < to; i++) {
    if (text[i] === ',' || text[i] === ';') return i + 1;
    if (text.startsWith(' and ', i)) return i + 5;
  }
  return to;
}
