/**
 * The vendor master as an ERP exports it, with planted findings and their truth: vendors with contracts,
 * vendors that never signed, contracting counterparties with no vendor row, the same supplier twice
 * (same_entity: a shared strong identifier, or name and phone), and rows that only share an address,
 * phone or bank account (same_or_affiliated) — plus lookalike companies that are NOT duplicates.
 */
import { stringify } from 'csv-stringify/sync';
import { friendlyFormatIBAN } from 'ibantools';
import type { Random } from '../../../resolvers/prng.ts';
import { corrupt } from '../corrupt.ts';
import { renderName } from '../render-name.ts';
import { INDUSTRIES, LEGAL_FORMS, countryOf } from '../name-parts.ts';
import { pickJurisdiction } from '../invent-organisation.ts';
import { companyIdentifiers } from './company-identifiers.ts';
import { address, coinedWord, phone } from './contacts.ts';
import { iban as makeIban } from './identifiers.ts';
import { splitLegalName } from './mentions.ts';
import type { ScenarioCounterparty, VendorDuplicate, VendorEntityRef, VendorMaster, VendorRow } from './types.ts';

export const VENDOR_COLUMNS = ['Vendor ID', 'Vendor Name', 'Tax ID', 'Registration No', 'Phone', 'Email', 'IBAN', 'Street', 'City', 'Postal Code', 'Country'];

/** Many ERP name fields hold 35 characters (common practice); longer names arrive cut. */
const ERP_NAME_LENGTH = 35;

interface Party {
  name: string;
  jurisdiction: string;
  legalForm?: string;
  isPerson: boolean;
  identifiers: ScenarioCounterparty['identifiers'];
  address: ScenarioCounterparty['address'];
  phone: string;
  emailDomain: string;
  iban?: string;
}

const TAX_SCHEMES = ['vat', 'us_ein', 'au_abn'];
const REGISTRATION_SCHEMES = ['gb_company', 'de_register', 'fr_siren', 'nl_kvk', 'au_acn', 'se_org'];

function erpName(name: string, rnd: Random): string {
  const n = rnd.chance(0.4) ? name.toUpperCase() : name;
  return n.length > ERP_NAME_LENGTH ? n.slice(0, ERP_NAME_LENGTH).trimEnd() : n;
}

function localPhone(e164: string, rnd: Random): string {
  if (rnd.chance(0.5)) return e164;
  const [cc, ...rest] = e164.split(' ');
  if (cc === '+1') return `(${rest[0]}) ${rest[1]}-${rest[2]}`;
  return `0${rest.join(' ')}`;
}

function rowOf(vendorId: string, p: Party, rnd: Random, name = erpName(p.name, rnd)): VendorRow {
  const tax = p.identifiers.find((i) => TAX_SCHEMES.includes(i.scheme));
  const reg = p.identifiers.find((i) => REGISTRATION_SCHEMES.includes(i.scheme));
  const local = rnd.pick(['accounts', 'ap', 'billing', 'invoices']);
  const email = p.isPerson ? `${p.name.toLowerCase().replace(' ', '.')}@${p.emailDomain}` : `${local}@${p.emailDomain}`;
  return {
    vendorId,
    name,
    taxId: tax && rnd.chance(0.8) ? tax.value : '',
    registrationNumber: reg && rnd.chance(0.5) ? reg.value : '',
    phone: localPhone(p.phone, rnd),
    email,
    iban: p.iban && rnd.chance(0.85) ? (rnd.chance(0.5) ? (friendlyFormatIBAN(p.iban) ?? p.iban) : p.iban) : '',
    street: p.address.street,
    city: p.address.city,
    postalCode: p.address.postalCode,
    country: p.address.country,
  };
}

function partyOf(c: ScenarioCounterparty): Party {
  return {
    name: c.legalName,
    jurisdiction: c.jurisdiction,
    legalForm: c.legalForm,
    isPerson: c.kind === 'person',
    identifiers: c.identifiers,
    address: c.address,
    phone: c.phone,
    emailDomain: c.emailDomain,
    iban: c.iban,
  };
}

