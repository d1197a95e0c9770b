/**
 * `importContractFiles` on each backend: documents made by independent writers (support.ts: pdf-lib, `docx`,
 * fflate) become contracts through the register's contract path; counts reconcile; a second import finds
 * everything unchanged; a changed file is stored again as a new version of the same contract, its history kept.
 */
import { readFileSync, writeFileSync, mkdirSync } from 'node:fs';
import { join } from 'node:path';
import { parse } from 'csv-parse/sync';
import { afterAll, beforeAll, expect, it } from 'vitest';
import { importContractFiles } from '../../../services/contract-files/import-files.ts';
import { describeEachBackend, makeTempDir, removeTempDir } from '../../support/database.ts';
import { docxFile, imageOnlyPdf, inventedContract, pdfLibPdf, zipOf } from './support.ts';

describeEachBackend('contract files imported', (ctx) => {
  let dir: string;
  let folder: string;
  const text = inventedContract();
  beforeAll(async () => {
    dir = makeTempDir('cpreg-import-');
    folder = join(dir, 'contracts');
    mkdirSync(folder);
    writeFileSync(join(folder, 'supply.pdf'), await pdfLibPdf(text)); // pdf-lib
    writeFileSync(join(folder, 'supply.docx'), await docxFile(text)); // docx
    writeFileSync(join(folder, 'supply.txt'), text);
    writeFileSync(join(folder, 'memo.txt'), 'Please file the signed copies by Friday.\n');
    writeFileSync(join(folder, 'scan.pdf'), await imageOnlyPdf());
    writeFileSync(
      join(folder, 'export.zip'),
      zipOf({ 'a/brackets.txt': Buffer.from(inventedContract('Farrowdene Metals Ltd')), '../escape.txt': Buffer.from(text) }),
    );
  });
  afterAll(() => removeTempDir(dir));

  const run = (rejectsFile: string) => importContractFiles({ db: ctx.db(), target: folder, source: 'shared-drive', actor: 'test:import', rejectsFile });

  it('imports the documents, links the same parties across them, and lists every file not imported', async () => {
    const rejectsFile = join(dir, 'first.rejects.csv');
    const summary = await run(rejectsFile);
    expect(summary.files).toEqual({ read: 7, imported: 4, new: 4, changed: 0, unchanged: 0, rejected: 3 });
    expect(summary.rejectedBy).toEqual({ no_parties: 1, no_text_layer: 1, unsafe_path: 1 });
    expect(summary.byType).toEqual({ pdf: 1, docx: 1, text: 2 });
    const contracts = await ctx.db().selectFrom('contract').select(['source', 'external_id', 'title']).orderBy('external_id').execute();
    expect(contracts).toEqual([
      { source: 'shared-drive', external_id: 'export.zip/a/brackets.txt', title: 'brackets.txt' },
      { source: 'shared-drive', external_id: 'supply.docx', title: 'supply.docx' },
      { source: 'shared-drive', external_id: 'supply.pdf', title: 'supply.pdf' },
      { source: 'shared-drive', external_id: 'supply.txt', title: 'supply.txt' },
    ]);
    // Three files of one contract name the same two companies: two counterparties, not six; the zip's adds one.
    const names = await ctx.db().selectFrom('counterparty').select('canonical_name').orderBy('canonical_name').execute();
    expect(names.map((n) => n.canonical_name)).toEqual(['Farrowdene Metals Ltd', 'Quillmoor Fabrication Ltd', 'Tessaline Trading GmbH']);
    const supply = summary.contracts.filter((c) => c.path.startsWith('supply.'));
    expect(new Set(supply.flatMap((c) => c.parties.map((p) => p.counterpartyId))).size).toBe(2);
    const rejects = parse(readFileSync(rejectsFile), { columns: true }) as { path: string; reason: string }[];
    expect(rejects.map((r) => [r.path, r.reason]).sort()).toEqual([
      ['export.zip/../escape.txt', 'unsafe_path'],
      ['memo.txt', 'no_parties'],
      ['scan.pdf', 'no_text_layer'],
    ]);
  });

  it('a second import finds every file unchanged; a changed file becomes a new version of its contract', async () => {
    const second = await run(join(dir, 'second.rejects.csv'));
    expect(second.files).toEqual({ read: 7, imported: 0, new: 0, changed: 0, unchanged: 4, rejected: 3 });
    const before = await ctx.db().selectFrom('contract').select(['id', 'content_hash']).where('external_id', '=', 'supply.txt').executeTakeFirstOrThrow();
    writeFileSync(join(folder, 'supply.txt'), inventedContract('Quillmoor Fabrication Ltd', 'Tessaline Trading GmbH', 'stainless hinges'));
    const third = await run(join(dir, 'third.rejects.csv'));
    expect(third.files).toEqual({ read: 7, imported: 1, new: 0, changed: 1, unchanged: 3, rejected: 3 });
    const after = await ctx
      .db()
      .selectFrom('contract')
      .select(['id', 'content_hash', 'text'])
      .where('external_id', '=', 'supply.txt')
      .executeTakeFirstOrThrow();
    expect(after.id).toBe(before.id);
    expect(after.content_hash).not.toBe(before.content_hash);
    expect(after.text).toContain('stainless hinges');
    const events = await ctx.db().selectFrom('history_event').select(['type', 'payload']).where('actor', '=', 'test:import').orderBy('id').execute();
    const ofContract = events.filter((e) => {
      const p = (typeof e.payload === 'string' ? JSON.parse(e.payload) : e.payload) as {
        details?: { entity?: string; contractId?: number };
        entity?: string;
        contractId?: number;
      };
      const d = p.details ?? p;
      return d.entity === 'contract' && Number(d.contractId) === Number(before.id);
    });
    expect(ofContract.map((e) => e.type)).toEqual(['created', 'mention_changed']);
  });
});
