/**
 * Initials are whole characters: a word that starts with a character outside the Basic Multilingual Plane (two
 * UTF-16 units in JavaScript strings, ECMAScript's String type) gives that character, never half of it. Half of
 * one is no text: the database refuses it inside JSON, and a blocking key holding it failed a whole write.
 * Names are invented.
 */
import { describe, expect, it } from 'vitest';
import { initialsOf } from '../../../resolvers/compare/index.ts';
import { acronymKeys } from '../../../resolvers/block/index.ts';

describe('initials of words outside the Basic Multilingual Plane', () => {
  it('take the whole first character of each word', () => {
    expect(initialsOf(['𝖲ervo', 'delmar'], true)).toBe('𝖲d');
    expect(initialsOf(['𔔜', '⛥', 'ꕉ'], true)).toBe('𔔜⛥ꕉ');
  });

  it('give acronym keys that are well-formed text', () => {
    for (const key of acronymKeys(['𔔜⛥', '𝖲𐙠', 'ဋ'])) expect((key as unknown as { isWellFormed(): boolean }).isWellFormed(), key).toBe(true);
  });
});
