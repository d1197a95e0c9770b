/**
 * Amendments and side letters that use the defined terms of an earlier agreement: "Capitalised terms used in this
 * Amendment have the meaning given to them in the Agreement", "as defined in the Master Services Agreement dated
 * June 1, 2024 between X and Y". Finds each such statement and describes the earlier agreement as the text gives it:
 * its title, date, reference number and the parties it names. When the statement names the agreement by a defined
 * term ("the Agreement"), the term's definition elsewhere in the text ('the Supply Agreement dated 3 March 2025
 * between us (the "Agreement")') gives the description. The phrases are common practice in British, US and translated
 * drafting. Regular expressions run only over bounded windows (a sentence of at most WINDOW characters).
 */
import { readDate } from './read-date.ts';
import { termKey } from './clean-term.ts';
import { trimEndChars } from './trim-end-chars.ts';

/** An earlier agreement whose defined terms this contract uses. */
export interface AgreementReference {
  /** The statement as written (at most WINDOW characters). */
  statement: string;
  /** "Master Services Agreement" (as written), when the text gives one. */
  title?: string;
  /** ISO 8601 date (yyyy-mm-dd) the agreement is dated, when the text gives one. */
  date?: string;
  /** A reference or contract number ("MSA-2023-041"), when the text gives one. */
  reference?: string;
  /** Names of its parties as the text writes them ("between X and Y"); empty when it says "between us". */
  parties: string[];
}

/** Characters of one statement or definition we read. */
const WINDOW = 600;
/** Statements per contract worth reporting, and cue phrases worth reading: the bounds keep adversarial input linear. */
const MAX_REFERENCES = 5;
const MAX_CUES = 50;

/** Lower-case phrases that say a term has the meaning an earlier agreement gives it. Common practice. */
const CARRY_OVER = [
  'have the meaning given',
  'have the meanings given',
  'has the meaning given',
  'have the same meaning',
  'have the same meanings',
  'shall have the meaning',
  'shall have the meanings',
  'have the meaning ascribed',
  'have the meanings ascribed',
  'have the meaning assigned',
  'have the meanings assigned',
  'have the meaning set out',
  'have the meanings set out',
  'as defined in',
  'terms defined in',
  'bear the meaning',
  'bear the same meaning',
];

