/**
 * Finds the places where a contract defines a term: a parenthesis holding quoted terms
 * (`(the "Licensee")`, `("Larkspur", "we", "us" or "our")`, `(each a "Party")`) or a
 * "hereinafter" phrase outside parentheses (`, hereinafter referred to as the "Buyer",`).
 * One linear pass to pair parentheses, then bounded work per parenthesis.
 */
import { isOpeningQuote, readQuoted } from './quotes.ts';
import { cleanTerm } from './clean-term.ts';
import { wordsOf } from './text-scan.ts';

export interface FoundTerm {
  /** Without quotes and leading article: "Licensee". */
  text: string;
  /** Refers to a set of parties: `each a "Party"`, `together the "Parties"`. */
  collective: boolean;
  /** Preceded by "this"/"these": `this "Agreement"` names the document, never a party. */
  thisMarker: boolean;
}

export interface Definition {
  /** Where the definition starts: the "(" or the "hereinafter" cue (with its leading comma). */
  start: number;
  /** Just after the ")" or the last quote. */
  end: number;
  terms: FoundTerm[];
}

/** Parentheses longer than this are prose, not a definition. */
const MAX_PAREN = 400;
/** Deeper nesting is never a definition; the bound keeps the work linear on "((((…". */
const MAX_DEPTH = 3;

const COLLECTIVE_CUES = new Set([
  'each',
  'together',
  'collectively',
  'jointly',
  'individually',
  'severally',
  'both',
  'all',
  'chacune',
  'chacun',
  'ensemble',
  'jeweils',
  'gemeinsam',
  'conjuntamente',
  'congiuntamente',
]);
/** "together with its Affiliates": the party plus its affiliates, not a set of parties. */
const POSSESSIVES = new Set(['its', 'their', 'his', 'her']);

/** Words allowed between chained terms: "X" or the "Y". */
const CHAIN_WORDS = new Set(['or', 'and', 'a', 'an', 'ou', 'oder', 'o', 'y', 'e', 'the', 'le', 'la', 'el', 'il', 'der', 'die']);

/** Reads the quoted terms of [from, to) in order, with the words that lead to each one. */
function readTerms(text: string, from: number, to: number): FoundTerm[] {
  const terms: FoundTerm[] = [];
  let collective = false;
  let leadStart = from;
  for (let i = from; i < to; i++) {
    if (!isOpeningQuote(text[i] as string)) continue;
    const q = readQuoted(text, i, to);
    if (q === null) continue;
    const lead = wordsOf(text.slice(leadStart, i));
    collective = collective || hasCollectiveCue(lead);
    const clean = cleanTerm(q.text);
    if (clean.length > 0) terms.push({ text: clean, collective, thisMarker: /^(?:this|these)$/.test(lead[lead.length - 1] ?? '') });
    leadStart = q.end;
    i = q.end - 1;
  }
  return terms;
}

function hasCollectiveCue(lead: string[]): boolean {
  for (let k = 0; k < lead.length; k++) {
    const w = lead[k] as string;
    if (!COLLECTIVE_CUES.has(w)) continue;
    if (w === 'together' && lead[k + 1] === 'with' && POSSESSIVES.has(lead[k + 2] ?? '')) continue;
    return true;
  }
  return false;
}

/**
 * Australian style defines terms without quotes: "… Melbourne VIC 3000 (Wattle Creek)" at the end of a
 * party's line. Accepted only as the last thing on its line or clause (then a line break, ";" or the end), with
 * one to four capitalised words and no digits, so "Goldline (Europe) Ltd" and "(UK)," stay qualifiers.
 */
