/**
 * The runner's table of results: each row's ratio against its baseline row, whether it met its goal, and the table
 * printed at the end of a run.
 */
import type { BenchRow } from './types.ts';

/** Fills `ratio` (times better than the baseline row) and `goalMet`. */
export function computeRatios(rows: BenchRow[]): BenchRow[] {
  const byKey = new Map(rows.map((r) => [`${r.bench}/${r.id}`, r]));
  return rows.map((row) => {
    const out = { ...row };
    if (row.baseline && row.skipped === undefined) {
      const base = byKey.get(`${row.bench}/${row.baseline}`);
      if (base && base.skipped === undefined && base.value > 0 && row.value > 0) {
        out.ratio = row.better === 'higher' ? row.value / base.value : base.value / row.value;
      }
    }
    if (row.goal && row.skipped === undefined) {
      out.goalMet = row.goal.op === '<=' ? row.value <= row.goal.value : row.value >= row.goal.value;
    }
    return out;
  });
}

/** The largest stage of a row's `stages` and its share of them all, e.g. "write 41 %"; undefined without stages. */
export function largestStage(stages: Record<string, number> | undefined): string | undefined {
  const entries = Object.entries(stages ?? {}).filter(([, v]) => Number.isFinite(v) && v > 0);
  if (entries.length === 0) return undefined;
  const total = entries.reduce((sum, [, v]) => sum + v, 0);
  const [stage, value] = entries.reduce((best, e) => (e[1] > best[1] ? e : best));
  return `${stage} ${Math.round((100 * value) / total)} %`;
}

/** The goal cell: the goal, whether it is met, and where it is missed the stage that took the most time. */
function goalCell(r: BenchRow): string {
  if (!r.goal) return '';
  const verdict = r.goalMet === undefined ? '' : r.goalMet ? 'met' : 'MISSED';
  const largest = r.goalMet === false ? largestStage(r.stages) : undefined;
  return `${r.goal.op} ${r.goal.value} ${verdict}${largest ? ` (most time: ${largest})` : ''}`;
}

function formatValue(v: number): string {
  if (!Number.isFinite(v)) return String(v);
  const abs = Math.abs(v);
  if (abs >= 1000) return Math.round(v).toLocaleString('en-US');
  if (abs >= 10) return v.toFixed(1);
  return v.toPrecision(3);
}

export function formatTable(rows: BenchRow[]): string {
  const header = ['bench', 'measure', 'size', 'backend', 'value', 'unit', 'vs baseline', 'goal'];
  const lines = rows.map((r) => [
    r.bench ?? '',
    r.label,
    r.size === undefined ? '' : r.size.toLocaleString('en-US'),
    r.backend ?? '',
    r.skipped !== undefined ? 'skipped' : formatValue(r.value),
    r.skipped !== undefined ? r.skipped : r.unit,
    r.ratio === undefined ? '' : `${r.ratio.toFixed(2)}× ${r.baseline}`,
    goalCell(r),
  ]);
  const widths = header.map((h, i) => Math.max(h.length, ...lines.map((l) => l[i]!.length)));
  const fmt = (cells: string[]): string =>
    cells
      .map((c, i) => c.padEnd(widths[i]!))
      .join('  ')
      .trimEnd();
  return [fmt(header), fmt(widths.map((w) => '-'.repeat(w))), ...lines.map(fmt)].join('\n');
}
