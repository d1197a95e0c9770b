/**
 * A zip archive read entry by entry with yauzl (from a file: the central directory and each entry are read from
 * disk as needed, so a 10,000-file archive is never held whole; from a buffer: an archive inside an archive, at
 * most one file's size). Before any entry is inflated the whole central directory is surveyed once: the entry
 * count, the total uncompressed size and the entry names (a Word package is a zip too). Names are decoded by
 * yauzl's own rules, but checked here (resolvers/files checkEntryPath), so that a hostile entry refuses that
 * entry and not the archive.
 */
import type { Readable } from 'node:stream';
import yauzl, { type Entry, type ZipFile } from 'yauzl';
import { checkEntryPath, checkZipEntry, printableEntryName, type FileLimits, type FileReject } from '../../resolvers/files/index.ts';

export type ZipSource = { file: string } | { buffer: Buffer };

/** yauzl checks while inflating that no entry yields more bytes than it declares (validateEntrySizes). */
const OPTIONS = { lazyEntries: true, decodeStrings: false, validateEntrySizes: true, autoClose: false } as const;

async function openZip(source: ZipSource): Promise<ZipFile> {
  return 'file' in source ? yauzl.openPromise(source.file, OPTIONS) : yauzl.fromBufferPromise(source.buffer, OPTIONS);
}

export function entryName(entry: Entry): string {
  return yauzl.getFileNameLowLevel(entry.generalPurposeBitFlag, entry.fileNameRaw, entry.extraFields, false);
}

const REPLACEMENT_BYTES = Buffer.from('\uFFFD', 'utf8');

/**
 * Whether yauzl decoded a name marked UTF-8 (APPNOTE 4.4.4 bit 11, or an Info-ZIP Unicode Path field) from bytes
 * that are not UTF-8: it puts U+FFFD in their place, so a U+FFFD that none of the name's byte sources holds was
 * made up. (Code page 437, the other decoding, has no U+FFFD.) Such a name once became the contract's external id.
 */
function undecodableName(entry: Entry, name: string): boolean {
  if (!name.includes('\uFFFD')) return false;
  const sources = [entry.fileNameRaw, ...entry.extraFields.filter((field) => field.id === 0x7075).map((field) => field.data.subarray(5))];
  return !sources.some((bytes) => bytes.includes(REPLACEMENT_BYTES));
}

const isDirectory = (name: string): boolean => name.endsWith('/');

export interface ZipSurvey {
  entryCount: number;
  files: number;
  totalUncompressed: number;
  names: string[];
  /** The first entry over the compression-ratio limit, with why (a Word package is refused for it). */
  bomb: string | null;
}

/** One pass over the central directory: nothing is inflated. */
export async function surveyZip(source: ZipSource, limits: Pick<FileLimits, 'maxEntries' | 'maxRatio' | 'ratioFloorBytes'>): Promise<ZipSurvey> {
  const zip = await openZip(source);
  try {
    const survey: ZipSurvey = { entryCount: zip.entryCount, files: 0, totalUncompressed: 0, names: [], bomb: null };
    // Over the entry limit the archive is refused on the count its end record gives: no entry is listed.
    if (zip.entryCount > limits.maxEntries) return survey;
    for await (const entry of zip.eachEntry()) {
      const name = entryName(entry);
      survey.names.push(name);
      if (!isDirectory(name)) survey.files++;
      survey.totalUncompressed += entry.uncompressedSize;
      if (survey.bomb === null) {
        const problem = checkZipEntry(entry, { maxFileBytes: Number.MAX_SAFE_INTEGER, ...limits });
        if (problem?.reason === 'compression_ratio') survey.bomb = `${name}: ${problem.detail}`;
      }
    }
    return survey;
  } finally {
    zip.close();
  }
}

/** Why an archive is refused whole (before any entry is read), or null. */
export function archiveProblem(
  survey: Pick<ZipSurvey, 'entryCount' | 'totalUncompressed'>,
  limits: Pick<FileLimits, 'maxEntries' | 'maxTotalBytes'>,
): string | null {
  if (survey.entryCount > limits.maxEntries) return `${survey.entryCount} entries; the limit is ${limits.maxEntries}`;
  if (survey.totalUncompressed > limits.maxTotalBytes) {
    return `${survey.totalUncompressed} bytes uncompressed in all (a zip bomb?); the limit is ${limits.maxTotalBytes} bytes`;
  }
  return null;
}

/** An entry that passed the checks: its safe path, its declared size, and a reader for its bytes. */
export interface ZipMember {
  path: string;
  size: number;
  read(): Promise<Buffer>;
}

export type ZipItem = { member: ZipMember } | { reject: Omit<FileReject, 'path'> & { path: string } };

async function collect(stream: Readable, limit: number): Promise<Buffer> {
  const parts: Buffer[] = [];
  let size = 0;
  for await (const chunk of stream) {
    size += (chunk as Buffer).length;
    if (size > limit) {
      stream.destroy();
      throw new Error(`the entry yields more than ${limit} bytes`);
    }
    parts.push(chunk as Buffer);
  }
  return Buffer.concat(parts);
}

/**
 * The archive's file entries in their order, each checked (path, symbolic link, encryption, size, ratio, a
 * repeated path). A member's bytes must be read before the next item is asked for (the reader moves on).
 * `prefix` goes before each path (the archive's own path when it sits in a folder or an archive).
 */
export async function* zipItems(source: ZipSource, prefix: string, limits: FileLimits): AsyncGenerator<ZipItem> {
  const zip = await openZip(source);
  const seen = new Set<string>();
  try {
    for await (const entry of zip.eachEntry()) {
      const name = entryName(entry);
      if (isDirectory(name) && entry.uncompressedSize === 0) continue;
      if (undecodableName(entry, name)) {
        const detail = 'the entry name is marked UTF-8 but its bytes are not UTF-8 (RFC 3629): not read, rather than stored with U+FFFD';
        yield { reject: { path: `${prefix}${printableEntryName(name)}`, reason: 'unsafe_path', detail } };
        continue;
      }
      const checked = checkEntryPath(name);
      if (!checked.ok) {
        yield { reject: { path: `${prefix}${printableEntryName(name)}`, reason: 'unsafe_path', detail: checked.problem } };
        continue;
      }
      const path = `${prefix}${checked.path}`;
      const problem = checkZipEntry(entry, limits);
      if (problem) {
        yield { reject: { path, ...problem } };
        continue;
      }
      if (seen.has(checked.path)) {
        yield { reject: { path, reason: 'duplicate_path', detail: `"${checked.path}" appears twice in the archive` } };
        continue;
      }
      seen.add(checked.path);
      yield { member: { path, size: entry.uncompressedSize, read: async () => collect(await zip.openReadStreamPromise(entry), limits.maxFileBytes) } };
    }
  } finally {
    zip.close();
  }
}
