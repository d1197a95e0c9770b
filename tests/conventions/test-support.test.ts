/**
 * The test harness has one way to do each thing: a suite that needs PostgreSQL is declared with describePostgres,
 * a suite per backend with describeEachBackend / describeBackends (tests/support/database.ts), a database is
 * handed out by tests/support (withTestDatabase, openTestDatabase) so that each is closed and dropped the same way,
 * and a folder's shared helpers live in its one support.ts. This test reads the tracked test files and fails on the
 * other forms.
 */
import { execFileSync } from 'node:child_process';
import { existsSync, readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';

/**
 * A suite registered or skipped by hand on the backends' availability, or a test (or suite) skipped or run on the
 * backend it is given (`it.skipIf(ctx.backend === 'pglite')`): PostgreSQL-only work is a describePostgres suite.
 */
const HAND_ROLLED_SKIP =
  /\?\s*describe\s*:\s*describe\.skip|\?\s*describe\.skip\s*:\s*describe|describe\.skipIf\(!?(?:isBackendAvailable|available|unavailable)|\b(?:it|test|describe)\.(?:skipIf|runIf)\([^)]*\bbackend\b/;

/** Opening a database by hand (db/open-database.ts, PGlite itself, or a kysely instance made by a test). */
const OPENS_A_DATABASE = /\bopenDatabase\(|\bnew PGlite\b|\bPGlite\.create\(|\bcreateDb\(/;

/** The test files that open databases themselves, each because the opening (or migrating) is what it tests. */
const OPENS_ITS_OWN: Readonly<Record<string, string>> = {
  'tests/db/open-database.test.ts': 'tests openDatabase itself: targets, options, locks, refusals',
  'tests/db/migrate.test.ts': 'migrates a database from empty, which the harness copies (already migrated) never are',
  'tests/db/embedded-template.test.ts': 'tests how a new embedded database is made from the template, the long way and as a copy',
  'tests/db/planner-settings.test.ts': 'tests the settings openDatabase gives every connection, with options carried by the URL',
  'tests/services/cli/open-command-database.test.ts': 'tests how a command opens its database (light reader, migration first)',
};

/**
 * The modules of test folders other than their support.ts, each with why it stands apart: data and whole suites,
 * not helpers. tests/support/ is the shared harness (one module per concern, exported through its index.ts).
 */
const NOT_SUPPORT: Readonly<Record<string, string>> = {
  'tests/reliability/crash-ingest-suite.ts': 'the crash suite itself, registered by one test file per backend so that the halves run in parallel',
  'tests/reliability/hostile-matrix.ts': 'the hostile-input matrix: every case with the answer it must get (as long as a test file)',
  'tests/resolvers/compare/reference-data.ts': 'data: the shared worked examples, read in place',
  'tests/resolvers/terms/corpus/contracts.ts': 'data: the contract corpus',
  'tests/resolvers/terms/corpus/declared-name-shapes.ts': 'data: corpus cases of one shape',
  'tests/resolvers/terms/corpus/earlier-agreement-shapes.ts': 'data: corpus cases of one shape',
  'tests/resolvers/terms/corpus/non-party-shapes.ts': 'data: corpus cases of one shape',
  'tests/resolvers/terms/corpus/second-look-shapes.ts': 'data: corpus cases of one shape',
  'tests/resolvers/terms/corpus/signer-shapes.ts': 'data: corpus cases of one shape',
};

function trackedTests(): string[] {
  return execFileSync('git', ['ls-files', '-z', 'tests'], { encoding: 'utf8' })
    .split('\0')
    .filter((f) => f.endsWith('.ts') && existsSync(f));
}

function trackedTestFiles(): string[] {
  // tests/conventions holds the examples of the forms it rejects.
  return trackedTests().filter((f) => !f.startsWith('tests/support/') && !f.startsWith('tests/conventions/'));
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

  it('recognises a database opened by hand (examples written for this test)', () => {
    expect(OPENS_A_DATABASE.test("const opened = await openDatabase(dir, { command: 'x' });")).toBe(true);
    expect(OPENS_A_DATABASE.test("const pg = new PGlite('memory://');")).toBe(true);
    expect(OPENS_A_DATABASE.test('const pg = await PGlite.create({ dataDir });')).toBe(true);
    expect(OPENS_A_DATABASE.test('const db = createDb(url);')).toBe(true);
    expect(OPENS_A_DATABASE.test("await withTestDatabase({ at: dir }, (opened) => opened.db.selectFrom('mention').execute());")).toBe(false);
    expect(OPENS_A_DATABASE.test('const second = await openTestDatabase({ at: url }, { poolSize: 5 });')).toBe(false);
  });

  it('hands out every database through tests/support, except in the tests of opening itself', () => {
    const found: string[] = [];
    for (const file of trackedTestFiles()) {
      if (file in OPENS_ITS_OWN) continue;
      readFileSync(file, 'utf8')
        .split('\n')
        .forEach((line, i) => {
          if (OPENS_A_DATABASE.test(line)) found.push(`${file}:${i + 1}: ${line.trim()}`);
        });
    }
    expect(found, 'use withTestDatabase (or openTestDatabase in hooks) from tests/support; { at } opens an existing database').toEqual([]);
    // An exception whose file no longer opens a database by hand is dropped from the list.
    const stale = Object.keys(OPENS_ITS_OWN).filter((f) => !existsSync(f) || !OPENS_A_DATABASE.test(readFileSync(f, 'utf8')));
    expect(stale).toEqual([]);
  });

  it("keeps each folder's shared test helpers in one module, its support.ts", () => {
    const modules = trackedTestFiles().filter((f) => !f.endsWith('.test.ts'));
    const apart = modules.filter((f) => !f.endsWith('/support.ts') && !(f in NOT_SUPPORT));
    expect(apart, "merge into the folder's support.ts, or list it in NOT_SUPPORT with the reason").toEqual([]);
    expect(Object.keys(NOT_SUPPORT).filter((f) => !modules.includes(f))).toEqual([]);
  });
});
