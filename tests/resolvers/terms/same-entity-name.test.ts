/**
 * Our own entities in a translated legal form (issue 16 item 6): "Co., Ltd." is how Japanese kabushiki kaisha
 * render their form in English (common practice); K.K. is ELF T417 (JP) in the ISO 20275 list v1.5. Invented names.
 */
import { describe, expect, it } from 'vitest';
import { analyseName } from '../../../resolvers/analyse/index.ts';
import { sameWithTranslatedForm } from '../../../resolvers/analyse/same-with-translated-form.ts';
import { parseParties, resolveInContract } from '../../../resolvers/terms/index.ts';
import { sameEntityName } from '../../../resolvers/terms/same-entity-name.ts';

describe('sameEntityName with a translated legal form', () => {
  it('K.K. and its English renderings are one entity', () => {
    expect(analyseName('Orvanel Japan K.K.').legalForm?.elfCodes).toEqual(['T417']);
    for (const rendered of ['Orvanel Japan Co., Ltd.', 'Orvanel Japan Corporation', 'Orvanel Japan Inc.']) {
      expect(sameEntityName(analyseName('Orvanel Japan K.K.'), analyseName(rendered)), rendered).toBe(true);
      expect(sameEntityName(analyseName(rendered), analyseName('Orvanel Japan K.K.')), rendered).toBe(true);
    }
  });

  it("another name, another jurisdiction's form, or a form no rendering lists stays apart", () => {
    expect(sameWithTranslatedForm(analyseName('Orvanel Japan K.K.'), analyseName('Orvanel Korea Co., Ltd.'))).toBe(false);
    expect(sameWithTranslatedForm(analyseName('Orvanel Deutschland GmbH'), analyseName('Orvanel Deutschland Ltd'))).toBe(false);
    expect(sameWithTranslatedForm(analyseName('Orvanel Japan K.K.'), analyseName('Orvanel Japan LLP'))).toBe(false);
  });

  it('marks the party as our own entity and resolves the other spelling to it', () => {
    const text =
      'This Distribution Agreement is made on 1 April 2025 between Orvanel Japan Co., Ltd., a company incorporated in Japan ("Orvanel"), and Hayashida Trading K.K., a company incorporated in Japan ("Distributor").';
    const parsed = parseParties(text, { ownEntities: ['Orvanel Japan K.K.'] });
    expect(parsed.parties.map((p) => [p.name, p.ownEntity])).toEqual([
      ['Orvanel Japan Co., Ltd.', true],
      ['Hayashida Trading K.K.', false],
    ]);
    expect(resolveInContract(parsed, 'Orvanel Japan K.K.').party?.name).toBe('Orvanel Japan Co., Ltd.');
  });
});
