/**
 * `cpreg ingest` (the CLI, not --as-job) on files with one row holding text PostgreSQL cannot store: the NUL
 * character (`\u0000` in NDJSON, a raw NUL byte in CSV) or a lone UTF-16 surrogate (`\ud800` in NDJSON). Such a
 * row used to fail the whole run (`unsupported Unicode escape sequence`, `invalid input syntax for type json`) with
 * nothing stored, and a rerun failed at the same place. Now the row goes to the rejects file with its line and the
 * field, every other row is stored, the printed counts reconcile, and a rerun counts the stored rows as
 * already ingested. Names are invented.
 */
import { readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { parse } from 'csv-parse/sync';
import { afterAll, beforeAll, expect, it } from 'vitest';
import { runCli } from '../../support/cli.ts';
import { createMigratedDataDir, createPostgresCopy, dropPostgresCopy, describeBackends, makeTempDir, removeTempDir } from '../../support/database.ts';
import { OUTCOME_WORDS } from '../../../services/cli/outcome-words.ts';

interface Summary {
  status: string;
  counts: Record<string, number>;
  unaccounted: number;
  rejectsFile: string | null;
}

interface Reject {
  line: string;
  reason: string;
  row: string;
}

const GOOD = [
  { externalId: 'g1', text: 'Orrin Vale Fabrication Ltd', country: 'GB' },
  { externalId: 'g2', text: 'Pellowmarsh Kunststoff GmbH', country: 'DE' },
  { externalId: 'g3', text: 'Quillon Harbour Freight AS', country: 'NO' },
  { externalId: 'g4', text: 'Sarrow Peak Instruments LLC', country: 'US' },
];

/** Four good lines with `bad` as line 3; JSON.stringify writes U+0000 as `\u0000` and a lone surrogate as `\ud800`. */
function ndjson(bad: Record<string, string>): string {
  const rows = [GOOD[0], GOOD[1], bad, GOOD[2], GOOD[3]];
  return `${rows.map((r) => JSON.stringify(r)).join('\n')}\n`;
}

function rejectsOf(file: string): Reject[] {
  return parse(readFileSync(file, 'utf8'), { columns: true }) as Reject[];
}

function stored(counts: Record<string, number>): number {
  return counts.linked! + counts.review! + counts.new!;
}

describeBackends(`cpreg ingest: a row with text the database cannot store is rejected by its line`, (backend) => {
  let dir: string;
  let db: string;
  beforeAll(async () => {
    dir = makeTempDir('cpreg-ingest-unstorable-');
    db = backend === 'pglite' ? await createMigratedDataDir() : await createPostgresCopy();
  });
  afterAll(async () => {
    removeTempDir(dir);
    if (backend === 'pglite') removeTempDir(db);
    else await dropPostgresCopy(db);
  });

  const ingest = async (file: string, source: string, json = true) => {
    const run = await runCli(['ingest', file, '--source', source, '--db', db, ...(json ? ['--json'] : [])], { timeoutMs: 120_000 });
    expect(run.code, run.stderr).toBe(0);
    return run;
  };

  it('NDJSON with \\u0000 in the name: the row is rejected naming the field, the others are stored, a rerun resumes', async () => {
    const file = join(dir, 'nul.ndjson');
    writeFileSync(file, ndjson({ externalId: 'b1', text: 'Tamsel\u0000Brook Ltd', country: 'GB' }));
    const first = JSON.parse((await ingest(file, 'nul-json')).stdout) as Summary;
    expect(first.status).toBe('finished');
    expect(first.counts.read).toBe(5);
    expect(first.counts.rejected).toBe(1);
    expect(stored(first.counts)).toBe(4);
    expect(first.unaccounted).toBe(0);
    const rejects = rejectsOf(first.rejectsFile!);
    expect(rejects).toHaveLength(1);
    expect(rejects[0]!.line).toBe('3');
    expect(rejects[0]!.reason).toBe('field /text contains the NUL character (U+0000), which cannot be stored');
    expect(rejects[0]!.row).toContain('"b1"');
    // The rerun no longer fails at the same place: the stored rows are already ingested, the bad one rejected again.
    const again = JSON.parse((await ingest(file, 'nul-json')).stdout) as Summary;
    expect(again.counts.read).toBe(5);
    expect(again.counts.already_ingested).toBe(4);
    expect(again.counts.rejected).toBe(1);
    expect(again.unaccounted).toBe(0);
  }, 240_000);

  it('NDJSON with a lone surrogate \\ud800 in the address: the row is rejected naming the field', async () => {
    const file = join(dir, 'surrogate.ndjson');
    writeFileSync(file, ndjson({ externalId: 'b2', text: 'Umbergate Salts Ltd', country: 'GB', address: '4 Kestle Row \ud800 Market Harwick' }));
    expect(readFileSync(file, 'utf8')).toContain('\\ud800');
    const summary = JSON.parse((await ingest(file, 'surrogate-json')).stdout) as Summary;
    expect(summary.counts.read).toBe(5);
    expect(summary.counts.rejected).toBe(1);
    expect(stored(summary.counts)).toBe(4);
    expect(summary.unaccounted).toBe(0);
    const rejects = rejectsOf(summary.rejectsFile!);
    expect(rejects.map((r) => [r.line, r.reason])).toEqual([['3', 'field /address is not well-formed Unicode (a lone UTF-16 surrogate)']]);
  }, 240_000);

  it('CSV with a raw NUL byte in the name: the row is rejected naming the field, and the printed counts reconcile', async () => {
    const file = join(dir, 'nul.csv');
    const lines = [
      'id,name,country',
      ...GOOD.slice(0, 2).map((g) => `${g.externalId},${g.text},${g.country}`),
      'b3,Vennick\u0000Ropes Ltd,GB',
      ...GOOD.slice(2).map((g) => `${g.externalId},${g.text},${g.country}`),
    ];
    writeFileSync(file, `${lines.join('\n')}\n`);
    expect(readFileSync(file).includes(0)).toBe(true);
    const run = await ingest(file, 'nul-csv', false);
    // The printed table: one line per outcome, then "= read"; the outcomes add up to the rows read.
    const outcomes = [...run.stdout.matchAll(/^ {2}([a-z]+(?: [a-z]+)*) +(\d+)$/gm)].map((m) => [m[1]!, Number(m[2])] as const);
    // The table says the outcomes in words ("in review"); read back as the keys of the JSON summary.
    const keyOf = Object.fromEntries(Object.entries(OUTCOME_WORDS).map(([key, words]) => [words, key]));
    const counts = Object.fromEntries(outcomes.map(([words, n]) => [keyOf[words] ?? words, n]));
    const read = Number(/^ {2}= read +(\d+)$/m.exec(run.stdout)?.[1]);
    expect(run.stdout).toMatch(/finished: 5 rows read/);
    expect(read).toBe(5);
    expect(outcomes.reduce((sum, [, n]) => sum + n, 0)).toBe(read);
    expect(counts.rejected).toBe(1);
    expect(stored(counts)).toBe(4);
    const rejectsFile = /^rejected rows \(line, reason, row\): (.+)$/m.exec(run.stdout)?.[1];
    expect(rejectsFile).toBe(`${file}.rejects.csv`);
    const rejects = rejectsOf(rejectsFile!);
    expect(rejects.map((r) => [r.line, r.reason])).toEqual([['4', 'field /text contains the NUL character (U+0000), which cannot be stored']]);
    expect(rejects[0]!.row).toBe('b3,Vennick\u0000Ropes Ltd,GB');
  }, 240_000);
});
