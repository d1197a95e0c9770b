/**
 * Named examples for each rule of issue 3 (all names invented). Expected values come from the issue text,
 * the ISO 20275 ELF list v1.5 (codes; ../shared/reference/iso20275-elf-code-list.csv) or common practice,
 * as noted beside each.
 */
import { describe, expect, it } from 'vitest';
import { analyseName, normaliseName, foldForComparison, lookupLegalForm } from '../../../resolvers/analyse/index.ts';

describe('normalisation', () => {
  it('folds case, diacritics and the German umlaut convention alike', () => {
    // Issue 3: Mühlberg ~ Muehlberg ~ Muhlberg.
    expect(foldForComparison('Mühlberg')).toBe('muhlberg');
    expect(foldForComparison('Muehlberg')).toBe('muhlberg');
    expect(foldForComparison('MUHLBERG')).toBe('muhlberg');
    // æ → ae, ø → o (common practice); then "vaev" folds like "Muehlberg" (ae after a consonant → a).
    expect(normaliseName('Ærøskøbing Væv')).toBe('aeroskobing vav');
    expect(normaliseName('Straße')).toBe('strasse'); // ß → ss (common practice)
    // Only diacritics go: kana voicing and Indic vowel signs spell (Unicode: U+3099, Devanagari matras), and
    // decomposed input recomposes (NFC) — "ダ" written as "タ" + U+3099 is still "ダ", not "タ".
    expect(normaliseName('トヨタ')).not.toBe(normaliseName('トヨダ'));
    expect(normaliseName('ト\u30e8\u30bf\u3099')).toBe(normaliseName('トヨダ'));
    expect(normaliseName('कंपनी')).toBe('कंपनी');
  });

  it('unifies quotes, dashes, apostrophes, dotted initials and compatibility forms', () => {
    expect(normaliseName('O\u2019Farrell\u2013Byrne')).toBe(normaliseName("O'Farrell-Byrne")); // common practice
    expect(normaliseName('O\u2019Farrell')).toBe('ofarrell');
    expect(normaliseName('A.B.C. Tooling')).toBe('abc tooling');
    expect(normaliseName('ＡＢＣ Tooling')).toBe('abc tooling'); // NFKC full-width letters (Unicode UAX #15)
  });

  it('treats "&", "+", "und" and "et" as "and"', () => {
    // Issue 3: "&" ~ "and" ~ "und" ~ "et".
    const expected = 'pellow and quist';
    for (const written of ['Pellow & Quist', 'Pellow and Quist', 'Pellow und Quist', 'Pellow et Quist', 'Pellow+Quist']) {
      expect(normaliseName(written), written).toBe(expected);
    }
  });

  it('drops a leading "The" from the core, not from the normalised text', () => {
    const a = analyseName('The Orrin Mill Company Limited'); // issue 3: a leading "The"
    expect(a.core).toBe('orrin mill company');
    expect(a.normalised).toBe('the orrin mill company limited');
  });
});

