/**
 * Documents for the contract-file tests, made by general-purpose writers from the registry that cpreg does not
 * use to read them: PDFs by pdf-lib (and an encrypted one by pdfkit), Word files by the `docx` package, zip
 * archives by fflate. The contract text is invented; no real company, person or contract.
 */
import { zipSync, type Zippable } from 'fflate';
import { Document, Packer, Paragraph } from 'docx';
import { PDFDocument, StandardFonts, rgb } from 'pdf-lib';
import PDFKit from 'pdfkit';

/** An invented contract with two parties, one line per paragraph (short lines, so a PDF page holds them). */
export function inventedContract(supplier = 'Quillmoor Fabrication Ltd', customer = 'Tessaline Trading GmbH', subject = 'precision brackets'): string {
  return [
    'SUPPLY AGREEMENT',
    '',
    'This Supply Agreement is made on 3 March 2026 between:',
    `(1) ${supplier}, a company incorporated in England and Wales ("Supplier"); and`,
    `(2) ${customer}, a company registered in Germany ("Customer").`,
    '',
    `1. Supply. The Supplier shall supply ${subject} to the Customer.`,
    '2. Price. The Customer shall pay the Supplier within 30 days of invoice.',
    '',
    `Signed for and on behalf of ${supplier}`,
    `Signed for and on behalf of ${customer}`,
  ].join('\n');
}

/**
 * Long lines cut at 95 characters on a space (blank lines kept), so that a PDF page holds them: pdf-lib does not
 * wrap. Used where a contract's own text, not a test's short one, goes into a PDF (the parity test, the bench).
 */
export function wrappedForPage(text: string): string {
  const out: string[] = [];
  for (const line of text.split('\n')) {
    let rest = line;
    while (rest.length > 95) {
      const cut = rest.lastIndexOf(' ', 95);
      const at = cut > 20 ? cut : 95;
      out.push(rest.slice(0, at));
      rest = rest.slice(at).trimStart();
    }
    out.push(rest);
  }
  return out.join('\n');
}

/** A contract's text as a PDF by pdf-lib, its lines wrapped as a page holds them (wrappedForPage). */
export function contractPdf(text: string): Promise<Buffer> {
  return pdfLibPdf(wrappedForPage(text));
}

/** pdf-lib: one text line per line of `text`, Helvetica 10 pt, 14 pt apart, 50 lines a page. */
export async function pdfLibPdf(text: string): Promise<Buffer> {
  const doc = await PDFDocument.create();
  const font = await doc.embedFont(StandardFonts.Helvetica);
  const lines = text.split('\n');
  for (let start = 0; start < lines.length; start += 50) {
    const page = doc.addPage([595, 842]);
    lines.slice(start, start + 50).forEach((line, i) => {
      if (line !== '') page.drawText(line, { x: 50, y: 790 - i * 14, size: 10, font });
    });
  }
  return Buffer.from(await doc.save());
}

/** pdf-lib: a page with only a grey rectangle, as a scan without a text layer looks to a text reader. */
export async function imageOnlyPdf(): Promise<Buffer> {
  const doc = await PDFDocument.create();
  const page = doc.addPage([595, 842]);
  page.drawRectangle({ x: 50, y: 50, width: 495, height: 742, color: rgb(0.8, 0.8, 0.8) });
  return Buffer.from(await doc.save());
}

/** pdfkit: a PDF that needs a user password to open (RC4/AES as pdfkit chooses for PDF 1.7). */
export function encryptedPdf(text: string): Promise<Buffer> {
  return new Promise((resolve, reject) => {
    const doc = new PDFKit({ userPassword: 'invented-password', ownerPassword: 'invented-owner', pdfVersion: '1.7' });
    const parts: Buffer[] = [];
    doc.on('data', (chunk: Buffer) => parts.push(chunk));
    doc.on('end', () => resolve(Buffer.concat(parts)));
    doc.on('error', reject);
    doc.text(text);
    doc.end();
  });
}

/** The `docx` package: one Word paragraph per line of `text`. */
export async function docxFile(text: string): Promise<Buffer> {
  const doc = new Document({ sections: [{ children: text.split('\n').map((line) => new Paragraph(line)) }] });
  return Packer.toBuffer(doc);
}

/** fflate: a zip of the given entries (names exactly as given, hostile ones included). */
export function zipOf(entries: Zippable): Buffer {
  return Buffer.from(zipSync(entries, { level: 6 }));
}

/** fflate entry options of a Unix symbolic link (external attributes S_IFLNK | 0777, made on Unix: APPNOTE 4.4.2, 4.4.15). */
export const SYMLINK_ATTRS = { os: 3, attrs: (0o120777 << 16) >>> 0 } as const;
