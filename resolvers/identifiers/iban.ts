/** IBAN (ISO 13616) through ibantools: electronic format (no spaces, upper case), country length and MOD 97 check. */
import { electronicFormatIBAN, validateIBAN, ValidationErrorsIBAN } from 'ibantools';
import { ok, problem, type SchemeResult } from './types.ts';

const IBAN_ERRORS: Partial<Record<ValidationErrorsIBAN, string>> = {
  [ValidationErrorsIBAN.NoIBANProvided]: 'is empty',
  [ValidationErrorsIBAN.NoIBANCountry]: 'does not start with a known country code',
  [ValidationErrorsIBAN.WrongBBANLength]: 'has the wrong length for its country',
  [ValidationErrorsIBAN.WrongBBANFormat]: 'does not have the account-number format of its country',
  [ValidationErrorsIBAN.ChecksumNotNumber]: 'check digits (characters 3-4) are not digits',
  [ValidationErrorsIBAN.WrongIBANChecksum]: 'check digits do not verify (MOD 97)',
  [ValidationErrorsIBAN.WrongAccountBankBranchChecksum]: 'national account check digits do not verify',
  [ValidationErrorsIBAN.QRIBANNotAllowed]: 'is a QR-IBAN, not allowed here',
};

export function normaliseIban(value: string): SchemeResult {
  const electronic = electronicFormatIBAN(value.replace(/^\s*iban\s*:?/i, ''));
  if (!electronic) return problem('is empty');
  const result = validateIBAN(electronic);
  if (!result.valid) {
    const reasons = result.errorCodes.map((code) => IBAN_ERRORS[code] ?? `fails check ${ValidationErrorsIBAN[code]}`);
    return problem(reasons.join('; '));
  }
  return ok(electronic);
}
