/** resolvers/files: file kinds from bytes, archive entry paths and records, the reason catalogue. */
import { describe, expect, it } from 'vitest';
import {
  FILE_LIMIT_DEFAULTS,
  REJECT_REASONS,
  checkEntryPath,
  checkZipEntry,
  detectFileType,
  isSymlinkEntry,
  isTextDocumentName,
  zipPackageKind,
} from '../../../resolvers/files/index.ts';

const bytes = (...b: number[]): Uint8Array => Uint8Array.from(b);
const ascii = (s: string): Uint8Array => new TextEncoder().encode(s);

describe('detectFileType', () => {
  it('reads PDF and zip signatures, not names', () => {
    // "%PDF-" header: ISO 32000-1 §7.5.2; readers accept it within the first 1,024 bytes (common practice, from memory).
    expect(detectFileType(ascii('%PDF-1.7\n%âãÏÓ')).kind).toBe('pdf');
    expect(detectFileType(ascii(`${' '.repeat(100)}%PDF-1.4`)).kind).toBe('pdf');
    expect(detectFileType(ascii(`${' '.repeat(1100)}%PDF-1.4`)).kind).toBe('text');
    // Local file header "PK\3\4" and end of central directory "PK\5\6": APPNOTE.TXT 4.3.7 and 4.3.16.
    expect(detectFileType(bytes(0x50, 0x4b, 0x03, 0x04, 0x14, 0)).kind).toBe('zip');
    expect(detectFileType(bytes(0x50, 0x4b, 0x05, 0x06, 0, 0)).kind).toBe('zip');
  });

  it('answers UTF-8 text without its byte-order mark, and names what it does not read', () => {
    expect(detectFileType(Uint8Array.from([0xef, 0xbb, 0xbf, ...ascii('Agreement')]))).toEqual({ kind: 'text', text: 'Agreement' });
    // PNG signature: RFC 2083 §3.1 / ISO 15948; OLE2 compound file: [MS-CFB] §2.2; RTF: "{\rtf" (RTF 1.9.1 spec).
    expect(detectFileType(bytes(0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a))).toMatchObject({ kind: 'other', what: expect.stringContaining('PNG') });
    expect(detectFileType(bytes(0xd0, 0xcf, 0x11, 0xe0, 0xa1, 0xb1, 0x1a, 0xe1))).toMatchObject({ kind: 'other', what: expect.stringContaining('.doc') });
    expect(detectFileType(ascii('{\\rtf1\\ansi Agreement}'))).toMatchObject({ kind: 'other', what: expect.stringContaining('RTF') });
    expect(detectFileType(bytes(0x41, 0x00, 0x42))).toMatchObject({ kind: 'other', what: expect.stringContaining('NUL') });
    // 0xC3 0x28 is an invalid UTF-8 sequence (RFC 3629 §3: a lead byte with no continuation byte).
    expect(detectFileType(bytes(0x41, 0xc3, 0x28))).toMatchObject({ kind: 'other' });
  });

  it("tells a Word package from other zips by its parts (ECMA-376 Part 2 content types, Word's main part name)", () => {
    expect(zipPackageKind(['[Content_Types].xml', '_rels/.rels', 'word/document.xml'])).toBe('docx');
    expect(zipPackageKind(['[Content_Types].xml', 'xl/workbook.xml'])).toBe('office');
    expect(zipPackageKind(['word/document.xml'])).toBe('archive');
    expect(zipPackageKind(['contracts/a.pdf', 'contracts/b.docx'])).toBe('archive');
  });

  it('reads text as a contract only under a document name', () => {
    expect(isTextDocumentName('a/b/supply.txt')).toBe(true);
    expect(isTextDocumentName('NOTES.MD')).toBe(true);
    expect(isTextDocumentName('README')).toBe(true);
    expect(isTextDocumentName('vendors.csv')).toBe(false);
    expect(isTextDocumentName('dir.d/data.json')).toBe(false);
  });
});

