/**
 * resolvers/files: what can be decided about a contract file from its bytes and an archive entry from its record,
 * before any I/O library runs. Pure.
 *
 *   detectFileType(bytes) · zipPackageKind(entry names) · isTextDocumentName(name): what a file is;
 *   checkEntryPath(name): an archive entry's path stays inside the archive; printableEntryName(name): how a refused one is shown;
 *   checkZipEntry(facts, limits): symbolic links, encryption, size and compression ratio of one entry;
 *   REJECT_REASONS: the one catalogue of reasons a file is not imported; FILE_LIMIT_DEFAULTS: the limits.
 */
export { detectFileType, isTextDocumentName, zipPackageKind, type DetectedType } from './detect-file-type.ts';
export { checkEntryPath, printableEntryName, type EntryPathCheck } from './check-entry-path.ts';
export { checkZipEntry, isSymlinkEntry, type ZipEntryFacts } from './check-zip-entry.ts';
export { REJECT_REASONS, REJECT_REASON_CODES, type FileReject, type RejectReason } from './reject-reasons.ts';
export { FILE_LIMIT_DEFAULTS, type FileLimits } from './limits.ts';
