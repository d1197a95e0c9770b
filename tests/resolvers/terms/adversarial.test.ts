/**
 * Adversarial 1 MB inputs built to make scanners or regular expressions backtrack: runs of parentheses, quotes,
 * cue words, signature labels, definitions and names. The ceiling only catches hangs (seconds, generous for a
 * loaded machine); speed itself is measured in bench/terms.bench.ts.
 */
import { describe, expect, it } from 'vitest';
import { MAX_CONTRACT_BYTES, parseParties } from '../../../resolvers/terms/index.ts';
import { grow } from './support.ts';
import { oneLine } from '../../../resolvers/terms/parse-parties.ts';

const HANG_CEILING_MS = 30_000;

function fill(unit: string): string {
  return unit.repeat(Math.floor((MAX_CONTRACT_BYTES - 16) / new TextEncoder().encode(unit).length));
}

const INPUTS: Array<[string, string]> = [
  ['open parentheses', fill('(')],
  ['empty parenthesis pairs', fill('()')],
  ['straight quotes', fill('"')],
  ['single quotes and letters', fill("'a")],
  ['one definition repeated', fill('Qorv Ltd ("A") ')],
  ['a parties clause repeated', fill('between Qorv Ltd, a Delaware corporation (the "Licensee"), and ')],
  ['"between" repeated', fill('between ')],
  ['signature labels', fill('By: x\n')],
  ['signature blocks', fill('QORV LIMITED\nBy: ___\nName: A B\nTitle: C\n')],
  ['collective cues', fill('each "a" ')],
  ['hereinafter chains', fill('hereinafter "X" or "Y" ')],
  ['capitalised words, no punctuation', fill('Qorv ')],
  ['numbering', fill('(1) ')],
  ['nested definitions', fill('(a "b" ')],
  ['alias cues', fill('Qorv Ltd d/b/a ')],
  ['clause openers', fill('BETWEEN:\n(1) A\n')],
  ['unquoted terms', fill('Qorv Ltd (Qorv)\n')],
  ['on-behalf lines', fill('for and on behalf of QORV LTD\n')],
  ['identifier cues', fill('company number 1 HRB RCS ACN ')],
  ['one line without spaces', fill('x')],
  ['one party, a new term each time', grow((i) => `Qorv Ltd ("A${i}") `)],
  ['many parties and collective terms', grow((i) => `between Qorv${i % 700} Ltd ("A${i % 700}") and Beta${i} Ltd (each a "P${i}") `)],
];

describe('parseParties on adversarial 1 MB inputs', () => {
  it.each(INPUTS)(
    '%s: finishes well under the hang ceiling',
    (_label, text) => {
      expect(new TextEncoder().encode(text).length).toBeLessThanOrEqual(MAX_CONTRACT_BYTES);
      expect(text.length).toBeGreaterThan(MAX_CONTRACT_BYTES / 8);
      const started = Date.now();
      const parsed = parseParties(text);
      expect(Date.now() - started).toBeLessThan(HANG_CEILING_MS);
      for (const p of parsed.parties) expect(oneLine(text).includes(p.name)).toBe(true);
    },
    HANG_CEILING_MS * 2,
  );

  it('terms beyond 50 per party are counted in a warning, not dropped silently', () => {
    let text = '';
    for (let i = 0; i < 80; i++) text += `Qorv Ltd ("A${i}") `;
    const parsed = parseParties(text);
    expect(parsed.parties).toHaveLength(1);
    expect(parsed.parties[0]?.terms).toHaveLength(50);
    expect(parsed.warnings?.[0]).toContain('30 more defined terms');
  });

  it(
    'many distinct parties: capped at 500 with a warning, not dropped silently',
    () => {
      let text = '';
      for (let i = 0; text.length < 200_000; i++) text += `between Qorv${i} Ltd ("A${i}") and `;
      const parsed = parseParties(text);
      expect(parsed.parties).toHaveLength(500);
      expect(parsed.warnings?.[0]).toContain('limit of 500');
    },
    HANG_CEILING_MS * 2,
  );
});
