/**
 * Small files: no tracked .ts or .js file (the console's hand-written pages are .js) outside tests/ is longer than
 * 300 lines (counted as `wc -l` counts them, by line ends). Landed migrations are never edited, so they are exempt
 * by folder; the other exemptions are listed below, each with its reason. The list only shrinks: an entry whose file
 * is gone or back under the limit fails the test.
 * To fix a failure, split the file one concept per module, named after its export.
 */
import { execFileSync } from 'node:child_process';
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';

const MAX_LINES = 300;

/** Landed migrations are never edited (a change is a new migration), whatever their length. */
const EXEMPT_FOLDERS = ['migrations/'];

const EXEMPT: { file: string; why: string }[] = [];

/** Lines as `wc -l` counts them: line ends. */
export function lineCount(text: string): number {
  let n = 0;
  for (let i = text.indexOf('\n'); i >= 0; i = text.indexOf('\n', i + 1)) n++;
  return n;
}

function trackedSources(): string[] {
  // Tracked files only, so node_modules (never tracked) is outside.
  return execFileSync('git', ['ls-files', '-z', '*.ts', '*.js'], { encoding: 'utf8' })
    .split('\0')
    .filter((f) => /\.(?:ts|js)$/.test(f) && !f.startsWith('tests/') && !EXEMPT_FOLDERS.some((d) => f.startsWith(d)));
}

function tooLong(files: readonly string[]): string[] {
  return files.flatMap((f) => {
    const n = lineCount(readFileSync(f, 'utf8'));
    return n > MAX_LINES ? [`${f}: ${n} lines`] : [];
  });
}

describe('file size', () => {
  it('counts lines as wc -l does (examples written for this test)', () => {
    expect(lineCount('')).toBe(0);
    expect(lineCount('one\ntwo\n')).toBe(2);
    expect(lineCount('one\ntwo')).toBe(1);
    expect(lineCount('\n'.repeat(301))).toBe(301);
  });

  it(`has no tracked source file over ${MAX_LINES} lines outside tests/ and the exemptions`, () => {
    const exempt = new Set(EXEMPT.map((e) => e.file));
    expect(tooLong(trackedSources().filter((f) => !exempt.has(f))), 'split these files, one concept per module').toEqual([]);
  });

  it('keeps no exemption that is no longer needed (so the list only shrinks)', () => {
    const tracked = new Set(trackedSources());
    const stale = EXEMPT.filter((e) => !tracked.has(e.file) || tooLong([e.file]).length === 0).map((e) => e.file);
    expect(stale).toEqual([]);
  });

  it('gives every exemption a reason', () => {
    expect(EXEMPT.filter((e) => e.why.trim().length === 0)).toEqual([]);
  });
});
