/**
 * The rows of the register's size after a scale-out run: each big table (with its indexes and TOAST) and all of them
 * together, per million mentions.
 */
import type { BenchRow } from '../types.ts';
import { SIZED_TABLES, type RunOutcome } from './run-once.ts';

/** The sizes read after the last complete run of one size, per million mentions; one skipped row when no run finished. */
export function sizeRows(size: number, lastComplete: RunOutcome | undefined): BenchRow[] {
  const rows: BenchRow[] = [];
  if (!lastComplete?.sizes) {
    rows.push({
      id: `scaleout.${size}.size.total`,
      label: 'register size per million mentions',
      value: 0,
      unit: 'MB',
      better: 'lower',
      size,
      backend: 'postgres',
      skipped: 'no run finished within its budget',
    });
    return rows;
  }
  const mentions = lastComplete.mentionRows!;
  const cps = lastComplete.counterparties!;
  const mb = (bytes: number): number => bytes / 1024 ** 2;
  let total = 0;
  for (const t of lastComplete.sizes) {
    total += t.bytes;
    rows.push({
      id: `scaleout.${size}.size.${t.table}`,
      label: `${t.table} (table + indexes + TOAST) per million mentions`,
      value: (mb(t.bytes) * 1e6) / mentions,
      unit: 'MB',
      better: 'lower',
      size,
      backend: 'postgres',
      extra: {
        bytes: t.bytes,
        tableBytes: t.tableBytes,
        indexBytes: t.indexBytes,
        rows: t.rows,
        mentions,
        counterparties: cps,
        mbPerMillionCounterparties: (mb(t.bytes) * 1e6) / Math.max(1, cps),
        rowsPerMention: t.rows / mentions,
      },
    });
  }
  rows.push({
    id: `scaleout.${size}.size.total`,
    label: `the ${SIZED_TABLES.length} tables together per million mentions`,
    value: (mb(total) * 1e6) / mentions,
    unit: 'MB',
    better: 'lower',
    size,
    backend: 'postgres',
    extra: {
      bytes: total,
      mentions,
      counterparties: cps,
      counterpartiesPerMention: cps / mentions,
      mbPerMillionCounterparties: (mb(total) * 1e6) / Math.max(1, cps),
    },
  });
  return rows;
}
