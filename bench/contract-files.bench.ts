/**
 * Contract files imported per second on the embedded database (issue 20's goals: ≥ 20 contracts/s from text and
 * Word files, ≥ 5/s from text-layer PDFs), and the memory of reading a 10,000-file zip (streamed, never whole).
 * The contracts are the demo scenario's invented ones (services/demo/scenario), written as .txt and .docx (the
 * `docx` package) and as PDFs (pdf-lib) by the tests' writers; each folder goes into a fresh embedded database
 * through importContractFiles, the code `cpreg contracts import` runs.
 * Runs under bench/run.ts (`npm run bench -- --only contract-files`) or alone: `node bin/run-ts.js bench/contract-files.bench.ts`.
 */
import { mkdirSync, writeFileSync } from 'node:fs';
import { mkdtemp, rm } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { migrateToLatest } from '../db/migrate.ts';
import { openDatabase } from '../db/open-database.ts';
import { importContractFiles } from '../services/contract-files/import-files.ts';
import { DocumentFinder } from '../services/contract-files/find-documents.ts';
import { generateScenario } from '../services/demo/scenario/index.ts';
import { contractPdf, docxFile, zipOf } from '../tests/services/contract-files/support.ts';
import type { BenchContext, BenchRow } from './types.ts';

type Ctx = Pick<BenchContext, 'mode' | 'seed' | 'tmpDir' | 'log' | 'withPeakMemory'>;

async function importRate(ctx: Ctx, folder: string, label: string): Promise<{ rate: number; imported: number; read: number; seconds: number }> {
  const dir = join(ctx.tmpDir, `db-${label}`);
  const database = await openDatabase(dir, { command: 'bench contract-files' });
  try {
    await migrateToLatest(database.db);
    const summary = await importContractFiles({
      db: database.db,
      target: folder,
      source: 'bench',
      actor: 'bench',
      rejectsFile: join(ctx.tmpDir, `${label}.rejects.csv`),
    });
    const seconds = summary.elapsedMs / 1000;
    ctx.log(`${label}: ${summary.files.read} files read, ${summary.files.imported} imported, ${summary.files.rejected} rejected in ${seconds.toFixed(1)} s`);
    return { rate: summary.files.imported / seconds, imported: summary.files.imported, read: summary.files.read, seconds };
  } finally {
    await database.close();
  }
}

export async function run(ctx: Ctx): Promise<BenchRow[]> {
  const count = ctx.mode === 'quick' ? 100 : 300;
  const contracts = generateScenario(ctx.seed).contracts.slice(0, count);
  const textWord = join(ctx.tmpDir, 'text-word');
  const pdfs = join(ctx.tmpDir, 'pdf');
  mkdirSync(textWord, { recursive: true });
  mkdirSync(pdfs, { recursive: true });
  ctx.log(`writing ${contracts.length} contracts as .txt/.docx and as .pdf`);
  for (const [i, c] of contracts.entries()) {
    const name = c.externalId.replace(/[^\w.-]/g, '_');
    if (i % 2 === 0) writeFileSync(join(textWord, `${name}.txt`), c.text);
    else writeFileSync(join(textWord, `${name}.docx`), await docxFile(c.text)); // docx
    writeFileSync(join(pdfs, `${name}.pdf`), await contractPdf(c.text)); // pdf-lib
  }

  // 10,000 small text files in one zip, read and extracted without a database (first, before any database
  // is opened, so that the process's peak is this reading's): memory stays about that of one file.
  const files = 10_000;
  const zipFile = join(ctx.tmpDir, 'many.zip');
  writeFileSync(
    zipFile,
    zipOf(Object.fromEntries(Array.from({ length: files }, (_, i) => [`c/${i}.txt`, Buffer.from(contracts[i % contracts.length]!.text)]))),
  );
  const rssBefore = process.memoryUsage().rss / 1048576;
  const started = performance.now();
  const {
    result: read,
    peakRssMb,
    peakHeapMb,
  } = await ctx.withPeakMemory(async () => {
    let n = 0;
    for await (const found of new DocumentFinder(zipFile).documents()) if (found.kind === 'document') n++;
    return n;
  });
  const zipSeconds = (performance.now() - started) / 1000;
  const tw = await importRate(ctx, textWord, 'text-word');
  const pdf = await importRate(ctx, pdfs, 'pdf');
  return [
    {
      id: 'import.text-word',
      label: 'contracts imported per second from .txt and .docx files (half each), embedded database',
      value: tw.rate,
      unit: 'contracts/s',
      better: 'higher',
      size: tw.imported,
      backend: 'pglite',
      goal: { op: '>=', value: 20 },
      extra: { read: tw.read, seconds: tw.seconds },
    },
    {
      id: 'import.pdf',
      label: 'contracts imported per second from text-layer PDFs, embedded database',
      value: pdf.rate,
      unit: 'contracts/s',
      better: 'higher',
      size: pdf.imported,
      backend: 'pglite',
      goal: { op: '>=', value: 5 },
      extra: { read: pdf.read, seconds: pdf.seconds },
    },
    {
      id: 'zip.read.10000',
      label: 'files read and extracted per second from a 10,000-file zip (no database)',
      value: read / zipSeconds,
      unit: 'files/s',
      better: 'higher',
      size: read,
      backend: 'memory',
    },
    {
      id: 'zip.read.10000.peakRss',
      label: 'peak RSS while reading a 10,000-file zip',
      value: peakRssMb,
      unit: 'MB',
      better: 'lower',
      size: read,
      backend: 'memory',
      extra: { peakHeapMb, rssBeforeMb: rssBefore },
    },
    {
      id: 'zip.read.10000.rssGrowth',
      label: 'RSS growth while reading a 10,000-file zip (peak minus before)',
      value: peakRssMb - rssBefore,
      unit: 'MB',
      better: 'lower',
      size: read,
      backend: 'memory',
    },
  ];
}

// Alone: `node bin/run-ts.js bench/contract-files.bench.ts [--quick]` prints the rows (the runner passes --child instead).
if (!process.argv.includes('--child')) {
  const tmp = await mkdtemp(join(tmpdir(), 'cpreg-bench-files-'));
  try {
    const rows = await run({
      mode: process.argv.includes('--quick') ? 'quick' : 'default',
      seed: 1,
      tmpDir: tmp,
      log: (message) => process.stderr.write(`${message}\n`),
      withPeakMemory: async (fn) => {
        let peak = 0;
        let heap = 0;
        const sample = (): void => {
          const m = process.memoryUsage();
          peak = Math.max(peak, m.rss / 1048576);
          heap = Math.max(heap, m.heapUsed / 1048576);
        };
        const timer = setInterval(sample, 50);
        try {
          const result = await fn(sample);
          sample();
          return { result, peakRssMb: peak, peakHeapMb: heap };
        } finally {
          clearInterval(timer);
        }
      },
    });
    for (const r of rows) console.log(`${r.label}: ${r.value.toFixed(1)} ${r.unit}`);
  } finally {
    await rm(tmp, { recursive: true, force: true });
  }
}
