/**
 * Names introduced inside one name string: "X d/b/a Y" (trade), "X f/k/a Y" (former), "X a/k/a Y"
 * (also known as; also a register's short form, "X in forma abbreviata Y", "X en abrégé Y"), "X, successor in interest to Y" (a separate entity: related successor_of, never an alias),
 * and "Y (a trading name of X)", where X is the party and Y its trade name.
 * Markers are matched on words, so no regular expression runs over the untrusted text.
 */
import type { AliasKind, RelationType } from '../vocabulary.ts';

type MarkerKind = AliasKind | 'successor_of' | 'trading_name_of';

interface Marker {
  words: readonly string[];
  kind: MarkerKind;
  /** Written without spaces ("d/b/a", "t/a"): one-letter words must not be separated by whitespace. */
  compact?: boolean;
}

/** Longest first within each leading word, so "formerly known as" wins over "formerly". Common practice. */
const MARKERS: readonly Marker[] = [
  { words: ['d', 'b', 'a'], kind: 'trade', compact: true },
  { words: ['dba'], kind: 'trade' },
  { words: ['doing', 'business', 'as'], kind: 'trade' },
  { words: ['t', 'a'], kind: 'trade', compact: true },
  { words: ['trading', 'as'], kind: 'trade' },
  { words: ['o', 'a'], kind: 'trade', compact: true },
  // "operating under the trade name", "carrying on business as", "trading under the name" (UK and translated
  // drafting; common practice).
  { words: ['operating', 'under', 'the', 'trade', 'name'], kind: 'trade' },
  { words: ['operating', 'under', 'the', 'name'], kind: 'trade' },
  { words: ['operating', 'as'], kind: 'trade' },
  { words: ['carrying', 'on', 'business', 'as'], kind: 'trade' },
  { words: ['trading', 'under', 'the', 'name'], kind: 'trade' },
  { words: ['under', 'the', 'trade', 'name'], kind: 'trade' },
  { words: ['f', 'k', 'a'], kind: 'former', compact: true },
  { words: ['fka'], kind: 'former' },
  { words: ['formerly', 'known', 'as'], kind: 'former' },
  { words: ['formerly', 'called'], kind: 'former' },
  { words: ['formerly', 'named'], kind: 'former' },
  // A trade name no longer used is a former name, not a current trade name.
  { words: ['formerly', 'trading', 'as'], kind: 'former' },
  { words: ['formerly'], kind: 'former' },
  { words: ['previously', 'known', 'as'], kind: 'former' },
  { words: ['previously', 'called'], kind: 'former' },
  { words: ['previously', 'named'], kind: 'former' },
  { words: ['previously'], kind: 'former' },
  // The same declaration in contracts drafted in German, French, Spanish and Italian ("vormals", "ehemals",
  // "anciennement [dénommée]", "anteriormente denominada", "precedentemente denominata"; common practice).
  { words: ['vormals'], kind: 'former' },
  { words: ['ehemals'], kind: 'former' },
  { words: ['anciennement', 'd\u00e9nomm\u00e9e'], kind: 'former' },
  { words: ['anciennement', 'denommee'], kind: 'former' },
  { words: ['anciennement'], kind: 'former' },
  { words: ['anteriormente', 'denominada'], kind: 'former' },
  { words: ['precedentemente', 'denominata'], kind: 'former' },
  { words: ['a', 'k', 'a'], kind: 'also_known_as', compact: true },
  { words: ['aka'], kind: 'also_known_as' },
  { words: ['also', 'known', 'as'], kind: 'also_known_as' },
  // Register spellings of a short name: Italian "in forma abbreviata" / "in breve" / "enunciabile anche", French
  // "en abrégé" (as Italian and French company registers write them; common practice).
  { words: ['o', 'in', 'forma', 'abbreviata'], kind: 'also_known_as' },
  { words: ['in', 'forma', 'abbreviata'], kind: 'also_known_as' },
  { words: ['in', 'abbreviato'], kind: 'also_known_as' },
  { words: ['in', 'breve'], kind: 'also_known_as' },
  { words: ['enunciabile', 'anche'], kind: 'also_known_as' },
  { words: ['en', 'abrege'], kind: 'also_known_as' },
  { words: ['en', 'abr\u00e9g\u00e9'], kind: 'also_known_as' },
  { words: ['successor', 'in', 'interest', 'to'], kind: 'successor_of' },
  { words: ['successor', 'by', 'merger', 'to'], kind: 'successor_of' },
  { words: ['successor', 'to'], kind: 'successor_of' },
  { words: ['a', 'trading', 'name', 'of'], kind: 'trading_name_of' },
  { words: ['the', 'trading', 'name', 'of'], kind: 'trading_name_of' },
  { words: ['trading', 'name', 'of'], kind: 'trading_name_of' },
];

const MARKERS_BY_FIRST = new Map<string, Marker[]>();
for (const m of MARKERS) {
  const first = m.words[0] as string;
  const list = MARKERS_BY_FIRST.get(first) ?? [];
  list.push(m);
  MARKERS_BY_FIRST.set(first, list);
}

interface Word {
  text: string;
  start: number;
  end: number;
}

