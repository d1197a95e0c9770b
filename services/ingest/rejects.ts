/** The rejects file: one CSV row per rejected input row (line, reason, the row as read), opened on first use. */
import { createWriteStream, type WriteStream } from 'node:fs';
import { once } from 'node:events';
import { stringify } from 'csv-stringify/sync';

export class RejectsWriter {
  private stream: WriteStream | undefined;
  written = 0;

  constructor(readonly file: string) {}

  write(line: number, reason: string, raw: string): void {
    if (!this.stream) {
      this.stream = createWriteStream(this.file, { flags: 'w' });
      this.stream.write(stringify([['line', 'reason', 'row']]));
    }
    this.written++;
    this.stream.write(stringify([[line, reason, raw]]));
  }

  async close(): Promise<void> {
    if (!this.stream) return;
    this.stream.end();
    await once(this.stream, 'finish');
  }
}
