import levenshtein from 'fast-levenshtein';
import { describe, expect, it } from 'vitest';
import { seededRandom } from '../../../resolvers/prng.ts';
import { VARIANT_KINDS } from '../../../services/demo/corrupt.ts';
import { keyboardTypo } from '../../../services/demo/variants/keyboard-typo.ts';
import { generateNames, MAX_NAMES } from '../../../services/demo/generate-names.ts';
import { DEFAULT_MIX } from '../../../services/demo/name-mix.ts';
import type { GeneratedNameRow } from '../../../services/demo/generated-name-row.ts';

const rows = [...generateNames(20_000, 11)];
const originals = new Map(rows.filter((r) => r.variantKind === 'original').map((r) => [r.entityId, r]));

function words(s: string): string[] {
  return s.replaceAll(',', '').split(' ').filter(Boolean);
}

describe('generateNames', () => {
  it('yields exactly the number asked for, the same rows for a seed and other rows for another seed', () => {
    expect(rows).toHaveLength(20_000);
    expect([...generateNames(20_000, 11)]).toEqual(rows);
    const other = [...generateNames(2_000, 12)];
    expect(other.map((r) => r.name)).not.toEqual(rows.slice(0, 2_000).map((r) => r.name));
    expect([...generateNames(0, 1)]).toEqual([]);
  });

  it('gives every row an entity whose original is in the output, and one original per entity', () => {
    const count = new Map<string, number>();
    for (const r of rows) if (r.variantKind === 'original') count.set(r.entityId, (count.get(r.entityId) ?? 0) + 1);
    for (const n of count.values()) expect(n).toBe(1);
    for (const r of rows) expect(originals.has(r.entityId), r.entityId).toBe(true);
    // Originals of different entities are different names (siblings differ in legal form or jurisdiction).
    const key = (r: GeneratedNameRow): string => `${r.name}|${r.country}`;
    expect(new Set([...originals.values()].map(key)).size).toBe(originals.size);
  });

  it('mixes originals and variants as documented (docs/generator.md)', () => {
    const mean = DEFAULT_MIX.variantsPerEntity.reduce((a, p, n) => a + p * n, 0);
    const share = originals.size / rows.length;
    // Expected share of originals ≈ 1 / (1 + mean variants); duplicates and inapplicable kinds lower the mean a little.
    expect(share).toBeGreaterThan(1 / (1 + mean) - 0.02);
    expect(share).toBeLessThan(1 / (1 + mean) + 0.06);
    const kinds = new Set(rows.flatMap((r) => (r.variantKind === 'original' ? [] : r.variantKind.split('+'))));
    for (const k of kinds) expect(VARIANT_KINDS as readonly string[]).toContain(k);
    for (const k of VARIANT_KINDS) expect(kinds, k).toContain(k);
    expect(rows.some((r) => r.variantKind.includes('+'))).toBe(true);
  });

  it('makes each single-kind variant the kind of change it claims', () => {
    for (const r of rows) {
      if (r.variantKind === 'original' || r.variantKind.includes('+')) continue;
      const o = originals.get(r.entityId)!;
      expect(r.name, r.variantKind).not.toBe(o.name);
      expect(r.country).toBe(o.country);
      switch (r.variantKind) {
        case 'case':
          // Upper-case both: "ß" upper-cases to "SS" (Unicode SpecialCasing), and a lower-cased "SS" stays "ss".
          expect(r.name.toUpperCase()).toBe(o.name.toUpperCase());
          break;
        case 'keyboard_typo':
          // One keystroke: insert, delete, substitute (distance 1) or swap of neighbours (distance 2).
          expect(levenshtein.get(r.name, o.name)).toBeLessThanOrEqual(2);
          break;
        case 'token_swap':
          expect([...words(r.name)].sort()).toEqual([...words(o.name)].sort());
          break;
        case 'token_drop':
          expect(words(r.name).length).toBeLessThan(words(o.name).length);
          break;
        case 'whitespace':
          expect(r.name.replaceAll(' ', '')).toBe(o.name.replaceAll(' ', ''));
          break;
        case 'punctuation':
          expect(r.name.replace(/[.,&]|\band\b/g, '').replaceAll(' ', '')).toBe(o.name.replace(/[.,&]|\band\b/g, '').replaceAll(' ', ''));
          break;
      }
    }
  });

  it('plants siblings: same words, another legal form or jurisdiction, a different entity', () => {
    const siblings = rows.filter((r) => r.siblingOf);
    expect(siblings.length).toBeGreaterThan(50);
    for (const s of siblings) {
      const of = originals.get(s.siblingOf!);
      if (!of) continue; // its sibling's original may lie beyond the cut-off of 20,000 rows
      expect(s.entityId).not.toBe(of.entityId);
      expect(`${s.name}|${s.country}`).not.toBe(`${of.name}|${of.country}`);
      expect(s.name.split(' ')[0]).toBe(of.name.split(' ')[0]);
    }
  });

  it('streams: the first rows of the largest allowed run come without building the run', () => {
    const it = generateNames(MAX_NAMES, 3);
    const first = Array.from({ length: 10 }, () => it.next().value as GeneratedNameRow);
    expect(first.every((r) => r.name.length > 0)).toBe(true);
  });

  it('rejects a count outside 0…MAX_NAMES with a message naming the limit', () => {
    expect(() => generateNames(MAX_NAMES + 1, 1).next()).toThrow(/names: expected a whole number from 0 to 10000000/);
    expect(() => generateNames(-1, 1).next()).toThrow(/names/);
    expect(() => generateNames(1.5, 1).next()).toThrow(/names/);
  });
});

describe('keyboardTypo', () => {
  it('only ever uses a neighbouring QWERTY key when it substitutes or inserts', () => {
    // Neighbours of "s" on a QWERTY keyboard: a, w, e, d, x, z (common practice).
    const rnd = seededRandom(5);
    for (let i = 0; i < 200; i++) {
      const out = keyboardTypo('ss', rnd)!;
      for (const ch of out.slice(1)) expect('awedxzs').toContain(ch);
    }
  });
});
