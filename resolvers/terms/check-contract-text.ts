/** Input guards for a contract text: empty, binary or over-size text gets a reason, never a guess. */
import type { EmptyReason } from './types.ts';

/** The largest contract text parsed: 1 MB (1,048,576 bytes of UTF-8). */
export const MAX_CONTRACT_BYTES = 1024 * 1024;

/** Share of control or replacement characters above which the text is binary data, not prose (common practice). */
const BINARY_SHARE = 0.01;

export interface TextProblem {
  code: EmptyReason;
  message: string;
}

/** UTF-8 length without allocating a copy. */
export function utf8Length(text: string): number {
  let bytes = 0;
  for (let i = 0; i < text.length; i++) {
    const c = text.charCodeAt(i);
    if (c < 0x80) bytes += 1;
    else if (c < 0x800) bytes += 2;
    else if (c >= 0xd800 && c <= 0xdbff) {
      bytes += 4;
      i++;
    } else bytes += 3;
  }
  return bytes;
}

export function checkContractText(text: unknown): TextProblem | null {
  if (typeof text !== 'string') return { code: 'empty_text', message: 'the contract text must be a string' };
  // A UTF-16 code unit is at least one UTF-8 byte: a long string is over the limit without counting.
  const bytes = text.length > MAX_CONTRACT_BYTES ? text.length : utf8Length(text);
  if (bytes > MAX_CONTRACT_BYTES) {
    return { code: 'too_large', message: `the contract text is ${bytes} bytes; the limit is 1 MB (${MAX_CONTRACT_BYTES} bytes)` };
  }
  if (text.trim().length === 0) return { code: 'empty_text', message: 'the contract text is empty' };
  let odd = 0;
  for (let i = 0; i < text.length; i++) {
    const c = text.charCodeAt(i);
    if (c === 0) return { code: 'binary_data', message: 'the contract text contains NUL bytes: it looks like binary data, not plain text' };
    if ((c < 32 && c !== 9 && c !== 10 && c !== 13 && c !== 12) || c === 0xfffd) odd++;
  }
  if (odd > text.length * BINARY_SHARE) {
    return { code: 'binary_data', message: `the contract text has ${odd} control or undecodable characters: it looks like binary data, not plain text` };
  }
  return null;
}
