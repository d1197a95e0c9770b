/**
 * Reads a natural person's name where a signature phrase says one stands ("by Oswin Tarrant, Managing Director",
 * "Witness: Theda Kornblum", "represented by Mr Anselm Voigt"): capitalised words, initials and family-name
 * particles, after an optional form of address. The cue, not the words, says it is a person, so no given-name list
 * is needed here; the reader only refuses what cannot be a name (a job title, a legal form, a signature rule).
 * Forms of address and particles are common practice.
 */
import { FAMILY_NAME_PARTICLES, FORMS_OF_ADDRESS } from '../analyse/index.ts';
import { analyseCached } from './analyse-cached.ts';
import { TITLE_WORDS } from './is-job-title.ts';
import { isSpace } from './text-scan.ts';
import { trimEndChars } from './trim-end-chars.ts';

export interface ReadName {
  /** The name without its form of address, as written. */
  name: string;
  start: number;
  /** Index just after the name's last word. */
  end: number;
  /** A form of address stood before it ("Mr", "Maître"): a person for sure. */
  addressed: boolean;
}

/**
 * Forms of address skipped before the name: the shared ones, and the French, Spanish and Italian forms a signature
 * block uses ("Maître", "Señora", "Avv."); "M"/"Me" only here, where a cue already says a person follows.
 */
const ADDRESS: ReadonlySet<string> = new Set([
  ...FORMS_OF_ADDRESS,
  'monsieur',
  'madame',
  'mademoiselle',
  'm',
  'me',
  'maître',
  'maitre',
  'señor',
  'señora',
  'signor',
  'signora',
  'sig',
  'dott.ssa',
  'avv',
]);
/** Particles inside a family name: the shared ones, and "y" and "zu" ("Ortega y Gasset", "zu Guttenberg"). */
const PARTICLES: ReadonlySet<string> = new Set([...FAMILY_NAME_PARTICLES, 'y', 'zu']);
/** A real name has at most this many words (given names, particles, family names). Common practice. */
const MAX_WORDS = 6;

interface Word {
  start: number;
  end: number;
  text: string;
}

function wordAt(text: string, i: number, end: number): Word | null {
  let j = i;
  while (j < end && /[\p{L}\p{M}'’.-]/u.test(text[j] as string)) j++;
  if (j === i) return null;
  return { start: i, end: j, text: text.slice(i, j) };
}

/** Reads a name starting at or after `from` (spaces skipped), before `end`; null when none stands there. */
export function readPersonName(text: string, from: number, end: number): ReadName | null {
  let i = from;
  while (i < end && isSpace(text[i])) i++;
  const taken: Word[] = [];
  let addressed = false;
  for (let guard = 0; guard < MAX_WORDS + 2 && i < end; guard++) {
    const w = wordAt(text, i, end);
    if (w === null) break;
    const bare = trimEndChars(w.text, ".'’");
    const lower = bare.toLowerCase();
    if (taken.length === 0 && !addressed && ADDRESS.has(lower) && /^\p{Lu}/u.test(w.text)) {
      addressed = true;
    } else if (/^\p{Lu}/u.test(w.text) && !TITLE_WORDS.has(lower)) {
      taken.push({ ...w, text: w.text.endsWith('.') && bare.length > 1 ? bare : w.text });
    } else if (taken.length > 0 && PARTICLES.has(w.text)) {
      taken.push(w);
    } else break;
    i = w.end;
    // Words of a name are separated by single spaces (or a line wrap inside prose); anything else ends it.
    let k = i;
    while (k < end && (text[k] === ' ' || text[k] === '\u00a0')) k++;
    if (k === i) break;
    i = k;
  }
  while (taken.length > 0 && PARTICLES.has((taken[taken.length - 1] as Word).text)) taken.pop();
  if (taken.length === 0 || taken.length > MAX_WORDS) return null;
  // One word is a name only after a form of address ("Maître Dufresne"); an initial alone never is.
  if (taken.length === 1 && !addressed) return null;
  const first = taken[0] as Word;
  const last = taken[taken.length - 1] as Word;
  const name = text.slice(first.start, last.start + last.text.length);
  if (name.replace(/\P{L}/gu, '').length < 2) return null;
  const analysis = analyseCached(name);
  // "Qorv Holdings Ltd": a company signing through its general partner is no person.
  if (analysis.legalForm !== null || analysis.kind === 'organisation' || analysis.partyStatus !== 'party') return null;
  return { name, start: first.start, end: last.start + last.text.length, addressed };
}
