/**
 * Finds the contract documents in a folder, a zip or one file and extracts their text, one found file at a time:
 * each comes out as a document (path, title, type, text) or as a reject with its reason. The type comes from the
 * content (resolvers/files detectFileType), the text from extract-text.ts. A folder is read without following
 * symbolic links (its subfolders only with `recursive`); a zip in the folder or given is read entry by entry,
 * and a zip inside it once more (FileLimits.maxNesting), never deeper. The path of a file inside the folder or
 * archive is what a contract's external id is made of.
 */
import { open, readdir, readFile, stat } from 'node:fs/promises';
import { basename, join } from 'node:path';
import { FILE_LIMIT_DEFAULTS, detectFileType, isTextDocumentName, zipPackageKind, type FileLimits, type FileReject } from '../../resolvers/files/index.ts';
import { MAX_CONTRACT_BYTES } from '../../resolvers/terms/index.ts';
import { MAX_ID_LENGTH } from '../../resolvers/vocabulary.ts';
import { extractDocxText, extractPdfText, type Extraction } from './extract-text.ts';
import { archiveProblem, surveyZip, zipItems, type ZipSource } from './zip-archive.ts';

export type FileType = 'pdf' | 'docx' | 'text';

export interface FoundDocument {
  kind: 'document';
  path: string;
  title: string;
  fileType: FileType;
  text: string;
}

export type FoundReject = { kind: 'rejected' } & FileReject;
export type Found = FoundDocument | FoundReject;

/** The archive given (or the only one to read) is over a limit: nothing in it is read. */
export class ArchiveRefusedError extends Error {
  constructor(
    readonly path: string,
    readonly detail: string,
  ) {
    super(`${path}: the archive is refused: ${detail}; nothing in it was read`);
    this.name = 'ArchiveRefusedError';
  }
}

/** The folder or file given cannot be read at all. */
export class TargetError extends Error {
  constructor(message: string, options?: { cause?: unknown }) {
    super(message, options);
    this.name = 'TargetError';
  }
}

export interface FindOptions {
  recursive?: boolean;
  limits?: Partial<FileLimits>;
  /** The name shown for the target when it is a file handed over without one (an upload). */
  displayName?: string;
}

const rejected = (path: string, reason: FileReject['reason'], detail: string): FoundReject => ({ kind: 'rejected', path, reason, detail });

function titleOf(path: string): string {
  return path.slice(path.lastIndexOf('/') + 1).slice(0, 1000);
}

async function readHead(file: string, size: number): Promise<Buffer> {
  const handle = await open(file, 'r');
  try {
    const buffer = Buffer.alloc(Math.min(size, 1024));
    await handle.read(buffer, 0, buffer.length, 0);
    return buffer;
  } finally {
    await handle.close();
  }
}

const errorText = (error: unknown): string => {
  const code = (error as NodeJS.ErrnoException).code;
  return code === 'EACCES' ? 'permission denied' : code === 'ENOENT' ? 'the file vanished while it was read' : (error as Error).message;
};

export class DocumentFinder {
  /** Files known so far; grows as archives are opened (each archive's files replace the archive): the progress total. */
  total = 0;
  /** Subfolders not entered (no `recursive`). */
  skippedFolders = 0;
  readonly limits: FileLimits;

  constructor(
    readonly target: string,
    readonly options: FindOptions = {},
  ) {
    this.limits = { ...FILE_LIMIT_DEFAULTS, ...options.limits };
  }

  async *documents(): AsyncGenerator<Found> {
    let info;
    try {
      info = await stat(this.target);
    } catch (error) {
      const code = (error as NodeJS.ErrnoException).code;
      throw new TargetError(`${this.target}: ${code === 'ENOENT' ? 'no such file or folder' : errorText(error)}`, { cause: error });
    }
    if (info.isDirectory()) {
      const files = await this.listFolder(this.target, '');
      this.total = files.length;
      for (const file of files) {
        if ('reject' in file) yield file.reject;
        else yield* this.fromDiskFile(file.abs, file.rel, false);
      }
    } else if (info.isFile()) {
      this.total = 1;
      yield* this.fromDiskFile(this.target, '', true);
    } else {
      throw new TargetError(`${this.target}: neither a folder nor a regular file`);
    }
  }

  /** The folder's files in name order (subfolders first listed, then entered, when recursive). */
  private async listFolder(dir: string, rel: string): Promise<({ abs: string; rel: string } | { reject: FoundReject })[]> {
    const out: ({ abs: string; rel: string } | { reject: FoundReject })[] = [];
    const entries = (await readdir(dir, { withFileTypes: true })).sort((a, b) => (a.name < b.name ? -1 : a.name > b.name ? 1 : 0));
    for (const entry of entries) {
      const path = rel === '' ? entry.name : `${rel}/${entry.name}`;
      const abs = join(dir, entry.name);
      if (entry.isSymbolicLink()) out.push({ reject: rejected(path, 'symlink', 'a symbolic link in the folder') });
      else if (entry.isDirectory()) {
        if (this.options.recursive) out.push(...(await this.listFolder(abs, path)));
        else this.skippedFolders++;
      } else if (entry.isFile()) out.push({ abs, rel: path });
      else out.push({ reject: rejected(path, 'unsupported_type', 'not a regular file (a device, socket or pipe)') });
    }
    return out;
  }

