/**
 * Exports of the register: register (counterparties), links (every mention to its counterparty), history and
 * review — as CSV or NDJSON, produced as a stream of text chunks read in keyset pages (memory stays flat).
 * Own entities are not counterparties and never appear in the register export; in the links export a mention
 * resolved to an own entity shows its status `own_entity` and no counterparty.
 *
 * Each column says whether it is free text (`text: true`): free-text CSV cells are neutralised against formula
 * injection (neutralise.ts); NDJSON carries values as they are.
 */
import { stringify } from 'csv-stringify/sync';
import type { Kysely } from 'kysely';
import type { Database } from '../../db/types.ts';
import { neutralise } from './neutralise.ts';
import { historyExportPage, linkExportPage, registerExportPage, reviewExportPage } from '../../db/queries/export-pages.ts';

export const EXPORT_KINDS = ['register', 'links', 'history', 'review'] as const;
export type ExportKind = (typeof EXPORT_KINDS)[number];
export const EXPORT_FORMATS = ['csv', 'ndjson'] as const;
export type ExportFormat = (typeof EXPORT_FORMATS)[number];

type Value = string | number | boolean | null;
export interface Column {
  name: string;
  text: boolean;
}

const PAGE = 1000;

export const COLUMNS: Record<ExportKind, Column[]> = {
  register: [
    { name: 'counterparty_id', text: false },
    { name: 'canonical_name', text: true },
    { name: 'kind', text: false },
    { name: 'jurisdiction', text: false },
    { name: 'names', text: true },
    { name: 'identifiers', text: false },
    { name: 'mention_count', text: false },
    { name: 'contract_count', text: false },
    { name: 'version', text: false },
    { name: 'created_at', text: false },
    { name: 'updated_at', text: false },
  ],
  links: [
    { name: 'mention_id', text: false },
    { name: 'source', text: true },
    { name: 'external_id', text: true },
    { name: 'text', text: true },
    { name: 'contract_source', text: true },
    { name: 'contract_external_id', text: true },
    { name: 'role', text: true },
    { name: 'status', text: false },
    { name: 'counterparty_id', text: false },
    { name: 'canonical_name', text: true },
    { name: 'score', text: false },
    { name: 'confirmed_by', text: true },
  ],
  history: [
    { name: 'event_id', text: false },
    { name: 'type', text: false },
    { name: 'at', text: false },
    { name: 'actor', text: true },
    { name: 'reason', text: true },
    { name: 'counterparty_ids', text: false },
    { name: 'mention_ids', text: false },
    { name: 'undoes_event_id', text: false },
    { name: 'details', text: true },
  ],
  review: [
    { name: 'review_item_id', text: false },
    { name: 'kind', text: false },
    { name: 'status', text: false },
    { name: 'score', text: false },
    { name: 'mention_id', text: false },
    { name: 'mention_text', text: true },
    { name: 'left_counterparty_id', text: false },
    { name: 'left_name', text: true },
    { name: 'right_counterparty_id', text: false },
    { name: 'right_name', text: true },
    { name: 'decision', text: false },
    { name: 'decided_by', text: true },
    { name: 'reason', text: true },
    { name: 'created_at', text: false },
  ],
};

const iso = (v: unknown): string | null => (v === null || v === undefined ? null : new Date(v as string).toISOString());
const num = (v: unknown): number | null => (v === null || v === undefined ? null : Number(v));

async function* registerRows(db: Kysely<Database>): AsyncGenerator<Record<string, Value>[]> {
  let after = 0;
  for (;;) {
    const rows = await registerExportPage(db, after, PAGE);
    if (rows.length === 0) return;
    after = Number(rows[rows.length - 1]!.id);
    yield rows.map((r) => ({
      counterparty_id: Number(r.id),
      canonical_name: r.canonical_name,
      kind: r.kind,
      jurisdiction: r.jurisdiction ?? null,
      names: r.names ?? '',
      identifiers: r.identifiers ?? '',
      mention_count: Number(r.mention_count),
      contract_count: Number(r.contract_count),
      version: Number(r.version),
      created_at: iso(r.created_at),
      updated_at: iso(r.updated_at),
    }));
  }
}

