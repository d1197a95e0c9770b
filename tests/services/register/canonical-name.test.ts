/** The canonical-value rules (docs/register.md) on hand-made name lists; every expectation follows a written rule. */
import { describe, expect, it } from 'vitest';
import { chooseCanonicalName, type NameCandidate } from '../../../services/register/index.ts';
import { isAllCapitals, letterCaseRank } from '../../../services/register/canonical-name.ts';

const name = (id: number, text: string, extra: Partial<NameCandidate> = {}): NameCandidate => ({
  id,
  name: text,
  kind: 'observed',
  legal_form: null,
  seen_count: 1,
  confirmed_by: null,
  ...extra,
});

describe('canonical-value rules', () => {
  it('rule 1: a name confirmed by a person or a strong identifier wins over a more frequent one', () => {
    const chosen = chooseCanonicalName([
      name(1, 'Fernhill Dairies Limited', { kind: 'legal', legal_form: 'ltd', seen_count: 9 }),
      name(2, 'Fernhill Dairies Ltd', { kind: 'legal', legal_form: 'ltd', confirmed_by: 'identifier:lei' }),
    ]);
    expect(chosen?.id).toBe(2);
  });
  it('rule 1: a typo sent with an identifier does not outrank the spelling seen more often; a person still wins', () => {
    // One letter apart (a letter dropped: one edit, Damerau 1964): the identifier confirmed the entity, not the spelling.
    const typo = name(2, 'Quillbrook Freight Sevices, Inc.', { kind: 'legal', legal_form: 'inc', confirmed_by: 'identifier:us_ein' });
    const usual = name(1, 'Quillbrook Freight Services, Inc.', { kind: 'legal', legal_form: 'inc', seen_count: 40 });
    expect(chooseCanonicalName([usual, typo])?.id).toBe(1);
    // Seen as often as the typo, the other spelling does not take the confirmation away.
    expect(chooseCanonicalName([{ ...usual, seen_count: 1 }, typo])?.id).toBe(2);
    // Two letters apart is another spelling, not a typo: the confirmation stands.
    expect(
      chooseCanonicalName([
        { ...usual, name: 'Quillbrook Freight Servces Inc' },
        { ...typo, name: 'Quillbrook Freight Services, Inc.' },
      ])?.id,
    ).toBe(2);
    // A person's confirmation stands whatever the spelling.
    expect(chooseCanonicalName([usual, { ...typo, confirmed_by: 'api:alice' }])?.id).toBe(2);
  });
  it('rule 2: the most frequent full legal name with its legal form, before a longer name without one', () => {
    const chosen = chooseCanonicalName([
      name(1, 'Fernhill Dairies Ltd', { legal_form: 'ltd', seen_count: 3 }),
      name(2, 'Fernhill Dairies Limited', { legal_form: 'ltd', seen_count: 2 }),
      name(3, 'Fernhill Dairies of the Northern Counties'),
    ]);
    expect(chosen?.id).toBe(1);
  });
  it('rule 3: otherwise the longest; former names only when nothing else is left; ties go to the oldest', () => {
    expect(chooseCanonicalName([name(1, 'Fernhill'), name(2, 'Fernhill Dairies')])?.id).toBe(2);
    expect(chooseCanonicalName([name(1, 'Fernhill Creamery Company Limited', { kind: 'former', legal_form: 'ltd' }), name(2, 'Fernhill')])?.id).toBe(2);
    expect(chooseCanonicalName([name(5, 'Fernhill Dairies'), name(4, 'Fernhill Dairiez')])?.id).toBe(4);
    expect(chooseCanonicalName([name(1, 'Old Fernhill', { kind: 'former' })])?.id).toBe(1);
    expect(chooseCanonicalName([])).toBeUndefined();
  });
});