describe('legal forms (ISO 20275 ELF v1.5)', () => {
  it('finds "Inc." and "Incorporated" in one family', () => {
    // Issue 3 examples; ELF v1.5 US rows list inc./incorporated (e.g. US-OH BTQ1).
    const a = analyseName('PELLINORE WIDGETS, INC.');
    const b = analyseName('Pellinore Widgets Incorporated');
    expect(a.core).toBe('pellinore widgets');
    expect(b.core).toBe('pellinore widgets');
    expect(a.legalForm?.family).toBe('inc');
    expect(b.legalForm?.family).toBe('inc');
    expect(a.legalForm?.text).toBe('INC.');
    expect(a.legalForm?.elfCodes).toContain('BTQ1'); // ELF v1.5 US-OH "company, co.;corporation;corp.;incorporated;inc."
  });

  it('families: Ltd ≡ Limited, Corp ≡ Corporation, LLP ≡ L.L.P., LLC ≡ L.L.C., GmbH ≡ its long name', () => {
    // Issue 3 equivalences; long German name from ELF v1.5 DE 2HBR.
    const pairs: Array<[string, string, string]> = [
      ['Ltd', 'Limited', 'ltd'],
      ['Corp.', 'Corporation', 'corp'],
      ['LLP', 'L.L.P.', 'llp'],
      ['LLC', 'L.L.C.', 'llc'],
      ['GmbH', 'Gesellschaft mit beschränkter Haftung', 'gmbh'],
      ['GmbH', 'Gesellschaft mit beschraenkter Haftung', 'gmbh'],
      ['AG', 'Aktiengesellschaft', 'ag'],
      ['S.A.', 'Société anonyme', 'sa'],
    ];
    for (const [short, long, family] of pairs) {
      expect(analyseName(`Vennick Orchards ${short}`).legalForm?.family, short).toBe(family);
      expect(analyseName(`Vennick Orchards ${long}`).legalForm?.family, long).toBe(family);
    }
  });

  it('accepts abbreviations with and without dots and spaces', () => {
    // Issue 3: S.A., SA, S. A.; Pty Ltd, PTY. LTD.; S.à r.l.
    for (const form of ['S.A.', 'SA', 'S. A.', 's.a.']) {
      const a = analyseName(`Corvale Andina ${form}`);
      expect(a.legalForm?.family, form).toBe('sa');
      expect(a.core, form).toBe('corvale andina');
    }
    for (const form of ['Pty Ltd', 'PTY. LTD.', 'Pty. Ltd.', 'Proprietary Limited']) {
      const a = analyseName(`Wombeyan Freight ${form}`, { country: 'AU' });
      // ELF v1.5 AU TXVC; AU Q82Q (unlimited proprietary) also lists "Pty Ltd" and "PTY." in v1.5.
      expect(a.legalForm?.elfCodes, form).toContain('TXVC');
      expect(a.legalForm?.family, form).toBe('ptyltd');
    }
    for (const form of ['S.à r.l.', 'S. à r.l.', 'SARL', 'S.a.r.l.']) {
      expect(analyseName(`Perrinel Nova ${form}`, { country: 'LU' }).legalForm?.elfCodes, form).toContain('DVXS'); // ELF v1.5 LU DVXS "SARL"
    }
  });

  it('recognises multi-word forms with a comma inside', () => {
    // ELF v1.5 MX HKWO "S.A. de C.V., SOFOM E.N.R." (SOURCES.md §2: the comma is part of the form).
    const a = analyseName('Financiera Quillon S.A. de C.V., SOFOM E.N.R.');
    expect(a.legalForm?.elfCodes).toEqual(['HKWO']);
    expect(a.legalForm?.text).toBe('S.A. de C.V., SOFOM E.N.R.');
    expect(a.core).toBe('financiera quillon');
    expect(analyseName('Ferretera Olmo S.A. de C.V.', { country: 'MX' }).legalForm?.text).toBe('S.A. de C.V.');
  });

  it('recognises prefix forms', () => {
    // Russian ООО / OOO (supplement, from memory: Civil Code of the RF) and Lithuanian UAB (ELF v1.5 LT BPLS).
    const ru = analyseName('ООО «Ромашка-Плюс»');
    expect(ru.legalForm?.elfCodes).toContain('17R7');
    expect(ru.core).toBe('ромашка плюс');
    expect(analyseName('OOO Vetlugin Stroi').legalForm?.family).toBe('ooo');
    const lt = analyseName('UAB Giraitės Baldai');
    expect(lt.legalForm?.elfCodes).toEqual(['BPLS']);
    expect(lt.core).toBe('giraites baldai');
    // Two-letter prefixes need the country: "AB Widgets" is a pair of initials, "AS Tallinna Vesi" in EE an AS.
    expect(analyseName('AB Quillet Foods').legalForm).toBeNull();
    expect(analyseName('AS Pärnu Veevärk', { country: 'EE' }).legalForm?.elfCodes).toEqual(['9LJA']); // ELF v1.5 EE 9LJA Aktsiaselts
    expect(analyseName('UAB Giraitės Baldai', { country: 'GB' }).legalForm).toBeNull(); // a hint outside the prefix countries
    // Polish full names open a name (common practice): ELF v1.5 PL SMIS "przedsiębiorstwo państwowe".
    expect(analyseName('Przedsiębiorstwo Państwowe Wodnik Zalew').legalForm?.elfCodes).toEqual(['SMIS']);
  });

  it('compound forms: the last designator rules and "& Co." is a connector', () => {
    // Issue 3: "X GmbH & Co. KG" is a KG. ELF v1.5 DE 8Z6G Kommanditgesellschaft.
    const a = analyseName('Holzner Feinmechanik GmbH & Co. KG');
    expect(a.legalForm?.family).toBe('kg');
    expect(a.legalForm?.elfCodes).toEqual(['8Z6G']);
    expect(a.legalForm?.text).toBe('GmbH & Co. KG');
    expect(a.core).toBe('holzner feinmechanik');
    // Austrian spelling without the dot: the compound is found by the connector rule, not the list.
    const at = analyseName('Brunnauer Sägewerk GmbH & Co KG', { country: 'AT' });
    expect(at.legalForm?.family).toBe('kg');
    expect(at.core).toBe('brunnauer sagewerk');
    // A general partner's form written straight before the partnership's (PL: ELF v1.5 BSJT "sp.k.", O7XB "sp. z o.o.").
    const pl = analyseName('Wodnik Zalew sp. z o.o. sp.k.');
    expect(pl.legalForm?.elfCodes).toEqual(['BSJT']);
    expect(pl.core).toBe('wodnik zalew');
    expect(analyseName('Marlow Trust AG').core).toBe('marlow trust'); // a word stays in the name
    // "& Co." alone before a designator is part of the name.
    expect(analyseName('Tregarth & Co. KG').core).toBe('tregarth and co');
  });

  it('"Co." and "Company" are designators only at the end', () => {
    // Issue 3 rule.
    expect(analyseName('Hollin Supply Co.').legalForm?.family).toBe('co');
    expect(analyseName('Hollin Supply Co.').core).toBe('hollin supply');
    const mid = analyseName('Hollin Company Services');
    expect(mid.legalForm).toBeNull();
    expect(mid.core).toBe('hollin company services');
    expect(analyseName('Hollin Co. Ltd').core).toBe('hollin co');
    // "Smith & Co." names the partners (common practice).
    expect(analyseName('Dellow & Co.').legalForm).toBeNull();
  });

  it('a country hint narrows the codes', () => {
    // Issue 3: "SA" with FR differs from "SA" with CH. ELF v1.5: FR QVPB, CH MVII.
    expect(analyseName('Corvale SA', { country: 'FR' }).legalForm?.elfCodes).toEqual(['QVPB']);
    expect(analyseName('Corvale SA', { country: 'CH' }).legalForm?.elfCodes).toEqual(['MVII']);
    expect(analyseName('Corvale SA').legalForm?.elfCodes.length).toBeGreaterThan(5);
    // A subdivision hint keeps its own and country-wide codes: ELF v1.5 US-DE XTIQ "Corporation".
    expect(analyseName('Brackenfield Corporation', { country: 'US-DE' }).legalForm?.elfCodes).toEqual(['XTIQ']);
    // A hint that matches nothing keeps every code rather than dropping the designator.
    expect(analyseName('Corvale GmbH', { country: 'JP' }).legalForm?.elfCodes).toContain('2HBR');
    expect(() => analyseName('Corvale SA', { country: 'France' })).toThrow(/hints\.country/);
  });

  it('lookupLegalForm answers for a designator alone', () => {
    expect(lookupLegalForm('P.L.C.', { country: 'GB' })).toMatchObject({ family: 'plc', elfCodes: ['B6ES'] }); // ELF v1.5 GB B6ES
    expect(lookupLegalForm('Widgets')).toBeNull();
  });

  it('Roman numerals and everyday two-letter tokens are not designators without support', () => {
    // ELF v1.5 lists "II" (LT A338), "DA" (NO CF5L), "I/S" (DK 7WRN); common practice: "Fund II" is a numeral.
    expect(analyseName('Halvard Growth Fund II').legalForm).toBeNull();
    expect(analyseName('Halvard Growth Fund II').core).toBe('halvard growth fund ii');
    expect(analyseName('Sandvik Rederi DA', { country: 'NO' }).legalForm?.elfCodes).toEqual(['CF5L']);
    expect(analyseName('Ostergaard Smede I/S').legalForm?.elfCodes).toContain('7WRN');
  });

  it('a designator alone is not a name', () => {
    expect(analyseName('Limited').legalForm).toBeNull();
    expect(analyseName('The Company').legalForm).toBeNull();
  });
});