  private async *fromDiskFile(abs: string, rel: string, top: boolean): AsyncGenerator<Found> {
    const shown = rel || this.options.displayName || basename(abs);
    let size: number;
    let head: Buffer;
    try {
      // Links inside a folder were refused when it was listed: this is a regular file, or the target given.
      const info = await stat(abs);
      size = info.size;
      head = await readHead(abs, size);
    } catch (error) {
      yield rejected(shown, 'unreadable', errorText(error));
      return;
    }
    if (detectFileType(head).kind === 'zip') {
      let survey;
      try {
        survey = await surveyZip({ file: abs }, this.limits);
      } catch (error) {
        yield rejected(shown, 'unreadable', `not a readable zip archive: ${(error as Error).message}`);
        return;
      }
      if (zipPackageKind(survey.names) === 'archive') {
        yield* this.fromArchive({ file: abs }, survey, shown, rel === '' ? '' : `${rel}/`, 0, top);
        return;
      }
    }
    if (size > this.limits.maxFileBytes) {
      yield rejected(shown, 'file_too_large', `${size} bytes; the limit for one file is ${this.limits.maxFileBytes} bytes`);
      return;
    }
    let bytes: Buffer;
    try {
      bytes = await readFile(abs);
    } catch (error) {
      yield rejected(shown, 'unreadable', errorText(error));
      return;
    }
    yield* this.fromBytes(bytes, rel || basename(abs), 0);
  }

  private async *fromArchive(
    source: ZipSource,
    survey: Awaited<ReturnType<typeof surveyZip>>,
    shown: string,
    prefix: string,
    depth: number,
    top: boolean,
  ): AsyncGenerator<Found> {
    const problem = archiveProblem(survey, this.limits);
    if (problem) {
      if (top) throw new ArchiveRefusedError(shown, problem);
      yield rejected(shown, 'archive_refused', problem);
      return;
    }
    // The archive counted as one file until now; its files take its place.
    this.total += survey.files - 1;
    try {
      for await (const item of zipItems(source, prefix, this.limits)) {
        if ('reject' in item) {
          yield { kind: 'rejected', ...item.reject };
          continue;
        }
        let bytes: Buffer;
        try {
          bytes = await item.member.read();
        } catch (error) {
          yield rejected(item.member.path, 'unreadable', `the archive entry could not be read: ${(error as Error).message}`);
          continue;
        }
        yield* this.fromBytes(bytes, item.member.path, depth);
      }
    } catch (error) {
      yield rejected(shown, 'unreadable', `the archive is damaged; entries after the damage were not read: ${(error as Error).message}`);
    }
  }

  private async *fromBytes(bytes: Buffer, path: string, depth: number): AsyncGenerator<Found> {
    const type = detectFileType(bytes);
    if (type.kind === 'zip') {
      let survey;
      try {
        survey = await surveyZip({ buffer: bytes }, this.limits);
      } catch (error) {
        yield rejected(path, 'unreadable', `not a readable zip archive: ${(error as Error).message}`);
        return;
      }
      const kind = zipPackageKind(survey.names);
      if (kind === 'archive') {
        if (depth + 1 > this.limits.maxNesting) {
          yield rejected(path, 'nested_too_deep', `an archive ${depth + 1} levels inside the one given; at most ${this.limits.maxNesting} is read`);
          return;
        }
        yield* this.fromArchive({ buffer: bytes }, survey, path, `${path}/`, depth + 1, false);
        return;
      }
      if (kind === 'office') {
        yield rejected(path, 'unsupported_type', 'a spreadsheet or presentation, not a Word document');
        return;
      }
      if (survey.bomb) yield rejected(path, 'compression_ratio', `the Word package's part ${survey.bomb}`);
      else if (survey.totalUncompressed > this.limits.maxPackageBytes) {
        yield rejected(path, 'file_too_large', `the Word package expands to ${survey.totalUncompressed} bytes; the limit is ${this.limits.maxPackageBytes}`);
      } else yield this.document(path, 'docx', await extractDocxText(bytes));
      return;
    }
    if (type.kind === 'pdf') {
      yield this.document(path, 'pdf', await extractPdfText(bytes));
      return;
    }
    if (type.kind === 'other') {
      yield rejected(path, 'unsupported_type', type.what);
      return;
    }
    if (!isTextDocumentName(path)) {
      yield rejected(
        path,
        'unsupported_type',
        `UTF-8 text, but named "${titleOf(path)}": only .txt, .md or names without an extension are read as contract text`,
      );
      return;
    }
    if (bytes.length > MAX_CONTRACT_BYTES) {
      yield rejected(path, 'text_too_large', `${bytes.length} bytes of text; the limit is ${MAX_CONTRACT_BYTES}`);
      return;
    }
    if (type.text.trim() === '') {
      yield rejected(path, 'no_text', 'the file is empty or holds only spaces');
      return;
    }
    yield this.document(path, 'text', { ok: true, text: type.text });
  }

  private document(path: string, fileType: FileType, extraction: Extraction): Found {
    if (!extraction.ok) return { kind: 'rejected', path, ...extraction.reject };
    // The path becomes the contract's external id, held to the register's id limit.
    if (path.length > MAX_ID_LENGTH) return rejected(path, 'path_too_long', `${path.length} characters; the limit is ${MAX_ID_LENGTH}`);
    return { kind: 'document', path, title: titleOf(path), fileType, text: extraction.text };
  }
}
