/**
 * The text of one PDF or Word document. PDF: unpdf (pdf.js built to run without a browser or a worker; no font
 * program is evaluated), lines as the page sets them, with the lines the layout wrapped joined again and a blank
 * line where the page leaves one (the party parser reads blank lines as boundaries: without them a title runs into
 * the first party's name; and a name broken over two lines is cut), pages joined by a blank line; a password-protected PDF and a PDF without a text layer (a scan) are refused by name: no OCR is
 * attempted and nothing is downloaded. Word: mammoth's raw text, one line
 * per paragraph (mammoth ends each paragraph with a blank line; a contract's plain text has one paragraph a line,
 * and the party parser reads blank lines as boundaries, so they are made single again).
 */
import type { PDFDocumentProxy } from 'unpdf/pdfjs';
import { MAX_CONTRACT_BYTES } from '../../resolvers/terms/index.ts';
import type { FileReject } from '../../resolvers/files/index.ts';

export type Extraction = { ok: true; text: string } | { ok: false; reject: Omit<FileReject, 'path'> };

const refuse = (reason: FileReject['reason'], detail: string): Extraction => ({ ok: false, reject: { reason, detail } });

export async function extractPdfText(bytes: Buffer): Promise<Extraction> {
  const { getDocumentProxy } = await import('unpdf');
  let pdf;
  try {
    pdf = await getDocumentProxy(new Uint8Array(bytes), { isEvalSupported: false, disableFontFace: true, verbosity: 0 });
  } catch (error) {
    const name = (error as Error).name;
    if (name === 'PasswordException') return refuse('encrypted_pdf', 'a password is needed to open it');
    return refuse('unreadable', `not a readable PDF: ${(error as Error).message}`);
  }
  try {
    const totalPages = pdf.numPages;
    const pages: string[] = [];
    let bytes = 0;
    for (let n = 1; n <= totalPages; n++) {
      const page = await pageText(pdf, n);
      bytes += Buffer.byteLength(page);
      // Stop reading once over the limit: the rest of a long PDF need not be decoded to refuse it.
      if (bytes > MAX_CONTRACT_BYTES)
        return refuse('text_too_large', `over ${MAX_CONTRACT_BYTES} bytes of text by page ${n} of ${totalPages}; the limit is ${MAX_CONTRACT_BYTES}`);
      pages.push(page);
    }
    const joined = pages.join('\n\n');
    if (joined.trim() === '') return refuse('no_text_layer', `${totalPages} page${totalPages === 1 ? '' : 's'} without any text`);
    return { ok: true, text: joined };
  } catch (error) {
    return refuse('unreadable', `the PDF's text could not be read: ${(error as Error).message}`);
  } finally {
    await pdf.destroy();
  }
}

/**
 * A vertical step between two text runs larger than this share of the font size starts a new line; larger than
 * BLANK_LINE_STEP, a blank line too (common practice: body text is set at 1.0–1.5 times its size, so a step of
 * about twice the size or more means an empty line between).
 */
const NEW_LINE_STEP = 0.5;
const BLANK_LINE_STEP = 1.9;
/**
 * A line that reaches this close to the right edge of the page's text (a share of the text's width) and is followed
 * by a line with no blank line between was wrapped by the layout, not ended by the writer: the two are joined with
 * a space, so that a name the page broke over two lines ("Sortamley Energy Pty / Ltd") reads whole again. A fifth
 * of the width holds the longest word a ragged-right line leaves for the next line (measured on the demo's 300
 * contracts: a tenth left 2 names broken, a fifth none).
 */
const SOFT_WRAP_SHARE = 0.2;

interface PageLine {
  text: string;
  left: number;
  right: number;
  /** An empty line stands before this one. */
  blankBefore: boolean;
}

async function pageLines(pdf: PDFDocumentProxy, n: number): Promise<PageLine[]> {
  const page = await pdf.getPage(n);
  try {
    const content = await page.getTextContent();
    const lines: PageLine[] = [];
    let line: PageLine | null = null;
    let lastY: number | null = null;
    for (const item of content.items) {
      if (!('str' in item) || item.str === '') continue;
      const x = item.transform[4] as number;
      const y = item.transform[5] as number;
      const size = item.height > 0 ? item.height : Math.hypot(item.transform[2] as number, item.transform[3] as number) || 10;
      if (line === null || (lastY !== null && Math.abs(lastY - y) > size * NEW_LINE_STEP)) {
        line = { text: '', left: x, right: x, blankBefore: lastY !== null && Math.abs(lastY - y) > size * BLANK_LINE_STEP };
        lines.push(line);
      }
      line.text += item.str;
      line.left = Math.min(line.left, x);
      line.right = Math.max(line.right, x + item.width);
      lastY = y;
    }
    return lines.map((l) => ({ ...l, text: l.text.trimEnd() })).filter((l) => l.text !== '');
  } finally {
    page.cleanup();
  }
}

async function pageText(pdf: PDFDocumentProxy, n: number): Promise<string> {
  const lines = await pageLines(pdf, n);
  if (lines.length === 0) return '';
  const left = Math.min(...lines.map((l) => l.left));
  const right = Math.max(...lines.map((l) => l.right));
  const reach = right - SOFT_WRAP_SHARE * (right - left);
  let text = lines[0]!.text;
  for (let i = 1; i < lines.length; i++) {
    const previous = lines[i - 1]!;
    const current = lines[i]!;
    if (current.blankBefore) text += `\n\n${current.text}`;
    else if (previous.right >= reach) text += ` ${current.text.trimStart()}`;
    else text += `\n${current.text}`;
  }
  return text;
}

export async function extractDocxText(bytes: Buffer): Promise<Extraction> {
  const mammoth = (await import('mammoth')).default;
  let raw: string;
  try {
    raw = (await mammoth.extractRawText({ buffer: bytes })).value;
  } catch (error) {
    return refuse('unreadable', `not a readable Word document: ${(error as Error).message}`);
  }
  const text = raw.split('\n\n').join('\n').trimEnd();
  if (text.trim() === '') return refuse('no_text', 'the Word document holds no text');
  return { ok: true, text };
}
