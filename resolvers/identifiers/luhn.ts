/**
 * The Luhn check (ISO/IEC 7812-1 Annex B): from the right, every second digit is doubled (9 subtracted
 * when the double exceeds 9); the total of a valid number is a multiple of 10. Used by FR SIREN/SIRET
 * and SE organisationsnummer.
 */
export function luhnSum(digits: string): number {
  let sum = 0;
  let double = false;
  for (let i = digits.length - 1; i >= 0; i--) {
    let d = digits.charCodeAt(i) - 48;
    if (d < 0 || d > 9) throw new RangeError(`luhn: "${digits[i]}" at position ${i + 1} is not a digit`);
    if (double) {
      d *= 2;
      if (d > 9) d -= 9;
    }
    sum += d;
    double = !double;
  }
  return sum;
}

export function isLuhnValid(digits: string): boolean {
  return digits.length > 0 && luhnSum(digits) % 10 === 0;
}

/** The digit to append to `payload` so that the whole passes the Luhn check. */
export function luhnCheckDigit(payload: string): number {
  return (10 - (luhnSum(`${payload}0`) % 10)) % 10;
}