function unquotedTerm(text: string, open: number, close: number): string | null {
  const inner = text.slice(open + 1, close).trim();
  if (inner.length < 2 || inner.length > 40 || /[^\p{L} &'’.-]/u.test(inner)) return null;
  const words = inner.split(' ').filter((w) => w.length > 0);
  if (words.length > 4 || !words.every((w) => /^\p{Lu}/u.test(w) || w === 'of' || w === '&')) return null;
  let j = close + 1;
  while (j < text.length && (text[j] === ' ' || text[j] === '\t' || text[j] === '\r')) j++;
  if (j < text.length && text[j] === '.') j++;
  while (j < text.length && (text[j] === ' ' || text[j] === '\t' || text[j] === '\r')) j++;
  return j >= text.length || text[j] === '\n' || text[j] === ';' ? cleanTerm(inner) : null;
}

/** Pairs parentheses in one pass; returns [open, close] pairs of acceptable size and depth, in order of opening. */
function pairParens(text: string): Array<[number, number]> {
  const stack: number[] = [];
  const pairs: Array<[number, number]> = [];
  for (let i = 0; i < text.length; i++) {
    const ch = text[i];
    if (ch === '(') stack.push(i);
    else if (ch === ')' && stack.length > 0) {
      const open = stack.pop() as number;
      if (stack.length < MAX_DEPTH && i - open <= MAX_PAREN) pairs.push([open, i]);
    }
  }
  return pairs.sort((a, b) => a[0] - b[0]);
}

/** A "hereinafter" phrase outside parentheses: the cue, a few words, then one or more quoted terms. */
function readHereinafter(text: string, cueStart: number, cueEnd: number, reach = 60): Definition | null {
  let i = cueEnd;
  const stop = Math.min(text.length, cueEnd + reach);
  while (i < stop && !isOpeningQuote(text[i] as string)) i++;
  const first = i < stop ? readQuoted(text, i) : null;
  if (first === null) return null;
  let end = first.end;
  // Chain: "X" or "Y", "Z" and "W"
  for (;;) {
    let j = end;
    while (j < text.length && j < end + 12 && !isOpeningQuote(text[j] as string) && text[j] !== '\n') j++;
    const between = text.slice(end, j).trim().toLowerCase();
    const words = wordsOf(between);
    if (/[^\p{L}\s,]/u.test(between) || words.length > 2 || !words.every((w) => CHAIN_WORDS.has(w))) break;
    const next = j < text.length ? readQuoted(text, j) : null;
    if (next === null) break;
    end = next.end;
  }
  // Include the comma before the cue in the definition so the name before it ends cleanly.
  let start = cueStart;
  while (start > 0 && ' ,\n\r\t–—-'.includes(text[start - 1] as string)) start--;
  // The lead of the first term includes the cue itself, so "each a "Party"" reads as collective.
  const terms = readTerms(text, cueStart, end);
  return terms.length > 0 ? { start, end, terms } : null;
}

export function findDefinitions(text: string): Definition[] {
  const defs: Definition[] = [];
  for (const [open, close] of pairParens(text)) {
    const terms = readTerms(text, open + 1, close);
    if (terms.length > 0) defs.push({ start: open, end: close + 1, terms });
    else {
      const bare = unquotedTerm(text, open, close);
      if (bare !== null) defs.push({ start: open, end: close + 1, terms: [{ text: bare, collective: false, thisMarker: false }] });
    }
  }
  const parenDefs = [...defs];
  const covered = coverage(parenDefs);
  const cue = /hereinafter|hereafter|ci-apr[eè]s|im folgenden|nachfolgend|en adelante|di seguito|referred to as|in prosieguo/giu;
  for (let m = cue.exec(text); m !== null; m = cue.exec(text)) {
    if (covered(m.index)) continue;
    const d = readHereinafter(text, m.index, m.index + m[0].length);
    if (d !== null) defs.push(d);
  }
  // Collective terms outside parentheses: "Licensor and Licensee are each a "Party" and together the "Parties"".
  const coveredToo = coverage(parenDefs);
  const each = /\b(?:each|together|collectively|individually|jointly)\b/giu;
  for (let m = each.exec(text); m !== null; m = each.exec(text)) {
    if (coveredToo(m.index)) continue;
    const d = readHereinafter(text, m.index, m.index + m[0].length, 30);
    if (d !== null && d.terms.every((t) => t.collective)) defs.push(d);
  }
  defs.sort((a, b) => a.start - b.start);
  // Keep the outermost of overlapping definitions (a quoted term inside a nested parenthesis).
  const out: Definition[] = [];
  for (const d of defs) {
    const last = out[out.length - 1];
    if (last !== undefined && d.start < last.end) continue;
    out.push(d);
  }
  return out;
}

/** For increasing positions: is the position inside one of `defs` (sorted by start)? Linear overall. */
function coverage(defs: Definition[]): (pos: number) => boolean {
  let k = 0;
  let maxEnd = -1;
  return (pos) => {
    while (k < defs.length && (defs[k] as Definition).start <= pos) {
      maxEnd = Math.max(maxEnd, (defs[k] as Definition).end);
      k++;
    }
    return pos < maxEnd;
  };
}
