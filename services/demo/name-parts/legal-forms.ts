/**
 * The legal forms generated names end in, per country, with the ways people write each of them: the variants are
 * what the matcher must see through.
 */

/** Legal forms per country: the canonical spelling first, then ways people write the same form. */
export interface LegalFormFamily {
  canonical: string;
  variants: readonly string[];
}

export const LEGAL_FORMS: Readonly<Record<string, readonly LegalFormFamily[]>> = {
  US: [
    { canonical: 'Inc.', variants: ['Inc', 'Incorporated', 'INC.', 'inc.'] },
    { canonical: 'LLC', variants: ['L.L.C.', 'Limited Liability Company', 'llc', 'L.L.C'] },
    { canonical: 'Corp.', variants: ['Corporation', 'Corp', 'CORP.'] },
    { canonical: 'L.P.', variants: ['LP', 'Limited Partnership'] },
  ],
  GB: [
    { canonical: 'Ltd', variants: ['Limited', 'Ltd.', 'LTD', 'ltd'] },
    { canonical: 'plc', variants: ['PLC', 'Public Limited Company', 'p.l.c.'] },
    { canonical: 'LLP', variants: ['L.L.P.', 'Limited Liability Partnership'] },
  ],
  DE: [
    { canonical: 'GmbH', variants: ['G.m.b.H.', 'Gesellschaft mit beschränkter Haftung', 'Gmbh', 'GMBH'] },
    { canonical: 'AG', variants: ['Aktiengesellschaft', 'A.G.'] },
    { canonical: 'GmbH & Co. KG', variants: ['GmbH & Co KG', 'GmbH u. Co. KG', 'GmbH and Co. KG'] },
  ],
  FR: [
    { canonical: 'SAS', variants: ['S.A.S.', 'Société par actions simplifiée', 'S.A.S'] },
    { canonical: 'SA', variants: ['S.A.', 'Société anonyme'] },
    { canonical: 'SARL', variants: ['S.A.R.L.', 'Société à responsabilité limitée', 'Sarl'] },
  ],
  NL: [
    { canonical: 'B.V.', variants: ['BV', 'Besloten Vennootschap', 'B.V', 'bv'] },
    { canonical: 'N.V.', variants: ['NV', 'Naamloze Vennootschap'] },
  ],
  JP: [
    { canonical: 'K.K.', variants: ['Kabushiki Kaisha', 'KK', 'Co., Ltd.'] },
    { canonical: 'G.K.', variants: ['Godo Kaisha', 'GK'] },
  ],
  AU: [
    { canonical: 'Pty Ltd', variants: ['Pty. Ltd.', 'Proprietary Limited', 'PTY LTD', 'Pty Limited'] },
    { canonical: 'Ltd', variants: ['Limited', 'Ltd.'] },
  ],
  SE: [{ canonical: 'AB', variants: ['Aktiebolag', 'Aktiebolaget', 'A.B.'] }],
  IT: [
    { canonical: 'S.r.l.', variants: ['Srl', 'SRL', 'Società a responsabilità limitata'] },
    { canonical: 'S.p.A.', variants: ['SpA', 'SPA'] },
  ],
  ES: [
    { canonical: 'S.L.', variants: ['SL', 'Sociedad Limitada'] },
    { canonical: 'S.A.', variants: ['SA', 'Sociedad Anónima'] },
  ],
};
