/** Places and jurisdictions are not parties (issue 16 item 1). Place names: ISO 3166 via package iso-3166. */
import { describe, expect, it } from 'vitest';
import { analyseName } from '../../../resolvers/analyse/index.ts';
import { isPlacePhrase } from '../../../resolvers/analyse/is-place-phrase.ts';
import { normaliseTokens } from '../../../resolvers/analyse/normalise-name.ts';
import { rorNames } from '../../services/demo/support.ts';

const place = (s: string): boolean => isPlacePhrase(normaliseTokens(s));

describe('isPlacePhrase', () => {
  it('reads countries and subdivisions with or without "the" (ISO 3166-1 and 3166-2 names)', () => {
    for (const p of [
      'New South Wales',
      'the Netherlands',
      'England and Wales',
      'Scotland',
      'Ontario',
      'Québec',
      'Delaware',
      'Deutschland',
      'the United Kingdom',
      'Noord-Holland',
    ]) {
      expect(place(p), p).toBe(true);
    }
  });

  it('reads polity phrases: the State of New York, the Kingdom of Spain (framing words: common practice)', () => {
    for (const p of [
      'the State of New York',
      'State of Delaware',
      'the Commonwealth of Massachusetts',
      'the Province of Ontario',
      'the Kingdom of Spain',
      'the Republic of Korea',
      'the Federal Republic of Germany',
      'United States of America',
      'the Grand Duchy of Luxembourg',
    ]) {
      expect(place(p), p).toBe(true);
    }
  });

  it('reads governing-law and venue phrases (common practice)', () => {
    for (const p of [
      'the laws of England and Wales',
      'the laws of the State of New York',
      'the courts of New South Wales',
      'the exclusive jurisdiction of the courts of Ireland',
      'New York law',
      'Jersey and Guernsey',
    ]) {
      expect(place(p), p).toBe(true);
    }
  });

  it('leaves names that only contain a place as names (invented names)', () => {
    for (const p of [
      'Bank of Ellesmere',
      'Ontario Pellwick Freight',
      'New York Harlow Trading',
      'the State of Qorvania',
      'Kingdom of Brell',
      'Ardle Scotland Partners',
    ]) {
      expect(place(p), p).toBe(false);
    }
  });

  it('an authority named after its place, and a short acronym, stay parties', () => {
    // "Government of Alberta" and "City of New York" are organisations in ROR; "ALBA" and "JURA" are ROR acronyms.
    for (const p of ['Government of Alberta', 'City of New York', 'ALBA', 'JURA']) expect(analyseName(p).partyStatus, p).toBe('party');
    expect(analyseName('THE NETHERLANDS').partyReason).toBe('place');
  });

  it('reads few real organisation names as places or documents (ROR names, shared/datasets/ror_org_names.csv)', () => {
    const names = [...rorNames()].filter((_, i) => i % 10 === 0 && _.length > 0);
    const out = names.filter((n) => {
      const reason = analyseName(n).partyReason;
      return reason === 'place' || reason === 'document';
    });
    // Measured 2026-12-04 on all 150,981 names: 93 places (regional authorities named as their region) and 2
    // documents, 0.06 %.
    expect(out.length / names.length, out.slice(0, 20).join(' | ')).toBeLessThan(0.002);
  });

  it('makes analyseName say not_a_party, reason place, and a legal form still makes a party', () => {
    for (const p of ['the State of New York', 'New South Wales', 'the Netherlands', 'England and Wales']) {
      const a = analyseName(p);
      expect(a.partyStatus, p).toBe('not_a_party');
      expect(a.partyReason, p).toBe('place');
    }
    expect(analyseName('Victoria Ltd').partyStatus).toBe('party');
    expect(analyseName('Victoria Ltd').partyReason).toBeUndefined();
  });
});
