/**
 * Property tests (fast-check): parsing never throws on arbitrary text up to 1 MB, and every party name it returns
 * stands verbatim in the input. Generated texts mix contract fragments with random characters so that parties
 * are actually found; the seed is fixed so a failure can be replayed.
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { MAX_CONTRACT_BYTES, parseParties, resolveInContract } from '../../../resolvers/terms/index.ts';
import type { ParsedContract } from '../../../resolvers/terms/index.ts';
import { oneLine } from '../../../resolvers/terms/parse-parties.ts';
import { CORPUS } from './corpus/contracts.ts';

/** Pieces of drafting (invented) that the parser reacts to, so random texts exercise every branch. */
const FRAGMENTS = [
  'between ',
  ' and ',
  ', ',
  '; ',
  '\n',
  '\n\n',
  '(',
  ')',
  '"',
  '“',
  '”',
  '„',
  '«',
  '»',
  "'",
  '‘',
  '’',
  'Qorv Widgets Ltd',
  'Brackenridge Fabrication, Inc.',
  'Holzner GmbH',
  'Tsubame K.K.',
  'Lumière SAS',
  ' (the "Licensee")',
  ' ("Supplier")',
  ' (hereinafter "Buyer")',
  ' (each a "Party" and together the "Parties")',
  ', a Delaware corporation',
  ', incorporated and registered in England and Wales with company number 04417782',
  ' HRB 20931',
  ' RCS Nantes 533 214 904',
  ' ACN 004 085 616',
  ' d/b/a Brightwater',
  ' f/k/a ',
  'BETWEEN:',
  'AND:',
  '(1) ',
  '(ii) ',
  '1. ',
  'The undersigned:',
  'By: ____',
  'Name: Jane Doe',
  'Title: CEO',
  'for and on behalf of ',
  'LICENSOR:',
  'im Folgenden „X“',
  'ci-après « le Client »',
  'this "Agreement"',
  '(Wattle)\n',
];

/** A whole party clause (cue, name, descriptive phrase, definition), so that parties are actually found. */
const clause = fc
  .tuple(
    fc.constantFrom('between ', ', and ', '\n(1) ', '\nAND:\n', 'by and among '),
    fc.constantFrom('Qorv Widgets Ltd', 'Brackenridge Fabrication, Inc.', 'Holzner GmbH', 'Osprey Data LLC', 'Rowan Ellery'),
    fc.constantFrom('', ', a Delaware corporation', ', a company incorporated in Sweden with organisation number 556410-2712', ' ACN 004 085 616'),
    fc.constantFrom(' (the "Licensee")', ' ("Supplier")', ' (hereinafter "Buyer")', ' ("Qorv", "we" or "us")', ''),
  )
  .map((parts) => parts.join(''));

// `size: 'max'`: fast-check's default size caps arrays and strings at about ten items whatever maxLength says, so
// contract-like texts had about ten pieces and the Unicode texts about ten characters (issue 17).
const contractLike = fc
  .array(fc.oneof(clause, fc.constantFrom(...FRAGMENTS), fc.string({ maxLength: 12, size: 'max' }), fc.string({ unit: 'binary', maxLength: 6, size: 'max' })), {
    maxLength: 120,
    size: 'max',
  })
  .map((parts) => parts.join(''));

function assertInvariants(text: string, parsed: ParsedContract): void {
  for (const p of parsed.parties) {
    // Verbatim, a line break inside a name read as one space (oneLine).
    expect(oneLine(text).includes(p.name), `party name ${JSON.stringify(p.name)} is not verbatim in the input`).toBe(true);
    expect(p.name.trim()).toBe(p.name);
    expect(p.name.length).toBeGreaterThan(0);
  }
  for (const c of parsed.collectiveTerms) for (const n of c.parties) expect(parsed.parties.some((p) => p.name === n)).toBe(true);
  if (parsed.parties.length === 0) expect(parsed.reason).toBeDefined();
}

describe('parseParties properties', () => {
  it('never throws on arbitrary Unicode up to 2,000 code points and returns only verbatim names', () => {
    const lengths: number[] = [];
    fc.assert(
      fc.property(fc.string({ unit: 'binary', maxLength: 2000, size: 'max' }), (text) => {
        lengths.push([...text].length);
        assertInvariants(text, parseParties(text));
      }),
      { numRuns: 300, seed: 20260401 },
    );
    // Long texts were really generated (with the default size the longest was about ten characters).
    expect(Math.max(...lengths)).toBeGreaterThan(1_500);
  });

  it('never throws on contract-like text and returns only verbatim names', () => {
    let longest = 0;
    fc.assert(
      fc.property(contractLike, (text) => {
        longest = Math.max(longest, text.length);
        const parsed = parseParties(text);
        assertInvariants(text, parsed);
        // Resolution never throws either, and never binds a term the contract does not define.
        const r = resolveInContract(parsed, 'the Licensee');
        if (r.status === 'bound') expect(parsed.parties.some((p) => p.terms.includes('Licensee'))).toBe(true);
      }),
      { numRuns: 400, seed: 20260402 },
    );
    // Up to 120 pieces of up to ~150 characters: texts of thousands of characters, not a handful of pieces.
    expect(longest).toBeGreaterThan(2_000);
  });

  it('finds parties on some generated texts (the property above is not vacuous)', () => {
    const samples = fc.sample(contractLike, { numRuns: 200, seed: 20260403 });
    const withParties = samples.filter((t) => parseParties(t).parties.length > 0).length;
    expect(withParties).toBeGreaterThan(10);
  });

  it('never throws on texts up to 1 MB and keeps names verbatim', () => {
    fc.assert(
      fc.property(contractLike, fc.integer({ min: 1, max: 4 }), (seedText, quarter) => {
        // Grow the generated text (plus a corpus passage) to up to 1 MB: quarter × 256 KiB.
        const target = Math.min(MAX_CONTRACT_BYTES, quarter * 256 * 1024) - 8;
        const unit = `${seedText}\n${CORPUS[quarter % CORPUS.length]?.text ?? ''}\n`;
        let text = unit.repeat(Math.max(1, Math.floor(target / Math.max(1, unit.length))));
        while (new TextEncoder().encode(text).length > MAX_CONTRACT_BYTES) text = text.slice(0, Math.floor(text.length * 0.9));
        const parsed = parseParties(text);
        expect(parsed.reason?.code).not.toBe('too_large');
        assertInvariants(text, parsed);
      }),
      { numRuns: 6, seed: 20260404 },
    );
  }, 120_000);
});
