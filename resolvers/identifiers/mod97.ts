/**
 * ISO/IEC 7064 MOD 97-10 over an alphanumeric string: letters A..Z count as 10..35, digits as
 * themselves, and the resulting digit string is reduced mod 97 piece by piece (no big integers).
 * Used by LEI (ISO 17442) and by the check digits of the US ULI (12 CFR 1003 Appendix C).
 */
export function mod97(value: string): number {
  let remainder = 0;
  for (let i = 0; i < value.length; i++) {
    const c = value.toUpperCase().charCodeAt(i);
    if (c >= 48 && c <= 57) {
      remainder = (remainder * 10 + (c - 48)) % 97;
    } else if (c >= 65 && c <= 90) {
      remainder = (remainder * 100 + (c - 55)) % 97;
    } else {
      throw new RangeError(`mod97: character "${value[i]}" at position ${i + 1} is not a letter or digit`);
    }
  }
  return remainder;
}

/** Two check digits that make `base + digits` ≡ 1 (mod 97): 98 − (base‖"00" mod 97). */
export function mod97CheckDigits(base: string): string {
  const check = 98 - mod97(`${base}00`);
  return check < 10 ? `0${check}` : String(check);
}
