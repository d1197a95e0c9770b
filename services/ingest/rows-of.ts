/**
 * The rows of an ingest file, CSV or NDJSON, streamed with their line numbers and raw text, each read into a mention
 * or refused with the reason (not UTF-8, not JSON, a cell too many or too few, a header that names a column twice).
 */
import { parse } from 'csv-parse';
import { columnWarnings, MappingError, mentionFromJson, mentionFromRow, resolveColumns, type FieldMap, type RowResult } from './mapping.ts';
import { MAX_NDJSON_LINE_BYTES, ndjsonLines } from './ndjson-lines.ts';
import { duplicateColumn } from './duplicate-column.ts';
import { hexByte } from './utf8.ts';
import { Utf8Watch } from './utf8-watch.ts';

export type IngestFormat = 'csv' | 'ndjson';

export function formatOf(file: string, given?: IngestFormat): IngestFormat {
  if (given) return given;
  const lower = file.toLowerCase();
  if (lower.endsWith('.ndjson') || lower.endsWith('.jsonl')) return 'ndjson';
  if (lower.endsWith('.csv')) return 'csv';
  throw new RangeError(`cannot tell the format of ${file} from its name: use .csv or .ndjson, or --format`);
}

export interface Row {
  line: number;
  raw: string;
  result: RowResult;
}

/** Rows of the file, each with its line number and raw text. */
export async function* rowsOf(
  file: string,
  format: IngestFormat,
  source: string,
  map: FieldMap,
  stream: NodeJS.ReadableStream,
  onSkip: (line: number, reason: string, raw: string) => void,
  onWarning: (message: string) => void = () => undefined,
): AsyncGenerator<Row> {
  if (format === 'ndjson') {
    for await (const read of ndjsonLines(stream as AsyncIterable<Buffer | string>)) {
      const line = read.line;
      if ('tooLong' in read) {
        yield {
          line,
          raw: `${read.head}…`,
          result: { ok: false, reason: `the line is longer than ${MAX_NDJSON_LINE_BYTES} bytes (1 MB), the limit of an NDJSON line` },
        };
        continue;
      }
      if (read.notUtf8) {
        yield { line, raw: read.text, result: { ok: false, reason: notUtf8Reason(read.notUtf8, 'of the line') } };
        continue;
      }
      // A byte order mark before the first line is an encoding marker, not text (the CSV reader strips it too).
      const text = line === 1 && read.text.startsWith('\uFEFF') ? read.text.slice(1) : read.text;
      if (text.trim() === '') continue;
      let value: unknown;
      try {
        value = JSON.parse(text);
      } catch (error) {
        yield { line, raw: text, result: { ok: false, reason: `not valid JSON: ${(error as Error).message}` } };
        continue;
      }
      yield { line, raw: text, result: mentionFromJson(value, text, source) };
    }
    return;
  }
  // csv-parse decodes an ill-formed byte to U+FFFD: the watch notes where such bytes lie and a record that holds
  // one is refused by its line (utf8-watch.ts).
  const watch = new Utf8Watch();
  let recordStart = 0;
  const parser = stream.pipe(watch).pipe(
    parse({
      bom: true,
      relax_column_count: true,
      skip_empty_lines: true,
      info: true,
      raw: true,
      skip_records_with_error: true,
      on_skip: (error, raw) => {
        onSkip((error as { lines?: number } | undefined)?.lines ?? 0, `unreadable CSV: ${error?.message ?? 'parse error'}`, raw ?? '');
        return undefined;
      },
    }),
  );
  let header: string[] | undefined;
  let columns: FieldMap = {};
  for await (const item of parser as AsyncIterable<{ record: string[]; info: { lines: number; bytes: number }; raw: string }>) {
    const { record, info, raw } = item;
    const line = info.lines;
    // The record's bytes are those after the previous record's end (a record skipped as unreadable CSV in between
    // is counted with this one's range: its own bytes were refused already).
    const bad = watch.firstIn(recordStart, info.bytes);
    const at = recordStart;
    recordStart = info.bytes;
    if (bad) {
      const where = { byteOffset: bad.offset - at, byte: bad.byte };
      if (!header) throw new MappingError(`the CSV header (line ${line}) is ${notUtf8Reason(where, 'of the header')}`);
      yield { line, raw: raw.replace(/\r?\n$/, ''), result: { ok: false, reason: notUtf8Reason(where, 'of the row') } };
      continue;
    }
    if (!header) {
      header = record.map((h) => h.trim());
      // Two columns of one name would leave each row holding only the last one's cell: the file is refused.
      const twice = duplicateColumn(header);
      if (twice)
        throw new MappingError(`the CSV header names the column "${twice.name}" twice (columns ${twice.first} and ${twice.second}); rename or remove one`);
      columns = resolveColumns(header, map);
      for (const warning of columnWarnings(header, columns)) onWarning(warning);
      continue;
    }
    const rawText = raw.replace(/\r?\n$/, '');
    if (record.length !== header.length) {
      yield { line, raw: rawText, result: { ok: false, reason: `has ${record.length} cells, the header has ${header.length}` } };
      continue;
    }
    const row: Record<string, string> = {};
    header.forEach((h, i) => (row[h] = record[i]!));
    yield { line, raw: rawText, result: mentionFromRow(row, record, columns, source) };
  }
  void file;
}

/** `not valid UTF-8: the byte 0xFF at byte offset 12 of the line …` (offsets count from 0). */
function notUtf8Reason(bad: { byteOffset: number; byte: number }, of: string): string {
  return `not valid UTF-8: the byte ${hexByte(bad.byte)} at byte offset ${bad.byteOffset} ${of} begins no well-formed sequence (RFC 3629); save the file as UTF-8`;
}
