export type { NormaliseOptions, NormaliseResult } from './types.ts';
export { normaliseIdentifier } from './normalise-identifier.ts';
export {
  compareIdentifiers,
  type IdentifierComparison,
  type CompareIdentifiersOptions,
  type IdentifierEvidence,
  type DifferingIdentifiers,
  type IgnoredIdentifier,
} from './compare-identifiers.ts';
export { isValidLei, leiCheckDigits, normaliseLei } from './lei.ts';
export { mod97, mod97CheckDigits } from './mod97.ts';
export { isLuhnValid, luhnCheckDigit, luhnSum } from './luhn.ts';
export {
  acnCheckDigit,
  abnWeightedSum,
  isValidAbn,
  normaliseAuAbn,
  normaliseAuAcn,
  normaliseFrSiren,
  normaliseGbCompany,
  normaliseNlKvk,
  normaliseSeOrg,
  normaliseUsEin,
} from './registration-numbers.ts';
export { normaliseDeRegister, normaliseCourtName } from './de-register.ts';
export { normaliseVat, frenchVatKey, sirenFromFrenchVat, vatPrefixForCountry, VAT_PREFIXES } from './vat.ts';
export { normalisePhone, normaliseEmailDomain, normaliseWebDomain, isFreeMailDomain } from './contact.ts';
export { FREE_MAIL_DOMAINS } from './free-mail-domains.ts';
export { normaliseIban } from './iban.ts';
export { normaliseAddress } from './address.ts';
export { schemeOfTaxId, schemeOfRegistrationNumber } from './scheme-of-column.ts';
