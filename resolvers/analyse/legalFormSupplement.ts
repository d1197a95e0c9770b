/**
 * Designators in everyday use that the ISO 20275 ELF list v1.5 does not spell out, each mapped to the ELF
 * code it stands for. Added to the table by buildElfTable so the committed table stays reproducible.
 * - FR "SARL" / "Société à responsabilité limitée": the list has only the long name with "(sans autre
 *   indication)" and no abbreviation for V9QP (SOURCES.md §2, "No abbreviation for FR SARL"); the short
 *   forms are common practice.
 * - RU ООО / АО / ПАО / ОАО / ЗАО and their Latin transliterations: the RU rows of v1.5 carry plural category
 *   names and no abbreviations; the mapping of each abbreviation to its row is from memory (Civil Code of the
 *   Russian Federation, arts. 87 and 96–97: limited liability company, joint-stock company, public/non-public).
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
];
