/** Streams generated names to a CSV file with back-pressure, so memory stays flat at any size. */
import { createWriteStream } from 'node:fs';
import { rename, rm } from 'node:fs/promises';
import { once } from 'node:events';
import { generateNames } from './generate-names.ts';
import { nameCsvLine, NAME_CSV_HEADER } from './name-csv.ts';

export interface NamesFileSummary {
  file: string;
  rows: number;
  entities: number;
  originals: number;
}

/**
 * Writes to `<file>.partial` and renames when complete, so an interrupted run never leaves a file that
 * looks finished.
 */
export async function writeNamesCsv(file: string, count: number, seed: number): Promise<NamesFileSummary> {
  const partial = `${file}.partial`;
  const out = createWriteStream(partial, { encoding: 'utf8' });
  const failed = new Promise<never>((_, reject) => out.once('error', reject));
  failed.catch(() => undefined);
  let rows = 0;
  let originals = 0;
  try {
    let chunk = `${NAME_CSV_HEADER}\n`;
    for (const row of generateNames(count, seed)) {
      rows++;
      if (row.variantKind === 'original') originals++;
      chunk += `${nameCsvLine(row)}\n`;
      if (chunk.length > 64 * 1024) {
        if (!out.write(chunk)) await Promise.race([once(out, 'drain'), failed]);
        chunk = '';
      }
    }
    out.end(chunk);
    await Promise.race([once(out, 'finish'), failed]);
  } catch (error) {
    out.destroy();
    await rm(partial, { force: true });
    throw error;
  }
  await rename(partial, file);
  // Every entity's original comes before its variants, so an entity with any row has its original.
  return { file, rows, entities: originals, originals };
}
