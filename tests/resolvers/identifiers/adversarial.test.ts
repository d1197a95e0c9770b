import { describe, expect, it } from 'vitest';
import { IDENTIFIER_SCHEMES } from '../../../resolvers/vocabulary.ts';
import { compareIdentifiers, normaliseAddress, normaliseIdentifier } from '../../../resolvers/identifiers/index.ts';

// Untrusted input: long, repetitive strings that make backtracking regular expressions or quadratic loops
// explode. The ceiling only catches hangs (seconds); speed is measured in bench/, not here.
const HANG_CEILING_MS = 5_000;
const nasty = [
  ' '.repeat(50_000) + 'x',
  'a.'.repeat(25_000),
  'HRB '.repeat(10_000),
  '1-'.repeat(25_000) + '!',
  'www.'.repeat(10_000) + 'example',
  '@'.repeat(20_000),
  'ab'.repeat(25_000),
  'RCS '.repeat(10_000) + '732 829 320',
  'vat vat vat '.repeat(5_000),
];

describe('no hang on hostile input', () => {
  it.each(nasty.map((s) => [s.slice(0, 12), s] as const))('normaliseIdentifier, every scheme: %s…', (_, value) => {
    const started = performance.now();
    for (const scheme of IDENTIFIER_SCHEMES) {
      const r = normaliseIdentifier({ scheme, value, label: 'x' }, { defaultCountry: 'GB' });
      expect(typeof r.ok).toBe('boolean');
    }
    compareIdentifiers([{ scheme: 'other', value, label: 'x' }], [{ scheme: 'phone', value }], { addresses: { a: value, b: value } });
    normaliseAddress(value);
    expect(performance.now() - started).toBeLessThan(HANG_CEILING_MS);
  });
});
