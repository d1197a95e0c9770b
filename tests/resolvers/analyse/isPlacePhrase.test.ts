/** Places and jurisdictions are not parties (issue 16 item 1). Place names: ISO 3166 via package iso-3166. */
import { describe, expect, it } from 'vitest';
import { analyseName } from '../../../resolvers/analyse/index.ts';
import { isPlacePhrase } from '../../../resolvers/analyse/isPlacePhrase.ts';
import { normaliseTokens } from '../../../resolvers/analyse/normaliseName.ts';

const place = (s: string): boolean => isPlacePhrase(normaliseTokens(s));

describe('isPlacePhrase', () => {
  it('reads countries and subdivisions with or without "the" (ISO 3166-1 and 3166-2 names)', () => {
    for (const p of ['New South Wales', 'the Netherlands', 'England and Wales', 'Scotland', 'Ontario', 'Québec', 'Delaware', 'Deutschland', 'the United Kingdom', 'Noord-Holland']) {
      expect(place(p), p).toBe(true);
    }
  });

  it('reads polity phrases: the State of New York, the Kingdom of Spain (framing words: common practice)', () => {
    for (const p of ['the State of New York', 'State of Delaware', 'the Commonwealth of Massachusetts', 'the Province of Ontario', 'the Kingdom of Spain', 'the Republic of Korea', 'the Federal Republic of Germany', 'United States of America', 'the Grand Duchy of Luxembourg']) {
      expect(place(p), p).toBe(true);
    }
  });

  it('reads governing-law and venue phrases (common practice)', () => {
    for (const p of ['the laws of England and Wales', 'the laws of the State of New York', 'the courts of New South Wales', 'the exclusive jurisdiction of the courts of Ireland', 'New York law', 'Jersey and Guernsey']) {
      expect(place(p), p).toBe(true);
    }
  });

  it('leaves names that only contain a place as names (invented names)', () => {
    for (const p of ['Bank of Ellesmere', 'Ontario Pellwick Freight', 'New York Harlow Trading', 'the State of Qorvania', 'Kingdom of Brell', 'Ardle Scotland Partners']) {
      expect(place(p), p).toBe(false);
    }
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
