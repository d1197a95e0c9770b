/**
 * One entry point for every identifier scheme of resolvers/vocabulary.ts: canonical value or a reason that
 * names the scheme and what is wrong.
 */
import { IDENTIFIER_SCHEMES, type IdentifierScheme } from '../vocabulary.ts';
import { normaliseEmailDomain, normalisePhone, normaliseWebDomain } from './contact.ts';
import { normaliseDeRegister } from './de-register.ts';
import { normaliseIban } from './iban.ts';
import { normaliseLei } from './lei.ts';
import {
  normaliseAuAbn,
  normaliseAuAcn,
  normaliseFrSiren,
  normaliseGbCompany,
  normaliseNlKvk,
  normaliseSeOrg,
  normaliseUsEin,
} from './registration-numbers.ts';
import { ok, problem, type NormaliseOptions, type NormaliseResult, type SchemeResult } from './types.ts';
import { normaliseVat } from './vat.ts';

const SCHEME_NAMES: Readonly<Record<IdentifierScheme, string>> = {
  lei: 'LEI',
  vat: 'VAT number',
  us_ein: 'US EIN',
  gb_company: 'GB company number',
  de_register: 'DE register entry',
  fr_siren: 'FR SIREN',
  nl_kvk: 'NL KvK number',
  se_org: 'SE organisation number',
  au_acn: 'AU ACN',
  au_abn: 'AU ABN',
  phone: 'phone number',
  email_domain: 'e-mail domain',
  web_domain: 'web domain',
  iban: 'IBAN',
  other: 'identifier (other)',
};

function normaliseOther(value: string): SchemeResult {
  const collapsed = value.trim().replace(/\s+/g, ' ');
  return collapsed.length > 0 ? ok(collapsed) : problem('is empty');
}

function checkCountry(country: string | undefined): string | null {
  if (country === undefined) return null;
  return /^[A-Z]{2}(?:-[A-Z0-9]{1,3})?$/i.test(country) ? null : `defaultCountry "${country}" is not ISO 3166-1 alpha-2 or ISO 3166-2`;
}

function bySchema(scheme: IdentifierScheme, value: string, country: string | undefined): SchemeResult {
  switch (scheme) {
    case 'lei':
      return normaliseLei(value);
    case 'vat':
      return normaliseVat(value, country);
    case 'us_ein':
      return normaliseUsEin(value);
    case 'gb_company':
      return normaliseGbCompany(value);
    case 'de_register':
      return normaliseDeRegister(value);
    case 'fr_siren':
      return normaliseFrSiren(value);
    case 'nl_kvk':
      return normaliseNlKvk(value);
    case 'se_org':
      return normaliseSeOrg(value);
    case 'au_acn':
      return normaliseAuAcn(value);
    case 'au_abn':
      return normaliseAuAbn(value);
    case 'phone':
      return normalisePhone(value, country);
    case 'email_domain':
      return normaliseEmailDomain(value);
    case 'web_domain':
      return normaliseWebDomain(value);
    case 'iban':
      return normaliseIban(value);
    case 'other':
      return normaliseOther(value);
  }
}

export function normaliseIdentifier(input: { scheme: string; value: string; label?: string }, options: NormaliseOptions = {}): NormaliseResult {
  const scheme = input.scheme as IdentifierScheme;
  if (!(IDENTIFIER_SCHEMES as readonly string[]).includes(input.scheme)) {
    return { ok: false, reason: `scheme "${input.scheme}" is unknown; use one of ${IDENTIFIER_SCHEMES.join(', ')}` };
  }
  const name = SCHEME_NAMES[scheme];
  if (typeof input.value !== 'string') return { ok: false, reason: `${name}: value must be a string` };
  if (input.value.trim().length === 0) return { ok: false, reason: `${name}: value is empty` };
  const countryProblem = checkCountry(options.defaultCountry);
  if (countryProblem) return { ok: false, reason: `${name}: ${countryProblem}` };
  let label: string | undefined;
  if (scheme === 'other') {
    label = input.label?.trim().toLowerCase().replace(/\s+/g, ' ');
    if (!label) return { ok: false, reason: `${name}: a label saying what the identifier is is required for scheme "other"` };
  }
  const result = bySchema(scheme, input.value, options.defaultCountry);
  if (!result.ok) return { ok: false, reason: `${name} "${input.value}": ${result.problem}` };
  return { ok: true, identifier: label === undefined ? { scheme, value: result.value } : { scheme, value: result.value, label } };
}
