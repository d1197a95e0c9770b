/**
 * Entities a contract names and expressly says are not its parties: "Brellwood Capital LLC, which is not a party
 * hereto", "Orsola Holding AG (the "Guarantor") is not a party to this Agreement", "X, not being a party to this
 * Agreement". The name is the run of capitalised words (with legal form) just before the phrase, after any term
 * definition in parentheses. Phrases are common practice in US, UK and translated drafting.
 */
import { asciiLower } from './ascii-lower.ts';
import { isSpace } from './text-scan.ts';
import { trimEndChars } from './trim-end-chars.ts';

export interface Exclusion {
  /** The name (or a defined term) the phrase is about, as written. */
  name: string;
  start: number;
  /** Quoted terms in a parenthesis between the name and the phrase ("Guarantor"). */
  terms: string[];
}

/** The phrases, lower case: "is not a party hereto", "shall not be a party", "not being a party", "a non-party". */
const PHRASES = [
  ' not a party',
  ' not party',
  ' not parties',
  ' not be a party',
  ' not become a party',
  ' not a signatory',
  ' not being a party',
  ' non-party',
  // Translated drafting ("Vertragspartei", "partie contractante"): common practice.
  ' not a contracting party',
  ' not a contractual party',
];
/** Words between the name and the phrase: "X, which is", "X shall", "X, a". */
const VERBS = new Set(['is', 'are', 'shall', 'will', 'does', 'do', 'which', 'who', 'that', 'being', 'also', 'itself', 'a']);
/** Lower-case words a company name may hold ("Bank of Tollaby", "Fonds de Garantie"). */
const INNER = new Set(['of', 'and', '&', 'de', 'du', 'des', 'la', 'le', 'van', 'der', 'den', 'von', 'für', 'und', 'y', 'e', 'di', 'del', 'for']);
/** A name is at most this many words (longer runs are headings or sentences). Common practice. */
const MAX_WORDS = 10;
/** Mentions per contract worth reporting; the bound keeps adversarial input linear. */
const MAX_EXCLUSIONS = 50;

const QUOTES = '"“”„«»';

/** Quoted terms of a parenthesis ('(the "Guarantor")'), without their article. */
function termsIn(group: string): string[] {
  const out: string[] = [];
  let open = -1;
  for (let i = 0; i < group.length; i++) {
    if (!QUOTES.includes(group[i] as string)) continue;
    if (open < 0) open = i;
    else {
      const t = group
        .slice(open + 1, i)
        .trim()
        .replace(/^(?:the|a|an) /iu, '')
        .trim();
      if (t.length > 0 && t.length <= 60) out.push(t);
      open = -1;
    }
  }
  return out;
}

/** Index where the subject of the phrase at `at` ends: verbs ("which is", "shall") and commas skipped backwards. */
function subjectEnd(text: string, at: number): number {
  let end = at;
  for (let guard = 0; guard < 6; guard++) {
    // "X (which is not a party …)": the parenthesis that opens the phrase is no part of the name.
    while (end > 0 && (isSpace(text[end - 1]) || text[end - 1] === ',' || text[end - 1] === '(')) end--;
    let w = end;
    while (w > 0 && /\p{L}/u.test(text[w - 1] as string)) w--;
    if (w === end || !VERBS.has(text.slice(w, end).toLowerCase())) return asCapacity(text, end);
    end = w;
  }
  return end;
}

/** "X, as escrow agent, which is not a party": a lower-case capacity after "as" stands between name and phrase. */
const MAX_CAPACITY = 40;

function asCapacity(text: string, end: number): number {
  const from = Math.max(0, end - MAX_CAPACITY);
  const k = text.lastIndexOf(', as ', end);
  if (k < from) return end;
  const words = text.slice(k + 5, end).trim();
  return words.length > 0 && /^[\p{Ll} -]+$/u.test(words) ? k : end;
}