/** Lower-cased words; markers are lower-case (one, "abrégé", with its accents), so other letters only need to break words correctly. */
function words(text: string): Word[] {
  const out: Word[] = [];
  let start = -1;
  for (let i = 0; i <= text.length; i++) {
    const c = i < text.length ? text.charCodeAt(i) : 0x20;
    const isWord = (c >= 0x61 && c <= 0x7a) || (c >= 0x41 && c <= 0x5a) || (c >= 0x30 && c <= 0x39) || c >= 0x80;
    if (isWord && start < 0) start = i;
    else if (!isWord && start >= 0) {
      // Marker words are at most 15 letters ("precedentemente"): longer words are never compared, so not lower-cased either.
      out.push({ text: i - start <= 15 ? text.slice(start, i).toLowerCase() : '', start, end: i });
      start = -1;
    }
  }
  return out;
}

export interface AliasSplit {
  /** The party's own name (original text, trimmed of the connecting punctuation). */
  primary: string;
  /** Offset of `primary` in the input. */
  primaryStart: number;
  aliases: { kind: AliasKind; name: string }[];
  related: { relation: RelationType; name: string }[];
}

interface Found {
  kind: MarkerKind;
  start: number;
  end: number;
}

function findMarkers(text: string, list: Word[]): Found[] {
  const found: Found[] = [];
  for (let w = 1; w < list.length; w++) {
    const candidates = MARKERS_BY_FIRST.get((list[w] as Word).text);
    if (!candidates) continue;
    for (const m of candidates) {
      if (w + m.words.length > list.length) continue;
      let ok = true;
      for (let k = 1; k < m.words.length && ok; k++) ok = (list[w + k] as Word).text === m.words[k];
      if (!ok) continue;
      const first = list[w] as Word;
      const last = list[w + m.words.length - 1] as Word;
      if (m.compact && !isCompact(text.slice(first.start, last.end))) continue;
      found.push({ kind: m.kind, start: first.start, end: m.compact ? skipDot(text, last.end) : last.end });
      w += m.words.length - 1;
      break;
    }
  }
  return found;
}

function isCompact(span: string): boolean {
  for (let i = 0; i < span.length; i++) {
    const c = span.charCodeAt(i);
    if (c === 0x20 || c === 0x09 || c === 0x0a || c === 0x0d || c === 0xa0) return false;
  }
  return span.includes('/') || span.includes('.');
}

function skipDot(text: string, at: number): number {
  return text.charCodeAt(at) === 0x2e ? at + 1 : at;
}

const EDGE = new Set([' ', '\t', '\n', '\r', '\u00a0', ',', ';', ':', '-', '\u2013', '\u2014']);

/** Trims whitespace and connecting punctuation; drops one unbalanced bracket at either edge. */
function trimPiece(text: string, start: number, end: number): { start: number; end: number } {
  let s = start;
  let e = end;
  for (;;) {
    while (s < e && EDGE.has(text[s] as string)) s++;
    while (e > s && EDGE.has(text[e - 1] as string)) e--;
    if (e <= s) break;
    const piece = text.slice(s, e);
    const opens = count(piece, '(');
    const closes = count(piece, ')');
    if (text[e - 1] === '(' || (text[e - 1] === ')' && closes > opens)) e--;
    else if (text[s] === ')' || (text[s] === '(' && opens > closes)) s++;
    else break;
  }
  return { start: s, end: e };
}

function count(text: string, ch: string): number {
  let n = 0;
  for (let i = text.indexOf(ch); i >= 0; i = text.indexOf(ch, i + 1)) n++;
  return n;
}

export function splitAliases(text: string): AliasSplit {
  const found = findMarkers(text, words(text)).filter((f, k, all) => {
    // A marker with nothing after it is a word of the name ("Zanthor DBA" — DBA is also a US-OR form).
    const next = all[k + 1];
    const piece = trimPiece(text, f.end, next ? next.start : text.length);
    return piece.end > piece.start;
  });
  if (found.length === 0) return { primary: text, primaryStart: 0, aliases: [], related: [] };
  const pieces: { start: number; end: number }[] = [];
  pieces.push(trimPiece(text, 0, (found[0] as Found).start));
  for (let k = 0; k < found.length; k++) {
    const next = found[k + 1];
    pieces.push(trimPiece(text, (found[k] as Found).end, next ? next.start : text.length));
  }
  let primary = pieces[0] as { start: number; end: number };
  const aliases: AliasSplit['aliases'] = [];
  const related: AliasSplit['related'] = [];
  for (let k = 0; k < found.length; k++) {
    const kind = (found[k] as Found).kind;
    const piece = pieces[k + 1] as { start: number; end: number };
    const name = text.slice(piece.start, piece.end);
    if (name === '') continue;
    if (kind === 'successor_of') related.push({ relation: 'successor_of', name });
    else if (kind === 'trading_name_of') {
      // "Brannock Print Works (a trading name of Iolo Brannock)": the party is the owner of the trade name.
      aliases.push({ kind: 'trade', name: text.slice(primary.start, primary.end) });
      primary = piece;
    } else aliases.push({ kind, name });
  }
  return { primary: text.slice(primary.start, primary.end), primaryStart: primary.start, aliases, related };
}
