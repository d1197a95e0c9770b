/**
 * Finding contract documents and extracting their text, checked against documents made by independent writers
 * (support.ts names each: pdf-lib, pdfkit, the `docx` package, fflate): the parties parsed from the extracted
 * text equal those parsed from the plain text of the same invented contract; hostile archives are refused entry by
 * entry, with their reasons, while the other files are read.
 */
import { mkdirSync, symlinkSync, truncateSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { parseParties } from '../../../resolvers/terms/index.ts';
import { ArchiveRefusedError, DocumentFinder, type Found } from '../../../services/contract-files/find-documents.ts';
import { makeTempDir, removeTempDir } from '../../support/database.ts';
import { SYMLINK_ATTRS, docxFile, encryptedPdf, imageOnlyPdf, inventedContract, pdfLibPdf, zipOf } from './support.ts';

const text = inventedContract();
const partiesOf = (t: string) => parseParties(t).parties.map((p) => ({ name: p.name, role: p.role, terms: p.terms, jurisdiction: p.jurisdiction }));

async function findAll(target: string, options: ConstructorParameters<typeof DocumentFinder>[1] = {}): Promise<{ found: Found[]; finder: DocumentFinder }> {
  const finder = new DocumentFinder(target, options);
  const found: Found[] = [];
  for await (const f of finder.documents()) found.push(f);
  return { found, finder };
}

const byPath = (found: Found[]) => new Map(found.map((f) => [f.path, f]));

let dir: string;
beforeAll(() => {
  dir = makeTempDir('cpreg-files-');
});
afterAll(() => removeTempDir(dir));

describe('text extraction against independent writers', () => {
  it('the plain text parses into two parties (the reference the others are held to)', () => {
    expect(partiesOf(text).map((p) => p.name)).toEqual(['Quillmoor Fabrication Ltd', 'Tessaline Trading GmbH']);
  });

  it('a PDF written by pdf-lib, a Word file by `docx` and the text itself give the same parties', async () => {
    const folder = join(dir, 'parity');
    mkdirSync(folder);
    writeFileSync(join(folder, 'supply.pdf'), await pdfLibPdf(text)); // pdf-lib
    writeFileSync(join(folder, 'supply.docx'), await docxFile(text)); // docx
    writeFileSync(join(folder, 'supply.txt'), text);
    const { found } = await findAll(folder);
    expect(found.map((f) => [f.path, f.kind, f.kind === 'document' ? f.fileType : f.reason])).toEqual([
      ['supply.docx', 'document', 'docx'],
      ['supply.pdf', 'document', 'pdf'],
      ['supply.txt', 'document', 'text'],
    ]);
    for (const f of found) if (f.kind === 'document') expect(partiesOf(f.text), f.path).toEqual(partiesOf(text));
    // The Word text is the plain text line for line (one paragraph a line, blank lines kept).
    const docx = found.find((f) => f.path === 'supply.docx');
    expect(docx?.kind === 'document' && docx.text).toBe(text);
  });

  it('reads the type from the content: a PDF named .txt is read as a PDF, a Word file without extension as Word', async () => {
    const folder = join(dir, 'misnamed');
    mkdirSync(folder);
    writeFileSync(join(folder, 'really-a-pdf.txt'), await pdfLibPdf(text));
    writeFileSync(join(folder, 'word-file'), await docxFile(text));
    const { found } = await findAll(folder);
    expect(found.map((f) => (f.kind === 'document' ? f.fileType : f.reason))).toEqual(['pdf', 'docx']);
  });
});

describe('files refused with their reasons while the others are read', () => {
  it('encrypted PDF (pdfkit), image-only PDF (pdf-lib), over-size, unsupported, empty, a symlink, no subfolders', async () => {
    const folder = join(dir, 'mixed');
    mkdirSync(join(folder, 'sub'), { recursive: true });
    writeFileSync(join(folder, 'good.txt'), text);
    writeFileSync(join(folder, 'locked.pdf'), await encryptedPdf(text)); // pdfkit, user password
    writeFileSync(join(folder, 'scan.pdf'), await imageOnlyPdf()); // pdf-lib, a rectangle and no text
    writeFileSync(join(folder, 'big.txt'), Buffer.alloc(60_000, 'a'));
    writeFileSync(join(folder, 'vendors.csv'), 'name,country\nQuillmoor,GB\n');
    writeFileSync(join(folder, 'empty.txt'), '   \n');
    writeFileSync(join(folder, 'sub', 'deeper.txt'), text);
    symlinkSync(join(folder, 'good.txt'), join(folder, 'link.txt'));
    const { found, finder } = await findAll(folder, { limits: { maxFileBytes: 50_000 } });
    const got = byPath(found);
    expect(got.get('good.txt')?.kind).toBe('document');
    expect(got.get('locked.pdf')).toMatchObject({ reason: 'encrypted_pdf' });
    expect(got.get('scan.pdf')).toMatchObject({ reason: 'no_text_layer', detail: '1 page without any text' });
    expect(got.get('big.txt')).toMatchObject({ reason: 'file_too_large', detail: '60000 bytes; the limit for one file is 50000 bytes' });
    expect(got.get('vendors.csv')).toMatchObject({ reason: 'unsupported_type' });
    expect(got.get('empty.txt')).toMatchObject({ reason: 'no_text' });
    expect(got.get('link.txt')).toMatchObject({ reason: 'symlink' });
    expect(got.has('sub/deeper.txt')).toBe(false);
    expect(finder.skippedFolders).toBe(1);
    expect(found).toHaveLength(7);
    const again = await findAll(folder, { recursive: true, limits: { maxFileBytes: 50_000 } });
    expect(byPath(again.found).get('sub/deeper.txt')?.kind).toBe('document');
  });

  it('a PDF of 50 MB (50,000,000 bytes) is refused with its size under the default limits; one byte less is read', async () => {
    // The edge of the default limit (resolvers/files/limits.ts): issue 20 says a PDF of 50 MB is refused. Sparse
    // files of zeros: the size is what is checked; the smaller one is read and found to be no PDF.
    const folder = join(dir, 'fifty');
    mkdirSync(folder);
    for (const [file, size] of [
      ['fifty.pdf', 50_000_000],
      ['under.pdf', 49_999_999],
    ] as const) {
      writeFileSync(join(folder, file), '');
      truncateSync(join(folder, file), size);
    }
    const got = byPath((await findAll(folder)).found);
    expect(got.get('fifty.pdf')).toMatchObject({ reason: 'file_too_large', detail: '50000000 bytes; the limit for one file is 49999999 bytes' });
    expect(got.get('under.pdf')).toMatchObject({ kind: 'rejected' });
    expect(got.get('under.pdf')).not.toMatchObject({ reason: 'file_too_large' });
  });

  it('a text over the 1 MB contract limit is refused as such', async () => {
    const folder = join(dir, 'long');
    mkdirSync(folder);
    writeFileSync(join(folder, 'long.txt'), `${text}\n${'x'.repeat(1024 * 1024)}`);
    const { found } = await findAll(folder);
    expect(found[0]).toMatchObject({ reason: 'text_too_large' });
  });
});

describe('hostile archives (built with fflate)', () => {
  it('path traversal, absolute paths, a symlink entry and a zip bomb entry are refused; the rest imports', async () => {
    const archive = zipOf({
      'contracts/good.txt': Buffer.from(text),
      '../escape.txt': Buffer.from(text),
      'contracts/../../escape2.txt': Buffer.from(text),
      '/etc/absolute.txt': Buffer.from(text),
      'contracts/link.txt': [Buffer.from('../../etc/passwd'), SYMLINK_ATTRS],
      'bomb.txt': Buffer.alloc(20 * 1024 * 1024, 0x20), // 20 MiB of spaces deflate to about 20 KiB
      'contracts/word.docx': [await docxFile(text), { level: 0 }],
    });
    const file = join(dir, 'hostile.zip');
    writeFileSync(file, archive);
    const { found } = await findAll(file);
    const got = byPath(found);
    expect(got.get('contracts/good.txt')?.kind).toBe('document');
    expect(got.get('contracts/word.docx')).toMatchObject({ kind: 'document', fileType: 'docx' });
    expect(got.get('../escape.txt')).toMatchObject({ reason: 'unsafe_path' });
    expect(got.get('contracts/../../escape2.txt')).toMatchObject({ reason: 'unsafe_path' });
    expect(got.get('/etc/absolute.txt')).toMatchObject({ reason: 'unsafe_path' });
    expect(got.get('contracts/link.txt')).toMatchObject({ reason: 'symlink' });
    expect(got.get('bomb.txt')).toMatchObject({ reason: 'compression_ratio', detail: expect.stringContaining('20971520') });
    expect(found).toHaveLength(7);
  });

  it('an archive over the entry or size limits is refused whole: as the target, with an error; in a folder, as one file', async () => {
    const entries = Object.fromEntries(Array.from({ length: 12 }, (_, i) => [`c${i}.txt`, Buffer.from(inventedContract(`Quillmoor Unit ${i} Ltd`))]));
    const many = join(dir, 'many.zip');
    writeFileSync(many, zipOf(entries));
    await expect(findAll(many, { limits: { maxEntries: 10 } })).rejects.toThrow(ArchiveRefusedError);
    await expect(findAll(many, { limits: { maxEntries: 10 } })).rejects.toThrow('12 entries; the limit is 10');
    await expect(findAll(many, { limits: { maxTotalBytes: 1000 } })).rejects.toThrow(/bytes uncompressed in all \(a zip bomb\?\); the limit is 1000 bytes/);
    const folder = join(dir, 'with-archives');
    mkdirSync(folder);
    writeFileSync(join(folder, 'many.zip'), zipOf(entries));
    writeFileSync(join(folder, 'single.txt'), text);
    const { found } = await findAll(folder, { limits: { maxEntries: 10 } });
    expect(found.map((f) => [f.path, f.kind === 'rejected' ? f.reason : f.kind])).toEqual([
      ['many.zip', 'archive_refused'],
      ['single.txt', 'document'],
    ]);
  });

  it('reads a zip inside the zip, but not a zip inside that', async () => {
    const innermost = zipOf({ 'deep.txt': Buffer.from(text) });
    const inner = zipOf({ 'inner.txt': Buffer.from(inventedContract('Brindlecombe Tools Ltd')), 'innermost.zip': innermost });
    const outer = zipOf({ 'outer.txt': Buffer.from(inventedContract('Farrowdene Metals Ltd')), 'inner.zip': inner });
    const file = join(dir, 'nested.zip');
    writeFileSync(file, outer);
    const { found, finder } = await findAll(file);
    expect(found.map((f) => [f.path, f.kind === 'rejected' ? f.reason : f.kind])).toEqual([
      ['outer.txt', 'document'],
      ['inner.zip/inner.txt', 'document'],
      ['inner.zip/innermost.zip', 'nested_too_deep'],
    ]);
    expect(finder.total).toBe(3);
  });

  it('a damaged archive is reported, not thrown', async () => {
    const folder = join(dir, 'damaged');
    mkdirSync(folder);
    const good = zipOf({ 'a.txt': Buffer.from(text) });
    writeFileSync(join(folder, 'cut.zip'), good.subarray(0, good.length - 10));
    const { found } = await findAll(folder);
    expect(found).toEqual([expect.objectContaining({ path: 'cut.zip', reason: 'unreadable' })]);
  });
});
