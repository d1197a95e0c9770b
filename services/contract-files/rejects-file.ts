/** The rejects file of an import: one CSV row per file not imported (path, reason code, what it means, detail). */
import { createWriteStream, type WriteStream } from 'node:fs';
import { once } from 'node:events';
import { stringify } from 'csv-stringify/sync';
import { REJECT_REASONS, type FileReject } from '../../resolvers/files/index.ts';

export class FileRejectsWriter {
  private readonly stream: WriteStream;
  written = 0;

  /** The file is written even when nothing is rejected (a header only), so that no earlier run's list is left. */
  constructor(readonly file: string) {
    this.stream = createWriteStream(file, { flags: 'w' });
    this.stream.write(stringify([['path', 'reason', 'meaning', 'detail']]));
  }

  write(reject: FileReject): void {
    this.written++;
    this.stream.write(stringify([[reject.path, reject.reason, REJECT_REASONS[reject.reason], reject.detail]]));
  }

  async close(): Promise<void> {
    this.stream.end();
    await once(this.stream, 'finish');
  }
}
