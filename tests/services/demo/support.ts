/** Helpers shared by the demo tests: check-digit validators of their own, and the names no invented name may equal. */
import { readFileSync } from 'node:fs';

/*
 * Independent check-digit validators for the scenario tests, written from the published rules (not shared
 * with the generator, so that a wrong rule in one shows up in the other).
 */
/** ISO/IEC 7064 MOD 97-10 value of a string of digits and letters (A = 10 … Z = 35, case-insensitive). */
export function mod97Of(value: string): number {
  let digits = '';
  for (const ch of value.toUpperCase()) digits += /\d/.test(ch) ? ch : String(ch.charCodeAt(0) - 55);
  let rest = 0;
  for (const d of digits) rest = (rest * 10 + Number(d)) % 97;
  return rest;
}

/** ISO 17442: 20 characters, 18 alphanumerics and 2 digits, MOD 97-10 value 1. */
export function validLei(lei: string): boolean {
  return /^[0-9A-Z]{18}\d{2}$/.test(lei) && mod97Of(lei) === 1;
}

/** Luhn (ISO/IEC 7812-1 annex B): doubling every second digit from the right, total divisible by 10. */
export function validLuhn(digits: string): boolean {
  let sum = 0;
  for (let i = 0; i < digits.length; i++) {
    let d = Number(digits[digits.length - 1 - i]);
    if (i % 2 === 1) {
      d *= 2;
      if (d > 9) d -= 9;
    }
    sum += d;
  }
  return sum % 10 === 0;
}

/** ASIC ACN: weights 8…1 on the first 8 digits; complement of the sum mod 10 is the 9th digit. */
export function validAcn(acn: string): boolean {
  if (!/^\d{9}$/.test(acn)) return false;
  let sum = 0;
  for (let i = 0; i < 8; i++) sum += Number(acn[i]) * (8 - i);
  return (10 - (sum % 10)) % 10 === Number(acn[8]);
}

/** ABR ABN: subtract 1 from the first digit, weights 10,1,3,…,19, sum divisible by 89. */
export function validAbn(abn: string): boolean {
  if (!/^\d{11}$/.test(abn)) return false;
  const w = [10, 1, 3, 5, 7, 9, 11, 13, 15, 17, 19];
  let sum = 0;
  for (let i = 0; i < 11; i++) sum += (Number(abn[i]) - (i === 0 ? 1 : 0)) * w[i]!;
  return sum % 89 === 0;
}

/** VAT numbers of the countries the scenario uses, each by its national rule. */
export function validVat(vat: string): boolean {
  const cc = vat.slice(0, 2);
  const body = vat.slice(2);
  switch (cc) {
    case 'GB': {
      // HMRC: 7 digits weighted 8…2 plus the 2-digit check, total divisible by 97.
      if (!/^\d{9}$/.test(body)) return false;
      let total = 0;
      for (let i = 0; i < 7; i++) total += Number(body[i]) * (8 - i);
      return (total + Number(body.slice(7))) % 97 === 0;
    }
    case 'DE': {
      // ISO 7064 MOD 11,10.
      if (!/^\d{9}$/.test(body)) return false;
      let product = 10;
      for (let i = 0; i < 8; i++) {
        let sum = (Number(body[i]) + product) % 10;
        if (sum === 0) sum = 10;
        product = (2 * sum) % 11;
      }
      return (11 - product) % 10 === Number(body[8]);
    }
    case 'FR': {
      // Key = (12 + 3 × (SIREN mod 97)) mod 97, SIREN Luhn-valid.
      const siren = body.slice(2);
      return /^\d{11}$/.test(body) && validLuhn(siren) && (12 + 3 * (Number(siren) % 97)) % 97 === Number(body.slice(0, 2));
    }
    case 'NL': {
      // Eleven test on 9 digits (weights 9…2, last digit = sum mod 11), then "B" and two digits.
      if (!/^\d{9}B\d{2}$/.test(body)) return false;
      let sum = 0;
      for (let i = 0; i < 8; i++) sum += Number(body[i]) * (9 - i);
      return sum % 11 === Number(body[8]);
    }
    case 'SE':
      return /^\d{10}01$/.test(body) && validLuhn(body.slice(0, 10));
    case 'IT':
      return /^\d{11}$/.test(body) && validLuhn(body);
    default:
      return false;
  }
}

/** JP corporate number: first digit = 9 - (Σ Pn × Qn mod 9) over the 12 following digits (from memory). */
export function validJpCorporateNumber(n: string): boolean {
  if (!/^\d{13}$/.test(n)) return false;
  const base = n.slice(1);
  let sum = 0;
  for (let i = 1; i <= 12; i++) sum += Number(base[12 - i]) * (i % 2 === 1 ? 1 : 2);
  return 9 - (sum % 9) === Number(n[0]);
}

/*
 * The lower-cased names of ../shared/datasets/ror_org_names.csv (real research organisations, README there): the
 * tests check that no invented name is one of them.
 */
export function rorNames(): Set<string> {
  return new Set(
    readFileSync(new URL('../../../../shared/datasets/ror_org_names.csv', import.meta.url), 'utf8')
      .split('\n')
      .slice(1)
      .map((line) => (line.split(',')[1] ?? '').toLowerCase()),
  );
}
