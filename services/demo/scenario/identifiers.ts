/**
 * Invented identifiers with valid check digits, computed here from the published rules (each function
 * names its rule), so that the scenario exercises validation as real data would. The numbers are random:
 * any match with a real registration is chance, and the demo never looks them up.
 */
import { composeIBAN, isValidIBAN } from 'ibantools';
import type { Random } from '../../../resolvers/prng.ts';

export function digits(rnd: Random, n: number, firstNonZero = false): string {
  let s = '';
  for (let i = 0; i < n; i++) s += String(i === 0 && firstNonZero ? 1 + rnd.int(9) : rnd.int(10));
  return s;
}

const ALNUM = '0123456789ABCDEFGHIJKLMNOPQRSTUVWXYZ';

/** ISO 7064 MOD 97-10 over a string of digits and capital letters (A = 10 … Z = 35). */
export function mod97(value: string): number {
  let rest = 0;
  for (const ch of value) {
    const code = ALNUM.indexOf(ch);
    if (code < 0) throw new Error(`mod97: unexpected character "${ch}"`);
    for (const d of String(code)) rest = (rest * 10 + Number(d)) % 97;
  }
  return rest;
}

/** LEI (ISO 17442): 4-character prefix, "00", 12 characters, then 98 - (base + "00") mod 97. */
export function lei(rnd: Random): string {
  let entity = '';
  for (let i = 0; i < 12; i++) entity += ALNUM[rnd.int(36)];
  const base = `${rnd.pick(['5493', '9845', '2138', '3912', '8945', '7245'])}00${entity}`;
  const check = 98 - mod97(`${base}00`);
  return base + String(check).padStart(2, '0');
}

/** Luhn check digit for a string of digits (ISO/IEC 7812-1 annex B). */
export function luhnCheckDigit(payload: string): number {
  let sum = 0;
  for (let i = 0; i < payload.length; i++) {
    let d = Number(payload[payload.length - 1 - i]);
    if (i % 2 === 0) {
      d *= 2;
      if (d > 9) d -= 9;
    }
    sum += d;
  }
  return (10 - (sum % 10)) % 10;
}

/** GB company number: 8 digits, or "SC" and 6 digits for Scotland (Companies House format; no check digit). */
export function gbCompanyNumber(rnd: Random): string {
  return rnd.chance(0.1) ? `SC${digits(rnd, 6, true)}` : `0${digits(rnd, 7, true)}`;
}

/** GB VAT: 7 digits weighted 8…2, plus two check digits making the total divisible by 97 (HMRC, standard). */
export function gbVat(rnd: Random): string {
  const body = digits(rnd, 7, true);
  let total = 0;
  for (let i = 0; i < 7; i++) total += Number(body[i]) * (8 - i);
  const check = (97 - (total % 97)) % 97;
  return `GB${body}${String(check).padStart(2, '0')}`;
}

/** DE VAT (USt-IdNr.): 8 digits and an ISO 7064 MOD 11,10 check digit. */
export function deVat(rnd: Random): string {
  const body = digits(rnd, 8, true);
  let product = 10;
  for (const ch of body) {
    let sum = (Number(ch) + product) % 10;
    if (sum === 0) sum = 10;
    product = (2 * sum) % 11;
  }
  const check = (11 - product) % 10;
  return `DE${body}${check}`;
}

const DE_COURTS = [
  'Amtsgericht Hamburg',
  'Amtsgericht München',
  'Amtsgericht Köln',
  'Amtsgericht Stuttgart',
  'Amtsgericht Düsseldorf',
  'Amtsgericht Frankfurt am Main',
];

/** DE commercial register entry: court, HRB (companies) or HRA (partnerships), number. */
export function deRegister(rnd: Random, partnership: boolean): { court: string; type: string; number: string } {
  return { court: rnd.pick(DE_COURTS), type: partnership ? 'HRA' : 'HRB', number: String(1000 + rnd.int(240_000)) };
}

/** FR SIREN: 8 digits and a Luhn check digit (INSEE). */
export function frSiren(rnd: Random): string {
  const body = digits(rnd, 8, true);
  return body + String(luhnCheckDigit(body));
}

/** FR VAT: key = (12 + 3 × (SIREN mod 97)) mod 97, then the SIREN. */
export function frVat(siren: string): string {
  const key = (12 + 3 * (Number(siren) % 97)) % 97;
  return `FR${String(key).padStart(2, '0')}${siren}`;
}

/** NL KvK number: 8 digits (no check digit). */
export function nlKvk(rnd: Random): string {
  return digits(rnd, 8, true);
}

