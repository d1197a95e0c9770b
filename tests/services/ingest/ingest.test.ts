/**
 * Batch ingest: a file with bad rows whose summary reconciles exactly (read = sum of outcomes), the rejects
 * file with line numbers and reasons, the row-identity rule, an interrupted run resumed without duplicates —
 * stopped between batches, and (PostgreSQL) a child `cpreg ingest` killed with SIGKILL then run again.
 */
import { afterAll, beforeAll, expect, it } from 'vitest';
import { spawn } from 'node:child_process';
import { readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { parse } from 'csv-parse/sync';
import { ingestFile } from '../../../services/ingest/run-ingest.ts';
import { unaccounted, COUNT_KEYS } from '../../../services/ingest/ingest-counts.ts';
import { parseMapOptions, MappingError } from '../../../services/ingest/mapping.ts';
import { describeEachBackend, describePostgres, makeTempDir, openTestDatabase, removeTempDir, type TestDatabase } from '../../support/database.ts';

const CSV = [
  'Party,Doc,Ref,Country',
  'Ashcombe Filters Ltd,C-1,r1,GB', // line 2
  'ASHCOMBE FILTERS LIMITED,C-2,r2,GB', // line 3
  ',C-3,r3,GB', // line 4: no name
  'Ashcombe Filters Ltd,C-1,r1,GB', // line 5: exact repeat of line 2
  'Tewkes Orchard Farms LLC,C-4,r5,US', // line 6
  'Too,few', // line 7: short row
  '"Bellmere, Dace & Co. KG",C-5,,DE', // line 8: no id (identity = hash of source and row)
  `${'N'.repeat(1001)},C-6,r8,GB`, // line 9: name over 1,000 characters
].join('\n');

describeEachBackend('ingest', (ctx) => {
  let dir: string;
  beforeAll(() => {
    dir = makeTempDir('cpreg-ingest-');
  });
  afterAll(() => removeTempDir(dir));

  it('accounts for every row: read = linked + review + new + … + already_ingested + rejected', async () => {
    const file = join(dir, 'parties.csv');
    writeFileSync(file, CSV);
    const rejectsFile = join(dir, 'parties.rejects.csv');
    const map = parseMapOptions(['text=Party', 'contract=Doc', 'externalId=Ref']);
    const summary = await ingestFile({ db: ctx.db(), file, source: 'erp-test', map, rejectsFile, actor: 'cli:test', batchSize: 3 });
    const c = summary.counts;
    expect(c.read).toBe(8);
    expect(unaccounted(c)).toBe(0);
    expect(COUNT_KEYS.reduce((s, key) => s + c[key], 0)).toBe(c.read);
    expect(c.rejected).toBe(3);
    expect(c.already_ingested).toBe(1);
    expect(c.linked + c.new + c.review).toBe(4);
    const rejects = parse(readFileSync(rejectsFile, 'utf8'), { columns: true }) as { line: string; reason: string; row: string }[];
    expect(rejects.map((r) => Number(r.line))).toEqual([4, 7, 9]);
    expect(rejects[0]!.reason).toContain('empty');
    expect(rejects[1]!.reason).toContain('cells');
    expect(rejects[2]!.reason).toContain('1000');
    expect(rejects[1]!.row).toBe('Too,few');
    const run = await ctx.db().selectFrom('ingest_run').selectAll().where('id', '=', summary.runId).executeTakeFirstOrThrow();
    expect(run.status).toBe('finished');
    const stored = (typeof run.counts === 'string' ? JSON.parse(run.counts) : run.counts) as Record<string, number>;
    expect(stored).toEqual(c);
    // Without an id, the row's identity is a hash of source and content: the same row again is the same mention.
    const hashed = await ctx
      .db()
      .selectFrom('mention')
      .select('external_id')
      .where('source', '=', 'erp-test')
      .where('text', '=', 'Bellmere, Dace & Co. KG')
      .execute();
    expect(hashed).toHaveLength(1);
    expect(hashed[0]!.external_id).toMatch(/^row-[0-9a-f]{32}$/);
    // …and an edited row without an id is a new mention (the documented rule).
    writeFileSync(file, CSV.replace('"Bellmere, Dace & Co. KG",C-5,,DE', '"Bellmere, Dace & Co KG",C-5,,DE'));
    const again = await ingestFile({ db: ctx.db(), file, source: 'erp-test', map, rejectsFile, actor: 'cli:test' });
    expect(again.counts.already_ingested).toBe(4); // lines 2, 3, 5 (a repeat of 2) and 6
    expect(again.counts.read - again.counts.rejected - again.counts.already_ingested).toBe(1);
    const bellmere = await ctx.db().selectFrom('mention').select('id').where('source', '=', 'erp-test').where('text', 'like', 'Bellmere%').execute();
    expect(bellmere).toHaveLength(2);
  });

  it('names a missing column and an unknown field', () => {
    expect(() => parseMapOptions(['colour=Party'])).toThrow(MappingError);
    expect(() => parseMapOptions(['text'])).toThrow(/field=column/);
  });

  it('resumes an interrupted run without duplicates', async () => {
    const file = join(dir, 'many.ndjson');
    const lines = Array.from({ length: 60 }, (_, i) =>
      JSON.stringify({ externalId: `n-${i}`, text: `Quenby ${['Alder', 'Birch', 'Cedar', 'Damson', 'Elm', 'Fir'][i % 6]} Works ${i} Ltd`, country: 'GB' }),
    );
    writeFileSync(file, `${lines.join('\n')}\n`);
    let batches = 0;
    const first = await ingestFile({
      db: ctx.db(),
      file,
      source: 'resume',
      rejectsFile: join(dir, 'r.csv'),
      actor: 'cli:test',
      batchSize: 20,
      shouldStop: () => ++batches >= 1,
    });
    expect(first.status).toBe('interrupted');
    expect(first.counts.read).toBe(20);
    const run = await ctx.db().selectFrom('ingest_run').select('status').where('id', '=', first.runId).executeTakeFirstOrThrow();
    expect(run.status).toBe('interrupted');
    const second = await ingestFile({ db: ctx.db(), file, source: 'resume', rejectsFile: join(dir, 'r.csv'), actor: 'cli:test', batchSize: 20 });
    expect(second.status).toBe('finished');
    expect(second.counts.read).toBe(60);
    expect(second.counts.already_ingested).toBe(20);
    const rows = await ctx.db().selectFrom('mention').select('external_id').where('source', '=', 'resume').execute();
    expect(rows).toHaveLength(60);
    expect(new Set(rows.map((r) => r.external_id)).size).toBe(60);
  });
});

// A child process killed mid-run needs a database two processes open at once: PostgreSQL.
describePostgres('ingest: a killed run resumed [postgres]', () => {
  let database: TestDatabase;
  let dir: string;
  beforeAll(async () => {
    database = await openTestDatabase('postgres');
    dir = makeTempDir();
  });
  afterAll(async () => {
    await database?.close();
    if (dir) removeTempDir(dir);
  });

  it('resumes after the process is killed with SIGKILL, without duplicates', async () => {
    const file = join(dir, 'kill.ndjson');
    const lines = Array.from({ length: 400 }, (_, i) =>
      JSON.stringify({ externalId: `k-${i}`, text: `Harrowfen ${i % 2 ? 'Tooling' : 'Castings'} ${i} GmbH`, country: 'DE' }),
    );
    writeFileSync(file, `${lines.join('\n')}\n`);
    const url = database.url!;
    const run = (extra: string[] = []) =>
      spawn(process.execPath, ['bin/cpreg.js', 'ingest', file, '--source', 'kill', '--db', url, '--batch-size', '25', ...extra], {
        stdio: ['ignore', 'pipe', 'pipe'],
      });
    const child = run();
    // Kill once some rows are stored, mid-run.
    for (let i = 0; i < 600; i++) {
      const n = await database.db
        .selectFrom('mention')
        .select((eb) => eb.fn.countAll<string>().as('n'))
        .where('source', '=', 'kill')
        .executeTakeFirstOrThrow();
      if (Number(n.n) >= 50) break;
      await new Promise((r) => setTimeout(r, 100));
    }
    child.kill('SIGKILL');
    await new Promise((r) => child.once('exit', r));
    const partial = await database.db
      .selectFrom('mention')
      .select((eb) => eb.fn.countAll<string>().as('n'))
      .where('source', '=', 'kill')
      .executeTakeFirstOrThrow();
    expect(Number(partial.n)).toBeGreaterThan(0);
    expect(Number(partial.n)).toBeLessThan(400);
    const again = run(['--json']);
    let out = '';
    again.stdout.on('data', (d) => (out += String(d)));
    const code = await new Promise((r) => again.once('exit', r));
    expect(code).toBe(0);
    const summary = JSON.parse(out.trim().split('\n').pop()!);
    expect(summary.counts.read).toBe(400);
    expect(summary.counts.already_ingested).toBe(Number(partial.n));
    expect(summary.unaccounted).toBe(0);
    const rows = await database.db.selectFrom('mention').select('external_id').where('source', '=', 'kill').execute();
    expect(rows).toHaveLength(400);
  }, 120_000);
});
