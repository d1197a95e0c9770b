/**
 * The lines of an NDJSON stream, read with a bound on memory. node:readline keeps a line in memory however long
 * it grows (a 30 MB line took 250 MB): here a line longer than `maxBytes` is given up as soon as it passes the
 * limit — its bytes are dropped until the next line break and it is reported by its number as too long, with the
 * first bytes kept for the rejects file. Line breaks are those readline knew (LF, CRLF, a lone CR), so line
 * numbers stay what they were. Bytes are decoded per whole line, so a character split across chunks survives;
 * a line that is not well-formed UTF-8 is marked with the byte offset where its first bad sequence begins.
 */
import { decodeUtf8Strictly } from './utf8.ts';

export const MAX_NDJSON_LINE_BYTES = 1024 * 1024;
/** How much of a line that is too long is kept to show in the rejects file. */
const HEAD_BYTES = 200;

/**
 * A line; `notUtf8` when its bytes are not well-formed UTF-8 (then `text` is shown with U+FFFD, for the rejects
 * file only: such a line is refused, never read as a mention).
 */
export type NdjsonLine = { line: number; text: string; notUtf8?: { byteOffset: number; byte: number } } | { line: number; tooLong: true; head: string };

export interface NdjsonLineOptions {
  maxBytes?: number;
  /** Filled in while reading: the most bytes of one line held at once (tests check the bound). */
  stats?: { peakBufferedBytes: number };
}

const LF = 0x0a;
const CR = 0x0d;

/** Strictly: Buffer#toString would turn an ill-formed byte into U+FFFD and the row would be stored so. */
function decodeLine(line: number, bytes: Buffer): NdjsonLine {
  const decoded = decodeUtf8Strictly(bytes);
  if (decoded.ok) return { line, text: decoded.text };
  return { line, text: bytes.toString('utf8'), notUtf8: { byteOffset: decoded.byteOffset, byte: decoded.byte } };
}

export async function* ndjsonLines(stream: AsyncIterable<Buffer | string>, options: NdjsonLineOptions = {}): AsyncGenerator<NdjsonLine> {
  const maxBytes = options.maxBytes ?? MAX_NDJSON_LINE_BYTES;
  let parts: Buffer[] = [];
  let size = 0;
  let head: Buffer | undefined; // set once the current line passed maxBytes
  let line = 0;
  let afterCR = false;

  const append = (bytes: Buffer): void => {
    if (bytes.length === 0 || head) return;
    if (size + bytes.length > maxBytes) {
      head = Buffer.concat([...parts, bytes]).subarray(0, HEAD_BYTES);
      parts = [];
      size = 0;
      return;
    }
    parts.push(bytes);
    size += bytes.length;
    if (options.stats && size > options.stats.peakBufferedBytes) options.stats.peakBufferedBytes = size;
  };
  const take = (): NdjsonLine => {
    line++;
    const out: NdjsonLine = head ? { line, tooLong: true, head: head.toString('utf8') } : decodeLine(line, Buffer.concat(parts, size));
    parts = [];
    size = 0;
    head = undefined;
    return out;
  };

  for await (const piece of stream) {
    const chunk = typeof piece === 'string' ? Buffer.from(piece, 'utf8') : piece;
    let start = 0;
    for (let i = 0; i < chunk.length; i++) {
      const byte = chunk[i];
      if (byte !== LF && byte !== CR) continue;
      if (byte === LF && afterCR && i === start) {
        // The LF of a CRLF whose CR ended the previous line.
        afterCR = false;
        start = i + 1;
        continue;
      }
      append(chunk.subarray(start, i));
      yield take();
      afterCR = byte === CR;
      start = i + 1;
    }
    if (start < chunk.length) {
      afterCR = false;
      append(chunk.subarray(start));
    }
  }
  if (size > 0 || head) yield take();
}
