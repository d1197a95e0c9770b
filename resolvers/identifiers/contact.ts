/**
 * Contact identifiers: phone numbers (E.164 through libphonenumber-js with full metadata) and e-mail / web
 * domains. All of these are "same or affiliated" evidence at most: affiliates share switchboards and domains.
 */
import { parsePhoneNumberFromString, type CountryCode } from 'libphonenumber-js/max';
import { FREE_MAIL_DOMAINS } from './free-mail-domains.ts';
import { ok, problem, type SchemeResult } from './types.ts';

export function normalisePhone(value: string, defaultCountry?: string): SchemeResult {
  const country = defaultCountry ? (defaultCountry.slice(0, 2).toUpperCase() as CountryCode) : undefined;
  const parsed = parsePhoneNumberFromString(value, country);
  if (!parsed) {
    return problem(
      country
        ? `"${value}" is not a phone number (read with default country ${country})`
        : `"${value}" is not a phone number; give it with +country code or pass a default country`,
    );
  }
  if (!parsed.isValid()) return problem(`${parsed.number} is not a valid number for ${parsed.country ?? `+${parsed.countryCallingCode}`}`);
  return ok(parsed.number);
}

/** Host name rules (RFC 1035 labels, after IDNA conversion by the URL parser). */
function checkHost(host: string): string | null {
  if (host.length === 0) return 'has no host name';
  if (host.length > 253) return 'host name is longer than 253 characters';
  if (/^[\d.]+$/.test(host) || host.startsWith('[')) return 'is an IP address, not a domain';
  const labels = host.split('.');
  if (labels.length < 2) return `"${host}" has no dot: not a registrable domain`;
  for (const label of labels) {
    if (!/^[a-z0-9](?:[a-z0-9-]{0,61}[a-z0-9])?$/.test(label)) return `"${label}" is not a valid domain label`;
  }
  return null;
}

/** Lower-case, IDNA (punycode), trailing dot and a leading "www." removed. */
function hostOf(text: string): SchemeResult {
  let url: URL;
  try {
    url = new URL(/^[a-z][a-z0-9+.-]*:\/\//i.test(text) ? text : `http://${text}`);
  } catch {
    return problem(`"${text}" is not a domain or web address`);
  }
  let host = url.hostname.toLowerCase();
  if (host.endsWith('.')) host = host.slice(0, -1);
  if (host.startsWith('www.')) host = host.slice(4);
  const wrong = checkHost(host);
  return wrong ? problem(wrong) : ok(host);
}

/** The domain of an e-mail address (or a bare domain). */
export function normaliseEmailDomain(value: string): SchemeResult {
  const text = value.trim().replace(/^mailto:/i, '');
  const at = text.lastIndexOf('@');
  const domain = at >= 0 ? text.slice(at + 1) : text;
  if (domain.includes('/') || domain.includes(':')) return problem(`"${domain}" is not an e-mail domain`);
  return hostOf(domain);
}

/** The domain of a web address: scheme, "www.", port, path, query and fragment removed. */
export function normaliseWebDomain(value: string): SchemeResult {
  const text = value.trim();
  if (text.includes('@') && !text.includes('/')) return problem('looks like an e-mail address; use scheme email_domain');
  return hostOf(text);
}

/** Free-mail providers: a shared address there says nothing about the company (common practice). */
export function isFreeMailDomain(domain: string): boolean {
  return FREE_MAIL_DOMAINS.has(domain.toLowerCase());
}
