/**
 * Why a file was not imported as a contract: the one catalogue of reasons, each with a stable snake_case code and
 * the plain words the summary, the rejects file and the job result print beside the file's own detail.
 */
import { MAX_ID_LENGTH } from '../vocabulary.ts';

export const REJECT_REASONS = {
  unreadable: 'the file could not be read or is damaged',
  encrypted_pdf: 'the PDF is encrypted with a password: save it without a password and import it again',
  no_text_layer: 'the PDF has no text layer (a scanned image?): no OCR is attempted; import a PDF with text or the text itself',
  no_text: 'the document holds no text',
  unsupported_type: 'not a PDF, Word (.docx) or UTF-8 text file',
  file_too_large: 'the file is over the size limit for one file',
  text_too_large: 'the extracted text is over the 1 MB limit of one contract',
  no_parties: 'the party parser found no parties (no parties clause, defined party term or signature block)',
  unsafe_path: "the archive entry's path is absolute, leaves the archive (..) or cannot be read as a name (a control character, bytes not UTF-8): not read",
  symlink: 'a symbolic link: not followed',
  encrypted_entry: 'the archive entry is encrypted: not read',
  compression_ratio: 'the archive entry expands too much for its compressed size (a zip bomb?): not read',
  archive_refused: 'the archive is over a limit (entries or total uncompressed size): nothing in it was read',
  nested_too_deep: 'an archive inside an archive inside an archive: only one level of nesting is read',
  duplicate_path: 'the archive holds another entry with the same path: only the first is read',
  contract_refused: 'the register refused the contract text',
  path_too_long: `the file's path is longer than the ${MAX_ID_LENGTH} characters of a contract's external id`,
} as const;

export type RejectReason = keyof typeof REJECT_REASONS;

export const REJECT_REASON_CODES = Object.keys(REJECT_REASONS) as RejectReason[];

/** A file that was not imported: where it is, why, and the detail of this file (a size, a library's message). */
export interface FileReject {
  path: string;
  reason: RejectReason;
  detail: string;
}
