/**
 * Finds the legal form of a name: the longest designator that ends the name (after trailing parenthesised
 * qualifiers), then compound forms where the last designator rules ("GmbH & Co. KG" is a KG; "& Co." is a
 * connector there), and else a prefix form. A designator must start a word and leave a non-empty name.
 */
import type { LegalFormEntry, TrieNode } from './legal-form-index.ts';
import { isPrefixJurisdiction, legalFormIndex } from './legal-form-index.ts';
import type { NameScan } from './scan-name.ts';

export interface LegalFormSpan {
  entry: LegalFormEntry;
  /** Offsets in the text the scan was made of: [start, end). */
  start: number;
  end: number;
  position: 'suffix' | 'prefix';
}

/** Walks the reversed-key trie from unit hi-1 down to lo; returns the start unit of the longest match. */
function longestSuffix(scan: NameScan, lo: number, hi: number, root: TrieNode): { at: number; entry: LegalFormEntry } | null {
  let node: TrieNode | undefined = root;
  let best: { at: number; entry: LegalFormEntry } | null = null;
  const { units, wordStart } = scan;
  for (let i = hi - 1; i > lo; i--) {
    node = node.next?.get(units[i] as number);
    if (!node) break;
    if (node.entry && wordStart[i] === 1) best = { at: i, entry: node.entry };
  }
  return best;
}

function longestPrefix(scan: NameScan, lo: number, hi: number, root: TrieNode, hinted: boolean): { end: number; entry: LegalFormEntry } | null {
  let node: TrieNode | undefined = root;
  let best: { end: number; entry: LegalFormEntry } | null = null;
  const { units, wordStart } = scan;
  for (let i = lo; i < hi - 1; i++) {
    node = node.next?.get(units[i] as number);
    if (!node) break;
    if (node.entry && wordStart[i + 1] === 1 && (hinted || distinctivePrefix(node.entry.key))) best = { end: i + 1, entry: node.entry };
  }
  return best;
}

/**
 * Without a country hint, a two-letter Latin prefix ("AB", "AS", "PS") is more often a pair of initials
 * ("AB Widgets") than a Lithuanian or Estonian form; longer ones ("UAB", "SIA", "OOO") and non-Latin ones ("ООО")
 * are distinctive enough. Common practice.
 */
function distinctivePrefix(key: string): boolean {
  if (key.length >= 3) return true;
  for (let i = 0; i < key.length; i++) if (key.charCodeAt(i) >= 0x80) return true;
  return false;
}

const CONNECTED_WORDS: ReadonlySet<string> = new Set(['co', 'cie', 'company', 'compagnie', 'comp']);
const CONNECTOR_WORDS: ReadonlySet<string> = new Set(['und', 'and', 'et', 'y']);

/** The unit range of the word that ends at unit `end` (exclusive). */
function wordBefore(scan: NameScan, end: number): { start: number; text: string } | null {
  if (end <= 0) return null;
  let start = end - 1;
  while (start > 0 && scan.wordStart[start] !== 1) start--;
  let text = '';
  for (let i = start; i < end && end - start <= 12; i++) text += String.fromCharCode(scan.units[i] as number);
  return { start, text };
}

/**
 * "X GmbH & Co. KG": when the matched form is preceded by "& Co." (or "und Co", "& Cie") and another
 * designator before that, the compound is one legal form whose last designator rules.
 */
function extendCompound(text: string, scan: NameScan, at: number, last: LegalFormEntry): number {
  const co = wordBefore(scan, at);
  if (!co || co.start === 0) return at;
  if (!CONNECTED_WORDS.has(co.text)) return extendAdjacent(text, scan, at, last);
  let connectorEnd = co.start;
  const gap = text.slice(scan.to[co.start - 1], scan.from[co.start]);
  if (!gap.includes('&') && !gap.includes('+')) {
    const word = wordBefore(scan, co.start);
    if (!word || !CONNECTOR_WORDS.has(word.text)) return at;
    connectorEnd = word.start;
  }
  const inner = longestSuffix(scan, 0, connectorEnd, legalFormIndex().suffix);
  return inner ? inner.at : at;
}

/**
 * "Widgets sp. z o.o. sp.k." (PL): a general partner's form written straight before the partnership's form.
 * Both must be abbreviations of one country, the inner one short or dotted (a word such as "Trust" in
 * "Marlow Trust AG" stays in the name), and "Co."/"Company" never joins ("Qorv Co. Ltd" keeps its "Co.").
 */
