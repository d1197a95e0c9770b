/**
 * A file's kind read from its first bytes (magic numbers), never from its name alone: `pdf` ("%PDF-" in the first
 * 1,024 bytes, where PDF readers look for it), `zip` (a local file header or an empty archive's end record: a
 * Word .docx is a zip and is told apart by its entry names, zipPackageKind), `text` (valid UTF-8 without NUL
 * bytes) or `other`, with a name for the common kinds that are not read (images, legacy Office, RTF, other
 * archives) so that the rejects file says what the file is.
 */
export type DetectedType = { kind: 'pdf' } | { kind: 'zip' } | { kind: 'text'; text: string } | { kind: 'other'; what: string };

/** Signatures of kinds we name when we refuse them (file-format specifications; "from memory" for the byte values). */
const KNOWN: readonly { bytes: readonly number[]; what: string }[] = [
  { bytes: [0xd0, 0xcf, 0x11, 0xe0, 0xa1, 0xb1, 0x1a, 0xe1], what: 'a legacy Office file (.doc/.xls): save it as .docx or PDF' },
  { bytes: [0x89, 0x50, 0x4e, 0x47], what: 'a PNG image: no OCR is attempted' },
  { bytes: [0xff, 0xd8, 0xff], what: 'a JPEG image: no OCR is attempted' },
  { bytes: [0x47, 0x49, 0x46, 0x38], what: 'a GIF image' },
  { bytes: [0x49, 0x49, 0x2a, 0x00], what: 'a TIFF image: no OCR is attempted' },
  { bytes: [0x4d, 0x4d, 0x00, 0x2a], what: 'a TIFF image: no OCR is attempted' },
  { bytes: [0x1f, 0x8b], what: 'a gzip archive: only zip archives are read' },
  { bytes: [0x37, 0x7a, 0xbc, 0xaf, 0x27, 0x1c], what: 'a 7z archive: only zip archives are read' },
  { bytes: [0x52, 0x61, 0x72, 0x21], what: 'a RAR archive: only zip archives are read' },
];

const PDF_MAGIC = [0x25, 0x50, 0x44, 0x46, 0x2d]; // "%PDF-"
const PDF_SEARCH = 1024;

function startsWith(bytes: Uint8Array, magic: readonly number[], at = 0): boolean {
  if (bytes.length < at + magic.length) return false;
  for (let i = 0; i < magic.length; i++) if (bytes[at + i] !== magic[i]) return false;
  return true;
}

function hasPdfHeader(bytes: Uint8Array): boolean {
  const end = Math.min(bytes.length - PDF_MAGIC.length, PDF_SEARCH);
  for (let at = 0; at <= end; at++) if (bytes[at] === 0x25 && startsWith(bytes, PDF_MAGIC, at)) return true;
  return false;
}

export function detectFileType(bytes: Uint8Array): DetectedType {
  if (hasPdfHeader(bytes)) return { kind: 'pdf' };
  // "PK\3\4" opens a zip with entries; "PK\5\6" is the end record of an empty one.
  if (startsWith(bytes, [0x50, 0x4b, 0x03, 0x04]) || startsWith(bytes, [0x50, 0x4b, 0x05, 0x06])) return { kind: 'zip' };
  for (const k of KNOWN) if (startsWith(bytes, k.bytes)) return { kind: 'other', what: k.what };
  if (bytes.includes(0)) return { kind: 'other', what: 'binary data (NUL bytes)' };
  let text: string;
  try {
    text = new TextDecoder('utf-8', { fatal: true }).decode(bytes);
  } catch {
    return { kind: 'other', what: 'neither UTF-8 text nor a known document format' };
  }
  if (text.charCodeAt(0) === 0xfeff) text = text.slice(1);
  // RTF is text on the surface, but its control words would be read as contract prose.
  if (text.startsWith('{\\rtf')) return { kind: 'other', what: 'an RTF document: save it as .docx, PDF or plain text' };
  return { kind: 'text', text };
}

/**
 * What a zip holds, from its entry names: `docx` when it is a WordprocessingML package (ECMA-376 Part 2: a
 * [Content_Types].xml part, and the main document part word/document.xml, the name Word gives it), `office` for
 * other Office Open XML packages (spreadsheets, presentations), `archive` otherwise.
 */
export function zipPackageKind(names: Iterable<string>): 'docx' | 'office' | 'archive' {
  let contentTypes = false;
  let word = false;
  let otherOffice = false;
  for (const name of names) {
    if (name === '[Content_Types].xml') contentTypes = true;
    else if (name === 'word/document.xml') word = true;
    else if (name === 'xl/workbook.xml' || name === 'ppt/presentation.xml') otherOffice = true;
  }
  if (contentTypes && word) return 'docx';
  if (contentTypes && otherOffice) return 'office';
  return 'archive';
}

/** Whether a name's extension says the text inside is meant as a document (a .csv or .json is data, not a contract). */
export function isTextDocumentName(name: string): boolean {
  const base = name.slice(name.lastIndexOf('/') + 1);
  const dot = base.lastIndexOf('.');
  if (dot <= 0) return true;
  return ['txt', 'md', 'markdown', 'text', 'pdf', 'docx'].includes(base.slice(dot + 1).toLowerCase());
}
