/**
 * Parties listed in a parties clause with no defined term: "BETWEEN: (1) FERNHILL COMPOSITES LIMITED, a company
 * …; and (2) OAKAPPLE DESIGN STUDIO LTD, …". Only inside a clause opened by a heading (BETWEEN, PARTIES,
 * The undersigned) and closed by the operative words (IT IS AGREED, WHEREAS, RECITALS …).
 */
import type { Definition } from './find-definitions.ts';
import { locateNameAt } from './locate-name.ts';
import { numberingAt } from './name-starts.ts';
import type { LocatedName } from './locate-name.ts';

const OPENERS = ['between:', 'between', 'parties', 'the parties', 'the undersigned:', 'the undersigned', 'entre', 'entre les soussignés', 'zwischen', 'tra'];
const LIST_ENDINGS = [' between', ' among', ' amongst', ' parties', ' entre', ' zwischen', ' tra'];
const CLOSERS = [
  'it is agreed',
  'it is hereby agreed',
  'whereas',
  'recitals',
  'background',
  'now',
  'agreed terms',
  'the parties agree',
  'have agreed',
  'operative',
  'préambule',
  'il a été convenu',
  'vorbemerkung',
  'premesso',
];
/** A parties clause longer than this is not one. */
const MAX_CLAUSE = 4000;

interface Line {
  start: number;
  end: number;
}

function linesOf(text: string, from: number, to: number): Line[] {
  const lines: Line[] = [];
  let s = from;
  for (let i = from; i <= to; i++) {
    if (i === to || text[i] === '\n') {
      lines.push({ start: s, end: i });
      s = i + 1;
    }
  }
  return lines;
}

function lineText(text: string, l: Line): string {
  return text.slice(l.start, l.end).trim().toLowerCase();
}

export function findPartyItems(text: string, defs: Definition[]): LocatedName[] {
  const out: LocatedName[] = [];
  let scanFrom = 0;
  // Clause openers are whole lines: find each and read the numbered items that follow.
  for (let guard = 0; guard < 20 && scanFrom < text.length; guard++) {
    const opener = findOpener(text, scanFrom);
    if (opener < 0) break;
    const limit = Math.min(text.length, opener + MAX_CLAUSE);
    const lines = linesOf(text, opener, limit);
    let itemStart = -1;
    let end = limit;
    const items: Array<[number, number]> = [];
    for (const l of lines) {
      const t = lineText(text, l);
      if (CLOSERS.some((c) => t.startsWith(c))) {
        end = l.start;
        break;
      }
      let k = l.start;
      while (k < l.end && (text[k] === ' ' || text[k] === '\t')) k++;
      const isAnd = t === 'and' || t === 'and:' || t === 'und' || t === 'et' || t === 'e' || t === 'y';
      if (numberingAt(text, k, l.end) > 0 || isAnd) {
        if (itemStart >= 0) items.push([itemStart, l.start]);
        itemStart = isAnd ? l.end : k;
      }
    }
    if (itemStart >= 0) items.push([itemStart, end]);
    for (const [s, e] of items) {
      if (defs.some((d) => d.start >= s && d.start < e)) continue; // handled with its definition
      const located = locateNameAt(text, s, e, true);
      if (located !== null) out.push(located);
    }
    scanFrom = Math.max(end, opener + 1);
  }
  return out;
}

/** Index of the next line that is a clause opener, or -1. */
function findOpener(text: string, from: number): number {
  let s = from;
  while (s < text.length) {
    let e = text.indexOf('\n', s);
    if (e < 0) e = text.length;
    const t = text.slice(s, e).trim().toLowerCase().replace(/:$/u, '');
    if (t.length <= 24 && OPENERS.some((o) => t === o.replace(/:$/u, ''))) return e;
    // "This Agreement is made on 1 July 2024 between:" — a sentence that ends by opening the list.
    if (t.length <= 200 && LIST_ENDINGS.some((o) => t.endsWith(o))) return e;
    s = e + 1;
  }
  return -1;
}
