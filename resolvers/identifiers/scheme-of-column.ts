/**
 * Which identifier scheme a vendor-master or batch-file value is, when its column says only "tax id" or
 * "registration number": a tax id with a two-letter prefix is a VAT number (the prefix names the country);
 * otherwise the row's country decides (US EIN, AU ABN for tax ids; GB company, DE register, FR SIREN, NL KvK,
 * AU ACN, SE org for registration numbers). Undefined: no scheme can be told for this value and country.
 * Shared by reconcile and ingest, so that both read one file's columns the same way.
 */
import type { IdentifierScheme } from '../vocabulary.ts';

const TAX_BY_COUNTRY: Partial<Record<string, IdentifierScheme>> = { US: 'us_ein', AU: 'au_abn' };
const REGISTRATION_BY_COUNTRY: Partial<Record<string, IdentifierScheme>> = {
  GB: 'gb_company',
  DE: 'de_register',
  FR: 'fr_siren',
  NL: 'nl_kvk',
  AU: 'au_acn',
  SE: 'se_org',
};

/** `country`: ISO 3166-1 alpha-2 (an ISO 3166-2 code is read by its country part). */
function countryPart(country: string | null | undefined): string | undefined {
  const code = country?.trim().toUpperCase().slice(0, 2);
  return code && /^[A-Z]{2}$/.test(code) ? code : undefined;
}

export function schemeOfTaxId(value: string, country?: string | null): IdentifierScheme | undefined {
  if (/^[a-z]{2}\s?[0-9a-z]/i.test(value.trim())) return 'vat';
  const code = countryPart(country);
  return code ? TAX_BY_COUNTRY[code] : undefined;
}

export function schemeOfRegistrationNumber(country?: string | null): IdentifierScheme | undefined {
  const code = countryPart(country);
  return code ? REGISTRATION_BY_COUNTRY[code] : undefined;
}
