/**
 * Reads a labelled CSV for `cpreg evaluate`: one row per name, a ground-truth id column, a name column, an
 * optional country column, with row filters. Every row that cannot be used is reported with its line number
 * (unparseable CSV, empty id, empty name), never dropped silently; rows left out by --filter / --exclude are
 * counted.
 */
import { readFileSync } from 'node:fs';
import { parse } from 'csv-parse/sync';
import { countryQualifierStripper } from './country-qualifier.ts';

export interface LabelledRow {
  /** 1-based line of the CSV where the record ends (the header is line 1). */
  line: number;
  id: string;
  name: string;
  /** The name as written, before a country qualifier was stripped. */
  originalName: string;
  country?: string;
  fields: Record<string, string>;
}

export interface RowProblem {
  line: number;
  problem: string;
}

export interface LoadOptions {
  idColumn: string;
  nameColumn: string;
  countryColumn?: string;
  /** Keep only rows where every column=value holds (a column given twice keeps rows matching any of its values). */
  filters?: readonly (readonly [string, string])[];
  /** Drop rows where any column=value holds. */
  excludes?: readonly (readonly [string, string])[];
  /** Remove a trailing "(Country name)" display qualifier (ROR's convention), counting the rows changed. */
  stripCountryQualifier?: boolean;
  /** Keep only entities whose id hashes below this fraction (deterministic subsample of whole entities). */
  entitySample?: number;
}

export interface LoadedFile {
  rows: LabelledRow[];
  problems: RowProblem[];
  filteredOut: number;
  excludedOut: number;
  qualifiersStripped: number;
  columns: string[];
}

export class LabelledFileError extends Error {}

export function loadLabelledCsv(path: string, options: LoadOptions): LoadedFile {
  let text: string;
  try {
    text = readFileSync(path, 'utf8');
  } catch (error) {
    throw new LabelledFileError(`cannot read ${path}: ${(error as Error).message}`);
  }
  return parseLabelledCsv(text, options);
}

export function parseLabelledCsv(text: string, options: LoadOptions): LoadedFile {
  const problems: RowProblem[] = [];
  let columns: string[] = [];
  const records = parse(text, {
    bom: true,
    columns: (header: string[]) => {
      columns = header.map((h) => h.trim());
      return columns;
    },
    info: true,
    skip_empty_lines: true,
    skip_records_with_error: true,
    on_skip: (error: { lines?: number; message: string } | undefined) => {
      if (!error) return;
      const line = error.lines ?? 0;
      // csv-parse may report one broken row twice (e.g. a stray quote); one line, one problem.
      if (problems.at(-1)?.line === line) return;
      problems.push({ line, problem: `unparseable CSV row: ${error.message}` });
    },
  }) as { record: Record<string, string>; info: { lines: number } }[];
  checkColumns(columns, options);
  const filters = groupByColumn(options.filters ?? []);
  const strip = options.stripCountryQualifier ? countryQualifierStripper() : null;
  const rows: LabelledRow[] = [];
  let filteredOut = 0;
  let excludedOut = 0;
  let qualifiersStripped = 0;
  for (const { record, info } of records) {
    if (![...filters].every(([column, values]) => values.has(record[column] ?? ''))) {
      filteredOut++;
      continue;
    }
    if ((options.excludes ?? []).some(([column, value]) => record[column] === value)) {
      excludedOut++;
      continue;
    }
    const id = (record[options.idColumn] ?? '').trim();
    const originalName = (record[options.nameColumn] ?? '').trim();
    if (id === '') {
      problems.push({ line: info.lines, problem: `empty ${options.idColumn} (the ground-truth id); row left out` });
      continue;
    }
    if (originalName === '') {
      problems.push({ line: info.lines, problem: `empty ${options.nameColumn} (the name); row left out` });
      continue;
    }
    if (options.entitySample !== undefined && hashFraction(id) >= options.entitySample) {
      filteredOut++;
      continue;
    }
    const name = strip ? strip(originalName) : originalName;
    if (name !== originalName) qualifiersStripped++;
    const country = options.countryColumn ? (record[options.countryColumn] ?? '').trim() || undefined : undefined;
    rows.push({ line: info.lines, id, name, originalName, ...(country ? { country } : {}), fields: record });
  }
  problems.sort((a, b) => a.line - b.line);
  return { rows, problems, filteredOut, excludedOut, qualifiersStripped, columns };
}

function checkColumns(columns: string[], options: LoadOptions): void {
  const needed: [string, string][] = [
    ['--id', options.idColumn],
    ['--name', options.nameColumn],
  ];
  if (options.countryColumn) needed.push(['--country', options.countryColumn]);
  for (const [column] of options.filters ?? []) needed.push(['--filter', column]);
  for (const [column] of options.excludes ?? []) needed.push(['--exclude', column]);
  const missing = needed.filter(([, column]) => !columns.includes(column));
  if (columns.length === 0) throw new LabelledFileError('the file has no header row; the first line must name the columns');
  if (missing.length > 0) {
    const list = missing.map(([option, column]) => `${option} ${column}`).join(', ');
    throw new LabelledFileError(`column(s) not in the header: ${list}; the header has: ${columns.join(', ')}`);
  }
}

function groupByColumn(pairs: readonly (readonly [string, string])[]): Map<string, Set<string>> {
  const out = new Map<string, Set<string>>();
  for (const [column, value] of pairs) {
    const set = out.get(column) ?? new Set<string>();
    set.add(value);
    out.set(column, set);
  }
  return out;
}

/** Parses "column=value" (the value may itself contain "="). */
export function parseColumnValue(text: string, option: string): [string, string] {
  const at = text.indexOf('=');
  if (at <= 0) throw new LabelledFileError(`${option} expects column=value, got "${text}"`);
  return [text.slice(0, at).trim(), text.slice(at + 1)];
}

/** FNV-1a of the id mapped to [0, 1): a stable choice of entities for --entity-sample. */
function hashFraction(id: string): number {
  let h = 0x811c9dc5;
  for (let i = 0; i < id.length; i++) {
    h ^= id.charCodeAt(i);
    h = Math.imul(h, 0x01000193) >>> 0;
  }
  return h / 4294967296;
}
