/**
 * The demo's contracts as files (services/demo/contract-files.ts: pdf-lib and the `docx` package at build time),
 * read back by the contract-file import: every file is a document of its type, and its parties are those parsed
 * from the contract's plain text (a PDF's lines, wrapped at 95 characters on the page, are joined again).
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { parseParties } from '../../../resolvers/terms/index.ts';
import { DocumentFinder, type Found } from '../../../services/contract-files/find-documents.ts';
import { writeContractFiles, type WrittenContractFiles } from '../../../services/demo/contract-files.ts';
import { DRAFTING_STYLES, generateScenario } from '../../../services/demo/scenario/index.ts';
import { makeTempDir, removeTempDir } from '../../support/database.ts';

const partiesOf = (text: string) => parseParties(text).parties.map((p) => [p.name, p.role, p.terms]);

describe('demo contract files', () => {
  let dir: string;
  let written: WrittenContractFiles;
  const found: Found[] = [];
  // Three contracts of each drafting style, in scenario order (the i-th file type is i mod 3).
  const all = generateScenario(1).contracts;
  const sample = DRAFTING_STYLES.flatMap((style) => all.filter((c) => c.style === style).slice(0, 3));
  beforeAll(async () => {
    dir = makeTempDir('cpreg-demo-files-');
    written = await writeContractFiles(dir, sample);
    for await (const f of new DocumentFinder(dir).documents()) found.push(f);
  });
  afterAll(() => removeTempDir(dir));

  it('writes every third contract as PDF, every third as Word, the rest as text', () => {
    expect(written.counts).toEqual({ pdf: 6, docx: 6, txt: 6 });
    expect(found).toHaveLength(sample.length);
  });

  it('reads each back with the parties of its plain text', () => {
    for (const f of found) {
      expect(f.kind, f.path).toBe('document');
      if (f.kind !== 'document') continue;
      const c = written.files.get(f.path)!;
      expect(partiesOf(f.text), `${f.path} (${c.style})`).toEqual(partiesOf(c.text));
      expect(partiesOf(f.text).length, f.path).toBeGreaterThanOrEqual(2);
    }
  });
});
