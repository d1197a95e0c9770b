/**
 * Designators in everyday use that the ISO 20275 ELF list v1.5 does not spell out, each mapped to the ELF
 * code it stands for. Added to the table by buildElfTable so the committed table stays reproducible.
 * - FR "SARL" / "Société à responsabilité limitée": the list has only the long name with "(sans autre
 *   indication)" and no abbreviation for V9QP (SOURCES.md §2, "No abbreviation for FR SARL"); the short
 *   forms are common practice.
 * - RU ООО / АО / ПАО / ОАО / ЗАО and their Latin transliterations: the RU rows of v1.5 carry plural category
 *   names and no abbreviations; the mapping of each abbreviation to its row is from memory (Civil Code of the
 *   Russian Federation, arts. 87 and 96–97: limited liability company, joint-stock company, public/non-public).
 * - CZ "s.r.o." / "a.s." (9HLU / 6CQN), SK "s.r.o." / "a.s." (VSZS / 2EEG), PT "Lda." / "S.A." (USOG / DFE5),
 *   JP "K.K." / "Kabushiki Kaisha" (T417) and "G.K." / "Godo Kaisha" (7QQ0): the v1.5 rows of these codes carry no
 *   Latin abbreviation (or only a long one such as SK "Spol. s r. o."); the short forms are common practice.
 * - CZ "v. v. i." (CIO8, veřejná výzkumná instituce): no abbreviation in v1.5; common practice.
 * - ES "S.C.C." / "C.C." / "S. Coop. de Crédito" and the regional "S.C.C.V." / "C.C.V." (Valencian) and "S.C.A.C."
 *   (Andalusian) for SS0L (Cooperativa de Crédito), and "S.A.U." (sociedad anónima unipersonal) for the ES S.A. row:
 *   v1.5 has no abbreviation for these; as supervisors' lists write them (common practice).
 * - IE "DAC" (designated activity company, LGWG): v1.5 writes it "DAC – (limited by shares)" only.
 * - ES "Sociedad Limitada" (DP3Q, Sociedad de Responsabilidad Limitada): v1.5 itself writes the variants of DP3Q
 *   that way ("Sociedad Limitada Laboral (o Sociedad de Responsabilidad Limitada laboral)" 1G29, "Sociedad Limitada
 *   Profesional" JB2M, "Sociedad Limitada Unipersonal" R6UT) but gives DP3Q only its long name; that the Spanish
 *   companies act allows "Sociedad Limitada" as the company's form is from memory (Ley de Sociedades de Capital, art. 6).
 */
export interface SupplementForm {
  text: string;
  code: string;
  kind: 'a' | 'n';
}

export const SUPPLEMENT_FORMS: readonly SupplementForm[] = [
  { text: 'SARL', code: 'V9QP', kind: 'a' },
  { text: 'S.à r.l.', code: 'V9QP', kind: 'a' },
  { text: 'Société à responsabilité limitée', code: 'V9QP', kind: 'n' },
  { text: 'ООО', code: '17R7', kind: 'a' },
  { text: 'OOO', code: '17R7', kind: 'a' },
  { text: 'АО', code: 'R71T', kind: 'a' },
  { text: 'AO', code: 'R71T', kind: 'a' },
  { text: 'ПАО', code: '4TYO', kind: 'a' },
  { text: 'PAO', code: '4TYO', kind: 'a' },
  { text: 'ОАО', code: 'MT3A', kind: 'a' },
  { text: 'OAO', code: 'MT3A', kind: 'a' },
  { text: 'ЗАО', code: 'JZBN', kind: 'a' },
  { text: 'ZAO', code: 'JZBN', kind: 'a' },
  { text: 's.r.o.', code: '9HLU', kind: 'a' },
  { text: 'a.s.', code: '6CQN', kind: 'a' },
  { text: 's.r.o.', code: 'VSZS', kind: 'a' },
  { text: 'a.s.', code: '2EEG', kind: 'a' },
  { text: 'Lda.', code: 'USOG', kind: 'a' },
  { text: 'Limitada', code: 'USOG', kind: 'a' },
  { text: 'S.A.', code: 'DFE5', kind: 'a' },
  { text: 'v. v. i.', code: 'CIO8', kind: 'a' },
  { text: 'K.K.', code: 'T417', kind: 'a' },
  { text: 'Kabushiki Kaisha', code: 'T417', kind: 'n' },
  { text: 'G.K.', code: '7QQ0', kind: 'a' },
  { text: 'Godo Kaisha', code: '7QQ0', kind: 'n' },
  { text: 'S.C.C.', code: 'SS0L', kind: 'a' },
  { text: 'C.C.', code: 'SS0L', kind: 'a' },
  { text: 'S. Coop. de Crédito', code: 'SS0L', kind: 'a' },
  { text: 'Sociedad Cooperativa de Crédito', code: 'SS0L', kind: 'n' },
  { text: 'S.C.C.V.', code: 'SS0L', kind: 'a' },
  { text: 'C.C.V.', code: 'SS0L', kind: 'a' },
  { text: 'S.C.A.C.', code: 'SS0L', kind: 'a' },
  { text: 'S.A.U.', code: '5RDO', kind: 'a' },
  { text: 'DAC', code: 'LGWG', kind: 'a' },
  { text: 'Sociedad Limitada', code: 'DP3Q', kind: 'n' },
];
