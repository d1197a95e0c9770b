/**
 * German commercial register entries: register court + register type + number, e.g.
 * "Amtsgericht München HRB 12345", "HRB 1234 B, AG Charlottenburg", "Frankfurt a. M. HRA 987".
 *
 * Canonical value: "<court> <TYPE> <number>[ <suffix>]", court in lower-case ASCII with hyphens and without
 * connectors ("muenchen HRB 12345", "berlin-charlottenburg HRB 1234 B", "frankfurt-main HRA 987").
 * A number is unique only within its court and register type, so the court is required.
 */
import { ok, problem, type SchemeResult } from './types.ts';

/** Register types (Handelsregister A/B, Genossenschafts-, Partnerschafts-, Vereinsregister). */
const REGISTER_TYPES = new Map<string, string>([
  ['HRA', 'HRA'],
  ['HRB', 'HRB'],
  ['GNR', 'GnR'],
  ['GENR', 'GnR'],
  ['PR', 'PR'],
  ['VR', 'VR'],
]);

/**
 * Words around the court name that are not part of it, and the connectors inside it ("am", "im", "an der"),
 * dropped so that "Frankfurt am Main", "Frankfurt a. M." and "Frankfurt/Main" give one key.
 */
const COURT_NOISE = new Set([
  'amtsgericht',
  'ag',
  'registergericht',
  'handelsregister',
  'beim',
  'register',
  'sitz',
  'nr',
  'nr.',
  'registernummer',
  'des',
  'amtsgerichts',
  'am',
  'an',
  'der',
  'im',
  'in',
]);

/** Abbreviations inside court names (common practice). */
const COURT_ABBREVIATIONS = new Map<string, string>([
  ['a.m.', 'am main'],
  ['a.main', 'am main'],
  ['i.br.', 'im breisgau'],
  ['a.d.', 'an der'],
  ['i.d.', 'in der'],
  ['(oder)', 'oder'],
]);

function foldCourtWord(word: string): string {
  return word.toLowerCase().replaceAll('ä', 'ae').replaceAll('ö', 'oe').replaceAll('ü', 'ue').replaceAll('ß', 'ss').normalize('NFD').replace(/\p{M}/gu, '');
}

/** Canonical court key: folded words joined by hyphens; "Charlottenburg" is Berlin's register court. */
export function normaliseCourtName(court: string): string {
  let text = foldCourtWord(court);
  // Join abbreviations written with spaces ("a. M.") before splitting into words.
  text = text.replaceAll('a. m.', 'a.m.').replaceAll('i. br.', 'i.br.').replaceAll('a. d.', 'a.d.').replaceAll('i. d.', 'i.d.');
  const words: string[] = [];
  for (const raw of text.split(/[\s,;/()]+/)) {
    if (raw.length === 0) continue;
    const expanded = COURT_ABBREVIATIONS.get(raw) ?? COURT_ABBREVIATIONS.get(`(${raw})`);
    const parts = (expanded ?? raw).split(' ');
    for (const part of parts) {
      const clean = part.replace(/[^a-z0-9-]/g, '');
      if (clean.length > 0 && !COURT_NOISE.has(clean)) words.push(...clean.split('-').filter((w) => w.length > 0));
    }
  }
  if (words.length === 1 && words[0] === 'charlottenburg') return 'berlin-charlottenburg';
  return words.join('-');
}

interface Parsed {
  type: string;
  number: string;
  suffix: string;
  courtWords: string[];
}

/** "HRB12345" / "HRB12345B" written as one token → "HRB", "12345B". */
function splitJoinedEntry(token: string): string[] {
  const upper = token.toUpperCase();
  for (const type of REGISTER_TYPES.keys()) {
    if (upper.startsWith(type) && upper.length > type.length && upper.charCodeAt(type.length) >= 48 && upper.charCodeAt(type.length) <= 57) {
      return [token.slice(0, type.length), token.slice(type.length)];
    }
  }
  return [token];
}

function parse(value: string): Parsed | string {
  const tokens = value
    .split(/[\s,;:]+/)
    .filter((t) => t.length > 0)
    .flatMap(splitJoinedEntry);
  let typeIndex = -1;
  let type = '';
  let consumed = 1;
  for (let i = 0; i < tokens.length; i++) {
    const upper = tokens[i]!.toUpperCase().replaceAll('.', '');
    if (REGISTER_TYPES.has(upper)) {
      typeIndex = i;
      type = REGISTER_TYPES.get(upper)!;
      break;
    }
    // "HR B 12345"
    if (upper === 'HR' && i + 1 < tokens.length && /^[AB]$/i.test(tokens[i + 1]!)) {
      typeIndex = i;
      type = `HR${tokens[i + 1]!.toUpperCase()}`;
      consumed = 2;
      break;
    }
  }
  if (typeIndex < 0) return 'needs a register type (HRA, HRB, GnR, PR or VR)';
  const numberToken = tokens[typeIndex + consumed];
  if (numberToken === undefined) return `needs a number after ${type}`;
  const match = /^(\d+)([A-Z]{0,2})$/i.exec(numberToken);
  if (!match) return `"${numberToken}" after ${type} is not a register number`;
  let suffix = match[2]!.toUpperCase();
  let after = typeIndex + consumed + 1;
  // A one- or two-letter suffix written apart ("HRB 1234 B").
  if (suffix === '' && after < tokens.length && /^[A-Z]{1,2}$/.test(tokens[after]!) && !COURT_NOISE.has(tokens[after]!.toLowerCase())) {
    suffix = tokens[after]!;
    after++;
  }
  const courtWords = [...tokens.slice(0, typeIndex), ...tokens.slice(after)];
  return { type, number: match[1]!.replace(/^0+(?=\d)/, ''), suffix, courtWords };
}

export function normaliseDeRegister(value: string): SchemeResult {
  const parsed = parse(value.trim());
  if (typeof parsed === 'string') return problem(parsed);
  const court = normaliseCourtName(parsed.courtWords.join(' '));
  if (court.length === 0) return problem('needs the register court (e.g. "Amtsgericht Köln HRB 12345")');
  return ok(`${court} ${parsed.type} ${parsed.number}${parsed.suffix ? ` ${parsed.suffix}` : ''}`);
}

/** Splits a canonical value back into court, type and number (for comparisons). */
export function splitDeRegister(value: string): { court: string; entry: string } {
  const space = value.indexOf(' ');
  return { court: value.slice(0, space), entry: value.slice(space + 1) };
}
