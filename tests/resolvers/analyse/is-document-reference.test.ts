/** The document and its parts are not parties (issue 16 item 2). Word lists: common practice in contract drafting. */
import { describe, expect, it } from 'vitest';
import { analyseName } from '../../../resolvers/analyse/index.ts';
import { isDocumentReference } from '../../../resolvers/analyse/is-document-reference.ts';
import { normaliseTokens } from '../../../resolvers/analyse/normalise-name.ts';
import { NON_PARTY_TERMS } from '../../../resolvers/terms/non-party-terms.ts';

const doc = (s: string): boolean => isDocumentReference(normaliseTokens(s));

describe('isDocumentReference', () => {
  it("reads the issue's examples and their kin", () => {
    for (const p of [
      'this Agreement',
      'the Contract',
      'Schedule 2',
      'the Effective Date',
      'the Services',
      'the Territory',
      'Annex B-1',
      'Clause 4.2',
      'Amendment No. 3',
      'the Master Services Agreement',
      'Statement of Work 7',
      'Part II',
      'the Order Form',
      'this Deed',
    ]) {
      expect(doc(p), p).toBe(true);
    }
  });

  it('leaves roles, labels of parties and names alone (invented names)', () => {
    for (const p of [
      'Party A',
      'the Licensee',
      'Lender 2',
      'its Affiliates',
      'Harnwick Schedule Planning',
      'Ardle Annex Partners',
      'Service Provider',
      'The Centre for Coastal Health and Water Policy',
      'Harnwick Credit Opportunities Fund Part II',
    ]) {
      expect(doc(p), p).toBe(false);
    }
  });

  it('reads titles whose noun comes first, and defined abbreviations of titles (common practice)', () => {
    for (const p of ['this Deed of Variation', 'the Letter of Intent', 'the Memorandum of Understanding', 'the MSA', 'this NDA']) {
      expect(doc(p), p).toBe(true);
    }
    // A body, not a document: "order" opens no title here; a long run is no title (invented names).
    for (const p of ['the Order of St Anselm', 'Letterwick Holdings', 'Deed of Trust Services of the Northern Coast Cooperative']) {
      expect(doc(p), p).toBe(false);
    }
  });

  it('makes analyseName say not_a_party, reason document; a legal form still makes a party', () => {
    for (const p of ['this Agreement', 'the Contract', 'Schedule 2', 'the Effective Date', 'the Services', 'the Territory']) {
      const a = analyseName(p);
      expect(a.partyStatus, p).toBe('not_a_party');
      expect(a.partyReason, p).toBe('document');
    }
    expect(analyseName('Territory Holdings Ltd').partyStatus).toBe('party');
  });

  it('every term resolvers/terms never binds is also ruled out by the name analysis (one list)', () => {
    for (const t of NON_PARTY_TERMS) {
      const a = analyseName(t);
      expect(a.partyStatus === 'not_a_party' || a.partyStatus === 'needs_binding', t).toBe(true);
    }
  });
});