describe('checkEntryPath', () => {
  it.each([
    ['../evil.txt', 'climbs out'],
    ['contracts/../../evil.txt', 'climbs out'],
    ['..\\..\\evil.txt', 'climbs out'],
    ['/etc/passwd', 'absolute'],
    ['\\\\host\\share\\x.txt', 'absolute'],
    ['C:/Windows/x.txt', 'drive letter'],
    ['c:evil.txt', 'drive letter'],
    ['a\u0000b.txt', 'control character'],
    ['./', 'names no file'],
    ['', 'empty name'],
  ])('refuses %j (zip-slip kinds of entry)', (name, why) => {
    const checked = checkEntryPath(name);
    expect(checked.ok).toBe(false);
    if (!checked.ok) expect(checked.problem).toContain(why);
  });

  it('normalises safe paths', () => {
    expect(checkEntryPath('contracts//2026/./supply.pdf')).toEqual({ ok: true, path: 'contracts/2026/supply.pdf' });
    expect(checkEntryPath('a\\b.txt')).toEqual({ ok: true, path: 'a/b.txt' });
    expect(checkEntryPath('..hidden/x..y.txt')).toEqual({ ok: true, path: '..hidden/x..y.txt' });
  });
});

describe('checkZipEntry', () => {
  const plain = { uncompressedSize: 5000, compressedSize: 2000, externalFileAttributes: 0, versionMadeBy: 20, generalPurposeBitFlag: 0 };
  const limits = FILE_LIMIT_DEFAULTS;

  it('passes an ordinary entry', () => expect(checkZipEntry(plain, limits)).toBeNull());

  it('finds a symbolic link only in a Unix-made entry (APPNOTE 4.4.2.2 host 3; S_IFLNK = 0o120000, POSIX <sys/stat.h>)', () => {
    const link = { externalFileAttributes: (0o120777 << 16) >>> 0, versionMadeBy: (3 << 8) | 20 };
    expect(isSymlinkEntry(link)).toBe(true);
    expect(checkZipEntry({ ...plain, ...link }, limits)?.reason).toBe('symlink');
    // A regular Unix file (S_IFREG 0o100644) and the same bits from a DOS host are no link.
    expect(isSymlinkEntry({ externalFileAttributes: (0o100644 << 16) >>> 0, versionMadeBy: (3 << 8) | 20 })).toBe(false);
    expect(isSymlinkEntry({ externalFileAttributes: link.externalFileAttributes, versionMadeBy: 20 })).toBe(false);
  });

  it('refuses encrypted entries (general-purpose flag bit 0, APPNOTE 4.4.4)', () => {
    expect(checkZipEntry({ ...plain, generalPurposeBitFlag: 1 }, limits)?.reason).toBe('encrypted_entry');
  });

  it('refuses a large entry with a compression ratio over the limit, and an entry over the file size', () => {
    const bomb = { ...plain, uncompressedSize: 10 * 1024 * 1024, compressedSize: 10 * 1024 };
    expect(checkZipEntry(bomb, limits)).toMatchObject({ reason: 'compression_ratio', detail: expect.stringContaining('ratio 1024') });
    // Under the floor a high ratio is allowed (a short file of one repeated byte).
    expect(checkZipEntry({ ...plain, uncompressedSize: 100_000, compressedSize: 100 }, limits)).toBeNull();
    expect(checkZipEntry({ ...plain, uncompressedSize: limits.maxFileBytes + 1, compressedSize: limits.maxFileBytes }, limits)?.reason).toBe('file_too_large');
  });
});

describe('REJECT_REASONS', () => {
  it('says plainly that no OCR is attempted for a scan', () => {
    expect(REJECT_REASONS.no_text_layer).toContain('no OCR is attempted');
    for (const [code, text] of Object.entries(REJECT_REASONS)) {
      expect(code).toMatch(/^[a-z]+(?:_[a-z]+)*$/);
      expect(text.length).toBeGreaterThan(10);
    }
  });
});
