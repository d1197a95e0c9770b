/**
 * reconcileGivenParties on hand-worked cases (invented names): a given party matches the parsed one with the same
 * entity name (another capitalisation, the legal form abbreviated: sameEntityName), each parsed party is matched
 * at most once, and roles and defined terms are compared without case, spacing, quotes or a leading article.
 */
import { describe, expect, it } from 'vitest';
import { analyseName } from '../../../resolvers/analyse/index.ts';
import { reconcileGivenParties } from '../../../resolvers/terms/index.ts';

const parsed = [
  { position: 0, name: 'Vellacourt Instruments GmbH', role: 'Seller', terms: ['Seller'] },
  { position: 1, name: 'Ambervale Print Limited', role: 'Buyer', terms: ['Buyer'] },
];

describe('reconcileGivenParties', () => {
  it('matches by entity name, reports a differing role, and agrees on a term written another way', () => {
    const r = reconcileGivenParties(
      [
        { name: 'AMBERVALE PRINT LTD', role: 'Purchaser', definedTerm: 'the "buyer"' },
        { name: 'Vellacourt Instruments GmbH', role: ' seller ' },
      ],
      parsed,
      (n) => analyseName(n),
    );
    expect(r.matched).toEqual([
      { given: 0, position: 1 },
      { given: 1, position: 0 },
    ]);
    expect(r.disagreements).toEqual([{ given: 0, position: 1, field: 'role', givenValue: 'Purchaser', parsedValue: 'Buyer' }]);
    expect(r.givenNotInText).toEqual([]);
    expect(r.parsedNotGiven).toEqual([]);
  });

  it('matches a parsed party once: a second given party with the same name is not in the text', () => {
    const r = reconcileGivenParties([{ name: 'Vellacourt Instruments GmbH' }, { name: 'Vellacourt Instruments GmbH' }], parsed, (n) => analyseName(n));
    expect(r.matched).toEqual([{ given: 0, position: 0 }]);
    expect(r.givenNotInText).toEqual([1]);
    expect(r.parsedNotGiven).toEqual([1]);
  });
});
