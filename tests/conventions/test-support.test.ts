/**
 * The test harness has one way to do each thing: a suite that needs PostgreSQL is declared with describePostgres,
 * a suite per backend with describeEachBackend / describeBackends (tests/support/database.ts), and a folder's
 * shared helpers live in its support.ts. This test reads the tracked test files and fails on the other forms.
 */
import { execFileSync } from 'node:child_process';
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';

/**
 * A suite registered or skipped by hand on the backends' availability, or a test (or suite) skipped or run on the
 * backend it is given (`it.skipIf(ctx.backend === 'pglite')`): PostgreSQL-only work is a describePostgres suite.
 */
const HAND_ROLLED_SKIP =
  /\?\s*describe\s*:\s*describe\.skip|\?\s*describe\.skip\s*:\s*describe|describe\.skipIf\(!?(?:isBackendAvailable|available|unavailable)|\b(?:it|test|describe)\.(?:skipIf|runIf)\([^)]*\bbackend\b/;

function trackedTestFiles(): string[] {
  return (
    execFileSync('git', ['ls-files', '-z', 'tests'], { encoding: 'utf8' })
      .split('\0')
      // tests/conventions holds the examples of the forms it rejects.
      .filter((f) => f.endsWith('.ts') && !f.startsWith('tests/support/') && !f.startsWith('tests/conventions/'))
  );
}

describe('one test harness', () => {
  it('recognises a hand-rolled skip (examples written for this test)', () => {
    expect(HAND_ROLLED_SKIP.test("(isBackendAvailable('postgres') ? describe : describe.skip)('x', () => {});")).toBe(true);
    expect(HAND_ROLLED_SKIP.test("describe.skipIf(!isBackendAvailable('postgres'))('x', () => {});")).toBe(true);
    expect(HAND_ROLLED_SKIP.test("(unavailable ? describe.skip : describe)('x', () => {});")).toBe(true);
    expect(HAND_ROLLED_SKIP.test("  it.skipIf(ctx.backend === 'pglite')('two pools', async () => {});")).toBe(true);
    expect(HAND_ROLLED_SKIP.test("  test.runIf(backend === 'postgres')('a killed child', async () => {});")).toBe(true);
    expect(HAND_ROLLED_SKIP.test("  it.skipIf(process.platform === 'win32')('a symlink', () => {});")).toBe(false);
    expect(HAND_ROLLED_SKIP.test("describePostgres('x', () => {});")).toBe(false);
    expect(HAND_ROLLED_SKIP.test("describe.skipIf(!present)('the committed table', () => {});")).toBe(false);
  });

  it('skips PostgreSQL-only suites one way (describePostgres) and registers per-backend suites through the support module', () => {
    const found: string[] = [];
    for (const file of trackedTestFiles()) {
      readFileSync(file, 'utf8')
        .split('\n')
        .forEach((line, i) => {
          if (HAND_ROLLED_SKIP.test(line)) found.push(`${file}:${i + 1}: ${line.trim()}`);
        });
    }
    expect(found, 'use describePostgres / describeBackends from tests/support').toEqual([]);
  });

  it("names each folder's shared test helpers support.ts", () => {
    const misnamed = trackedTestFiles().filter((f) => /(?:^|[/-])(?:helpers?|[a-z0-9]+-support|test-utils?)\.ts$/.test(f.split('/').pop() ?? ''));
    expect(misnamed, 'rename to support.ts (scripts/rename-to-kebab.ts does it)').toEqual([]);
  });
});
