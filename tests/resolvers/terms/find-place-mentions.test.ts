/**
 * Governing-law and venue places are listed among a contract's non-parties (issue 16 item 1). Invented passages;
 * the framing ("laws of", "courts of") is common practice; place names are ISO 3166 names via package iso-3166.
 */
import { describe, expect, it } from 'vitest';
import { findPlaceMentions } from '../../../resolvers/terms/find-place-mentions.ts';
import { parseParties, resolveInContract } from '../../../resolvers/terms/index.ts';

describe('findPlaceMentions', () => {
  it('finds the place after "laws of" and "courts of", as written', () => {
    expect(findPlaceMentions('This Agreement is governed by the laws of the State of New York, without regard to conflicts.')).toEqual([
      'the State of New York',
    ]);
    expect(findPlaceMentions('governed by the laws of England and Wales; the courts of England and Wales have jurisdiction.')).toEqual(['England and Wales']);
    expect(findPlaceMentions('subject to the non-exclusive jurisdiction of the courts of New South Wales.')).toEqual(['New South Wales']);
    expect(findPlaceMentions('This agreement is subject to the laws of the Netherlands.')).toEqual(['the Netherlands']);
  });

  it('finds nothing where no place follows', () => {
    expect(findPlaceMentions('the laws of physics and the courts of public opinion')).toEqual([]);
    expect(findPlaceMentions('in accordance with the laws of Qorvania Trading')).toEqual([]);
  });

  it('a place mention resolves to not_a_party inside the contract', () => {
    const text =
      'This Supply Agreement is made between Harnwick Data LLC, a New York limited liability company ("Vendor"), and Tolliver Pike Logistics, Inc., a Delaware corporation ("Buyer"). It is governed by the laws of the State of New York.';
    const parsed = parseParties(text);
    expect(parsed.notParties).toContain('the State of New York');
    expect(resolveInContract(parsed, 'the State of New York').status).toBe('not_a_party');
    expect(resolveInContract(parsed, 'New South Wales').status).toBe('not_a_party');
    expect(resolveInContract(parsed, 'the Controller').status).toBe('unbound_term');
    expect(resolveInContract(parsed, 'this Agreement').status).toBe('not_a_party');
  });
});