const TITLE_WORDS = ['Agreement', 'Contract', 'Deed', 'Lease', 'Licence', 'License', 'Terms', 'Order', 'Arrangement', 'Letter'];
const REFERENCE = /\b(?:no\.|number|ref\.|reference|contract no\.?|agreement no\.?)[\s:]{0,3}([A-Z0-9][\w./-]{2,40})/iu;
const BETWEEN = /\b(?:between|among|by and between)\s+([^()"“”]{3,400})/iu;

/** Words a period follows without ending the sentence ("Inc.", "No."): legal forms and abbreviations. Common practice. */
const ABBREVIATIONS = new Set([
  'inc',
  'ltd',
  'co',
  'corp',
  'no',
  'nr',
  'ref',
  'llc',
  'plc',
  'pty',
  'bv',
  'nv',
  'ag',
  'sa',
  'srl',
  'spa',
  'st',
  'mr',
  'mrs',
  'ms',
  'dr',
  'art',
  'cl',
  'sec',
]);

/** Whether the period at `i` ends a sentence: a line break or a space follows, and it closes no abbreviation or initial. */
function endsSentence(text: string, i: number): boolean {
  if (text[i] !== '.') return false;
  const next = text[i + 1];
  if (next !== undefined && next !== ' ' && next !== '\n' && next !== '\r') return false;
  let w = i;
  while (w > 0 && i - w < 12 && /\p{L}/u.test(text[w - 1] as string)) w--;
  const word = text.slice(w, i).toLowerCase();
  // "… with reference 2022/017. Terms …": a number closes the sentence too.
  if (word.length === 0) return /\d/u.test(text[i - 1] ?? '');
  return word.length > 1 && !ABBREVIATIONS.has(word);
}

function sentenceAround(text: string, at: number): [number, number] {
  let s = at;
  while (s > 0 && at - s < WINDOW && text[s - 1] !== '\n' && !(text[s - 1] === ' ' && endsSentence(text, s - 2))) s--;
  let e = at;
  while (e < text.length && e - at < WINDOW && text[e] !== '\n' && !endsSentence(text, e)) e++;
  return [s, e];
}

/** The agreement named after "… in the" / "… to them in": its words up to the end of the sentence. */
function namedAfter(statement: string): string {
  const lower = statement.toLowerCase();
  let best = -1;
  for (const cue of [' in the ', ' in that ', ' in ', ' under the ', ' by the ']) {
    const k = lower.lastIndexOf(cue);
    if (k > best) best = k + cue.length;
  }
  const named = best < 0 ? '' : statement.slice(best).trim();
  // "… have the same meaning in this Amendment": the present document, not the earlier one.
  return /^(?:this|these)\s/iu.test(named) ? '' : named;
}

/** "in that agreement", "in the said contract": the agreement named in the sentence before. */
const ANAPHORA = /\b(?:in|under) (?:that|said|the said|such) (?:agreement|contract)\b/iu;

/** The sentence that ends just before `s`, when there is one. */
function previousSentence(text: string, s: number): string | undefined {
  let e = s;
  while (e > 0 && (text[e - 1] === ' ' || text[e - 1] === '\n' || text[e - 1] === '\r')) e--;
  if (e === 0) return undefined;
  const [ps] = sentenceAround(text, e - 2);
  return text.slice(ps, e);
}

/** A short name like "Agreement" or "Principal Agreement": defined elsewhere in the text, read there. */
function definitionOf(text: string, term: string): string | undefined {
  const key = termKey(term);
  if (key.length === 0) return undefined;
  for (let i = text.indexOf('(', 0); i >= 0 && i < text.length; i = text.indexOf('(', i + 1)) {
    const close = text.indexOf(')', i);
    if (close < 0 || close - i > 60) continue;
    const inner = text
      .slice(i + 1, close)
      .replace(/["“”„«»]/gu, '')
      .trim();
    if (termKey(inner) !== key) continue;
    const [s] = sentenceAround(text, i);
    return text.slice(Math.max(s, i - WINDOW), i);
  }
  return undefined;
}

/** Words that end a title read backwards ("refer to the supply agreement"). */
const BEFORE_TITLE = new Set(['the', 'a', 'an', 'our', 'your', 'to', 'of', 'in', 'under', 'refer', 'this', 'that', 'said']);

/** "Master Services Agreement", "supply agreement": words before a title word; never "this Amendment Agreement". */
function titleIn(description: string): string | undefined {
  const words = description.split(/\s/u).filter((w) => w.length > 0);
  for (let k = 0; k < words.length; k++) {
    const w = trimEndChars(words[k] as string, ',.;:');
    if (!TITLE_WORDS.some((t) => t.toLowerCase() === w.toLowerCase())) continue;
    let s = k;
    // Backwards over words of the title; a label ("Re:") or another word before it ends it.
    while (
      s > 0 &&
      k - s < 5 &&
      !BEFORE_TITLE.has((words[s - 1] as string).toLowerCase()) &&
      /^\p{L}/u.test(words[s - 1] as string) &&
      !(words[s - 1] as string).endsWith(':')
    )
      s--;
    if (s > 0 && ['this', 'these'].includes((words[s - 1] as string).toLowerCase())) continue;
    if (s < k) return [...words.slice(s, k), w].join(' ');
  }
  return undefined;
}

/** "between Harrowgate Analytics, Inc. and Quillon Freight LLC" → both names; "between us" → none. */
function partiesIn(description: string): string[] {
  const m = BETWEEN.exec(description);
  if (!m) return [];
  let run = (m[1] as string).split(/;\s|\n/u)[0] as string;
  run = cutAtFirst(run, [' dated ', ' as amended', ' made ', ' entered ']).trim();
  if (/^(?:us|ourselves|you and us|us and you)\b/iu.test(run)) return [];
  const k = run.lastIndexOf(' and ');
  const names = k > 0 ? [run.slice(0, k), run.slice(k + 5)] : [run];
  return names.map((n) => trimEndChars(n.replace(/^(?:the|and)\s/iu, '').trim(), ', ')).filter((n) => /^\p{Lu}/u.test(n) && n.length <= 150);
}

/** `text` up to the first of `cues` (lower case, matched ignoring case), or all of it. */
function cutAtFirst(text: string, cues: readonly string[]): string {
  const lower = text.toLowerCase();
  let end = text.length;
  for (const cue of cues) {
    const k = lower.indexOf(cue);
    if (k >= 0 && k < end) end = k;
  }
  return text.slice(0, end);
}

function describe(statement: string, description: string): AgreementReference {
  const found = REFERENCE.exec(description)?.[1];
  const reference = found === undefined ? undefined : trimEndChars(found, '.,;:');
  const date = readDate(description);
  const title = titleIn(description);
  return {
    statement,
    ...(title ? { title } : {}),
    ...(date ? { date } : {}),
    ...(reference && /\d/.test(reference) ? { reference } : {}),
    parties: partiesIn(description),
  };
}

export function findEarlierAgreements(text: string): AgreementReference[] {
  const lower = text.toLowerCase();
  const out: AgreementReference[] = [];
  const seen = new Set<number>();
  let read = 0;
  for (const cue of CARRY_OVER) {
    for (let at = lower.indexOf(cue); at >= 0 && out.length < MAX_REFERENCES && read < MAX_CUES; at = lower.indexOf(cue, at + cue.length)) {
      read++;
      const [s, e] = sentenceAround(text, at);
      if (seen.has(s)) continue;
      seen.add(s);
      const statement = text.slice(s, e + 1).trim();
      // "the Agreement" as a defined term of this text: its definition describes the earlier agreement.
      const named = namedAfter(text.slice(at, e));
      // "the Cooperation Agreement, of which this letter forms part": the term ends at the first comma or parenthesis.
      const short = trimEndChars(
        cutAtFirst(named, [',', ';', ' ('])
          .replace(/^(?:the|that)\s/iu, '')
          .trim(),
        '.,;:',
      );
      const defined = short.split(' ').length <= 4 ? definitionOf(text, short) : undefined;
      // "… in that agreement": the agreement the sentence before described ("… amend the cooperation agreement of
      // 1 February 2022 with reference 2022/017. Terms … have the meaning given to them in that agreement.").
      const before = defined === undefined && ANAPHORA.test(text.slice(at, e)) ? previousSentence(text, s) : undefined;
      const reference = describe(statement, defined ?? before ?? (named === '' ? statement : named));
      if (reference.title === undefined && reference.reference === undefined && reference.date === undefined) continue;
      out.push(reference);
    }
  }
  return out;
}
