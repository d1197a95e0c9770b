/**
 * Issue 18: the register stores each name's analysis in its compact form, and rebuildAnalysis gives back exactly
 * the analysis analyseName gives. Checked on every name of the LEI dev set (../shared/datasets/lei_org_names_dev.csv,
 * GLEIF LEI records, README there), each under its own country and under none, and on invented names that take the
 * rarer paths (a descriptor's place, a prefix form, a compound form, aliases, a transliteration, a non-party).
 */
import { readFileSync } from 'node:fs';
import { parse } from 'csv-parse/sync';
import { describe, expect, it } from 'vitest';
import { analyseName, compactAnalysis, rebuildAnalysis, type CompactAnalysis } from '../../../resolvers/analyse/index.ts';

function leiNames(): { name: string; country: string | null }[] {
  const text = readFileSync(new URL('../../../../shared/datasets/lei_org_names_dev.csv', import.meta.url), 'utf8');
  const rows = parse(text, { columns: true, skip_empty_lines: true }) as { name: string; country: string }[];
  return rows.map((r) => ({ name: r.name, country: r.country === '' ? null : r.country }));
}

const hintOf = (country: string | null) => (country ? { country } : undefined);
const roundTrip = (name: string, country: string | null) => {
  const fresh = analyseName(name, hintOf(country));
  const compact = compactAnalysis(name, country, fresh);
  // Stored as JSON and read back.
  const read = JSON.parse(JSON.stringify(compact)) as CompactAnalysis;
  return { fresh, compact, rebuilt: rebuildAnalysis(name, country, read) };
};

describe('compact stored analyses', () => {
  it('rebuild to the fresh analysis for every LEI dev name, under its country and under none, never by the fallback', () => {
    const names = leiNames();
    // 15,316 rows (the README of shared/datasets): the whole set is read.
    expect(names.length).toBe(15_316);
    let fullBytes = 0;
    let compactBytes = 0;
    const fellBack: string[] = [];
    for (const { name, country } of names) {
      for (const c of [country, null]) {
        const { fresh, compact, rebuilt } = roundTrip(name, c);
        expect(rebuilt, `${name} [${c}]`).toEqual(fresh);
        // Key order too: a rebuilt analysis prints as a fresh one (cpreg analyse, explanations).
        expect(JSON.stringify(rebuilt)).toBe(JSON.stringify(fresh));
        if (compact.x !== undefined || (compact.l !== undefined && 'e' in compact.l)) fellBack.push(`${name} [${c}]`);
        fullBytes += JSON.stringify(fresh).length;
        compactBytes += JSON.stringify(compact).length;
      }
    }
    expect(fellBack.slice(0, 10)).toEqual([]);
    // Measured 2026-12-05 on this set: 520 characters of JSON a name in full, 98 compact.
    expect(compactBytes / fullBytes).toBeLessThan(0.25);
  });

  it('rebuild the rarer paths too, by reference', () => {
    const cases: [string, string | null][] = [
      ['Brackenridge Fabrication, a Delaware corporation', null],
      ['Brackenridge Fabrication, a Delaware corporation', 'US'],
      ['Brackenridge Fab.', 'US'],
      ['UAB Qorvis Baltic', 'LT'],
      ['UAB Qorvis Baltic', null],
      ['Ostermark Fenster GmbH & Co. KG', 'DE'],
      ['Widmar sp. z o.o. sp.k.', 'PL'],
      ['Harlow Pumps Ltd d/b/a Harlow Water', 'GB'],
      ['Балтийский Кредит', 'RU'],
      ['Goldline (Europe) Ltd', 'GB'],
      ['Dr Hanna Velt', null],
      ['the Supplier', null],
      ['', null],
    ];
    for (const [name, country] of cases) {
      const { fresh, compact, rebuilt } = roundTrip(name, country);
      expect(rebuilt, name).toEqual(fresh);
      expect(compact.x, name).toBeUndefined();
    }
  });

  it('keep what no entry reproduces by writing it out, so a stored analysis always rebuilds to the one given', () => {
    // A legal form no table entry narrows to (an analysis as an older table made it): written out, still exact.
    const fresh = analyseName('Quillbury Anchors Ltd', { country: 'GB' });
    const odd = { ...fresh, legalForm: { ...fresh.legalForm!, elfCodes: ['ZZZZ'], jurisdictions: ['GB'] } };
    const compact = compactAnalysis('Quillbury Anchors Ltd', 'GB', odd);
    expect(compact.l).toEqual({ t: 'Ltd', f: 'ltd', e: ['ZZZZ'], u: ['GB'] });
    expect(rebuildAnalysis('Quillbury Anchors Ltd', 'GB', compact)).toEqual(odd);
    // Anything else the compact form cannot say: the whole analysis is kept.
    const strange = { ...fresh, tokens: ['quillbury', 'anchors', 'extra'] };
    const kept = compactAnalysis('Quillbury Anchors Ltd', 'GB', strange);
    expect(kept.x).toBeDefined();
    expect(rebuildAnalysis('Quillbury Anchors Ltd', 'GB', kept)).toEqual(strange);
  });
});
