/**
 * Finds a party's name in the stretch of text that precedes its definition:
 * "…by and between Qorv Robotics, Inc., a Delaware corporation" → name "Qorv Robotics, Inc.",
 * descriptive phrase "a Delaware corporation". Hand-written scanning over a bounded window.
 */
import { analyseCached as analyseName } from './analyse-cached.ts';
import { anyWordAt, isSpace, isWordChar, skipSpaces, trimBounds, wordAt } from './text-scan.ts';
import { ALIAS_CUES, CONNECTORS, DESCRIPTIVE_STARTS, HONORIFICS, ID_CUES, LINE_HEADINGS, LOWER_ONLY } from './name-words.ts';
import { nameStarts, numberingAt } from './name-starts.ts';

const MAX_NAME = 150;

export interface LocatedName {
  nameStart: number;
  nameEnd: number;
  /** End of the name together with alias phrases ("X d/b/a Y"): what goes to the name analysis. */
  fullEnd: number;
  /** The descriptive phrase between the name and the definition. */
  descStart: number;
  descEnd: number;
  /** A party cue ("between", a numbered list, "BETWEEN:") introduced this name. */
  partyCue: boolean;
  /** A form of address ("Mr", "Madame") stood before the name: the party is a person. */
  honorific: boolean;
}

/** Skips separators, connectors and numbering before a name; `honorific` is set when a form of address was skipped. */
function skipLeading(text: string, i: number, to: number, seen: { honorific: boolean } = { honorific: false }): number {
  let j = i;
  for (;;) {
    const before = j;
    j = skipSpaces(text, j, to);
    while (j < to && ',;:.-–—•*'.includes(text[j] as string)) j++;
    j = skipSpaces(text, j, to);
    const conn = anyWordAt(text, j, CONNECTORS);
    // German articles and "the company" are stripped only in lower case: "Der Grüne Kranich GmbH" keeps its "Der".
    if (conn !== undefined && !(LOWER_ONLY.has(conn) && !isLowerLetter(text[j]))) j += conn.length;
    const n = numberingAt(text, j, to);
    if (n > 0) j = n;
    const h = anyWordAt(text, j, HONORIFICS);
    // Title case only ("Mr", "Madame"): "MS Kelvarn Shipping Ltd" keeps its initials.
    if (h !== undefined && /\p{Lu}/u.test(text[j] as string) && /\p{Ll}/u.test(text[j + 1] ?? '')) {
      j += h.length;
      if (text[j] === '.') j++;
      seen.honorific = true;
    }
    if (j === before) return j;
  }
}

/**
 * Hard-wrapped prose breaks names across lines ("…between Greystoke\nHarbour Services Limited, a company…").
 * A line break continues the name when the next line starts with a capitalised word that is not a numbered
 * item, a label ("By:") or a heading, and the name so far does not already end with a legal form.
 */

function continuesOnNextLine(text: string, s: number, nl: number, limit: number): boolean {
  let j = nl + 1;
  while (j < limit && (text[j] === ' ' || text[j] === '\t' || text[j] === '\r')) j++;
  if (j >= limit || !/\p{Lu}/u.test(text[j] as string)) return false;
  if (numberingAt(text, j, limit) > 0) return false;
  let k = j;
  while (k < limit && isWordChar(text[k])) k++;
  if (text[k] === ':' || LINE_HEADINGS.has(text.slice(j, k).toLowerCase())) return false;
  return !endsWithLegalForm(text, s, nl);
}

