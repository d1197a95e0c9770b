/**
 * Legal Entity Identifier (ISO 17442): 18 upper-case letters or digits, then two check digits
 * computed with ISO/IEC 7064 MOD 97-10 (a valid LEI read as one number is ≡ 1 mod 97).
 */
import { mod97, mod97CheckDigits } from './mod97.ts';
import { compactAlphanumeric, ok, problem, type SchemeResult } from './types.ts';

function hasLeiFormat(value: string): boolean {
  if (value.length !== 20) return false;
  for (let i = 0; i < 20; i++) {
    const c = value.charCodeAt(i);
    const digit = c >= 48 && c <= 57;
    const upper = c >= 65 && c <= 90;
    if (i >= 18 ? !digit : !(digit || upper)) return false;
  }
  return true;
}

/** Strict check of a stored LEI: format [A-Z0-9]{18}[0-9]{2} (upper case) and MOD 97-10. */
export function isValidLei(value: string): boolean {
  return hasLeiFormat(value) && mod97(value) === 1;
}

/** Check digits for an 18-character LEI base. */
export function leiCheckDigits(base: string): string {
  if (base.length !== 18) throw new RangeError(`leiCheckDigits: the base must have 18 characters, got ${base.length}`);
  return mod97CheckDigits(base);
}

/** Input as people write it: case and spaces are forgiven, then the strict check applies. */
export function normaliseLei(value: string): SchemeResult {
  const compact = compactAlphanumeric(value);
  if (compact.length !== 20) return problem(`must have 20 letters or digits, found ${compact.length}`);
  if (!hasLeiFormat(compact)) return problem('the last two characters (check digits) must be digits');
  const remainder = mod97(compact);
  if (remainder !== 1) {
    return problem(`check digits do not verify (ISO 7064 MOD 97-10 gives ${remainder}, not 1); expected ${leiCheckDigits(compact.slice(0, 18))}`);
  }
  return ok(compact);
}
