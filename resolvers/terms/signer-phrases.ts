/**
 * The pieces signature phrases are made of: a title before or after a person's name ("acting through its director
 * Anselm Voigt", "by Oswin Tarrant, Managing Director"). Shared by the signature-block and signer scanners.
 */
import { asciiLower } from './ascii-lower.ts';
import { jobTitleOf, TITLE_WORDS } from './is-job-title.ts';
import { readPersonName } from './read-person-name.ts';
import type { ReadName } from './read-person-name.ts';

export interface SignerAt extends ReadName {
  title?: string;
}

/** Phrases after which a title stops: "…, Director, for and on behalf of X", "…, duly authorised". */
const TITLE_STOPS = [
  ' for and on behalf of',
  ' on behalf of',
  ' for ',
  ' duly ',
  ' in ',
  ' known ',
  ' who ',
  ' pour le compte',
  ' für ',
  ' per conto',
  ' en nombre',
];

/** A title and what may follow it on the line ("…, Vice President, Operations, for and on behalf of"). Common practice. */
const MAX_TITLE_CHARS = 160;

/** The job title after `end` when ", <title>" follows the name on the same line (up to `lineEnd`). */
export function titleAfter(text: string, end: number, lineEnd: number): string | undefined {
  if (text[end] !== ',') return undefined;
  // Only the rest of the line is searched: a search through the whole text per signer would be quadratic.
  const line = text.slice(end, Math.min(lineEnd, end + MAX_TITLE_CHARS));
  const lower = asciiLower(line);
  let stop = line.length;
  for (const s of [...TITLE_STOPS, ';', '(', '"', '“']) {
    const k = lower.indexOf(s, 1);
    if (k >= 0 && k < stop) stop = k;
  }
  const whole = line.slice(1, stop).trim().replace(/,$/u, '');
  const t = jobTitleOf(whole);
  if (t !== null) return t;
  const comma = whole.indexOf(',');
  return comma > 0 ? (jobTitleOf(whole.slice(0, comma)) ?? undefined) : undefined;
}

const LEADS = new Set(['its', 'their', 'his', 'her', 'a', 'an', 'the', 'our']);

/**
 * A signer after a cue ("acting through ", "represented by "): either "[its] <title>[,] <Name>" or
 * "<Name>[, <title>]". `from` is just after the cue; the phrase must end before `lineEnd`.
 */
export function signerAfter(text: string, from: number, lineEnd: number): SignerAt | null {
  const direct = readPersonName(text, from, lineEnd);
  if (direct !== null) {
    const title = titleAfter(text, direct.end, lineEnd);
    return title === undefined ? direct : { ...direct, title };
  }
  // "its managing director Anselm Voigt", "its Managing Director, Anselm Voigt"
  const re = /[\p{L}&'-]+/guy;
  let i = from;
  while (i < lineEnd && text[i] === ' ') i++;
  const titleStart = i;
  let titleEnd = -1;
  let sawTitle = false;
  for (let guard = 0; guard < 8 && i < lineEnd; guard++) {
    re.lastIndex = i;
    const m = re.exec(text);
    if (m === null || m.index !== i) break;
    const w = m[0].toLowerCase();
    if (TITLE_WORDS.has(w)) sawTitle = true;
    else if (!(LEADS.has(w) || (!sawTitle && jobTitleOf(`${m[0]} director`) !== null))) break;
    i += m[0].length;
    if (sawTitle) titleEnd = i;
    while (i < lineEnd && text[i] === ' ') i++;
  }
  if (!sawTitle || titleEnd < 0) return null;
  let j = titleEnd;
  if (text[j] === ',') j++;
  const named = readPersonName(text, j, lineEnd);
  if (named === null) return null;
  const title = jobTitleOf(text.slice(titleStart, titleEnd));
  return title === null ? named : { ...named, title };
}