/** A short parenthesis inside a name: "Goldwren (Europe) Ltd". Returns the index after ")" or -1. */
function innerQualifier(text: string, i: number, to: number): number {
  const close = text.indexOf(')', i);
  if (close < 0 || close >= to || close - i > 30) return -1;
  const inner = text.slice(i + 1, close);
  if (/["“”„«»'‘’\d(]/u.test(inner)) return -1;
  const next = skipSpaces(text, close + 1, to);
  const ch = text[next];
  return ch !== undefined && /\p{Lu}/u.test(ch) ? close + 1 : -1;
}

/** End of the bare name starting at `s`: before a comma, parenthesis, line break or descriptive word. */
function bareNameEnd(text: string, s: number, to: number, stopAtAnd: boolean): number {
  const limit = Math.min(to, s + MAX_NAME);
  for (let i = s; i < limit; i++) {
    const ch = text[i] as string;
    if (ch === '(') {
      const q = innerQualifier(text, i, limit);
      if (q > 0) {
        i = q - 1;
        continue;
      }
      return i;
    }
    if (ch === '\n') {
      if (!continuesOnNextLine(text, s, i, limit)) return i;
      continue;
    }
    if (ch === ',' || ch === ';' || ch === ':' || ch === '"' || ch === '“' || ch === '«' || ch === '„') return i;
    if (isSpace(ch) && i > s) {
      const w = skipSpaces(text, i, limit);
      // Descriptive words are lower case ("a Delaware corporation"); "Team A Ltd" keeps its capital A.
      if (isLowerLetter(text[w]) && anyWordAt(text, w, DESCRIPTIVE_STARTS) !== undefined && !insideLegalForm(text, s, i, limit)) return i;
      if (stopAtAnd && (wordAt(text, w, 'and') || wordAt(text, w, 'und') || wordAt(text, w, 'et'))) return i;
      if (wordAt(text, w, 'of') && /\d/.test(text[skipSpaces(text, w + 2, limit)] ?? '')) return i;
      if (anyWordAt(text, w, ALIAS_CUES) !== undefined) return i;
      if (anyWordAt(text, w, ID_CUES) !== undefined && /\p{Lu}/u.test(text[w] as string)) return i;
      if (wordAt(text, w, 'of') && /\p{Lu}/u.test(text[skipSpaces(text, w + 2, limit)] ?? '') && endsWithLegalForm(text, s, i)) return i;
    }
  }
  return limit;
}

/**
 * "Orvanel Deutschland Gesellschaft mit beschränkter Haftung": the lower-case word at `i` is inside a legal form
 * written out in full (ISO 20275 lists such names), not the start of a descriptive phrase ("mit Sitz in …").
 */
function insideLegalForm(text: string, s: number, i: number, limit: number): boolean {
  let e = i + 1;
  while (e < limit && !',;:("“\n'.includes(text[e] as string)) e++;
  const [, end] = trimBounds(text, s, e);
  const lf = analyseName(text.slice(s, end)).legalForm;
  if (lf === null || !loose(text.slice(s, end)).endsWith(loose(lf.text))) return false;
  return end - lf.text.length < i;
}

/** "Pellinore Widgets Limited of 4 Quarry Lane": after a legal form, "of" starts the address. */
function endsWithLegalForm(text: string, s: number, e: number): boolean {
  const lf = analyseName(text.slice(s, e)).legalForm;
  return lf !== null && loose(text.slice(s, e)).endsWith(loose(lf.text));
}

function isLowerLetter(ch: string | undefined): boolean {
  return ch !== undefined && ch !== ch.toUpperCase() && ch === ch.toLowerCase();
}

function loose(s: string): string {
  return s.toLowerCase().replace(/[^\p{L}\p{N}]/gu, '');
}

/**
 * Room after the comma for a legal form written out in full: "Orvanel España, Sociedad de Responsabilidad
 * Limitada" (ISO 20275 long names run to about 40 characters and 5 words).
 */
const DESIGNATOR_ROOM = 48;
const DESIGNATOR_WORDS = 5;

/** "Qorv Robotics, Inc.": the comma part is the legal form of the name before it. */
function extendOverDesignator(text: string, s: number, e: number, to: number): number {
  if (text[e] !== ',') return e;
  const p = bareNameEnd(text, skipSpaces(text, e + 1, to), Math.min(to, e + DESIGNATOR_ROOM), false);
  const [ps, pe] = trimBounds(text, e + 1, p);
  const part = text.slice(ps, pe);
  if (part.length === 0 || part.split(' ').length > DESIGNATOR_WORDS || !/^\p{Lu}/u.test(part)) return e;
  const lf = analyseName(text.slice(s, pe)).legalForm;
  if (lf === null) return e;
  const lp = loose(part);
  return lp.length > 0 && loose(lf.text).endsWith(lp) ? pe : e;
}

/**
 * "Tollaby Logistics Limited (formerly Tollaby Cold Storage Ltd)": an alias phrase in parentheses right after the
 * name. Answers the index after the closing parenthesis, or -1 when the parenthesis holds no alias phrase.
 */
function aliasInParentheses(text: string, p: number, to: number): number {
  if (text[p] !== '(') return -1;
  const inner = skipSpaces(text, p + 1, to);
  const cue = anyWordAt(text, inner, ALIAS_CUES);
  if (cue === undefined) return -1;
  // "(formerly the Licensee under the Original Agreement)" describes a role, not a name: a name starts with a capital.
  if (!/[\p{Lu}\p{N}]/u.test(text[skipSpaces(text, inner + cue.length, to)] ?? '')) return -1;
  const close = text.indexOf(')', inner);
  if (close < 0 || close >= to || close - p > MAX_NAME) return -1;
  // A quote inside is a definition ("(formerly "Kestrel")"): left to findDefinitions.
  return /["“”„«»]/u.test(text.slice(inner, close)) ? -1 : close + 1;
}

/** Alias phrases after the name: ", d/b/a Brightwater Tools", " formerly known as Kestrel Ltd", " (f/k/a Kestrel Ltd)". */
function extendOverAliases(text: string, e: number, to: number): number {
  let end = e;
  for (let guard = 0; guard < 4; guard++) {
    let p = text[end] === ',' ? end + 1 : end;
    p = skipSpaces(text, p, to);
    const closed = aliasInParentheses(text, p, to);
    if (closed > 0) {
      end = closed;
      continue;
    }
    const cue = anyWordAt(text, p, ALIAS_CUES);
    if (cue === undefined) return end;
    const s = skipSpaces(text, p + cue.length, to);
    let q = bareNameEnd(text, s, to, false);
    q = extendOverDesignator(text, s, q, to);
    if (q <= s) return end;
    end = q;
  }
  return end;
}

/** Locates a name starting at or after `from` (boundaries and connectors skipped), ending before `to`. */
export function locateNameAt(text: string, from: number, to: number, partyCue: boolean, stopAtAnd = false): LocatedName | null {
  const seen = { honorific: false };
  const s = skipLeading(text, from, to, seen);
  if (s >= to) return null;
  let e = bareNameEnd(text, s, to, stopAtAnd);
  e = extendOverDesignator(text, s, e, to);
  [, e] = trimBounds(text, s, e, ',');
  if (e <= s) return null;
  const fullEnd = extendOverAliases(text, e, to);
  const [descStart, descEnd] = trimBounds(text, fullEnd, to, ',');
  return { nameStart: s, nameEnd: e, fullEnd, descStart, descEnd, partyCue, honorific: seen.honorific };
}

/** Locates the name before a definition that starts at `to`; `from` is where the previous definition ended. */
export function locateName(text: string, from: number, to: number, inheritedCue = false): LocatedName | null {
  const first = nameStarts(text, from, to, inheritedCue)[0] as { at: number; partyCue: boolean };
  return locateNameAt(text, first.at, to, first.partyCue);
}
