/**
 * rowsJson (db/queries/state-writes.ts) writes a lone surrogate as U+FFFD and everything else as JSON.stringify
 * does. Reference for the replacement: ECMA-262 (ES2024) String.prototype.toWellFormed, which replaces each lone
 * surrogate with U+FFFD; and JSON.stringify escapes only lone surrogates (ES2019 well-formed JSON.stringify), a
 * pair is written as the character itself. Names are invented.
 */
import { describe, expect, it } from 'vitest';
import { rowsJson } from '../../db/queries/state-writes.ts';

describe('rowsJson', () => {
  it('writes plain rows exactly as JSON.stringify does', () => {
    const rows = [
      { id: 1, name: 'Quellbrook Textiles Ltd', evidence: { summary: 'a "quoted" word', list: [1, null, true] } },
      { id: 2, name: 'Ørsted-Ænlund 𝔸 GmbH', evidence: null },
    ];
    expect(rowsJson(rows)).toBe(JSON.stringify(rows));
  });

  it('writes a lone surrogate, high or low, top level or nested, as U+FFFD', () => {
    const rows = [{ id: 1, name: 'Tarn\uD835wick', evidence: { names: ['\uDC00Velm', 'ok'] } }];
    expect(JSON.parse(rowsJson(rows))).toEqual([{ id: 1, name: 'Tarn\uFFFDwick', evidence: { names: ['\uFFFDVelm', 'ok'] } }]);
  });

  it('keeps a pair whole and a reversed pair as two replacements', () => {
    expect(JSON.parse(rowsJson([{ name: 'A\uD835\uDD38B' }]))).toEqual([{ name: 'A𝔸B' }]);
    expect(JSON.parse(rowsJson([{ name: 'A\uDD38\uD835B' }]))).toEqual([{ name: 'A\uFFFD\uFFFDB' }]);
  });

  it('leaves a name that spells a backslash-u escape as its text', () => {
    const rows = [{ name: 'Path \\ud800 Ltd' }, { name: 'Tarn\uD835wick' }];
    expect(JSON.parse(rowsJson(rows))).toEqual([{ name: 'Path \\ud800 Ltd' }, { name: 'Tarn\uFFFDwick' }]);
    expect(rowsJson([rows[0]!])).toBe(JSON.stringify([rows[0]]));
  });
});
