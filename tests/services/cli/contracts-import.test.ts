/**
 * `cpreg contracts import` as a user runs it: a folder of documents made by independent writers (pdf-lib, `docx`,
 * fflate; tests/services/contract-files/support.ts), progress on stderr, a summary whose counts reconcile, the
 * rejects file, the caution, a second run that finds everything unchanged, and a zip bomb given as the target
 * refused with a clear error.
 */
import { mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { runCli } from '../../support/cli.ts';
import { createMigratedDataDir, makeTempDir, removeTempDir } from '../../support/index.ts';
import { docxFile, encryptedPdf, inventedContract, pdfLibPdf, zipOf } from '../contract-files/support.ts';

// Each run starts the embedded database in a new process (several seconds on a busy machine).
describe('cpreg contracts import', { timeout: 240_000 }, () => {
  let db: string;
  let dir: string;
  let folder: string;
  beforeAll(async () => {
    db = await createMigratedDataDir();
    dir = makeTempDir('cpreg-cli-import-');
    folder = join(dir, 'signed');
    mkdirSync(folder);
    writeFileSync(join(folder, 'supply.pdf'), await pdfLibPdf(inventedContract())); // pdf-lib
    writeFileSync(join(folder, 'service.docx'), await docxFile(inventedContract('Brindlecombe Tools Ltd', 'Tessaline Trading GmbH'))); // docx
    writeFileSync(join(folder, 'locked.pdf'), await encryptedPdf(inventedContract())); // pdfkit
    writeFileSync(join(folder, 'photo.png'), Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, 0, 0]));
  });
  afterAll(() => {
    removeTempDir(db);
    removeTempDir(dir);
  });

  it('imports a folder: summary, progress on stderr, rejects file beside the folder, the caution', async () => {
    const run = await runCli(['contracts', 'import', `${folder}/`, '--db', db]);
    expect(run.stderr).toMatch(/import: \d+ files?/);
    expect(run.code).toBe(0);
    expect(run.stdout).toContain('4 files read');
    expect(run.stdout).toMatch(/imported\s+2\s+\(new 2;/);
    expect(run.stdout).toMatch(/unchanged\s+0/);
    expect(run.stdout).toMatch(/rejected\s+2/);
    expect(run.stdout).toMatch(/encrypted_pdf\s+1/);
    expect(run.stdout).toMatch(/unsupported_type\s+1/);
    expect(run.stdout).toMatch(/= read\s+4/);
    expect(run.stdout).toContain('Extraction and party parsing are proposals: the signed document stands.');
    const rejects = readFileSync(`${folder}.rejects.csv`, 'utf8');
    expect(rejects.split('\n')[0]).toBe('path,reason,meaning,detail');
    expect(rejects).toContain('locked.pdf,encrypted_pdf,');
    expect(rejects).toContain('photo.png,unsupported_type,');
  });

  it('a second run reports everything unchanged (--json)', async () => {
    const run = await runCli(['contracts', 'import', folder, '--db', db, '--json']);
    expect(run.code).toBe(0);
    const summary = JSON.parse(run.stdout) as { files: Record<string, number>; contracts: unknown[]; caution: string };
    expect(summary.files).toEqual({ read: 4, imported: 0, new: 0, changed: 0, unchanged: 2, rejected: 2 });
    expect(summary.contracts).toEqual([]);
    expect(summary.caution).toContain('the signed document stands');
  });

  it('refuses the bomb entry of a zip given as the target while the rest imports; a missing target is one clear line', async () => {
    const bomb = join(dir, 'bomb.zip');
    // fflate: 20 MiB of spaces deflate to about 20 KiB; the limit on the total is 4 GiB, so the entry's ratio refuses it.
    writeFileSync(bomb, zipOf({ 'contract.txt': Buffer.alloc(20 * 1024 * 1024, 0x20), 'ok.txt': Buffer.from(inventedContract('Farrowdene Metals Ltd')) }));
    const run = await runCli(['contracts', 'import', bomb, '--db', db, '--json']);
    expect(run.code).toBe(0);
    const summary = JSON.parse(run.stdout) as { files: Record<string, number>; rejectedBy: Record<string, number> };
    expect(summary.files).toMatchObject({ read: 2, imported: 1, rejected: 1 });
    expect(summary.rejectedBy).toEqual({ compression_ratio: 1 });
    const missing = await runCli(['contracts', 'import', join(dir, 'nowhere'), '--db', db]);
    expect(missing.code).toBe(1);
    expect(missing.stderr).toContain('no such file or folder');
  });
});