function extendAdjacent(text: string, scan: NameScan, at: number, last: LegalFormEntry): number {
  if (!last.abbreviation) return at;
  const inner = longestSuffix(scan, 0, at, legalFormIndex().suffix);
  // A Roman numeral before the form numbers a series ("Merrow Finance II S.r.l."): it stays in the name.
  if (!inner || !inner.entry.abbreviation || CONNECTED_WORDS.has(inner.entry.key) || AMBIGUOUS_SUFFIXES.has(inner.entry.key)) return at;
  if (inner.entry.key.length > 4 && !text.slice(scan.from[inner.at], scan.to[at - 1]).includes('.')) return at;
  const countries = new Set(last.jurisdictions.map((j) => j.slice(0, 2)));
  return inner.entry.jurisdictions.some((j) => countries.has(j.slice(0, 2))) ? inner.at : at;
}

/**
 * Two-letter designators that are also everyday tokens at the end of names: Roman numerals ("Fund II"), "EU",
 * "PR", "CA". With a country hint they count only in a country they belong to ("v. i." is no LT form in CZ);
 * without one, only when written with their punctuation ("I/S", "C/A", "D.A."). Common practice.
 */
const AMBIGUOUS_SUFFIXES: ReadonlySet<string> = new Set(['ii', 'vi', 'eu', 'pr', 'is', 'et', 'da', 'ca']);

function ambiguousWithoutSupport(text: string, scan: NameScan, at: number, hi: number, entry: LegalFormEntry, country: string | undefined): boolean {
  if (!AMBIGUOUS_SUFFIXES.has(entry.key)) return false;
  if (country !== undefined) {
    const whole = country.slice(0, 2);
    return !entry.jurisdictions.some((j) => j.slice(0, 2) === whole);
  }
  const written = text.slice(scan.from[at], scan.to[hi - 1]);
  return !written.includes('/') && !written.includes('.');
}

/** "Smith & Co.": a firm name, where "Co." means the partners and is no designator. */
function isPartnersCo(text: string, scan: NameScan, at: number, key: string): boolean {
  if (!CONNECTED_WORDS.has(key) || at === 0) return false;
  const gap = text.slice(scan.to[at - 1], scan.from[at]);
  if (gap.includes('&') || gap.includes('+')) return true;
  const word = wordBefore(scan, at);
  return word !== null && CONNECTOR_WORDS.has(word.text);
}

/**
 * The legal form that ends the first `hi` units of `scan` (a scan of `text`), or null. `limit` is the offset in
 * `text` the match may extend to over final dots.
 */
export function matchSuffixForm(text: string, scan: NameScan, hi: number, limit: number, country?: string): LegalFormSpan | null {
  if (hi < 2) return null;
  const hit = longestSuffix(scan, 0, hi, legalFormIndex().suffix);
  if (!hit || isPartnersCo(text, scan, hit.at, hit.entry.key)) return null;
  if (ambiguousWithoutSupport(text, scan, hit.at, hi, hit.entry, country)) return null;
  const at = extendCompound(text, scan, hit.at, hit.entry);
  let start = scan.from[at] as number;
  // "(Pvt.) Ltd.", "(Pty) Ltd": an opening bracket closed inside the form belongs to it.
  if (start > 0 && text.charCodeAt(start - 1) === 0x28 && text.indexOf(')', start) < (scan.to[hi - 1] as number)) start--;
  return { entry: hit.entry, start, end: extendOverDots(text, scan.to[hi - 1] as number, limit), position: 'suffix' };
}

/**
 * The legal form that opens the scanned text, for the forms written first, or null. `country` is the hint:
 * a hint outside the prefix countries rules prefix forms out; one inside admits the short ones.
 */
export function matchPrefixForm(text: string, scan: NameScan, country: string | undefined): LegalFormSpan | null {
  const n = scan.length;
  if (n < 2) return null;
  if (country !== undefined && !isPrefixJurisdiction(country, true)) return null;
  const hit = longestPrefix(scan, 0, n, legalFormIndex().prefix, country !== undefined);
  if (!hit) return null;
  return { entry: hit.entry, start: scan.from[0] as number, end: extendOverDots(text, scan.to[hit.end - 1] as number, text.length), position: 'prefix' };
}

/** "Ltd." and "S.A." keep their final dot in the matched text. */
function extendOverDots(text: string, at: number, limit: number): number {
  let end = at;
  while (end < limit && text.charCodeAt(end) === 0x2e) end++;
  return end;
}
