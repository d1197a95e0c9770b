/**
 * Hang catcher: inputs built to make regular expressions or naive scanners go quadratic or worse must still
 * finish. The ceiling is generous (seconds) on purpose: speed itself is measured in bench/analyse.bench.ts.
 * Every regular expression in resolvers/analyse is also linted by eslint-plugin-regexp (no super-linear backtracking).
 */
import { describe, expect, it } from 'vitest';
import { analyseName } from '../../../resolvers/analyse/index.ts';

const CEILING_MS = 5_000; // generous: only a hang (or catastrophic backtracking) gets near it

const ATTACKS: Array<[string, string]> = [
  ['a long word', 'a'.repeat(10_000) + '!'],
  ['open brackets', '('.repeat(10_000)],
  ['nested brackets', '('.repeat(5_000) + ')'.repeat(4_999)],
  ['dotted initials', 'a.'.repeat(5_000)],
  ['alias markers', 'x d/b/a '.repeat(1_250)],
  ['compound connectors', 'GmbH & Co. '.repeat(900) + 'KG'],
  ['spaces and commas', ' ,'.repeat(5_000) + 'Ltd'],
  ['designator tail', 'Limited '.repeat(1_250)],
  ['colons', 'By:'.repeat(3_300)],
  ['combining marks', 'e' + '\u0301'.repeat(9_999)],
  ['trailing groups', 'Qorv' + ' (x)'.repeat(2_400)],
  ['descriptor commas', 'Qorv' + ', a Delaware'.repeat(800) + ' corporation'],
  ['compound stacking', 'Qorv' + ' GmbH'.repeat(1_900) + ' KG'],
  ['Cyrillic prefix run', 'ООО '.repeat(2_400) + 'Ромашка'],
];

describe('adversarial inputs', () => {
  for (const [label, text] of ATTACKS) {
    it(`finishes on ${label} (${text.length} characters)`, () => {
      const started = performance.now();
      const a = analyseName(text);
      const elapsed = performance.now() - started;
      expect(a.input).toBe(text);
      expect(elapsed).toBeLessThan(CEILING_MS);
    });
  }
});
