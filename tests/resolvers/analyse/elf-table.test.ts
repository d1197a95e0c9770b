/**
 * The committed legal-form table is exactly what scripts/build-elf-table.ts produces from the ELF CSV, and the
 * builder handles the quirks of v1.5 listed in ../shared/reference/SOURCES.md §2.
 */
import { existsSync, readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { analyseName, designatorKey } from '../../../resolvers/analyse/index.ts';
import { buildElfTable, compoundFamily, parseElfRows, serialiseElfTable, splitAbbreviations } from '../../../resolvers/analyse/build-elf-table.ts';

// Resolved from this file, not the working directory: run from elsewhere, a relative path turned the checks below
// into skips (issue 17). The worktree sits beside ../shared.
const CSV = fileURLToPath(new URL('../../../../shared/reference/iso20275-elf-code-list.csv', import.meta.url));
const present = existsSync(CSV);

describe('splitAbbreviations (quirks from SOURCES.md §2)', () => {
  it('splits on semicolons', () => {
    // SOURCES.md §2, AU TXVC: "Proprietary Limited;Proprietary Ltd;Pty Limited;PTY LTD;…"
    expect(splitAbbreviations('Proprietary Limited;Pty Ltd;PTY. LTD.', 'AU')).toEqual(['Proprietary Limited', 'Pty Ltd', 'PTY. LTD.']);
  });
  it('splits US rows on commas as well', () => {
    // SOURCES.md §2: US rows "RLLP, LLP, R.L.L.P., L.L.P." and "company, co.;corporation;corp.;incorporated;inc."
    expect(splitAbbreviations('RLLP, LLP, R.L.L.P., L.L.P.', 'US')).toEqual(['RLLP', 'LLP', 'R.L.L.P.', 'L.L.P.']);
    expect(splitAbbreviations('company, co.;corporation;corp.;incorporated;inc.', 'US')).toEqual([
      'company',
      'co.',
      'corporation',
      'corp.',
      'incorporated',
      'inc.',
    ]);
  });
  it('keeps a comma that belongs to one form outside the US', () => {
    // SOURCES.md §2: MX "S.A. de C.V., SOFOM E.N.R." is one form.
    expect(splitAbbreviations('S.A. de C.V., SOFOM E.N.R.', 'MX')).toEqual(['S.A. de C.V., SOFOM E.N.R.']);
  });
  it('drops a stray trailing comma and trailing no-break spaces', () => {
    // SOURCES.md §2: HU X0SX "tksz,;hsz."; LU 5GGB "SA\u00a0".
    expect(splitAbbreviations('tksz,;hsz.', 'HU')).toEqual(['tksz', 'hsz.']);
    expect(splitAbbreviations('SA\u00a0', 'LU')).toEqual(['SA']);
  });
  it('gives a compound joined by "& Co." the family of its last designator', () => {
    // Issue 3: "X GmbH & Co. KG" is a KG. DE 8Z6G lists "GmbH & Co. KG" (ELF v1.5).
    expect(compoundFamily('GmbH & Co. KG')).toBe('kg');
    expect(compoundFamily('AG & Co. KGaA')).toBe('kgaa');
    expect(compoundFamily('GmbH')).toBeUndefined();
  });
});

describe.skipIf(!present)('the committed table (needs ../shared/reference)', () => {
  const csv = present ? readFileSync(CSV, 'utf8') : '';

  it('reads the file with its byte-order mark: 3,819 rows, 3,430 codes', () => {
    const rows = parseElfRows(csv);
    expect(rows.length).toBe(3819); // SOURCES.md §2: 1 header and 3,819 data rows
    expect(new Set(rows.map((r) => r.code)).size).toBe(3430); // SOURCES.md §2: 3,430 distinct ELF codes
    expect(rows[0]?.code).toBe('8888'); // first data row of v1.5; the BOM would otherwise break the header
  });

  it('equals the output of scripts/build-elf-table.ts', () => {
    const committed = readFileSync(new URL('../../../resolvers/analyse/elf-table.json', import.meta.url), 'utf8');
    expect(committed).toBe(serialiseElfTable(buildElfTable(csv)));
  });

  it('carries the worked examples', () => {
    const table = buildElfTable(csv);
    // worked-examples.json → iso20275_elf_examples (ELF v1.5 rows)
    expect(table.forms['gmbh']?.[2].split(' ')).toContain('2HBR');
    expect(table.forms['ltd']?.[2].split(' ')).toContain('H0PO');
    expect(table.forms['cyf']?.[2]).toBe('H0PO');
    expect(table.forms['plc']?.[2].split(' ')).toContain('B6ES');
    expect(table.forms['bv']?.[2].split(' ')).toContain('54M6');
    expect(table.forms['ptyltd']?.[2].split(' ')).toContain('TXVC');
    expect(table.forms['sa']?.[2].split(' ')).toEqual(expect.arrayContaining(['QVPB', 'MVII', '5GGB']));
    expect(table.forms['株']?.[2]).toBe('T417');
    expect(table.codes['XTIQ']).toBe('US-DE');
    // FR SARL V9QP has no abbreviation in v1.5 (SOURCES.md §2); "SARL" comes from legal-form-supplement.ts (common practice).
    expect(table.forms['sarl']?.[2].split(' ')).toContain('V9QP');
    expect(table.about).toContain('CC0');
    // SOURCES.md §2 quirks: Cyrillic left in a "transliterated" field (BY AABD "ТАА") and the "kr" language code
    // (KR 5RCH 주식회사, transliterated "JuSikHoeSa"): script and language are not used, the designators still count.
    expect(table.forms['таа']?.[2]).toBe('AABD');
    expect(table.forms[designatorKey('주식회사')]?.[2]).toBe('5RCH'); // keys are folded (Hangul decomposes to jamo)
    expect(table.forms['jusikhoesa']?.[2]).toBe('5RCH');
    // Trailing NBSP (LU 5GGB "SA\u00a0"): the code sits under the plain key.
    expect(table.forms['sa']?.[2].split(' ')).toContain('5GGB');
    // US comma-separated rows (OK OJDX "RLLP, LLP, R.L.L.P., L.L.P."): each piece is a key of its own.
    expect(table.forms['rllp']?.[2].split(' ')).toContain('OJDX');
    expect(table.forms['llp']?.[2].split(' ')).toContain('OJDX');
    // MX HKWO "S.A. de C.V., SOFOM E.N.R.": one key with the comma's parts together.
    expect(table.forms['sadecvsofomenr']?.[2]).toBe('HKWO');
    // ES DP3Q "Sociedad de Responsabilidad Limitada" (abbreviations "S.L.;S.R.L."): v1.5 writes its variants
    // "Sociedad Limitada …" (1G29, JB2M, R6UT); the short name comes from legal-form-supplement.ts and joins "S.L.".
    expect(table.forms['sociedadlimitada']).toEqual(['sl', 'n', 'DP3Q']);
    const a = analyseName('Zanthorpe Cerámica Sociedad Limitada'); // invented name
    expect(a.core).toBe('zanthorpe ceramica');
    expect(a.legalForm?.family).toBe(analyseName('Zanthorpe Cerámica S.L.').legalForm?.family);
  });
});
