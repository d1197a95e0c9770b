/**
 * SQL lives in db/ (one query module per concern, db/queries/<concern>.ts); services, benches, scripts and the
 * command-line entry points call those functions. This test reads every tracked file under services/, bench/,
 * scripts/ and bin/ and fails on a sql`…` template, sql.raw, a query-builder entry
 * (.selectFrom( / .insertInto( / .updateTable( / .deleteFrom( / .mergeInto() or a string that starts with SQL text,
 * outside the allow-list below. The allow-list only shrinks: each entry says why it is still there.
 */
import { execFileSync } from 'node:child_process';
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';

const ALLOWED: { prefix: string; why: string }[] = [];

/** What counts as SQL in a file outside db/ (the query builder's entry points, the template tag, raw SQL text). */
const SQL_PATTERNS: RegExp[] = [
  /\bsql(?:<[^`\n]*>)?`/,
  /\bsql\.raw\(/,
  /\.(?:selectFrom|insertInto|updateTable|deleteFrom|mergeInto)\(/,
  /['"`]\s*(?:SELECT|INSERT INTO|UPDATE [a-z_]+ SET|DELETE FROM|WITH [a-z_]+ AS|CREATE |DROP |ALTER |TRUNCATE |VACUUM|ANALYZE|EXPLAIN )/,
];

/** The folders whose code must call db/ for its SQL. */
const SCANNED = ['services', 'bench', 'scripts', 'bin'];

function trackedScannedFiles(): string[] {
  const out = execFileSync('git', ['ls-files', '-z', ...SCANNED], { encoding: 'utf8' });
  return out.split('\0').filter((f) => /\.(?:ts|js)$/.test(f));
}

/** `file:line: text` for every line of a scanned file that holds SQL. */
export function sqlLines(file: string, text: string): string[] {
  const found: string[] = [];
  text.split('\n').forEach((line, i) => {
    if (SQL_PATTERNS.some((p) => p.test(line))) found.push(`${file}:${i + 1}: ${line.trim().slice(0, 120)}`);
  });
  return found;
}

describe('SQL lives in db/', () => {
  it('finds the SQL forms it looks for (each pattern catches its example, plain code passes)', () => {
    // Examples written for this test (common practice for a grep-based rule: show it fires).
    expect(sqlLines('x.ts', 'await sql`select 1`.execute(db);')).toHaveLength(1);
    expect(sqlLines('x.ts', 'const r = await sql<{ n: number }>`SELECT count(*) AS n FROM mention`;')).toHaveLength(1);
    expect(sqlLines('x.ts', "await db.selectFrom('job').selectAll().execute();")).toHaveLength(1);
    expect(sqlLines('x.ts', "await trx.deleteFrom('mention').execute();")).toHaveLength(1);
    expect(sqlLines('x.ts', "await client.query('DELETE FROM mention WHERE id = $1', [id]);")).toHaveLength(1);
    expect(sqlLines('x.ts', 'sql.raw(text)')).toHaveLength(1);
    expect(sqlLines('x.ts', 'await admin.query(`DROP DATABASE IF EXISTS "${name}" WITH (FORCE)`);')).toHaveLength(1);
    expect(sqlLines('x.ts', "await target.query('ANALYZE');")).toHaveLength(1);
    expect(sqlLines('x.ts', 'await sql`VACUUM ANALYZE`.execute(db);')).toHaveLength(1);
    expect(sqlLines('x.ts', '// one SELECT per identifier, which is why the rows are read up front\nconst selected = items.filter(Boolean);')).toEqual([]);
  });

  it('has no SQL in services/, bench/, scripts/ or bin/ outside the allow-list', () => {
    const offending = trackedScannedFiles()
      .filter((f) => !ALLOWED.some((a) => f.startsWith(a.prefix)))
      .flatMap((f) => sqlLines(f, readFileSync(f, 'utf8')));
    expect(offending, 'move these statements into a db/queries/<concern>.ts function and call it').toEqual([]);
  });

  it('keeps no allow-list entry that is no longer needed (so the list only shrinks)', () => {
    const files = trackedScannedFiles();
    const stale = ALLOWED.filter((a) => !files.some((f) => f.startsWith(a.prefix) && sqlLines(f, readFileSync(f, 'utf8')).length > 0));
    expect(stale.map((a) => a.prefix)).toEqual([]);
  });

  it('has no SQL in the register write path already moved to db/ (state, history, resolve, matching, the building blocks, batch)', () => {
    const moved = ['services/register/state/', 'services/register/history/', 'services/register/resolve/', 'services/register/matching/'];
    const files = [
      'services/register/check-name.ts',
      'services/register/normalise-identifier-or-throw.ts',
      'services/register/create-counterparty-row.ts',
      'services/register/add-name-sighting.ts',
      'services/register/add-identifier-row.ts',
      'services/register/touch-counterparty.ts',
      'services/register/lock-active.ts',
      'services/register/chunk-prefetch.ts',
      'services/register/batch.ts',
      'services/register/batch-check.ts',
      'services/register/batch-decide.ts',
      'services/register/batch-cluster.ts',
      'services/register/batch-plan.ts',
      'services/register/batch-write.ts',
      'services/register/walk.ts',
    ];
    const offending = trackedScannedFiles()
      .filter((f) => moved.some((m) => f.startsWith(m)) || files.includes(f))
      .flatMap((f) => sqlLines(f, readFileSync(f, 'utf8')));
    expect(offending, 'move these statements into a db/queries/<concern>.ts function and call it').toEqual([]);
  });
});