async function* linkRows(db: Kysely<Database>): AsyncGenerator<Record<string, Value>[]> {
  let after = 0;
  for (;;) {
    const rows = await linkExportPage(db, after, PAGE);
    if (rows.length === 0) return;
    after = Number(rows[rows.length - 1]!.id);
    yield rows.map((r) => ({
      mention_id: Number(r.id),
      source: r.source,
      external_id: r.external_id,
      text: r.text,
      contract_source: r.contract_source,
      contract_external_id: r.contract_external_id,
      role: r.role,
      status: r.status,
      counterparty_id: num(r.counterparty_id),
      canonical_name: r.canonical_name ?? null,
      score: r.score === null || !Number.isFinite(Number(r.score)) ? null : Number(r.score),
      confirmed_by: r.confirmed_by,
    }));
  }
}

async function* historyRows(db: Kysely<Database>): AsyncGenerator<Record<string, Value>[]> {
  let after = 0;
  for (;;) {
    const rows = await historyExportPage(db, after, PAGE);
    if (rows.length === 0) return;
    after = Number(rows[rows.length - 1]!.id);
    yield rows.map((r) => {
      const payload = (typeof r.payload === 'string' ? JSON.parse(r.payload) : r.payload) as { details?: unknown };
      return {
        event_id: Number(r.id),
        type: r.type,
        at: iso(r.at),
        actor: r.actor,
        reason: r.reason,
        counterparty_ids: (r.counterparty_ids ?? []).map(Number).join(' '),
        mention_ids: (r.mention_ids ?? []).map(Number).join(' '),
        undoes_event_id: num(r.undoes_event_id),
        details: JSON.stringify(payload?.details ?? {}),
      };
    });
  }
}

async function* reviewRows(db: Kysely<Database>): AsyncGenerator<Record<string, Value>[]> {
  let after = 0;
  for (;;) {
    const rows = await reviewExportPage(db, after, PAGE);
    if (rows.length === 0) return;
    after = Number(rows[rows.length - 1]!.id);
    yield rows.map((r) => ({
      review_item_id: Number(r.id),
      kind: r.kind,
      status: r.status,
      score: r.score === null || !Number.isFinite(Number(r.score)) ? null : Number(r.score),
      mention_id: num(r.mention_id),
      mention_text: r.mention_text ?? null,
      left_counterparty_id: num(r.left_counterparty_id),
      left_name: r.left_name ?? null,
      right_counterparty_id: num(r.right_counterparty_id),
      right_name: r.right_name ?? null,
      decision: r.decision,
      decided_by: r.decided_by,
      reason: r.reason,
      created_at: iso(r.created_at),
    }));
  }
}

const SOURCES: Record<ExportKind, (db: Kysely<Database>) => AsyncGenerator<Record<string, Value>[]>> = {
  register: registerRows,
  links: linkRows,
  history: historyRows,
  review: reviewRows,
};

export function csvLine(columns: Column[], row: Record<string, Value>): string {
  return stringify([
    columns.map((c) => {
      const v = row[c.name];
      if (v === null || v === undefined) return '';
      return c.text ? neutralise(String(v)) : String(v);
    }),
  ]);
}

/** The export as text chunks (one page of rows each); `onRows` counts rows for progress. */
export async function* exportChunks(db: Kysely<Database>, kind: ExportKind, format: ExportFormat, onRows?: (n: number) => void): AsyncGenerator<string> {
  const columns = COLUMNS[kind];
  if (format === 'csv') yield stringify([columns.map((c) => c.name)]);
  for await (const rows of SOURCES[kind](db)) {
    onRows?.(rows.length);
    yield rows.map((row) => (format === 'csv' ? csvLine(columns, row) : `${JSON.stringify(row)}\n`)).join('');
  }
}
