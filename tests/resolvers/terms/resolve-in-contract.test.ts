/**
 * Resolving mentions inside one contract, and isolation between contracts. Contract texts are invented; the
 * expected outcomes follow the rules (a term binds only in its own contract; unbound terms are never
 * matched; collective terms bind no single party).
 */
import { describe, expect, it } from 'vitest';
import { parseParties, resolveInContract } from '../../../resolvers/terms/index.ts';

const CONTRACT_A = `This Agreement is made between Quarrington Textiles Limited, a company incorporated in England and Wales with company number 05551234 (the "Company"), and Velloway Dyes Inc., a Delaware corporation (the "Supplier"). The Company and the Supplier are each a "Party" and together the "Parties".`;
const CONTRACT_B = `This Agreement is made between Marsh Lantern Software GmbH, a company organised under the laws of Germany (the "Licensor"), and Pinewick Retail Ltd, a company incorporated in Scotland (the "Company").`;

describe('resolveInContract', () => {
  const a = parseParties(CONTRACT_A);
  const b = parseParties(CONTRACT_B);

  it('resolves the same term to a different party in each contract', () => {
    const inA = resolveInContract(a, 'the Company');
    const inB = resolveInContract(b, 'the Company');
    expect(inA.status).toBe('bound');
    expect(inA.party?.name).toBe('Quarrington Textiles Limited');
    expect(inA.party?.index).toBe(0);
    expect(inB.status).toBe('bound');
    expect(inB.party?.name).toBe('Pinewick Retail Ltd');
    expect(inB.party?.index).toBe(1);
  });

  it('never lets a term of one contract bind in another', () => {
    // "Licensor" is bound in B only; in A it is an unbound term, never matched against the register.
    expect(resolveInContract(b, 'the Licensor').party?.name).toBe('Marsh Lantern Software GmbH');
    const inA = resolveInContract(a, 'the Licensor');
    expect(inA.status).toBe('unbound_term');
    expect(inA.party).toBeUndefined();
    // "Supplier" is bound in A only.
    expect(resolveInContract(a, 'Supplier').party?.name).toBe('Velloway Dyes Inc.');
    expect(resolveInContract(b, 'Supplier').status).toBe('unbound_term');
  });

  it('reads the mention as a mention: article, case, quotes and possessive do not matter', () => {
    for (const m of ['the Company', 'Company', 'THE COMPANY', '"Company"', "the Company's", '“the Company”']) {
      expect(resolveInContract(a, m).party?.name, m).toBe('Quarrington Textiles Limited');
    }
  });

  it('gives a collective term no single party', () => {
    const r = resolveInContract(a, 'the Parties');
    expect(r.status).toBe('collective_term');
    expect(r.party).toBeUndefined();
    expect(r.parties?.map((p) => p.name)).toEqual(['Quarrington Textiles Limited', 'Velloway Dyes Inc.']);
    expect(resolveInContract(a, 'either Party').status).toBe('collective_term');
  });

  it('sends names on to matching, and marks one that names a party of this contract', () => {
    const own = resolveInContract(a, 'Quarrington Textiles Ltd');
    expect(own.status).toBe('match');
    expect(own.party?.name).toBe('Quarrington Textiles Limited');
    const other = resolveInContract(a, 'Harbourside Freight plc');
    expect(other.status).toBe('match');
    expect(other.party).toBeUndefined();
  });

  it('binds defined pronouns and short names, and passes non-parties through', () => {
    const text = `These Terms are an agreement between Larkspur Analytics Ltd, a company incorporated in England and Wales ("Larkspur", "we", "us" or "our"), and the customer (the "Customer"). This Agreement (this "Agreement") starts on the date of signature (the "Effective Date").`;
    const parsed = parseParties(text);
    for (const m of ['we', 'us', 'our', 'Larkspur']) expect(resolveInContract(parsed, m).party?.name, m).toBe('Larkspur Analytics Ltd');
    expect(resolveInContract(parsed, 'the Customer').status).toBe('unbound_term');
    expect(resolveInContract(parsed, 'you').status).toBe('unbound_term');
    expect(resolveInContract(parsed, 'the Effective Date').status).toBe('not_a_party');
    expect(resolveInContract(parsed, 'By:').status).toBe('not_a_party');
  });

  it('marks our own entities so that their terms resolve to our side', () => {
    const parsed = parseParties(CONTRACT_A, { ownEntities: ['Quarrington Textiles Ltd'] });
    expect(parsed.parties.map((p) => p.ownEntity)).toEqual([true, false]);
    const r = resolveInContract(parsed, 'the Company');
    expect(r.status).toBe('bound');
    expect(r.party?.ownEntity).toBe(true);
    expect(r.explanation).toContain('own');
    // The same name in another contract is our entity there too; a different company is not.
    expect(parseParties(CONTRACT_B, { ownEntities: ['Quarrington Textiles Ltd'] }).parties.every((p) => !p.ownEntity)).toBe(true);
  });

  it('treats a term bound to two parties of one contract as unbound', () => {
    const text = `This Agreement is made between Ashdown Mills Ltd, a company incorporated in England (the "Seller"), and Brockley Farms Ltd, a company incorporated in England (the "Seller").`;
    const parsed = parseParties(text);
    expect(parsed.parties).toHaveLength(2);
    expect(resolveInContract(parsed, 'the Seller').status).toBe('unbound_term');
  });

  it('resolves nothing inside a contract that has no parties', () => {
    const empty = parseParties('');
    expect(resolveInContract(empty, 'the Company').status).toBe('unbound_term');
    expect(resolveInContract(empty, 'Harbourside Freight plc').status).toBe('match');
  });
});

