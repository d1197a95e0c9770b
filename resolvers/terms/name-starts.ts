/**
 * Where a party's name may start before its definition: after the last boundary (a numbered item, a parties cue
 * such as "by and between", a recital word, a semicolon, a blank line), or after the list separator before it.
 */
import { anyWordAt, isSpace, isWordChar, skipSpaces, wordAt } from './text-scan.ts';

/** How far back from a definition we look for its party's name. */
export const NAME_WINDOW = 600;

/** Words after which a parties clause starts; the name follows. */
const PARTY_CUES = [
  'by and between',
  'by and among',
  'between',
  'among',
  'amongst',
  'entered into by',
  'made by',
  'executed by',
  'entre',
  'zwischen',
  'tra',
  'fra',
  'undersigned',
  'de una parte',
  'de otra parte',
  "d'une part",
  "d'autre part",
  'da una parte',
  "dall'altra parte",
  // The same cues of Spanish, French and Italian drafting put into English (common practice).
  'on the one hand',
  'on the other hand',
  // A one-sided instrument names its giver and its beneficiary ("given by X to Y", "made by X in favour of Y").
  'given by',
  'in favour of',
  'in favor of',
];
/** Words that end a recital or clause: the name, if any, follows. */
const CLAUSE_CUES = ['whereas', 'recitals', 'background'];

/** Line-start numbering: "(1)", "(a)", "(iv)", "1.", "1)", "a)". Returns the index after it, or -1. */
export function numberingAt(text: string, i: number, end: number): number {
  let j = i;
  const paren = text[j] === '(';
  if (paren) j++;
  const s = j;
  while (j < end && j - s < 4 && isWordChar(text[j]) && /[\da-z]/i.test(text[j] as string)) j++;
  if (j === s) return -1;
  const token = text.slice(s, j);
  if (!/^(?:\d{1,2}|[a-z]|[ivx]{1,4})$/i.test(token)) return -1;
  if (paren ? text[j] !== ')' : text[j] !== '.' && text[j] !== ')') return -1;
  j++;
  return isSpace(text[j]) || j >= end ? j : -1;
}

function isLineStart(text: string, i: number): boolean {
  let k = i - 1;
  while (k >= 0 && (text[k] === ' ' || text[k] === '\t')) k--;
  return k < 0 || text[k] === '\n';
}

/** The last boundary in [from, to): where a name may start, and whether a party cue set it. */
function lastBoundary(text: string, from: number, to: number): { at: number; partyCue: boolean } {
  let at = from;
  let partyCue = false;
  for (let i = from; i < to; i++) {
    const ch = text[i] as string;
    if (ch === ';') {
      at = i + 1;
      continue;
    }
    if (ch === '\n') {
      const next = skipSpaces(text, i + 1, to);
      if (text.slice(i + 1, next).includes('\n')) at = next; // blank line
      continue;
    }
    if (isWordChar(text[i - 1])) continue;
    if (isLineStart(text, i)) {
      const n = numberingAt(text, i, to);
      if (n > 0) {
        at = n;
        partyCue = true;
        continue;
      }
      if (wordAt(text, i, 'and') || wordAt(text, i, 'between')) {
        const after = skipSpaces(text, i + (wordAt(text, i, 'and') ? 3 : 7), to);
        if (text[after] === ':' || text[after - 1] === '\n' || after >= to) {
          at = after;
          partyCue = true;
          continue;
        }
      }
    }
    const cue = anyWordAt(text, i, PARTY_CUES);
    if (cue !== undefined) {
      at = i + cue.length;
      partyCue = true;
      continue;
    }
    const clause = anyWordAt(text, i, CLAUSE_CUES);
    if (clause !== undefined) at = i + clause.length;
  }
  return { at, partyCue };
}

/**
 * Where a name may start before a definition at `to`: after the last boundary, then (when that reads as
 * a descriptive phrase rather than a name) after the last ", and", " and" or "," — the next party
 * in a list follows its predecessor's descriptive phrase. The caller tries them in order.
 */
export function nameStarts(text: string, from: number, to: number, inheritedCue: boolean): Array<{ at: number; partyCue: boolean }> {
  const windowStart = Math.max(from, to - NAME_WINDOW);
  const b = lastBoundary(text, windowStart, to);
  // Only a stretch that directly follows the previous party's definition inherits its parties-clause context.
  const partyCue = b.partyCue || (inheritedCue && windowStart === from && b.at === windowStart);
  const starts = [{ at: b.at, partyCue }];
  const segment = text.slice(b.at, to);
  // Not a bare " and ": "to Harrow and Pendle LLP" must not become "Pendle LLP".
  for (const sep of [', and ', '; and ', ', or ', ', ']) {
    const k = segment.lastIndexOf(sep);
    if (k > 0) starts.push({ at: b.at + k + sep.length, partyCue });
  }
  return starts;
}
