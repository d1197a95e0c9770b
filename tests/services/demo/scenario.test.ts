import { parse } from 'csv-parse/sync';
import { isValidIBAN } from 'ibantools';
import { describe, expect, it } from 'vitest';
import { normaliseIdentifier } from '../../../resolvers/identifiers/index.ts';
import { generateScenario, MENTION_STYLES, DRAFTING_STYLES, splitLegalName, type Scenario } from '../../../services/demo/scenario/index.ts';
import { rorNames, validAbn, validAcn, validJpCorporateNumber, validLei, validLuhn, validVat } from './support.ts';

const SEEDS = [1, 2, 42];
const scenarios = new Map<number, Scenario>(SEEDS.map((s) => [s, generateScenario(s)]));
const one = scenarios.get(1)!;

describe('generateScenario: determinism', () => {
  it('gives the same scenario for the same seed and a different one for another seed', () => {
    expect(JSON.stringify(generateScenario(1))).toBe(JSON.stringify(one));
    expect(JSON.stringify(scenarios.get(2))).not.toBe(JSON.stringify(one));
  });
});

describe.each(SEEDS)('generateScenario(%i): ground truth is consistent', (seed) => {
  const s = scenarios.get(seed)!;
  const cps = new Map(s.counterparties.map((c) => [c.id, c]));
  const own = new Map(s.ownEntities.map((e) => [e.id, e]));
  const contracts = new Map(s.contracts.map((c) => [c.externalId, c]));

  it('has the sizes of the brief: several own entities in different countries, ~150 counterparties, 300 contracts', () => {
    expect(s.ownEntities.length).toBeGreaterThanOrEqual(4);
    expect(new Set(s.ownEntities.map((e) => e.jurisdiction.slice(0, 2))).size).toBe(s.ownEntities.length);
    expect(s.counterparties.length).toBe(150);
    expect(s.contracts.length).toBe(300);
    expect(new Set(s.counterparties.map((c) => c.id)).size).toBe(150);
    expect(new Set(s.contracts.map((c) => c.externalId)).size).toBe(300);
  });

  it('spreads counterparties over at least six jurisdictions (countries, US states counted once)', () => {
    expect(new Set(s.counterparties.map((c) => c.jurisdiction.slice(0, 2))).size).toBeGreaterThanOrEqual(6);
  });

  it('uses every drafting style and writes every party name verbatim in its contract', () => {
    expect(new Set(s.contracts.map((c) => c.style))).toEqual(new Set(DRAFTING_STYLES));
    for (const c of s.contracts) {
      expect(c.parties.length).toBeGreaterThanOrEqual(2);
      for (const p of c.parties) {
        expect(c.text, `${c.externalId}: ${p.nameInText}`).toContain(p.nameInText);
        // Quoted as defined: "Supplier", or "the Supplier" in the hereinafter-referred-to-as style.
        for (const term of p.terms) expect(c.text.includes(`"${term}"`) || c.text.includes(`"the ${term}"`), `${c.externalId}: term ${term}`).toBe(true);
        if (p.ref.kind === 'counterparty') expect(cps.has(p.ref.id)).toBe(true);
        else expect(own.has(p.ref.id)).toBe(true);
      }
      expect(c.parties.filter((p) => p.ref.kind === 'own_entity')).toHaveLength(1);
    }
  });

  it('gives every counterparty at least one contract', () => {
    const signed = new Set(s.contracts.flatMap((c) => c.parties.filter((p) => p.ref.kind === 'counterparty').map((p) => p.ref.id)));
    expect(signed.size).toBe(s.counterparties.length);
  });

  it('points every mention to an existing contract and its truth to an existing party of that contract', () => {
    for (const m of s.mentions) {
      const c = contracts.get(m.input.contract!.externalId);
      expect(c, m.input.externalId).toBeDefined();
      const bare = m.input.text.replace(/^the /, '');
      const boundHere = c!.parties.flatMap((p) => p.terms);
      switch (m.truth.kind) {
        case 'counterparty': {
          const id = m.truth.counterpartyId;
          expect(cps.has(id)).toBe(true);
          expect(
            c!.parties.some((p) => p.ref.kind === 'counterparty' && p.ref.id === id),
            m.input.externalId,
          ).toBe(true);
          break;
        }
        case 'own_entity': {
          const id = m.truth.ownEntityId;
          expect(own.has(id)).toBe(true);
          expect(c!.parties.some((p) => p.ref.kind === 'own_entity' && p.ref.id === id)).toBe(true);
          break;
        }
        case 'unbound_term':
          expect(boundHere).not.toContain(bare);
          break;
        case 'collective_term':
          expect(c!.collectiveTerms).toContain(bare);
          break;
        case 'not_a_party':
          if (m.truth.reason === 'signer') {
            expect(c!.parties.some((p) => p.signer?.name === m.input.text)).toBe(true);
            expect(c!.parties.some((p) => p.nameInText === m.input.text)).toBe(false);
          }
          expect(c!.text).toContain(m.truth.reason === 'defined_non_party_term' ? bare.replace(/^this /, '') : m.input.text);
          break;
      }
      if (m.style === 'defined_term' || m.style === 'pronoun') {
        const party = c!.parties.find((p) =>
          m.truth.kind === 'counterparty'
            ? p.ref.kind === 'counterparty' && p.ref.id === m.truth.counterpartyId
            : m.truth.kind === 'own_entity' && p.ref.id === m.truth.ownEntityId,
        );
        expect(party!.terms, m.input.externalId).toContain(bare);
      }
      if (m.style === 'exact') expect(c!.text).toContain(m.input.text);
    }
    expect(new Set(s.mentions.map((m) => `${m.input.source}/${m.input.externalId}`)).size).toBe(s.mentions.length);
  });

  it('writes mentions in every style the brief lists', () => {
    const seen = new Set(s.mentions.map((m) => m.style));
    for (const style of MENTION_STYLES) expect(seen, style).toContain(style);
  });

  it('plants lookalikes (same words, other legal form or jurisdiction) and parent/subsidiary pairs', () => {
    const lookalikes = s.counterparties.filter((c) => c.lookalikeOf);
    expect(lookalikes.length).toBeGreaterThanOrEqual(4);
    for (const twin of lookalikes) {
      const original = cps.get(twin.lookalikeOf!)!;
      expect(twin.id).not.toBe(original.id);
      expect(splitLegalName(twin.legalName, twin.legalForm, twin.jurisdiction).base).toBe(
        splitLegalName(original.legalName, original.legalForm, original.jurisdiction).base,
      );
      expect(twin.legalForm !== original.legalForm || twin.jurisdiction !== original.jurisdiction).toBe(true);
    }
    const subs = s.counterparties.filter((c) => c.parentId);
    expect(subs.length).toBeGreaterThanOrEqual(4);
    for (const sub of subs) expect(cps.get(sub.parentId!)).toBeDefined();
    expect(s.counterparties.some((c) => c.names.some((n) => n.kind === 'trade'))).toBe(true);
    expect(s.counterparties.some((c) => c.names.some((n) => n.kind === 'former'))).toBe(true);
  });

  it('computes valid check digits for every identifier and IBAN (own rules and the project validator agree)', () => {
    const all = [...s.counterparties, ...s.ownEntities].flatMap((e) => e.identifiers.map((i) => ({ ...i, country: e.jurisdiction.slice(0, 2) })));
    expect(all.length).toBeGreaterThan(150);
    const seen = new Set<string>();
    for (const id of all) {
      const v = id.value;
      seen.add(id.scheme === 'other' ? id.label! : id.scheme);
      if (id.scheme === 'lei') expect(validLei(v), v).toBe(true);
      if (id.scheme === 'vat') expect(validVat(v), v).toBe(true);
      if (id.scheme === 'fr_siren') expect(validLuhn(v), v).toBe(true);
      if (id.scheme === 'au_acn') expect(validAcn(v), v).toBe(true);
      if (id.scheme === 'au_abn') expect(validAbn(v), v).toBe(true);
      if (id.scheme === 'se_org') expect(validLuhn(v.replace('-', '')), v).toBe(true);
      if (id.label === 'jp_corporate_number') expect(validJpCorporateNumber(v), v).toBe(true);
      if (id.scheme !== 'other') {
        const checked = normaliseIdentifier(id, { defaultCountry: id.country });
        expect(checked.ok, `${id.scheme} ${v}: ${checked.ok ? '' : checked.reason}`).toBe(true);
      }
    }
    for (const scheme of ['lei', 'vat', 'gb_company', 'de_register', 'fr_siren', 'nl_kvk', 'au_acn', 'au_abn']) expect(seen, scheme).toContain(scheme);
    const ibans = s.counterparties.flatMap((c) => (c.iban ? [c.iban] : []));
    expect(ibans.length).toBeGreaterThan(50);
    for (const iban of ibans) expect(isValidIBAN(iban), iban).toBe(true);
  });

  it('keeps vendor-master truth consistent with the CSV', () => {
    const vm = s.vendorMaster;
    const rows = parse(vm.csv, { columns: true }) as Array<Record<string, string>>;
    expect(rows.map((r) => r['Vendor ID'])).toEqual(vm.rows.map((r) => r.vendorId));
    expect(Object.keys(rows[0]!)).toEqual(vm.columns);
    const truth = new Map(vm.truth.rows.map((r) => [r.vendorId, r.entity]));
    expect(truth.size).toBe(rows.length);
    for (const r of rows) expect(truth.has(r['Vendor ID']!)).toBe(true);
    for (const [, entity] of truth) if (entity.kind === 'counterparty') expect(cps.has(entity.id)).toBe(true);
    const byId = new Map(vm.rows.map((r) => [r.vendorId, r]));
    const kinds = new Set<string>();
    for (const d of vm.truth.duplicates) {
      const [a, b] = d.vendorIds.map((id) => byId.get(id));
      expect(a && b, d.vendorIds.join(',')).toBeTruthy();
      const ea = truth.get(d.vendorIds[0])!;
      const eb = truth.get(d.vendorIds[1])!;
      expect(ea.id === eb.id).toBe(d.sameEntity);
      kinds.add(`${d.expectedFinding}/${d.sameEntity}`);
      const squash = (x: string): string => x.replace(/[\s()-]/g, '');
      if (d.shared.includes('tax_id')) expect(squash(a!.taxId)).toBe(squash(b!.taxId));
      if (d.shared.includes('phone')) expect(a!.phone).toBe(b!.phone);
      if (d.shared.includes('iban')) expect(squash(a!.iban)).toBe(squash(b!.iban));
      if (d.shared.includes('address')) expect(`${a!.street}|${a!.city}`).toBe(`${b!.street}|${b!.city}`);
      if (d.expectedFinding === 'same_or_affiliated') expect(squash(a!.taxId) === '' || squash(a!.taxId) !== squash(b!.taxId)).toBe(true);
    }
    expect(kinds).toEqual(new Set(['same_entity/true', 'same_or_affiliated/true', 'same_or_affiliated/false']));
    for (const id of vm.truth.vendorsWithoutContract) expect(truth.get(id)!.kind).toBe('vendor_only');
    expect(vm.truth.vendorsWithoutContract.length).toBeGreaterThanOrEqual(10);
    const withRow = new Set([...truth.values()].filter((e) => e.kind === 'counterparty').map((e) => e.id));
    expect(vm.truth.counterpartiesWithoutVendor.length).toBeGreaterThanOrEqual(10);
    for (const id of vm.truth.counterpartiesWithoutVendor) {
      expect(cps.has(id)).toBe(true);
      expect(withRow.has(id)).toBe(false);
    }
    expect(withRow.size + vm.truth.counterpartiesWithoutVendor.length).toBe(s.counterparties.length);
    for (const [a, b] of vm.truth.distinctLookalikes) expect(truth.get(a)!.id).not.toBe(truth.get(b)!.id);
    for (const r of vm.rows) if (r.iban) expect(isValidIBAN(r.iban.replaceAll(' ', '')), r.iban).toBe(true);
  });
});

describe('generateScenario: invented names', () => {
  it('names no organisation that appears in the ROR open dataset (a check that the names are not real ones)', () => {
    const ror = rorNames();
    expect(ror.size).toBeGreaterThan(10_000);
    for (const c of one.counterparties) {
      expect(ror.has(c.legalName.toLowerCase()), c.legalName).toBe(false);
      expect(ror.has(splitLegalName(c.legalName, c.legalForm, c.jurisdiction).base.toLowerCase()), c.legalName).toBe(false);
    }
  });
});
