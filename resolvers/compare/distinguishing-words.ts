/**
 * Words that tell two otherwise equal organisation names apart: series numbers, branch designations, activity
 * words of a group's companies, places. Tokens are compared as the name analysis folds them (lower case, accents
 * off). The lists are common practice in company naming; the number words cover the languages of the legal forms
 * most often met (English, German, French, Spanish, Italian, Dutch, Portuguese).
 */

const ROMAN = /^(?=[ivxlc])c{0,3}(?:xc|xl|l?x{0,3})(?:ix|iv|v?i{0,3})$/;

const NUMBER_WORDS: ReadonlySet<string> = new Set([
  'one',
  'two',
  'three',
  'four',
  'five',
  'six',
  'seven',
  'eight',
  'nine',
  'ten',
  'eleven',
  'twelve',
  'first',
  'second',
  'third',
  'fourth',
  'fifth',
  'sixth',
  'seventh',
  'eighth',
  'ninth',
  'tenth',
  'eins',
  'zwei',
  'drei',
  'vier',
  'funf',
  'sechs',
  'sieben',
  'acht',
  'neun',
  'zehn',
  'un',
  'deux',
  'trois',
  'quatre',
  'cinq',
  'premier',
  'premiere',
  'deuxieme',
  'troisieme',
  'uno',
  'dos',
  'tres',
  'cuatro',
  'cinco',
  'primero',
  'primera',
  'segundo',
  'segunda',
  'due',
  'tre',
  'quattro',
  'primo',
  'prima',
  'secondo',
  'seconda',
  'terzo',
  'een',
  'twee',
  'drie',
  'vijf',
  'um',
  'dois',
  'quatro',
]);

/** Branch of a company, as opposed to the company (the head office): not the same legal relation. */
export const BRANCH_WORDS: ReadonlySet<string> = new Set([
  'branch',
  'branches',
  'niederlassung',
  'zweigniederlassung',
  'zweigstelle',
  'filiale',
  'filial',
  'succursale',
  'sucursal',
  'sucursale',
  'bijkantoor',
  'agency',
  'office',
  'representative',
]);

/**
 * Words naming what a company of a group does: two names equal but for these ("Alder Securities" / "Alder Bank")
 * are sister companies, not spellings of one.
 */
export const ACTIVITY_WORDS: ReadonlySet<string> = new Set([
  'bank',
  'banque',
  'banca',
  'banco',
  'bancorp',
  'banking',
  'securities',
  'capital',
  'finance',
  'financial',
  'financing',
  'funding',
  'insurance',
  'assurance',
  'reinsurance',
  'life',
  'leasing',
  'investment',
  'investments',
  'invest',
  'asset',
  'assets',
  'management',
  'managers',
  'advisors',
  'advisers',
  'advisory',
  'partners',
  'trust',
  'trustees',
  'holding',
  'holdings',
  'group',
  'fund',
  'funds',
  'credit',
  'mortgage',
  'mortgages',
  'realty',
  'real',
  'estate',
  'property',
  'properties',
  'services',
  'solutions',
  'technologies',
  'technology',
  'systems',
  'logistics',
  'energy',
  'power',
  'trading',
  'markets',
  'brokers',
  'broking',
  'factoring',
  'payments',
  'wealth',
  'equity',
  'ventures',
  'infrastructure',
  'pensions',
  'pension',
  'versicherung',
  'versicherungen',
  'kapital',
  'immobilien',
  'verwaltung',
  'beteiligungen',
  'assicurazioni',
  'seguros',
  'vida',
  'gestion',
  'inversiones',
  'finanz',
  'finanzierung',
  'consulting',
  'construction',
  'engineering',
  'manufacturing',
  'industries',
  'shipping',
  'transport',
  'telecom',
  'media',
  'pharma',
  'foods',
  'retail',
  'marine',
  'mining',
  'resources',
]);

/** Regions and place words often put in a subsidiary's name; country names come from ICU (countryWords). */
const REGION_WORDS: readonly string[] = [
  'asia',
  'europe',
  'european',
  'america',
  'americas',
  'africa',
  'pacific',
  'asia pacific',
  'emea',
  'apac',
  'latam',
  'nordic',
  'nordics',
  'benelux',
  'middle east',
  'gulf',
  'international',
  'global',
  'uk',
  'usa',
  'us',
  'hong kong',
  'scandinavia',
  'iberia',
  'deutschland',
  'schweiz',
  'suisse',
  'osterreich',
  'espana',
  'italia',
  'nederland',
  'london',
  'new york',
  'paris',
  'frankfurt',
  'singapore',
  'tokyo',
  'luxembourg',
  'dublin',
  'zurich',
  'sydney',
];

let placeWords: ReadonlySet<string> | null = null;

/** Lower-cased English country names (ICU display names of every ISO 3166-1 alpha-2 code) and region words. */
export function isPlaceWord(token: string): boolean {
  if (placeWords === null) placeWords = buildPlaceWords();
  return placeWords.has(token);
}

function buildPlaceWords(): ReadonlySet<string> {
  const out = new Set<string>();
  for (const word of REGION_WORDS) for (const part of word.split(' ')) out.add(part);
  const names = new Intl.DisplayNames(['en'], { type: 'region', fallback: 'none' });
  for (let a = 65; a <= 90; a++) {
    for (let b = 65; b <= 90; b++) {
      const name = names.of(String.fromCharCode(a, b));
      if (!name) continue;
      const folded = name
        .normalize('NFKD')
        .replace(/[\u0300-\u036f]/g, '')
        .toLowerCase();
      // One-word names only: "United" or "Republic" alone would tell nothing.
      if (/^[a-z]+$/.test(folded)) out.add(folded);
    }
  }
  return out;
}

/**
 * A token that numbers a series: a number ("2", "1884", "2nd"), a Roman numeral (i … ccc), or a number word.
 * A word with a digit inside ("r0botics", a misread letter; "n26", a brand) is not one. Remembered per token (a
 * bounded memo): the same tokens recur in many pairs.
 */
export function isNumberToken(token: string): boolean {
  const known = numberMemo.get(token);
  if (known !== undefined) return known;
  const result = /^\d+[a-z]{0,2}$/.test(token) || (token.length <= 6 && ROMAN.test(token)) || NUMBER_WORDS.has(token);
  if (numberMemo.size >= MEMO_LIMIT) numberMemo.clear();
  numberMemo.set(token, result);
  return result;
}

const MEMO_LIMIT = 100_000;
const numberMemo = new Map<string, boolean>();