/** The capitalised run ending at `end`, walking back at most MAX_WORDS words and never past a line or sentence. */
function nameBefore(text: string, end: number): { start: number; end: number } | null {
  let e = end;
  while (e > 0 && isSpace(text[e - 1])) e--;
  let s = e;
  let words = 0;
  let capitalised = 0;
  for (;;) {
    let k = s;
    while (k > 0 && isSpace(text[k - 1]) && text[k - 1] !== '\n') k--;
    let w = k;
    while (w > 0 && !isSpace(text[w - 1])) w--;
    const word = text.slice(w, k);
    if (word.length === 0 || words >= MAX_WORDS) break;
    const bare = trimEndChars(word, ',.');
    // A sentence ends at a full stop after a lower-case word ("agreed. Brellwood"): not part of the name.
    if (word.endsWith(';') || word.endsWith(':') || (words > 0 && endsSentence(word))) break;
    if (/^[\p{Lu}\d]/u.test(bare)) capitalised++;
    // A lower-case legal form closes many names ("Kittering Holdings plc", "Qorv s.r.l."); the analysis checks it later.
    else if (!(INNER.has(bare) && words > 0) && !(words === 0 && (bare.length <= 4 || bare.includes('.')))) break;
    s = w;
    words++;
  }
  // Trailing lower-case joiners picked up at the start are not part of the name.
  while (s < e && INNER.has(text.slice(s, text.indexOf(' ', s) < 0 ? e : text.indexOf(' ', s)))) s = text.indexOf(' ', s) + 1;
  return capitalised === 0 || s >= e ? null : { start: s, end: e };
}

/** "funded." ends a sentence; "Inc." and "J." do not. */
function endsSentence(word: string): boolean {
  if (!word.endsWith('.') || word.length < 4) return false;
  const tail = word.slice(-4, -1);
  return tail === tail.toLowerCase() && tail !== tail.toUpperCase();
}

/** How far back a term's definition is looked for, and how far its parenthesis may open before the quote. */
const DEFINITION_WINDOW = 2000;
const PAREN_GAP = 12;

/**
 * "Alderwick Marine Group plc (the "Parent") … The Parent, which is not a party to this Agreement": the term names
 * the entity its definition follows, so that entity is the one mentioned (common practice in UK drafting).
 */
function definedEarlier(text: string, name: string, before: number): Exclusion | null {
  if (!name.toLowerCase().startsWith('the ')) return null;
  const term = name.slice(4).trim();
  if (term.length === 0) return null;
  const from = Math.max(0, before - DEFINITION_WINDOW);
  const window = text.slice(from, before);
  for (const q of ['"', '“']) {
    const k = window.lastIndexOf(`${q}${term}`);
    if (k < 0) continue;
    const open = window.lastIndexOf('(', k);
    if (open < 0 || k - open > PAREN_GAP || !'"”'.includes(window[k + 1 + term.length] ?? '')) continue;
    let end = from + open;
    while (end > 0 && isSpace(text[end - 1])) end--;
    const span = nameBefore(text, end);
    if (span !== null) return { name: text.slice(span.start, span.end), start: span.start, terms: [term] };
  }
  return null;
}

function phraseStarts(lower: string): number[] {
  const at: number[] = [];
  for (const p of PHRASES) {
    for (let k = lower.indexOf(p); k >= 0 && at.length < MAX_EXCLUSIONS * 4; k = lower.indexOf(p, k + p.length)) {
      // A whole phrase: "not a party" but not "not a partyline".
      if (!/\p{L}/u.test(lower[k + p.length] ?? ' ')) at.push(k);
    }
  }
  return at.sort((a, b) => a - b);
}

export function findExclusions(text: string): Exclusion[] {
  const out: Exclusion[] = [];
  for (const at of phraseStarts(asciiLower(text))) {
    if (out.length >= MAX_EXCLUSIONS) break;
    let end = subjectEnd(text, at);
    let terms: string[] = [];
    // "X (the "Guarantor") is not a party": the parenthesis defines X's term.
    if (text[end - 1] === ')') {
      const open = text.lastIndexOf('(', end - 1);
      if (open >= 0 && end - open < 120) {
        terms = termsIn(text.slice(open, end));
        end = open;
      }
    }
    while (end > 0 && (isSpace(text[end - 1]) || text[end - 1] === ',')) end--;
    const span = nameBefore(text, end);
    if (span === null) continue;
    const name = text.slice(span.start, span.end);
    out.push(terms.length === 0 ? (definedEarlier(text, name, span.start) ?? { name, start: span.start, terms }) : { name, start: span.start, terms });
  }
  return out;
}
