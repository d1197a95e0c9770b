// The bench runner's pure parts (the benchmarks themselves never run in `npm test`).
import { describe, expect, it } from 'vitest';
import { discover } from '../../bench/discover.ts';
import { computeRatios, formatTable } from '../../bench/format-table.ts';
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
