/** A short form of a party's name inside its contract (issue 16: own entities and parties in their other forms). Invented names. */
import { describe, expect, it } from 'vitest';
import { parseParties, resolveInContract } from '../../../resolvers/terms/index.ts';

const text =
  'This Supply Agreement is made on 2 June 2025 between Orvanel Holdings plc, a company incorporated in England and Wales ("Buyer"), and Hanardham Logistics Ltd, a company incorporated in Scotland ("Supplier").';

describe('partyByShortName through resolveInContract', () => {
  it("the first words of one party's name name that party", () => {
    const parsed = parseParties(text, { ownEntities: ['Orvanel Holdings plc'] });
    expect(resolveInContract(parsed, 'Orvanel').party?.name).toBe('Orvanel Holdings plc');
    expect(resolveInContract(parsed, 'Hanardham').party?.name).toBe('Hanardham Logistics Ltd');
    expect(resolveInContract(parsed, 'HANARDHAM LOGISTICS').party?.name).toBe('Hanardham Logistics Ltd');
  });

  it('a short name two parties share, a short word, or another name decides nothing', () => {
    const two = parseParties(
      'This Agreement is made between Orvanel Holdings plc, a company incorporated in England and Wales ("Buyer"), and Orvanel Europe B.V., a company incorporated in the Netherlands ("Seller").',
    );
    expect(resolveInContract(two, 'Orvanel').party).toBeUndefined();
    const parsed = parseParties(text);
    expect(resolveInContract(parsed, 'Orv').party).toBeUndefined();
    expect(resolveInContract(parsed, 'Tollaby').party).toBeUndefined();
    expect(resolveInContract(parsed, 'Hanardham Freight').party).toBeUndefined();
  });
});

describe("partyByShortName: a dropped middle word, the party's own legal form", () => {
  const deal =
    'This Supply Agreement is made on 3 March 2025 between Orvanel Holdings plc, a company incorporated in England and Wales ("Buyer"), and Indfenmore Rail Components K.K., a company incorporated in Japan ("Supplier").';
  it('keeps the first word and drops a middle one', () => {
    const parsed = parseParties(deal, { ownEntities: ['Orvanel Holdings plc'] });
    expect(resolveInContract(parsed, 'INDFENMORE COMPONENTS K.K.').party?.name).toBe('Indfenmore Rail Components K.K.');
    expect(resolveInContract(parsed, 'Indfenmore K.K.').party?.name).toBe('Indfenmore Rail Components K.K.');
  });
  it('a legal form of another family decides nothing (as often another company of the group)', () => {
    const parsed = parseParties(deal, { ownEntities: ['Orvanel Holdings plc'] });
    expect(resolveInContract(parsed, 'Orvanel Ltd').party).toBeUndefined();
    expect(resolveInContract(parsed, 'Indfenmore GmbH').party).toBeUndefined();
    expect(resolveInContract(parsed, 'Components Indfenmore K.K.').party).toBeUndefined();
  });
});

describe('partyByInitials through resolveInContract', () => {
  const deal =
    'This Services Agreement is made on 9 May 2025 between Orvanel Holdings plc, a company incorporated in England and Wales ("Customer"), and Kelnatette Ceramics AB, a company incorporated in Sweden ("Supplier").';
  it('the initials of one party name that party, with its legal form or none', () => {
    const parsed = parseParties(deal, { ownEntities: ['Orvanel Holdings plc'] });
    expect(resolveInContract(parsed, 'KC AB').party?.name).toBe('Kelnatette Ceramics AB');
    expect(resolveInContract(parsed, 'KC').party?.name).toBe('Kelnatette Ceramics AB');
    expect(resolveInContract(parsed, 'KC AB').explanation).toContain('initials of party Kelnatette Ceramics AB');
  });
  it('other letters, another legal form, or initials two parties share decide nothing', () => {
    const parsed = parseParties(deal, { ownEntities: ['Orvanel Holdings plc'] });
    expect(resolveInContract(parsed, 'KX AB').party).toBeUndefined();
    expect(resolveInContract(parsed, 'KC GmbH').party).toBeUndefined();
    const two = parseParties(
      'This Agreement is made between Kelnatette Ceramics AB, a company incorporated in Sweden ("Buyer"), and Korvell Cables AB, a company incorporated in Sweden ("Seller").',
    );
    expect(resolveInContract(two, 'KC AB').party).toBeUndefined();
  });
});
