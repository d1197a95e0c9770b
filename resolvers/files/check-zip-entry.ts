/**
 * The checks one archive entry passes before a byte of it is decompressed, from its central-directory record:
 * a symbolic link (Unix mode S_IFLNK in the upper half of the external attributes when the entry was made on Unix,
 * APPNOTE 4.4.2 and 4.4.15), encryption (general-purpose flag bit 0, APPNOTE 4.4.4), the size of one file, and the
 * compression ratio of a large entry (a zip bomb). The reader also checks while it inflates that no entry yields
 * more bytes than it declares (yauzl's validateEntrySizes), so the declared sizes can be trusted here.
 */
import type { FileLimits } from './limits.ts';
import type { RejectReason } from './reject-reasons.ts';

export interface ZipEntryFacts {
  uncompressedSize: number;
  compressedSize: number;
  externalFileAttributes: number;
  versionMadeBy: number;
  generalPurposeBitFlag: number;
}

const S_IFMT = 0o170000;
const S_IFLNK = 0o120000;
/** The "version made by" upper byte of an entry made on Unix (APPNOTE 4.4.2.2). */
const HOST_UNIX = 3;

export function isSymlinkEntry(e: Pick<ZipEntryFacts, 'externalFileAttributes' | 'versionMadeBy'>): boolean {
  if (e.versionMadeBy >> 8 !== HOST_UNIX) return false;
  const mode = (e.externalFileAttributes >>> 16) & 0xffff;
  return (mode & S_IFMT) === S_IFLNK;
}

export function checkZipEntry(
  e: ZipEntryFacts,
  limits: Pick<FileLimits, 'maxFileBytes' | 'maxRatio' | 'ratioFloorBytes'>,
): { reason: RejectReason; detail: string } | null {
  if (isSymlinkEntry(e)) return { reason: 'symlink', detail: 'the archive entry is a symbolic link' };
  if ((e.generalPurposeBitFlag & 1) !== 0) return { reason: 'encrypted_entry', detail: 'the entry is encrypted (zip encryption flag)' };
  if (e.uncompressedSize > limits.maxFileBytes) {
    return { reason: 'file_too_large', detail: `${e.uncompressedSize} bytes uncompressed; the limit is ${limits.maxFileBytes} bytes` };
  }
  if (e.uncompressedSize >= limits.ratioFloorBytes) {
    const ratio = e.uncompressedSize / Math.max(1, e.compressedSize);
    if (ratio > limits.maxRatio) {
      return {
        reason: 'compression_ratio',
        detail: `${e.compressedSize} bytes would expand to ${e.uncompressedSize} (ratio ${Math.round(ratio)}; the limit is ${limits.maxRatio})`,
      };
    }
  }
  return null;
}