describe('resolveInContract with signature labels', () => {
  it('a label over a signature block binds its term when the preamble does not', () => {
    const text = 'SUPPLIER:\nFENWICK & DALE LIMITED\n\nBy: ______\nName: Alistair Bexley\nTitle: Director';
    const parsed = parseParties(text);
    expect(resolveInContract(parsed, 'the Supplier').party?.name).toBe('FENWICK & DALE LIMITED');
  });

  it('a label never rebinds a term the preamble gave another party', () => {
    const text = `This Agreement is made between Ashdown Mills Ltd, a company incorporated in England (the "Supplier"), and Brockley Farms Ltd, a company incorporated in England (the "Customer").

SUPPLIER:
BROCKLEY FARMS LTD
By: ______`;
    const parsed = parseParties(text);
    expect(parsed.parties.map((p) => p.name)).toEqual(['Ashdown Mills Ltd', 'Brockley Farms Ltd']);
    expect(resolveInContract(parsed, 'the Supplier').party?.name).toBe('Ashdown Mills Ltd');
  });

  it('reads a declared former name only when a name follows the cue, and binds a name two parties declared to neither', () => {
    // Issue 16 item 8: "(formerly the licensee under …)" describes a role; "(formerly X Ltd)" declares a name.
    const parsed = parseParties(
      `This Agreement is made between Acme Widgets Ltd (formerly the licensee under the Original Agreement), a company incorporated in England (the "Licensee"), and Corrin Hale Ltd (formerly Corrin Hale & Sons Ltd) (the "Licensor").`,
    );
    expect(parsed.parties.map((p) => [p.name, p.aliases])).toEqual([
      ['Acme Widgets Ltd', []],
      ['Corrin Hale Ltd', [{ kind: 'former', name: 'Corrin Hale & Sons Ltd' }]],
    ]);
    expect(resolveInContract(parsed, 'Corrin Hale & Sons Limited')).toMatchObject({
      status: 'match',
      party: { name: 'Corrin Hale Ltd' },
      alias: { kind: 'former' },
    });
    const both = parseParties(
      `This Agreement is made between Brennock Mills Limited (formerly Ardley Textiles Limited) (the "Buyer") and Sallow Weaving Ltd (previously Ardley Textiles Limited) (the "Seller").`,
    );
    const r = resolveInContract(both, 'Ardley Textiles Limited');
    expect(r.party).toBeUndefined();
    expect(r.status).toBe('match');
  });
});
