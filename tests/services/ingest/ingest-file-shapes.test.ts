/**
 * Issue 17 item 14: file shapes the ingest readers mishandled. A byte order mark before an NDJSON file's first
 * line rejected line 1 as invalid JSON (the CSV reader stripped it); a CSV header naming a column twice was
 * silently read as its last column; an NDJSON line had no length limit (readline held a 30 MB line whole). Now:
 * the BOM is stripped, the duplicate header is refused naming the column, and a line over 1 MB is rejected by its
 * number while the reader holds at most 1 MB of it. Names are invented.
 */
import { readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { Readable } from 'node:stream';
import { parse } from 'csv-parse/sync';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { ingestFile } from '../../../services/ingest/run-ingest.ts';
import { MAX_NDJSON_LINE_BYTES, ndjsonLines, type NdjsonLine } from '../../../services/ingest/ndjson-lines.ts';
import { describeEachBackend, makeTempDir, removeTempDir } from '../../support/index.ts';

const ROWS = [
  { externalId: 'b1', text: 'Tamsworth Gearing Ltd', country: 'GB' },
  { externalId: 'b2', text: 'Ulvenhus Papir AS', country: 'NO' },
];

async function collect(source: AsyncIterable<Buffer | string>, maxBytes?: number): Promise<{ lines: NdjsonLine[]; peak: number }> {
  const stats = { peakBufferedBytes: 0 };
  const lines: NdjsonLine[] = [];
  for await (const l of ndjsonLines(source, { ...(maxBytes ? { maxBytes } : {}), stats })) lines.push(l);
  return { lines, peak: stats.peakBufferedBytes };
}

describe('ndjsonLines', () => {
  it('splits on LF, CRLF and a lone CR like readline, across chunk boundaries, and decodes split characters', async () => {
    const bytes = Buffer.from('{"a":1}\r\n{"b":"Zürich"}\n\n{"c":3}\r{"d":4}', 'utf8');
    // One byte per chunk: every boundary (inside CRLF, inside ü) is crossed.
    const { lines } = await collect(Readable.from([...bytes].map((b) => Buffer.from([b]))));
    expect(lines).toEqual([
      { line: 1, text: '{"a":1}' },
      { line: 2, text: '{"b":"Zürich"}' },
      { line: 3, text: '' },
      { line: 4, text: '{"c":3}' },
      { line: 5, text: '{"d":4}' },
    ]);
  });

  it('gives up a line over the limit by its number, keeps counting, and never holds more than the limit', async () => {
    const chunk = Buffer.alloc(64 * 1024, 'a');
    async function* source(): AsyncGenerator<Buffer> {
      yield Buffer.from('{"ok":1}\n"');
      for (let i = 0; i < 480; i++) yield chunk; // a 30 MB line
      yield Buffer.from('"\n{"ok":3}\n');
    }
    const { lines, peak } = await collect(source());
    expect(lines.map((l) => l.line)).toEqual([1, 2, 3]);
    expect(lines[1]).toMatchObject({ line: 2, tooLong: true });
    expect((lines[1] as { head: string }).head.length).toBeLessThanOrEqual(200);
    expect(lines[2]).toEqual({ line: 3, text: '{"ok":3}' });
    expect(peak).toBeLessThanOrEqual(MAX_NDJSON_LINE_BYTES);
  });

  it('takes a line of exactly the limit', async () => {
    const { lines } = await collect(Readable.from([Buffer.from(`"${'x'.repeat(98)}"\n`)]), 100);
    expect(lines).toEqual([{ line: 1, text: `"${'x'.repeat(98)}"` }]);
    const over = await collect(Readable.from([Buffer.from(`"${'x'.repeat(99)}"\n`)]), 100);
    expect(over.lines[0]).toMatchObject({ line: 1, tooLong: true });
  });
});

interface Reject {
  line: string;
  reason: string;
}

describeEachBackend('ingest file shapes', (t) => {
  let dir: string;
  beforeAll(() => {
    dir = makeTempDir('cpreg-ingest-shapes-');
  });
  afterAll(() => {
    removeTempDir(dir);
  });

  const run = (file: string, source: string) => ingestFile({ db: t.db(), file, source, rejectsFile: `${file}.rejects.csv`, actor: 'test:shapes' });
  const rejectsOf = (file: string): Reject[] => parse(readFileSync(`${file}.rejects.csv`, 'utf8'), { columns: true }) as Reject[];

  it('strips a byte order mark before the first NDJSON line instead of rejecting line 1', async () => {
    const file = join(dir, 'bom.ndjson');
    writeFileSync(file, `\uFEFF${ROWS.map((r) => JSON.stringify(r)).join('\n')}\n`);
    const summary = await run(file, 'bom');
    expect(summary.counts.rejected).toBe(0);
    expect(summary.counts.read).toBe(2);
    expect(summary.unaccounted).toBe(0);
    const stored = await t.db().selectFrom('mention').select('external_id').where('source', '=', 'bom').orderBy('external_id').execute();
    expect(stored.map((r) => r.external_id)).toEqual(['b1', 'b2']);
  });

  it('rejects an NDJSON line over 1 MB by its number and ingests the others', async () => {
    const file = join(dir, 'long.ndjson');
    const long = JSON.stringify({ externalId: 'l2', text: `Vexmoor ${'x'.repeat(MAX_NDJSON_LINE_BYTES)} Ltd` });
    writeFileSync(file, `${JSON.stringify({ ...ROWS[0], externalId: 'l1' })}\n${long}\n${JSON.stringify({ ...ROWS[1], externalId: 'l3' })}\n`);
    const summary = await run(file, 'long');
    expect(summary.counts).toMatchObject({ read: 3, rejected: 1 });
    expect(summary.unaccounted).toBe(0);
    const rejects = rejectsOf(file);
    expect(rejects).toHaveLength(1);
    expect(rejects[0]).toMatchObject({ line: '2' });
    expect(rejects[0]!.reason).toMatch(/longer than 1048576 bytes/);
  });

  it('refuses a CSV header that names a column twice, naming the column, and stores nothing', async () => {
    const file = join(dir, 'twice.csv');
    writeFileSync(file, 'external_id,name,country,name\nt1,Wexcombe Tiles Ltd,GB,Wexcombe Holdings Ltd\n');
    await expect(run(file, 'twice')).rejects.toThrow(/column "name" twice \(columns 2 and 4\)/);
    const stored = await t.db().selectFrom('mention').select('id').where('source', '=', 'twice').execute();
    expect(stored).toEqual([]);
  });

  it('still reads a CSV whose header ends in empty cells', async () => {
    const file = join(dir, 'trailing.csv');
    writeFileSync(file, '\uFEFFexternal_id,name,country,,\nt1,Wexcombe Tiles Ltd,GB,,\n');
    const summary = await run(file, 'trailing');
    expect(summary.counts).toMatchObject({ read: 1, rejected: 0 });
  });
});
