/**
 * Job titles in signature blocks ("Managing Director", "Vice President, Operations", "Geschäftsführer"): they say
 * in what capacity a person signs, so they are never a party and never a non-party *name* either. Word lists are
 * common practice in contract execution blocks (English, and the usual titles of translated French, German,
 * Italian, Spanish and Japanese drafting).
 */
import { trimEndChars } from './trim-end-chars.ts';

/** Words that head a title or make it one wherever they stand. */
export const TITLE_WORDS: ReadonlySet<string> = new Set([
  'director',
  'directors',
  'officer',
  'president',
  'secretary',
  'treasurer',
  'chairman',
  'chairwoman',
  'chairperson',
  'chair',
  'manager',
  'counsel',
  'head',
  'partner',
  'member',
  'signatory',
  'representative',
  'attorney',
  'ceo',
  'cfo',
  'coo',
  'cto',
  'cio',
  'clo',
  'evp',
  'svp',
  'vp',
  'founder',
  'proprietor',
  'owner',
  'trustee',
  'administrator',
  'liquidator',
  'receiver',
  'controller',
  'comptroller',
  'executive',
  'notary',
  'witness',
  'agent',
  'procurist',
  'geschäftsführer',
  'geschaftsfuhrer',
  'geschaeftsfuehrer',
  'prokurist',
  'vorstand',
  'vorstandsvorsitzender',
  'gérant',
  'gerant',
  'président',
  'directeur',
  'directrice',
  'administrateur',
  'mandataire',
  'amministratore',
  'presidente',
  'consigliere',
  'procuratore',
  'administrador',
  'apoderado',
  'consejero',
  'procurador',
  'representante',
  'notaire',
  'notar',
  'notario',
  'notaio',
  'torishimariyaku',
  'shachō',
  'shacho',
]);

/** Words that qualify a title ("Senior Vice President", "Company Secretary", "Legal Representative"). */
const MODIFIERS: ReadonlySet<string> = new Set([
  'senior',
  'deputy',
  'assistant',
  'associate',
  'executive',
  'managing',
  'general',
  'chief',
  'vice',
  'group',
  'regional',
  'legal',
  'company',
  'corporate',
  'authorised',
  'authorized',
  'duly',
  'sole',
  'joint',
  'acting',
  'interim',
  'finance',
  'financial',
  'operating',
  'technology',
  'information',
  'commercial',
  'sales',
  'procurement',
  'operations',
  'country',
  'representative',
  'designated',
  'statutory',
  'non',
  'independent',
  'delegato',
  'delegado',
  'unico',
  'único',
  'général',
  'general',
  'délégué',
  'public',
  'of',
  'and',
  '&',
  'the',
  'for',
  'de',
  'du',
  'des',
  'der',
  'di',
  'del',
  'in',
  'fact',
  'daihyo',
  'daihyō',
  'torishimariyaku',
]);

/** Leading words that introduce a title: "its President", "a director", "as Managing Director". */
const LEADS: ReadonlySet<string> = new Set(['its', 'their', 'his', 'her', 'a', 'an', 'the', 'as', 'being', 'in', 'capacity']);

/** Most titles are short: beyond this many words a phrase is prose, not a title (common practice). */
const MAX_TITLE_WORDS = 7;

function words(s: string): string[] {
  return s
    .toLowerCase()
    .split(/[^\p{L}&]+/u)
    .filter((w) => w.length > 0);
}

/** The title without its leading "its"/"a"/"as", or null when the phrase is not a job title. */
export function jobTitleOf(phrase: string): string | null {
  const raw = trimEndChars(phrase.trim(), ',;.:').trim();
  if (raw.length === 0 || /\d/u.test(raw)) return null;
  let ws = words(raw);
  let cut = 0;
  while (ws.length > 0 && LEADS.has(ws[0] as string)) {
    ws = ws.slice(1);
    cut++;
  }
  if (ws.length === 0 || ws.length > MAX_TITLE_WORDS) return null;
  if (!ws.some((w) => TITLE_WORDS.has(w))) return null;
  // Every word before the last title word is a title or a modifier ("Head of Procurement"); after it, at most a
  // short department ("Vice President, Operations").
  let last = -1;
  ws.forEach((w, k) => {
    if (TITLE_WORDS.has(w)) last = k;
  });
  for (let k = 0; k < last; k++) {
    const w = ws[k] as string;
    if (!TITLE_WORDS.has(w) && !MODIFIERS.has(w)) return null;
  }
  if (ws.length - last - 1 > 3) return null;
  return stripLeads(raw, cut);
}

export function isJobTitle(phrase: string): boolean {
  return jobTitleOf(phrase) !== null;
}

function stripLeads(raw: string, count: number): string {
  let s = raw;
  for (let k = 0; k < count; k++) s = s.replace(/^\s*\p{L}+/u, '').replace(/^[\s,]+/u, '');
  return s.trim();
}
