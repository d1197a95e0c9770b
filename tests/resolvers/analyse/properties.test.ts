/**
 * Property tests (fast-check): analysis never throws on arbitrary Unicode up to 10,000 characters (issue 3),
 * normalisation is idempotent, and the original is always recoverable from the analysis.
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { analyseName, normaliseName } from '../../../resolvers/analyse/index.ts';

/**
 * Any UTF-16 string, lone surrogates included, up to 10,000 code units (issue 3 bound). `size: 'max'`: without it
 * fast-check's default size caps generated arrays at about ten items whatever maxLength says (issue 17).
 */
const anyUnits = fc.array(fc.integer({ min: 0, max: 0xffff }), { maxLength: 10_000, size: 'max' }).map((codes) => String.fromCharCode(...codes));
/** Any code points (astral planes included). */
const anyCodePoints = fc.string({ unit: 'binary', maxLength: 2_000, size: 'max' });
/** Name-like strings: words, designators, markers, brackets and punctuation mixed at random. */
const PIECES = [
  'Ltd',
  'GmbH',
  '&',
  'Co.',
  'KG',
  'S.A.',
  'de',
  'C.V.,',
  'd/b/a',
  'f/k/a',
  'trading as',
  '(',
  ')',
  'the',
  'Company',
  'ООО',
  '«',
  '»',
  'Mühlberg',
  'Muehlberg',
  'we',
  'By:',
  ',',
  '.',
  'Pty',
  'Inc.',
  'successor in interest to',
  'ß',
  'ǅ',
  '\u00a0',
  '\u0301',
  'a trading name of',
  'p.l.c.',
  'Iolo',
  'Brannock',
  '株式会社',
  '(SE)',
  '[',
  ']',
  "O'",
  '–',
];
const nameLike = fc.array(fc.constantFrom(...PIECES), { maxLength: 40, size: 'max' }).map((parts) => parts.join(' '));

const arbitrary = fc.oneof(anyUnits, anyCodePoints, nameLike);

describe('analyseName properties', () => {
  it('never throws and keeps the input verbatim, on inputs up to 10,000 code units', () => {
    const lengths: number[] = [];
    fc.assert(
      fc.property(arbitrary, (text) => {
        lengths.push(text.length);
        const a = analyseName(text);
        expect(a.input).toBe(text);
        expect(a.tokens.join(' ')).toBe(a.core);
        if (a.legalForm) expect(text.includes(a.legalForm.text)).toBe(true);
        for (const alias of a.aliases) expect(text.includes(alias.name)).toBe(true);
        for (const r of a.related) expect(text.includes(r.name)).toBe(true);
      }),
      { numRuns: 200, seed: 31 },
    );
    // The long inputs the title promises were really generated (with the default size the longest was about 10).
    expect(Math.max(...lengths)).toBeGreaterThan(8_000);
    expect(lengths.filter((n) => n > 1_000).length).toBeGreaterThan(20);
  });

  it('normalisation is idempotent', () => {
    fc.assert(
      fc.property(arbitrary, (text) => {
        const once = normaliseName(text);
        expect(normaliseName(once)).toBe(once);
      }),
      { numRuns: 300, seed: 32 },
    );
  });

  it('the normalised core is itself a fixed point of normalisation', () => {
    fc.assert(
      fc.property(nameLike, (text) => {
        const { core } = analyseName(text);
        expect(normaliseName(core)).toBe(core);
      }),
      { numRuns: 300 },
    );
  });
});