describe('canonical-value rule 4: mixed case, then capitals, then lower case', () => {
  // Invented names. The rule is ours (docs/register.md, rule 4): capitals are how source systems store names.
  it('among case variants of one name, the mixed-case spelling wins even when the capitals were seen more often', () => {
    const chosen = chooseCanonicalName([
      name(1, 'FROWILORA RESEARCH B.V.', { legal_form: 'bv', seen_count: 5 }),
      name(2, 'Frowilora Research B.V.', { legal_form: 'bv', seen_count: 2 }),
    ]);
    expect(chosen?.name).toBe('Frowilora Research B.V.');
  });
  it('all lower case comes last: typed in a hurry, it never replaces a mixed-case or capitals spelling', () => {
    const chosen = chooseCanonicalName([
      name(1, 'Belwarrow Energy, Inc.', { legal_form: 'inc', seen_count: 1 }),
      name(2, 'belwarrow energy, inc.', { legal_form: 'inc', seen_count: 6 }),
      name(3, 'BELWARROW ENERGY, INC.', { legal_form: 'inc', seen_count: 2 }),
    ]);
    expect(chosen?.id).toBe(1);
    expect(chooseCanonicalName([name(1, 'belwarrow energy'), name(2, 'BELWARROW ENERGY')])?.id).toBe(2);
    expect(letterCaseRank('Belwarrow')).toBe(2);
    expect(letterCaseRank('BELWARROW')).toBe(1);
    expect(letterCaseRank('belwarrow')).toBe(0);
    expect(letterCaseRank('3-4-5')).toBe(2);
  });
  it('case variants count their sightings together against another name (rule 2)', () => {
    const chosen = chooseCanonicalName([
      name(1, 'FROWILORA RESEARCH B.V.', { legal_form: 'bv', seen_count: 3 }),
      name(2, 'Frowilora Research B.V.', { legal_form: 'bv', seen_count: 1 }),
      name(3, 'Frowilora Research Holding B.V.', { legal_form: 'bv', seen_count: 3 }),
    ]);
    // 3 + 1 sightings of the case-insensitive "frowilora research b.v." beat 3 of the longer name.
    expect(chosen?.id).toBe(2);
  });
  it('a tie-break after length, before the oldest id; among mixed-case variants the more frequent one', () => {
    expect(chooseCanonicalName([name(1, 'HALVERN TEXTILES'), name(2, 'Halvern Textiles')])?.id).toBe(2);
    // The longer name still wins over a shorter mixed-case one (rule 3 comes first).
    expect(chooseCanonicalName([name(1, 'HALVERN TEXTILES GROUP'), name(2, 'Halvern Textiles')])?.id).toBe(1);
    expect(
      chooseCanonicalName([
        name(1, 'Halvern textiles Ltd', { legal_form: 'ltd', seen_count: 1 }),
        name(2, 'Halvern Textiles Ltd', { legal_form: 'ltd', seen_count: 4 }),
        name(3, 'HALVERN TEXTILES LTD', { legal_form: 'ltd', seen_count: 9 }),
      ])?.id,
    ).toBe(2);
    // A person's confirmation still wins over the rule (rule 1).
    expect(
      chooseCanonicalName([
        name(1, 'Halvern Textiles Ltd', { legal_form: 'ltd' }),
        name(2, 'HALVERN TEXTILES LTD', { legal_form: 'ltd', confirmed_by: 'api:alice' }),
      ])?.id,
    ).toBe(2);
  });
  it('rule 5: on a tie the name that is canonical now stays, so a variant ranked the same never replaces it', () => {
    // A typo seen as often, and a legal form in capitals: each ties with the well-formed name on rules 1-4. The
    // well-formed name's row is the newer one, as after a re-resolution took its sighting away and added it back.
    const typo = [name(6, 'Brisworth Agritecb Inc.', { legal_form: 'inc' }), name(9, 'Brisworth Agritech Inc.', { legal_form: 'inc' })];
    expect(chooseCanonicalName(typo, 'Brisworth Agritech Inc.')?.id).toBe(9);
    expect(chooseCanonicalName(typo)?.id).toBe(6);
    const caps = [name(3, 'Carnholt Water Systems, INC.', { legal_form: 'inc' }), name(7, 'Carnholt Water Systems, Inc.', { legal_form: 'inc' })];
    expect(chooseCanonicalName(caps, 'Carnholt Water Systems, Inc.')?.id).toBe(7);
    // The current name keeps nothing the rules rank lower: a more frequent spelling still takes over (rule 2).
    const seen = [name(1, 'Carnholt Water Systems, Inc.', { legal_form: 'inc' }), name(2, 'Carnholt Water Systems Inc.', { legal_form: 'inc', seen_count: 3 })];
    expect(chooseCanonicalName(seen, 'Carnholt Water Systems, Inc.')?.id).toBe(2);
    expect(chooseCanonicalName([name(1, 'carnholt water'), name(2, 'Carnholt Water')], 'carnholt water')?.id).toBe(2);
  });
  it('isAllCapitals needs letters, all of them capitals', () => {
    expect(isAllCapitals('FROWILORA B.V.')).toBe(true);
    expect(isAllCapitals('Frowilora B.V.')).toBe(false);
    expect(isAllCapitals('3-4-5')).toBe(false);
    expect(isAllCapitals('ÖSTERLUND AB')).toBe(true);
  });
});
