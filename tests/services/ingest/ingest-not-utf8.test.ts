/**
 * Issue 17 item 11, the command line: `cpreg ingest` on a file some of whose rows are not UTF-8 — a stray 0xFF,
 * an overlong form (C0 AF), a sequence cut short (E2 82 before a quote), the CESU-8 bytes of a surrogate (ED A0
 * 80). Such rows used to be read with U+FFFD in place of the bad bytes and stored so. Now each goes to the rejects
 * file with its line and the byte offset within it, every other row is stored, and the counts reconcile. Byte
 * ranges: The Unicode Standard, Table 3-7; offsets counted from the lines written here. Names are invented.
 */
import { readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { parse } from 'csv-parse/sync';
import { afterAll, beforeAll, expect, it } from 'vitest';
import { runCli } from '../../support/cli.ts';
import { createMigratedDataDir, createPostgresCopy, dropPostgresCopy, describeBackends, makeTempDir, removeTempDir } from '../../support/database.ts';

interface Summary {
  status: string;
  counts: Record<string, number>;
  unaccounted: number;
  rejectsFile: string | null;
}

const GOOD = ['Orrin Vale Fabrication Ltd', 'Pellowmarsh Kunststoff GmbH', 'Quillon Harbour Freight AS', 'Sarrow Peak Instruments LLC'];
const BAD: [string, number[]][] = [
  ['0xFF', [0xff]],
  ['overlong', [0xc0, 0xaf]],
  ['truncated', [0xe2, 0x82]],
  ['CESU-8 surrogate', [0xed, 0xa0, 0x80]],
];

/** A line whose text is `Tamsel<bad>Brook Ltd`, with the offset of the bad bytes within the line. */
function badLine(prefix: string, bytes: number[], suffix: string): { line: Buffer; offset: number } {
  const head = Buffer.from(prefix);
  return { line: Buffer.concat([head, Buffer.from(bytes), Buffer.from(suffix)]), offset: head.length };
}

function rejectsOf(file: string): { line: string; reason: string; row: string }[] {
  return parse(readFileSync(file, 'utf8'), { columns: true }) as { line: string; reason: string; row: string }[];
}

describeBackends(`cpreg ingest: rows that are not UTF-8 are rejected by their line and byte offset`, (backend) => {
  let dir: string;
  let db: string;
  beforeAll(async () => {
    dir = makeTempDir('cpreg-ingest-utf8-');
    db = backend === 'pglite' ? await createMigratedDataDir() : await createPostgresCopy();
  });
  afterAll(async () => {
    removeTempDir(dir);
    if (backend === 'pglite') removeTempDir(db);
    else await dropPostgresCopy(db);
  });

  const ingest = async (file: string, source: string): Promise<Summary> => {
    const run = await runCli(['ingest', file, '--source', source, '--db', db, '--json'], { timeoutMs: 120_000 });
    expect(run.code, run.stderr).toBe(0);
    return JSON.parse(run.stdout) as Summary;
  };

  it('NDJSON: each ill-formed line is rejected with its line and offset; the good lines are stored', async () => {
    const file = join(dir, 'mixed.ndjson');
    const lines: Buffer[] = [];
    const expected: [string, string][] = [];
    GOOD.forEach((text, i) => {
      lines.push(Buffer.from(JSON.stringify({ externalId: `g${i}`, text })));
      const [, bytes] = BAD[i]!;
      const bad = badLine(`{"externalId":"b${i}","text":"Tamsel`, bytes, 'Brook Ltd"}');
      lines.push(bad.line);
      expected.push([String(lines.length), `at byte offset ${bad.offset} of the line`]);
    });
    writeFileSync(file, Buffer.concat(lines.flatMap((l) => [l, Buffer.from('\n')])));
    const summary = await ingest(file, 'utf8-json');
    expect(summary.status).toBe('finished');
    expect(summary.counts.read).toBe(8);
    expect(summary.counts.rejected).toBe(4);
    expect(summary.counts.linked! + summary.counts.review! + summary.counts.new!).toBe(4);
    expect(summary.unaccounted).toBe(0);
    const rejects = rejectsOf(summary.rejectsFile!);
    expect(rejects.map((r) => r.line)).toEqual(expected.map(([line]) => line));
    rejects.forEach((r, i) => {
      expect(r.reason).toMatch(/^not valid UTF-8: the byte 0x[0-9A-F]{2} /);
      expect(r.reason).toContain(expected[i]![1]);
    });
  }, 240_000);

  it('CSV (with a byte order mark): a row with ill-formed bytes is rejected with its line; the header and the other rows are read', async () => {
    const file = join(dir, 'mixed.csv');
    const bad = badLine('b1,Vennick', [0xff], 'Ropes Ltd,GB');
    const cesu = badLine('b2,"Wrenfold', [0xed, 0xa0, 0x80], ' Tiles, Ltd",GB');
    const body = Buffer.concat([
      Buffer.from([0xef, 0xbb, 0xbf]),
      Buffer.from(
        `id,name,country\n${GOOD.slice(0, 2)
          .map((t, i) => `g${i},${t},GB`)
          .join('\n')}\n`,
      ),
      bad.line,
      Buffer.from(
        `\n${GOOD.slice(2)
          .map((t, i) => `g${i + 2},${t},GB`)
          .join('\n')}\n`,
      ),
      cesu.line,
      Buffer.from('\n'),
    ]);
    writeFileSync(file, body);
    const summary = await ingest(file, 'utf8-csv');
    expect(summary.counts.read).toBe(6);
    expect(summary.counts.rejected).toBe(2);
    expect(summary.unaccounted).toBe(0);
    const rejects = rejectsOf(summary.rejectsFile!);
    expect(rejects.map((r) => r.line)).toEqual(['4', '7']);
    expect(rejects[0]!.reason).toContain(`the byte 0xFF at byte offset ${bad.offset} of the row`);
    expect(rejects[1]!.reason).toContain(`the byte 0xED at byte offset ${cesu.offset} of the row`);
  }, 240_000);

  it('CSV whose header is not UTF-8: the file is refused with a clear error, nothing is stored', async () => {
    const file = join(dir, 'header.csv');
    writeFileSync(file, Buffer.concat([Buffer.from('id,n'), Buffer.from([0xe4]), Buffer.from('me,country\ng1,Xandle Works Ltd,GB\n')]));
    const run = await runCli(['ingest', file, '--source', 'utf8-header', '--db', db], { timeoutMs: 120_000 });
    expect(run.code).not.toBe(0);
    expect(run.stderr).toMatch(/the CSV header \(line 1\) is not valid UTF-8: the byte 0xE4 at byte offset 4 of the header/);
  }, 240_000);
});
