/**
 * Formula-injection neutralisation of CSV cells. The trigger characters are those of the OWASP "CSV Injection"
 * guidance: =, +, -, @, tab (0x09) and carriage return (0x0D). Data columns are left alone: the identifiers
 * column writes `scheme:value`, so an E.164 phone (ITU-T E.164: "+" then digits) is not altered.
 */
import { describe, expect, it } from 'vitest';
import { neutralise } from '../../../services/export/neutralise.ts';
import { COLUMNS, csvLine } from '../../../services/export/exports.ts';

describe('CSV neutralisation', () => {
  it('prefixes an apostrophe to text starting with each OWASP trigger (OWASP CSV Injection)', () => {
    for (const trigger of ['=', '+', '-', '@', '\t', '\r']) {
      expect(neutralise(`${trigger}SUM(A1:A2)`)).toBe(`'${trigger}SUM(A1:A2)`);
    }
  });

  it('leaves other text alone, including triggers that are not first', () => {
    for (const text of ['Brackenridge Fabrication, Inc.', 'A=B Holdings', "'quoted", '', ' =SUM(1)']) expect(neutralise(text)).toBe(text);
    expect(neutralise(null)).toBe('');
  });

  it('neutralises only free-text columns: names yes, counts and identifiers no', () => {
    const line = csvLine(COLUMNS.register, {
      counterparty_id: 7,
      canonical_name: '=cmd|" /C calc"!A0',
      kind: 'organisation',
      jurisdiction: 'GB',
      names: '@SUM(1)',
      identifiers: 'phone:+442079460958; vat:GB980780684',
      mention_count: -1,
      contract_count: 0,
      version: 1,
      created_at: '2026-12-01T00:00:00.000Z',
      updated_at: '2026-12-01T00:00:00.000Z',
    });
    expect(line).toContain(`"'=cmd|"" /C calc""!A0"`);
    expect(line).toContain("'@SUM(1)");
    expect(line).toContain('phone:+442079460958; vat:GB980780684');
    expect(line).toContain(',-1,');
  });

  it('declares which columns are free text for every export', () => {
    const text = Object.fromEntries(Object.entries(COLUMNS).map(([kind, cols]) => [kind, cols.filter((c) => c.text).map((c) => c.name)]));
    expect(text).toEqual({
      register: ['canonical_name', 'names'],
      links: ['source', 'external_id', 'text', 'contract_source', 'contract_external_id', 'role', 'canonical_name', 'confirmed_by'],
      history: ['actor', 'reason', 'details'],
      review: ['mention_text', 'left_name', 'right_name', 'decided_by', 'reason'],
    });
  });
});
