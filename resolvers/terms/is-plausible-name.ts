/**
 * Whether a located name can be a party: it reads as a name (capitalised words), the name analysis says
 * "party", and something in the text supports it (a parties clause, a legal form, a person's name, or a
 * descriptive phrase with a jurisdiction, identifier or address). This keeps "Italy (the "Territory")"
 * and "WHEREAS, the Licensor owns…" out.
 */
import type { NameAnalysis } from '../analyse/index.ts';

const NAME_CONNECTORS = new Set([
  'of',
  'and',
  'the',
  'for',
  'de',
  'du',
  'des',
  'la',
  'le',
  'les',
  'von',
  'van',
  'der',
  'den',
  'di',
  'da',
  'del',
  'della',
  'y',
  'e',
  'et',
  'und',
  'für',
  'zu',
  'am',
  'im',
  'in',
  'on',
  'at',
  'to',
  '&',
  'd',
  "d'",
  'l',
  "l'",
  'i',
  'af',
  'och',
  'og',
  'do',
  'dos',
  'das',
  'el',
  'a',
  'an',
  'und',
  'mit',
  'with',
]);
const BAD_STARTS = new Set([
  'this',
  'these',
  'that',
  'such',
  'each',
  'any',
  'all',
  'whereas',
  'now',
  'in',
  'dated',
  'date',
  'signed',
  'agreement',
  'witness',
  'executed',
  'between',
  'and',
  'our',
  'its',
  'their',
  'his',
  'her',
]);

export const MAX_NAME_LENGTH = 150;

function letterStart(w: string): string | undefined {
  for (const ch of w) if (/\p{L}/u.test(ch)) return ch;
  return undefined;
}

/**
 * "Qorv Ltd and Beta Ltd (the "MSA")": two legal entities joined by "and" are a set, not one party. A firm name
 * with "and" ("Smith and Jones LLP") has no legal form on the left; "X GmbH und Co. KG" has no name on the right.
 */
export function joinsTwoEntities(name: string, analyse: (text: string) => NameAnalysis): boolean {
  for (const joiner of [' and ', ' und ', ' et ']) {
    const k = name.indexOf(joiner);
    if (k <= 0 || analyse(name.slice(0, k)).legalForm === null) continue;
    const right = analyse(name.slice(k + joiner.length));
    if (right.legalForm !== null && right.core.length > 0 && !/^co\b/u.test(right.core)) return true;
  }
  return false;
}

export function readsAsName(name: string, analysis: NameAnalysis): boolean {
  if (name.length < 2 || name.length > MAX_NAME_LENGTH) return false;
  const first = name[0] as string;
  if (!/[\p{Lu}\p{N}]/u.test(first)) return false;
  if (/^\p{N}+$/u.test(name.split(/\s/u)[0] ?? '')) return false; // "1 March 2024"
  const words = name.split(/\s+/u).filter((w) => w.length > 0);
  // "LEI 9845…", "ACN 004 085 616": a long token mixing letters and digits, or digit groups, is an identifier.
  if (words.some((w) => w.length >= 9 && /\d/u.test(w) && /\p{L}/u.test(w))) return false;
  if (words.filter((w) => /^\d+$/u.test(w)).length >= 2) return false;
  if (BAD_STARTS.has((words[0] ?? '').toLowerCase())) return false;
  const form = (analysis.legalForm?.text ?? '').toLowerCase().replace(/\P{L}/gu, '');
  for (const w of words) {
    const ch = letterStart(w);
    if (ch === undefined || ch === ch.toUpperCase()) continue;
    const bare = w.toLowerCase().replace(/[^\p{L}'&]/gu, '');
    if (NAME_CONNECTORS.has(bare) || (form.length > 0 && form.includes(bare.replace(/\P{L}/gu, '')))) continue;
    return false;
  }
  return analysis.partyStatus === 'party';
}
