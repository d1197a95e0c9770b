/**
 * COPY's text format as db/queries/copy-rows.ts writes it. Source of the expected fields: the PostgreSQL 15 manual,
 * COPY, "Text Format" (\N for null; backslash, newline, carriage return and tab written as \\, \n, \r, \t; any other
 * character as itself) and "Array Value Input" ({1,2,3}). The round trip through a real COPY, with hostile names,
 * is in tests/services/register/bulk-load.test.ts.
 */
import { describe, expect, it } from 'vitest';
import { copyField, copyLine, escapeCopyText, jsonText } from '../../db/queries/copy-rows.ts';

describe('COPY text fields', () => {
  it('writes null and undefined as \\N, and a text "\\N" escaped so that it stays text', () => {
    expect(copyField(null, false, 't.c')).toBe('\\N');
    expect(copyField(undefined, false, 't.c')).toBe('\\N');
    expect(copyField('\\N', false, 't.c')).toBe('\\\\N');
    expect(copyField('NULL', false, 't.c')).toBe('NULL');
  });

  it('escapes backslash, newline, carriage return and tab, and leaves other characters as they are', () => {
    expect(escapeCopyText('a\tb\nc\rd\\e', 't.c')).toBe('a\\tb\\nc\\rd\\\\e');
    expect(escapeCopyText('\\.', 't.c')).toBe('\\\\.');
    expect(escapeCopyText('Zürcher 𝔘𝔫𝔦𝔬𝔫 😀 "q" \'s\' ,;|', 't.c')).toBe('Zürcher 𝔘𝔫𝔦𝔬𝔫 😀 "q" \'s\' ,;|');
  });

  it('refuses U+0000 naming the column (PostgreSQL text cannot hold it)', () => {
    expect(() => escapeCopyText('a\u0000b', 'counterparty.canonical_name')).toThrow(/counterparty\.canonical_name: .*U\+0000/);
  });

  it('writes numbers, booleans, dates and integer arrays in the forms the server reads', () => {
    expect(copyField(42, false, 't.c')).toBe('42');
    expect(copyField(true, false, 't.c')).toBe('t');
    expect(copyField(false, false, 't.c')).toBe('f');
    expect(copyField(new Date('2026-03-04T05:06:07.089Z'), false, 't.c')).toBe('2026-03-04T05:06:07.089Z');
    expect(copyField([3, 1, 2], false, 't.c')).toBe('{3,1,2}');
    expect(copyField([], false, 't.c')).toBe('{}');
    expect(() => copyField(Number.NaN, false, 't.c')).toThrow(/t\.c/);
    expect(() => copyField(['a'], false, 't.c')).toThrow(/t\.c/);
    expect(() => copyField({ a: 1 }, false, 't.c')).toThrow(/t\.c/);
  });

  it('writes a JSON column as its JSON text, escaped like any text', () => {
    expect(copyField({ name: 'a\tb', n: [1, null] }, true, 't.payload')).toBe('{"name":"a\\\\tb","n":[1,null]}');
    expect(copyField({ path: 'C:\\x' }, true, 't.payload')).toBe('{"path":"C:\\\\\\\\x"}');
  });

  it('writes a lone surrogate in JSON as U+FFFD (jsonb refuses the escape JSON.stringify gives it)', () => {
    expect(jsonText({ name: 'x\ud800y' })).toBe('{"name":"x\ufffdy"}');
    expect(jsonText({ name: '😀' })).toBe('{"name":"😀"}');
  });

  it('joins fields with tabs and ends the line', () => {
    expect(copyLine(['1', '\\N', 'a\\tb'])).toBe('1\t\\N\ta\\tb\n');
  });
});
