/**
 * A pass-through stream that notes, without changing a byte, where ill-formed UTF-8 sequences begin (file
 * offsets, counted from 0) as the bytes go by. The CSV reader decodes cells itself (an ill-formed byte becomes
 * U+FFFD, and csv-parse cannot hand out bytes instead: its errors fail with `encoding: null`); it reports how
 * many bytes it had read at the end of each record (`info.bytes`), so a record whose byte range holds a noted
 * offset is refused by its line instead of being stored with U+FFFD. A sequence split across two chunks is held
 * until the next chunk decides it.
 */
import { Transform, type TransformCallback } from 'node:stream';
import { sequenceAt } from './utf8.ts';

export interface IllFormedByte {
  offset: number;
  byte: number;
}

export class Utf8Watch extends Transform {
  /** In file order, from the last range asked on. */
  readonly illFormed: IllFormedByte[] = [];
  private carry: Buffer = Buffer.alloc(0);
  /** File offset of carry[0] (or of the next chunk when nothing is carried). */
  private base = 0;

  override _transform(chunk: Buffer, _encoding: BufferEncoding, done: TransformCallback): void {
    const bytes = this.carry.length > 0 ? Buffer.concat([this.carry, chunk]) : chunk;
    let i = 0;
    while (i < bytes.length) {
      const length = sequenceAt(bytes, i);
      if (length === -1) break; // undecided: kept for the next chunk
      if (length === 0) {
        this.illFormed.push({ offset: this.base + i, byte: bytes[i]! });
        i++;
      } else i += length;
    }
    this.carry = Buffer.from(bytes.subarray(i));
    this.base += i;
    done(null, chunk);
  }

  override _flush(done: TransformCallback): void {
    // The file ends inside a sequence: ill-formed (a sequence cut short).
    if (this.carry.length > 0) this.illFormed.push({ offset: this.base, byte: this.carry[0]! });
    done();
  }

  /**
   * The first ill-formed byte in [start, end), or undefined. Ranges are asked in file order: what lies before
   * `start` is forgotten, so a file full of bad bytes (Latin-1 saved as CSV) holds only what the parser has not
   * reached yet (bounded by the streams' buffers).
   */
  firstIn(start: number, end: number): IllFormedByte | undefined {
    let drop = 0;
    while (drop < this.illFormed.length && this.illFormed[drop]!.offset < start) drop++;
    if (drop > 0) this.illFormed.splice(0, drop);
    const first = this.illFormed[0];
    return first && first.offset < end ? first : undefined;
  }
}
