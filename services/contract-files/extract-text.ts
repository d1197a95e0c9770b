/**
 * The text of one PDF or Word document. PDF: unpdf (pdf.js built to run without a browser or a worker; no font
 * program is evaluated), pages joined by a blank line; a password-protected PDF and a PDF without a text layer
 * (a scan) are refused by name: no OCR is attempted and nothing is downloaded. Word: mammoth's raw text, one line
 * per paragraph (mammoth ends each paragraph with a blank line; a contract's plain text has one paragraph a line,
 * and the party parser reads blank lines as boundaries, so they are made single again).
 */
import { MAX_CONTRACT_BYTES } from '../../resolvers/terms/index.ts';
import type { FileReject } from '../../resolvers/files/index.ts';

export type Extraction = { ok: true; text: string } | { ok: false; reject: Omit<FileReject, 'path'> };

const refuse = (reason: FileReject['reason'], detail: string): Extraction => ({ ok: false, reject: { reason, detail } });

export async function extractPdfText(bytes: Buffer): Promise<Extraction> {
  const { extractText, getDocumentProxy } = await import('unpdf');
  let pdf;
  try {
    pdf = await getDocumentProxy(new Uint8Array(bytes), { isEvalSupported: false, disableFontFace: true, verbosity: 0 });
  } catch (error) {
    const name = (error as Error).name;
    if (name === 'PasswordException') return refuse('encrypted_pdf', 'a password is needed to open it');
    return refuse('unreadable', `not a readable PDF: ${(error as Error).message}`);
  }
  try {
    const { text, totalPages } = await extractText(pdf, { mergePages: false });
    const joined = text.join('\n\n');
    if (joined.trim() === '') return refuse('no_text_layer', `${totalPages} page${totalPages === 1 ? '' : 's'} without any text`);
    if (Buffer.byteLength(joined) > MAX_CONTRACT_BYTES) return refuse('text_too_large', `${Buffer.byteLength(joined)} bytes of text from ${totalPages} pages; the limit is ${MAX_CONTRACT_BYTES}`);
    return { ok: true, text: joined };
  } catch (error) {
    return refuse('unreadable', `the PDF's text could not be read: ${(error as Error).message}`);
  } finally {
    await pdf.destroy();
  }
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