/** A name variant another clerk would type for the same company. */
function retypedName(p: Party, rnd: Random): string {
  const parts = splitLegalName(p.name, p.legalForm, p.jurisdiction);
  for (let tries = 0; tries < 5; tries++) {
    const out = corrupt(rnd.pick(['legal_form', 'case', 'keyboard_typo', 'punctuation'] as const), parts, rnd);
    if (out) return erpName(renderName(out), rnd);
  }
  return p.name.toUpperCase();
}

export function buildVendorMaster(rnd: Random, counterparties: readonly ScenarioCounterparty[], vendorOnlyCount = 24): VendorMaster {
  const usedIds = new Set<string>();
  const newId = (): string => {
    let id = '';
    do id = `V${100000 + rnd.int(900000)}`;
    while (usedIds.has(id));
    usedIds.add(id);
    return id;
  };
  const rows: VendorRow[] = [];
  const truthRows: Array<{ vendorId: string; entity: VendorEntityRef }> = [];
  const duplicates: VendorDuplicate[] = [];
  const rowOfCounterparty = new Map<string, VendorRow>();
  const push = (row: VendorRow, entity: VendorEntityRef): VendorRow => {
    rows.push(row);
    truthRows.push({ vendorId: row.vendorId, entity });
    return row;
  };

  // Who must have a vendor row: parents and subsidiaries, lookalikes, and the companies planted as duplicates.
  const related = new Set<string>();
  for (const c of counterparties) {
    if (c.parentId) related.add(c.parentId).add(c.id);
    if (c.lookalikeOf) related.add(c.lookalikeOf).add(c.id);
  }
  const organisations = counterparties.filter((c) => c.kind === 'organisation' && !related.has(c.id));
  const withStrongId = organisations.filter((c) => c.identifiers.some((i) => TAX_SCHEMES.includes(i.scheme) || REGISTRATION_SCHEMES.includes(i.scheme)));
  const strongDupes = withStrongId.slice(0, 6);
  const phoneDupes = organisations.filter((c) => !strongDupes.includes(c)).slice(0, 4);
  const bankOnlyDupes = organisations.filter((c) => !strongDupes.includes(c) && !phoneDupes.includes(c) && c.iban).slice(0, 2);
  const planted = new Set([...strongDupes, ...phoneDupes, ...bankOnlyDupes].map((c) => c.id));

  for (const c of counterparties) {
    const keep = related.has(c.id) || planted.has(c.id) || rnd.chance(0.72);
    if (!keep) continue;
    rowOfCounterparty.set(c.id, push(rowOf(newId(), partyOf(c), rnd), { kind: 'counterparty', id: c.id }));
  }

  for (const c of strongDupes) {
    const first = rowOfCounterparty.get(c.id)!;
    const p = partyOf(c);
    const second = rowOf(newId(), p, rnd, retypedName(p, rnd));
    // The shared strong identifier is the evidence: make sure both rows carry it.
    const tax = c.identifiers.find((i) => TAX_SCHEMES.includes(i.scheme));
    if (tax) {
      first.taxId = tax.value;
      second.taxId = tax.value.replace(/^([A-Z]{2})/, '$1 ');
    } else {
      const reg = c.identifiers.find((i) => REGISTRATION_SCHEMES.includes(i.scheme))!;
      first.registrationNumber = reg.value;
      second.registrationNumber = reg.value;
    }
    // The duplicate was keyed in later, from an invoice: another phone line, no bank details yet.
    second.phone = localPhone(phone(rnd, c.jurisdiction), rnd);
    second.iban = '';
    push(second, { kind: 'counterparty', id: c.id });
    duplicates.push({
      vendorIds: [first.vendorId, second.vendorId],
      expectedFinding: 'same_entity',
      sameEntity: true,
      shared: [tax ? 'tax_id' : 'registration_number'],
    });
  }
  for (const c of phoneDupes) {
    const first = rowOfCounterparty.get(c.id)!;
    const p = partyOf(c);
    const second = rowOf(newId(), p, rnd, retypedName(p, rnd));
    second.taxId = '';
    second.registrationNumber = '';
    second.iban = '';
    second.phone = first.phone;
    push(second, { kind: 'counterparty', id: c.id });
    duplicates.push({ vendorIds: [first.vendorId, second.vendorId], expectedFinding: 'same_entity', sameEntity: true, shared: ['name', 'phone'] });
  }
  for (const c of bankOnlyDupes) {
    // The same company under a name nobody recognises (a payee name), sharing only the bank account.
    const first = rowOfCounterparty.get(c.id)!;
    const p = partyOf(c);
    const payee = coinedWord(rnd);
    const second = rowOf(
      newId(),
      {
        ...p,
        name: `${payee} Payments`,
        phone: phone(rnd, c.jurisdiction),
        address: address(rnd, c.jurisdiction),
        identifiers: [],
        emailDomain: `${payee.toLowerCase()}.example`,
      },
      rnd,
    );
    first.iban = c.iban!;
    second.iban = friendlyFormatIBAN(c.iban!) ?? c.iban!;
    push(second, { kind: 'counterparty', id: c.id });
    duplicates.push({ vendorIds: [first.vendorId, second.vendorId], expectedFinding: 'same_or_affiliated', sameEntity: true, shared: ['iban'] });
  }
  // Parent and subsidiary at one address with one switchboard: affiliated, not the same.
  for (const c of counterparties) {
    if (!c.parentId) continue;
    const parent = counterparties.find((x) => x.id === c.parentId)!;
    if (parent.phone !== c.phone) continue;
    const a = rowOfCounterparty.get(parent.id)!;
    const b = rowOfCounterparty.get(c.id)!;
    b.phone = a.phone;
    duplicates.push({ vendorIds: [a.vendorId, b.vendorId], expectedFinding: 'same_or_affiliated', sameEntity: false, shared: ['address', 'phone'] });
  }
  const distinctLookalikes: Array<[string, string]> = [];
  for (const c of counterparties) {
    if (c.lookalikeOf) distinctLookalikes.push([rowOfCounterparty.get(c.lookalikeOf)!.vendorId, rowOfCounterparty.get(c.id)!.vendorId]);
  }

  // Vendors that never signed a contract; two of them are paid through one collecting agent's account.
  const vendorsWithoutContract: string[] = [];
  const cores = new Set(counterparties.map((c) => c.legalName.split(' ')[0]!));
  const agentIban = makeIban(rnd, 'DE')!;
  for (let i = 0; i < vendorOnlyCount; i++) {
    let core = coinedWord(rnd);
    while (cores.has(core) || core.toLowerCase().startsWith('orv')) core = coinedWord(rnd);
    cores.add(core);
    const jurisdiction = pickJurisdiction(rnd);
    const form = LEGAL_FORMS[countryOf(jurisdiction)]![0]!.canonical;
    const name = `${core} ${rnd.pick(INDUSTRIES)} ${form}`;
    const p: Party = {
      name,
      jurisdiction,
      legalForm: form,
      isPerson: false,
      identifiers: companyIdentifiers(rnd, jurisdiction, form),
      address: address(rnd, jurisdiction),
      phone: phone(rnd, jurisdiction),
      emailDomain: `${core.toLowerCase()}.example`,
      iban: makeIban(rnd, countryOf(jurisdiction)),
    };
    const row = push(rowOf(newId(), p, rnd), { kind: 'vendor_only', id: `vo-${String(i + 1).padStart(3, '0')}`, name });
    if (i < 2) row.iban = agentIban;
    vendorsWithoutContract.push(row.vendorId);
  }
  const agentRows = rows.filter((r) => r.iban === agentIban);
  duplicates.push({ vendorIds: [agentRows[0]!.vendorId, agentRows[1]!.vendorId], expectedFinding: 'same_or_affiliated', sameEntity: false, shared: ['iban'] });

  rows.sort((a, b) => a.vendorId.localeCompare(b.vendorId));
  const counterpartiesWithoutVendor = counterparties.filter((c) => !rowOfCounterparty.has(c.id)).map((c) => c.id);
  const csv = stringify(
    rows.map((r) => [r.vendorId, r.name, r.taxId, r.registrationNumber, r.phone, r.email, r.iban, r.street, r.city, r.postalCode, r.country]),
    { header: true, columns: VENDOR_COLUMNS, record_delimiter: '\r\n' },
  );
  truthRows.sort((a, b) => a.vendorId.localeCompare(b.vendorId));
  return {
    columns: VENDOR_COLUMNS,
    csv,
    rows,
    truth: { rows: truthRows, duplicates, vendorsWithoutContract, counterpartiesWithoutVendor, distinctLookalikes },
  };
}
