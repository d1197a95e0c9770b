/**
 * The demo's contracts as files, as a legal team holds them on a shared drive: every third one a PDF (written by
 * pdf-lib: Helvetica 10 pt, lines wrapped at 95 characters as a page holds them, 50 lines a page), every third one
 * a Word file (the `docx` package: one paragraph a line), the rest plain text. Written at demo build time by this
 * code; `cpreg demo` then reads them back through the contract-file import (services/contract-files). A contract
 * whose text Helvetica's WinAnsi encoding cannot write (some scripts) is written as text instead.
 */
import { mkdir, writeFile } from 'node:fs/promises';
import { join } from 'node:path';
import { Document, Packer, Paragraph } from 'docx';
import { PDFDocument, StandardFonts } from 'pdf-lib';
import type { ScenarioContract } from './scenario/index.ts';

export const CONTRACT_FILES_DIR = 'contract-files';
const WIDTH = 95;
const LINES_PER_PAGE = 50;

export type ContractFileType = 'pdf' | 'docx' | 'txt';

/** The file type the demo gives its i-th contract. */
export const demoFileType = (index: number): ContractFileType => (['pdf', 'docx', 'txt'] as const)[index % 3]!;

/** The contract's file name: its external id (a path-safe one) and the extension of its type. */
export function contractFileName(c: Pick<ScenarioContract, 'externalId'>, type: ContractFileType): string {
  return `${c.externalId.replace(/[^\w.-]/g, '_')}.${type}`;
}

/** Long lines cut on a space at WIDTH characters (a word longer than that is cut where it stands). */
export function wrapLines(text: string): string[] {
  const out: string[] = [];
  for (const line of text.split('\n')) {
    let rest = line;
    while (rest.length > WIDTH) {
      const cut = rest.lastIndexOf(' ', WIDTH);
      const at = cut > 20 ? cut : WIDTH;
      out.push(rest.slice(0, at));
      rest = rest.slice(at).trimStart();
    }
    out.push(rest);
  }
  return out;
}

async function pdfOf(text: string): Promise<Uint8Array> {
  const doc = await PDFDocument.create();
  const font = await doc.embedFont(StandardFonts.Helvetica);
  const lines = wrapLines(text);
  for (let start = 0; start < lines.length; start += LINES_PER_PAGE) {
    const page = doc.addPage([595, 842]);
    lines.slice(start, start + LINES_PER_PAGE).forEach((line, i) => {
      if (line !== '') page.drawText(line, { x: 50, y: 790 - i * 14, size: 10, font });
    });
  }
  return doc.save();
}

async function docxOf(text: string): Promise<Buffer> {
  return Packer.toBuffer(new Document({ sections: [{ children: text.split('\n').map((line) => new Paragraph(line)) }] }));
}

export interface WrittenContractFiles {
  /** File name → the contract it holds. */
  files: Map<string, ScenarioContract>;
  counts: Record<ContractFileType, number>;
}

export async function writeContractFiles(dir: string, contracts: readonly ScenarioContract[]): Promise<WrittenContractFiles> {
  await mkdir(dir, { recursive: true });
  const files = new Map<string, ScenarioContract>();
  const counts: Record<ContractFileType, number> = { pdf: 0, docx: 0, txt: 0 };
  for (const [i, c] of contracts.entries()) {
    let type = demoFileType(i);
    let bytes: Uint8Array | Buffer | string = c.text;
    try {
      if (type === 'pdf') bytes = await pdfOf(c.text);
      else if (type === 'docx') bytes = await docxOf(c.text);
    } catch {
      // pdf-lib's standard fonts write WinAnsi only: such a contract goes in as plain text.
      type = 'txt';
      bytes = c.text;
    }
    const name = contractFileName(c, type);
    await writeFile(join(dir, name), bytes);
    files.set(name, c);
    counts[type]++;
  }
  return { files, counts };
}