describe('qualifiers', () => {
  it('keeps parenthesised places apart', () => {
    // Issue 3 examples.
    const a = analyseName('Goldline (Europe) Ltd');
    expect(a.core).toBe('goldline');
    expect(a.qualifiers).toEqual(['europe']);
    expect(a.legalForm?.family).toBe('ltd');
    const b = analyseName('Marlow Credit Union (Bristol)');
    expect(b.qualifiers).toEqual(['bristol']);
    expect(b.core).toBe('marlow');
    expect(b.legalForm?.text).toBe('Credit Union');
    const c = analyseName('Penhallow Shipping Ltd (Cyprus)');
    expect(c.core).toBe('penhallow shipping');
    expect(c.qualifiers).toEqual(['cyprus']);
  });

  it('reads a parenthesised legal form as a legal form, not a qualifier', () => {
    // ELF v1.5 AT O65B "Europäische Gesellschaft (SE)"; "(Pty) Ltd" as written in South Africa (common practice).
    const a = analyseName('Kessler Antriebe Europäische Gesellschaft (SE)', { country: 'AT' });
    expect(a.legalForm?.elfCodes).toEqual(['O65B']);
    expect(a.qualifiers).toEqual([]);
    const b = analyseName('Umhlanga Steelworks (Pty) Ltd');
    expect(b.legalForm?.family).toBe('ptyltd');
    expect(b.core).toBe('umhlanga steelworks');
    expect(b.qualifiers).toEqual([]);
  });
});