/** NL VAT (old format): 9 digits passing the eleven test (weights 9…2, check = sum mod 11, never 10), "B01". */
export function nlVat(rnd: Random): string {
  for (;;) {
    const body = digits(rnd, 8, true);
    let sum = 0;
    for (let i = 0; i < 8; i++) sum += Number(body[i]) * (9 - i);
    const check = sum % 11;
    if (check !== 10) return `NL${body}${check}B01`;
  }
}

/** AU ACN: 8 digits weighted 8…1, check = (10 - sum mod 10) mod 10 (ASIC). */
export function auAcn(rnd: Random): string {
  const body = digits(rnd, 8, true);
  let sum = 0;
  for (let i = 0; i < 8; i++) sum += Number(body[i]) * (8 - i);
  return body + String((10 - (sum % 10)) % 10);
}

/** AU ABN of a company: two leading digits chosen so that the ABR weighted sum is divisible by 89, then the ACN. */
export function auAbnFromAcn(acn: string): string {
  for (let prefix = 10; prefix <= 99; prefix++) {
    const abn = `${prefix}${acn}`;
    if (abnWeightedSum(abn) % 89 === 0) return abn;
  }
  throw new Error(`no ABN prefix for ACN ${acn}`);
}

/** ABR rule: subtract 1 from the first digit, weight 10,1,3,5,…,19, sum. */
export function abnWeightedSum(abn: string): number {
  const weights = [10, 1, 3, 5, 7, 9, 11, 13, 15, 17, 19];
  let sum = 0;
  for (let i = 0; i < 11; i++) sum += (Number(abn[i]) - (i === 0 ? 1 : 0)) * weights[i]!;
  return sum;
}

/** SE organisationsnummer: 9 digits (third ≥ 2 for legal persons) and a Luhn check digit (Skatteverket). */
export function seOrg(rnd: Random): string {
  const body = `55${2 + rnd.int(8)}${digits(rnd, 6)}`;
  return `${body.slice(0, 6)}-${body.slice(6)}${luhnCheckDigit(body)}`;
}

/** SE VAT: "SE", the 10 digits of the organisation number, "01". */
export function seVat(org: string): string {
  return `SE${org.replace('-', '')}01`;
}

/** IT partita IVA: 10 digits and a Luhn check digit. */
export function itVat(rnd: Random): string {
  const body = digits(rnd, 10, true);
  return `IT${body}${luhnCheckDigit(body)}`;
}

/** JP corporate number: check digit = 9 - (Σ Pn × Qn mod 9), Pn the n-th of 12 digits from the right,
 * Qn 1 for odd n and 2 for even n; the check digit comes first (National Tax Agency rule, from memory). */
export function jpCorporateNumber(rnd: Random): string {
  const base = digits(rnd, 12, true);
  let sum = 0;
  for (let n = 1; n <= 12; n++) sum += Number(base[12 - n]) * (n % 2 === 1 ? 1 : 2);
  return `${9 - (sum % 9)}${base}`;
}

/** US EIN "NN-NNNNNNN" with a prefix from the IRS campus prefixes (no check digit). */
export function usEin(rnd: Random): string {
  const prefix = rnd.pick(['20', '26', '27', '45', '46', '47', '81', '82', '83', '84', '85', '86', '87', '88', '91', '93']);
  return `${prefix}-${digits(rnd, 7)}`;
}

/** A BBAN shape per country ('a' letter, '9' digit); the national check digits are found by retrying. */
const BBAN_SHAPES: Readonly<Record<string, string>> = {
  GB: 'aaaa99999999999999',
  DE: '999999999999999999',
  NL: 'aaaa9999999999',
  FR: '99999999999999999999999',
  SE: '99999999999999999999',
  IT: 'a9999999999999999999999',
  ES: '99999999999999999999',
};

export function ibanCountries(): string[] {
  return Object.keys(BBAN_SHAPES);
}

/** A valid IBAN for a country that has IBANs (checked with ibantools, which also checks national keys). */
export function iban(rnd: Random, country: string): string | undefined {
  const shape = BBAN_SHAPES[country];
  if (!shape) return undefined;
  for (let tries = 0; tries < 10_000; tries++) {
    let bban = '';
    for (const c of shape) bban += c === 'a' ? ALNUM[10 + rnd.int(26)] : String(rnd.int(10));
    const candidate = composeIBAN({ countryCode: country, bban });
    if (candidate && isValidIBAN(candidate)) return candidate;
  }
  throw new Error(`could not compose a valid IBAN for ${country}`);
}
