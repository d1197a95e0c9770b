/** Bad input gets an empty result with a reason: never a crash, never a party invented from nothing. */
import { describe, expect, it } from 'vitest';
import { MAX_CONTRACT_BYTES, parseParties } from '../../../resolvers/terms/index.ts';

describe('parseParties on bad input', () => {
  it.each([
    ['empty text', '', 'empty_text'],
    ['whitespace only', ' \n\t \r\n', 'empty_text'],
    ['prose with no parties', 'The weather in the valley was mild for most of the year, and the river ran clear.', 'no_parties_found'],
    ['terms that bind nothing', 'This Agreement (the "Agreement") starts on the Effective Date (the "Effective Date").', 'no_parties_found'],
    ['role words only', 'The Licensee shall pay the Licensor (each a "Party").', 'no_parties_found'],
    ['NUL bytes', 'Qorv Ltd ("Qorv")\u0000\u0000binary', 'binary_data'],
    ['control characters', `Qorv Ltd ("Qorv") ${'\u0001\u0002\u0003'.repeat(20)}`, 'binary_data'],
  ])('%s', (_label, text, code) => {
    const r = parseParties(text);
    expect(r.parties).toEqual([]);
    expect(r.collectiveTerms).toEqual([]);
    expect(r.reason?.code).toBe(code);
    expect(r.reason?.message.length).toBeGreaterThan(10);
  });

  it('refuses text over 1 MB and names the limit', () => {
    const text = `between Qorv Ltd ("Qorv") and ${'x'.repeat(MAX_CONTRACT_BYTES)}`;
    const r = parseParties(text);
    expect(r.parties).toEqual([]);
    expect(r.reason?.code).toBe('too_large');
    expect(r.reason?.message).toContain('1 MB');
    expect(r.reason?.message).toContain(String(MAX_CONTRACT_BYTES));
  });

  it('counts the limit in UTF-8 bytes, not characters', () => {
    // 'é' is 2 bytes in UTF-8 (RFC 3629): 600,000 of them are 1,200,000 bytes, over the limit.
    expect(parseParties('é'.repeat(600_000)).reason?.code).toBe('too_large');
  });

  it('does not throw on a non-string at run time', () => {
    const r = parseParties(undefined as unknown as string);
    expect(r.parties).toEqual([]);
    expect(r.reason?.code).toBe('empty_text');
  });
});