describe('contract descriptors and definitions after a name', () => {
  it('reads ", a Delaware corporation" as place and form, not as name', () => {
    // Common practice in contract preambles. ELF v1.5 US-DE XTIQ "Corporation".
    const a = analyseName('Brackenridge Fabrication, a Delaware corporation');
    expect(a.core).toBe('brackenridge fabrication');
    expect(a.qualifiers).toEqual(['delaware']);
    expect(a.legalForm?.elfCodes).toEqual(['XTIQ']);
    expect(a.legalForm?.text).toBe('corporation');
    const b = analyseName('Brackenridge Fabrication, Inc., a Delaware corporation');
    expect(b.core).toBe('brackenridge fabrication');
    expect(b.legalForm?.text).toBe('Inc.');
    expect(b.legalForm?.jurisdictions.every((j) => j.startsWith('US'))).toBe(true); // no US-DE row lists "Inc."
  });

  it('reads "a company incorporated in England and Wales" as a place', () => {
    // Common practice; ELF v1.5 GB H0PO lists "Limited".
    const a = analyseName('Orrin Mill Limited, a company incorporated in England and Wales');
    expect(a.core).toBe('orrin mill');
    expect(a.qualifiers).toEqual(['england and wales']);
    expect(a.legalForm?.elfCodes).toContain('H0PO');
    expect(a.legalForm?.jurisdictions).toEqual(['GB']);
  });

  it('leaves a defined term in parentheses out of the qualifiers and the core', () => {
    const a = analyseName('Quennell Bakeries Ltd ("Supplier")');
    expect(a.core).toBe('quennell bakeries');
    expect(a.qualifiers).toEqual([]);
    expect(a.legalForm?.family).toBe('ltd');
  });

  it('does not take an ordinary apposition for a descriptor', () => {
    expect(analyseName('Dellow, a partner').core).toBe('dellow a partner');
  });
});

describe('aliases and related entities', () => {
  it('types trade names', () => {
    // Issue 3: d/b/a, dba, t/a, trading as, o/a, operating as → trade.
    for (const marker of ['d/b/a', 'dba', 'D.B.A.', 't/a', 'trading as', 'o/a', 'operating as', 'doing business as']) {
      const a = analyseName(`Quennell Bakeries Ltd ${marker} Rising Loaf`);
      expect(a.aliases, marker).toEqual([{ kind: 'trade', name: 'Rising Loaf' }]);
      expect(a.core, marker).toBe('quennell bakeries');
    }
  });

  it('types former names and also-known-as names', () => {
    // Issue 3: f/k/a, formerly known as, formerly, previously → former; a/k/a, also known as → also_known_as.
    for (const marker of ['f/k/a', 'fka', 'formerly known as', 'formerly', 'previously']) {
      expect(analyseName(`Ostrander Labs Inc. ${marker} Ostrander Research Inc.`).aliases, marker).toEqual([
        { kind: 'former', name: 'Ostrander Research Inc.' },
      ]);
    }
    expect(analyseName('Ostrander Labs Inc. (formerly Ostrander Research Inc.)').aliases).toEqual([{ kind: 'former', name: 'Ostrander Research Inc.' }]);
    for (const marker of ['a/k/a', 'aka', 'also known as']) {
      expect(analyseName(`Ostrander Labs Inc. ${marker} OLab`).aliases, marker).toEqual([{ kind: 'also_known_as', name: 'OLab' }]);
    }
  });

  it('puts a predecessor in `related`, never in aliases', () => {
    // Issue 3: "successor in interest to X" → related successor_of.
    const a = analyseName('Brightwater Utilities LLC, successor in interest to Old Brightwater Power Co.');
    expect(a.aliases).toEqual([]);
    expect(a.related).toEqual([{ relation: 'successor_of', name: 'Old Brightwater Power Co.' }]);
    expect(a.core).toBe('brightwater utilities');
  });

  it('reads "a trading name of" the other way round', () => {
    // Issue 3 example: the party is Iolo Brannock; "Brannock Print Works" is his trade name.
    const a = analyseName('Brannock Print Works (a trading name of Iolo Brannock)');
    expect(a.core).toBe('iolo brannock');
    expect(a.kind).toBe('person');
    expect(a.aliases).toEqual([{ kind: 'trade', name: 'Brannock Print Works' }]);
  });

  it('keeps several aliases in order', () => {
    const a = analyseName('Ferrow Ltd f/k/a Ferrow Tools Ltd d/b/a Ferrow Direct');
    expect(a.aliases).toEqual([
      { kind: 'former', name: 'Ferrow Tools Ltd' },
      { kind: 'trade', name: 'Ferrow Direct' },
    ]);
  });
});

