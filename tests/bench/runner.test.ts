// The bench runner's pure parts (the benchmarks themselves never run in `npm test`).
import { describe, expect, it } from 'vitest';
import { discover } from '../../bench/discover.ts';
import { computeRatios, formatTable, largestStage } from '../../bench/format-table.ts';
import { ingestTargets } from '../../bench/ingest.bench.ts';
import { resolveStages } from '../../bench/resolve-stages.ts';
import { fullScale, parseArgs, sizesFor } from '../../bench/runner-options.ts';
import type { BenchRow } from '../../bench/types.ts';

const row = (r: Partial<BenchRow> & Pick<BenchRow, 'id' | 'value' | 'better'>): BenchRow => ({ label: r.id, unit: 'x', bench: 'k', ...r });

describe('bench runner', () => {
  it('reads --quick, --full, --only and --seed, and rejects what it does not know', () => {
    expect(parseArgs([])).toEqual({ mode: 'default', only: [], seed: 1, keep: false });
    expect(parseArgs(['--quick', '--only', 'a,b', '--seed', '7'])).toEqual({ mode: 'quick', only: ['a', 'b'], seed: 7, keep: false });
    expect(parseArgs(['--full']).mode).toBe('full');
    expect(() => parseArgs(['--fast'])).toThrow(/unknown option "--fast"/);
    expect(() => parseArgs(['--quick', '--full'])).toThrow(/exclude/);
    expect(() => parseArgs(['--seed', 'x'])).toThrow(/--seed/);
  });

  it("reads --sizes as the sizes of every bench in place of the mode's, and gives 1,000,000 the full heap", () => {
    const options = parseArgs(['--only', 'register', '--sizes', '1000000']);
    expect(options).toEqual({ mode: 'default', only: ['register'], seed: 1, keep: false, sizes: [1_000_000] });
    expect(sizesFor(options.mode, options.sizes)).toEqual({ register: [1_000_000], names: [1_000_000], ingest: [1_000_000], scaleOut: [1_000_000] });
    expect(fullScale(options)).toBe(true);
    expect(parseArgs(['--quick', '--sizes', '10000,20000']).sizes).toEqual([10_000, 20_000]);
    expect(fullScale(parseArgs(['--quick', '--sizes', '10000']))).toBe(false);
    expect(fullScale(parseArgs(['--full']))).toBe(true);
    for (const bad of ['', '1e6', '-5', '0', '10,x']) expect(() => parseArgs(['--sizes', bad])).toThrow(/--sizes/);
    expect(() => parseArgs(['--sizes'])).toThrow(/--sizes: missing value/);
  });

  it('sizes the quick run at 10,000 and adds 1,000,000 only under --full', () => {
    expect(sizesFor('quick').register).toEqual([10_000]);
    expect(sizesFor('default').register).not.toContain(1_000_000);
    expect(sizesFor('full').register).toContain(1_000_000);
  });

  it('computes ratios as "times better than the baseline" in both directions, and goals', () => {
    const rows = computeRatios([
      row({ id: 'ours', value: 2_000_000, better: 'higher', baseline: 'natural' }),
      row({ id: 'natural', value: 500_000, better: 'higher' }),
      row({ id: 'p99', value: 5, better: 'lower', baseline: 'trigram', goal: { op: '<=', value: 10 } }),
      row({ id: 'trigram', value: 226, better: 'lower' }),
      row({ id: 'late', value: 20, better: 'lower', goal: { op: '<=', value: 10 } }),
      row({ id: 'gone', value: 0, better: 'higher', baseline: 'natural', skipped: 'DATABASE_URL not set' }),
    ]);
    expect(rows[0]!.ratio).toBe(4);
    expect(rows[2]!.ratio).toBeCloseTo(45.2, 10);
    expect(rows[2]!.goalMet).toBe(true);
    expect(rows[4]!.goalMet).toBe(false);
    expect(rows[5]!.ratio).toBeUndefined();
    expect(formatTable(rows)).toContain('4.00× natural');
    expect(formatTable(rows)).toContain('MISSED');
  });

  it('finds the bench files and names the available ones when --only names an unknown one', () => {
    expect(discover([])).toContain('generator.bench.ts');
    expect(() => discover(['no-such-bench'])).toThrow(/no bench named no-such-bench \(available: .*generator/);
  });
});

describe('a missed goal names the stage that took the time', () => {
  it('prints the largest stage and its share beside MISSED, and nothing more for a goal met or a row without stages', () => {
    // Stage figures invented for the test; the shares follow from them (60 of 100 ms).
    const stages = { read: 10, decide: 30, flush: 60 };
    const rows = computeRatios([
      row({ id: 'slow', value: 20, better: 'lower', goal: { op: '<=', value: 10 }, stages }),
      row({ id: 'fast', value: 5, better: 'lower', goal: { op: '<=', value: 10 }, stages }),
      row({ id: 'bare', value: 100, better: 'higher', goal: { op: '>=', value: 5000 } }),
    ]);
    const lines = formatTable(rows).split('\n');
    expect(lines.find((l) => /^k +slow /.test(l))).toContain('<= 10 MISSED (most time: flush 60 %)');
    expect(lines.find((l) => /^k +fast /.test(l))).toMatch(/<= 10 met$/);
    expect(lines.find((l) => /^k +bare /.test(l))).toMatch(/>= 5000 MISSED$/);
    expect(largestStage({ check: 1, write: 3 })).toBe('write 75 %');
    expect(largestStage({})).toBeUndefined();
  });

  it('cuts one resolve at its statements into check, read, decide, write, flush and result, which add up to its time', () => {
    // A timeline shaped like one traced resolve on PostgreSQL (bench/resolve-stages.ts): begin, the stored mention,
    // locks and settings, candidates, the lock-and-ids statement, the set-based write, commit. Times invented.
    const at = (text: string, start: number, end: number) => ({ text, start, end });
    const statements = [
      at('begin', 2, 3),
      at('SELECT m.* FROM mention m', 3, 4),
      at('SELECT pg_advisory_xact_lock(h)', 4, 5),
      at('WITH q AS (SELECT p, key FROM unnest($1))', 5, 9),
      at('SELECT * FROM counterparty WHERE id = ANY($1) ORDER BY id FOR UPDATE', 15, 16),
      at('WITH w0 AS (INSERT INTO explanation (id, body) SELECT …)', 18, 21),
      at('commit', 21, 23),
    ];
    const stages = resolveStages(0, 24, statements);
    expect(stages).toEqual({ check: 2, read: 7, decide: 6, write: 3, flush: 5, result: 1 });
    expect(Object.values(stages).reduce((a, b) => a + b, 0)).toBe(24);
    // The first statement also draws ids (a single resolve's ids drawn with its locks): still read, not write.
    const drawing = [at('begin', 2, 3), at('SELECT pg_advisory_xact_lock(h), nextval(s) FROM k', 3, 5), ...statements.slice(3)];
    expect(resolveStages(0, 24, drawing)).toEqual({ check: 2, read: 7, decide: 6, write: 3, flush: 5, result: 1 });
    // A new counterparty: no lock statement after the candidates, the write draws its id itself (decide runs to it).
    const creating = [...drawing.slice(0, 3), at('WITH d AS (SELECT nextval(s)), w0 AS (INSERT INTO counterparty …)', 15, 21), at('commit', 21, 23)];
    expect(resolveStages(0, 24, creating)).toEqual({ check: 2, read: 7, decide: 6, write: 0, flush: 8, result: 1 });
    // Already ingested: only reads and the commit.
    expect(resolveStages(0, 5, [at('begin', 1, 2), at('SELECT m.* FROM mention m', 2, 3), at('commit', 3, 4)])).toEqual({
      check: 1,
      read: 2,
      decide: 0,
      write: 0,
      flush: 1,
      result: 1,
    });
  });
});

describe('ingest bench targets', () => {
  it('ingests into a loaded register only at 1,000,000 under a mode, and at every size given by --sizes', () => {
    expect(ingestTargets({ sizes: sizesFor('quick') }).filter((t) => t.registerSize > 0)).toEqual([]);
    expect(ingestTargets({ sizes: sizesFor('default') }).filter((t) => t.registerSize > 0)).toEqual([]);
    expect(ingestTargets({ sizes: sizesFor('full') }).filter((t) => t.registerSize > 0)).toEqual([
      { backend: 'postgres', size: 100_000, registerSize: 1_000_000 },
    ]);
    expect(ingestTargets({ sizes: sizesFor('quick', [10_000]), sizesGiven: true })).toEqual([
      { backend: 'pglite', size: 10_000, registerSize: 0 },
      { backend: 'postgres', size: 10_000, registerSize: 0 },
      { backend: 'postgres', size: 10_000, registerSize: 10_000 },
    ]);
    expect(ingestTargets({ sizes: sizesFor('default', [1_000_000]), sizesGiven: true })).toEqual([
      { backend: 'postgres', size: 1_000_000, registerSize: 0 },
      { backend: 'postgres', size: 1_000_000, registerSize: 1_000_000 },
    ]);
  });
});
