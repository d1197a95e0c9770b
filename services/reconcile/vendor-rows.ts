/**
 * Vendor master rows as the ERP exports them: columns found by name (or `--map field=column`), identifiers
 * normalised with the same validators as the register (resolvers/identifiers; IBAN through ibantools). The tax id
 * is read as a VAT number when it carries a country prefix, else by the vendor's country (US EIN, AU ABN); the
 * registration number by the country (GB company, DE register, FR SIREN, NL KvK, AU ACN, SE org). A value that
 * does not validate is kept out of matching and named in the evidence, never dropped silently.
 */
import { normaliseIdentifier, schemeOfRegistrationNumber, schemeOfTaxId } from '../../resolvers/identifiers/index.ts';
import { normaliseAddress } from '../../resolvers/identifiers/index.ts';
import type { Identifier, IdentifierScheme } from '../../resolvers/vocabulary.ts';

export const VENDOR_FIELDS = ['id', 'name', 'taxId', 'registrationNumber', 'phone', 'email', 'iban', 'street', 'city', 'postalCode', 'country'] as const;
export type VendorField = (typeof VENDOR_FIELDS)[number];

const DEFAULTS: Record<VendorField, string[]> = {
  id: ['vendorid', 'vendor', 'supplierid', 'id', 'vendorno', 'vendornumber'],
  name: ['vendorname', 'name', 'suppliername'],
  taxId: ['taxid', 'vat', 'vatid', 'vatnumber', 'taxnumber'],
  registrationNumber: ['registrationno', 'registrationnumber', 'companynumber', 'regno'],
  phone: ['phone', 'telephone', 'tel'],
  email: ['email', 'emailaddress'],
  iban: ['iban', 'bankaccount'],
  street: ['street', 'address'],
  city: ['city', 'town'],
  postalCode: ['postalcode', 'postcode', 'zip', 'zipcode'],
  country: ['country', 'countrycode'],
};

export class VendorMappingError extends Error {}

export type VendorMap = Partial<Record<VendorField, string>>;

export function parseVendorMap(options: readonly string[]): VendorMap {
  const map: VendorMap = {};
  for (const option of options) {
    const at = option.indexOf('=');
    const field = option.slice(0, at).trim();
    if (at <= 0 || !(VENDOR_FIELDS as readonly string[]).includes(field)) {
      throw new VendorMappingError(`--map ${option}: expected field=column with field one of ${VENDOR_FIELDS.join(', ')}`);
    }
    map[field as VendorField] = option.slice(at + 1).trim();
  }
  return map;
}

const squash = (s: string): string => s.toLowerCase().replace(/[\s_-]+/g, '');

export function vendorColumns(header: readonly string[], map: VendorMap): VendorMap {
  const out: VendorMap = { ...map };
  for (const [field, column] of Object.entries(map)) {
    if (!header.includes(column!))
      throw new VendorMappingError(`--map ${field}=${column}: the file has no column "${column}"; its columns: ${header.join(', ')}`);
  }
  for (const field of VENDOR_FIELDS) {
    if (out[field] !== undefined) continue;
    const found = header.find((h) => DEFAULTS[field].includes(squash(h)));
    if (found !== undefined) out[field] = found;
  }
  for (const needed of ['id', 'name'] as const) {
    if (out[needed] === undefined)
      throw new VendorMappingError(
        `no column for the vendor ${needed === 'id' ? 'row id' : 'name'}: add --map ${needed}=<column>; the file's columns: ${header.join(', ')}`,
      );
  }
  return out;
}

export interface VendorRow {
  line: number;
  id: string;
  name: string;
  country: string | null;
  strong: Identifier[];
  /** phone (E.164), email_domain, iban. */
  contact: Identifier[];
  /** Folded street, postal code and city; null when incomplete. */
  addressKey: string | null;
  /** Values that did not validate, with the reason. */
  problems: string[];
}

function add(
  list: Identifier[],
  problems: string[],
  scheme: IdentifierScheme | undefined,
  value: string | undefined,
  country: string | null,
  what: string,
): void {
  if (!value) return;
  if (!scheme) {
    problems.push(`${what} ${value}: no identifier scheme for country ${country ?? '(none)'}`);
    return;
  }
  const result = normaliseIdentifier({ scheme, value }, country ? { defaultCountry: country } : {});
  if (result.ok) list.push(result.identifier);
  else problems.push(`${what} ${value}: ${result.reason}`);
}

export function vendorRow(line: number, row: Record<string, string>, columns: VendorMap): VendorRow | string {
  const get = (field: VendorField): string | undefined => {
    const column = columns[field];
    const value = column === undefined ? undefined : row[column]?.trim();
    return value ? value : undefined;
  };
  const id = get('id');
  const name = get('name');
  if (!id) return `the vendor id column "${columns.id}" is empty`;
  if (!name) return `the vendor name column "${columns.name}" is empty`;
  const countryCell = get('country')?.toUpperCase();
  const country = countryCell && /^[A-Z]{2}$/.test(countryCell) ? countryCell : null;
  const strong: Identifier[] = [];
  const contact: Identifier[] = [];
  const problems: string[] = [];
  const tax = get('taxId');
  if (tax) add(strong, problems, schemeOfTaxId(tax, country), tax, country, 'tax id');
  add(strong, problems, schemeOfRegistrationNumber(country), get('registrationNumber'), country, 'registration number');
  add(contact, problems, 'phone', get('phone'), country, 'phone');
  const email = get('email');
  if (email) add(contact, problems, 'email_domain', email.slice(email.lastIndexOf('@') + 1), country, 'e-mail domain');
  add(contact, problems, 'iban', get('iban'), country, 'IBAN');
  const street = get('street');
  const city = get('city');
  const postal = get('postalCode');
  const addressKey = street && city ? normaliseAddress(`${street} ${postal ?? ''} ${city} ${country ?? ''}`) : null;
  return { line, id, name, country, strong, contact, addressKey, problems };
}