describe('party filter', () => {
  it('pronouns need binding', () => {
    // Issue 3: we, us, our, you, your, I, me.
    for (const p of ['we', 'We', 'us', 'our', 'you', 'your', 'I', 'me']) {
      const a = analyseName(p);
      expect(a.partyStatus, p).toBe('needs_binding');
      expect(a.kind, p).toBe('unknown');
    }
  });

  it('role and collective words need binding', () => {
    // Issue 3: "the Company", "Licensee", "Party", "the Parties", "its Affiliates"; others common practice.
    for (const p of [
      'the Company',
      'Licensee',
      'Party',
      'the Parties',
      'its Affiliates',
      'the Supplier',
      'Disclosing Party',
      'Party A',
      'each Party',
      'the Customer',
    ]) {
      expect(analyseName(p).partyStatus, p).toBe('needs_binding');
    }
  });

  it('signature labels, empty, numeric and too-short strings are not parties', () => {
    // Issue 3: By:, Name:, Title:, empty, numeric-only, too short.
    for (const p of ['By:', 'Name:', 'Title:', 'By: ____________', 'Name: Iolo Brannock', '', '   ', '12345', '42-17', 'X', '.', '—']) {
      expect(analyseName(p).partyStatus, JSON.stringify(p)).toBe('not_a_party');
    }
  });

  it('a natural person is a party of kind person', () => {
    // Issue 3: no legal form, looks like given + family name. Invented names.
    for (const p of ['Iolo Brannock', 'Dr Hanna Velt', 'Maria van der Linde', 'Iolo T. Brannock', 'Mrs Petra Quaill']) {
      const a = analyseName(p);
      expect(a.partyStatus, p).toBe('party');
      expect(a.kind, p).toBe('person');
    }
    expect(analyseName('Dr Hanna Velt').core).toBe('hanna velt');
  });

  it('organisations and undecided names', () => {
    expect(analyseName('Pellinore Widgets').kind).toBe('organisation'); // an organisation word (common practice)
    expect(analyseName('Quarrendon Vale').kind).toBe('unknown'); // no evidence either way
    expect(analyseName('Licensee Holdings Ltd').partyStatus).toBe('party'); // a legal form makes it a name
    // A local-government area opening with a given name is no person (US and UK administrative words, common
    // practice; invented and generic area names).
    for (const p of ['Travis County', 'Orleans Parish', 'Lincoln Township']) expect(analyseName(p).kind, p).not.toBe('person');
  });
});

describe('output', () => {
  it('has the fields of the contract and keeps the input verbatim', () => {
    const input = '  Goldline (Europe) Ltd d/b/a Goldline Direct ';
    const a = analyseName(input);
    expect(Object.keys(a).sort()).toEqual(
      ['aliases', 'alternatives', 'core', 'input', 'kind', 'legalForm', 'normalised', 'partyStatus', 'qualifiers', 'related', 'tokens'].sort(),
    );
    expect(a.alternatives).toEqual([{ kind: 'alias', tokens: ['goldline', 'direct'], core: 'goldline direct' }]);
    expect(a.input).toBe(input);
    expect(a.tokens).toEqual(a.core.split(' '));
    expect(input).toContain(a.legalForm?.text);
  });
});
