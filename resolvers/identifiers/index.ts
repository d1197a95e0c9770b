export type { NormaliseOptions, NormaliseResult } from './types.ts';
export { normaliseIdentifier } from './normaliseIdentifier.ts';
export {
  compareIdentifiers,
  type IdentifierComparison,
  type CompareIdentifiersOptions,
  type IdentifierEvidence,
  type DifferingIdentifiers,
  type IgnoredIdentifier,
} from './compareIdentifiers.ts';
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
} from './registrationNumbers.ts';
export { normaliseDeRegister, normaliseCourtName } from './deRegister.ts';
export { normaliseVat, frenchVatKey, sirenFromFrenchVat, vatPrefixForCountry, VAT_PREFIXES } from './vat.ts';
export { normalisePhone, normaliseEmailDomain, normaliseWebDomain, isFreeMailDomain } from './contact.ts';
export { FREE_MAIL_DOMAINS } from './freeMailDomains.ts';
export { normaliseIban } from './iban.ts';
export { normaliseAddress } from './address.ts';
export { schemeOfTaxId, schemeOfRegistrationNumber } from './schemeOfColumn.ts';
