/**
 * Strict UTF-8 for request bodies. Node's Buffer#toString('utf8') turns every ill-formed byte into U+FFFD, so
 * a body with a stray 0xFF, an overlong form, a sequence cut short or CESU-8 surrogate bytes was stored with
 * U+FFFD instead of refused. JSON travels in UTF-8 (RFC 8259 §8.1): the body is decoded with a fatal
 * TextDecoder (WHATWG Encoding), and when that refuses it, `firstIllFormedOffset` names the byte where the first
 * ill-formed sequence begins (the decoder itself does not say).
 */
const fatalDecoder = new TextDecoder('utf-8', { fatal: true, ignoreBOM: true });

/**
 * Where the first ill-formed sequence of `bytes` begins, or -1 when all of it is well-formed. The ranges are
 * those of Unicode's table of well-formed UTF-8 byte sequences (The Unicode Standard, ch. 3, Table 3-7): they
 * exclude overlong forms (C0, C1, E0 80..9F, F0 80..8F), surrogates (ED A0..BF) and values past U+10FFFF.
 */
export function firstIllFormedOffset(bytes: Uint8Array): number {
  for (let i = 0; i < bytes.length;) {
    const length = sequenceAt(bytes, i);
    if (length <= 0) return i;
    i += length;
  }
  return -1;
}

/**
 * The length of the well-formed sequence that begins at `i`; 0 when the bytes there are ill-formed; -1 when they
 * are the well-formed beginning of a sequence that `bytes` ends before completing (ill-formed at the end of input,
 * undecided in the middle of a stream).
 */
export function sequenceAt(bytes: Uint8Array, i: number): number {
  const lead = bytes[i]!;
  if (lead < 0x80) return 1;
  const shape = sequenceShape(lead);
  if (!shape) return 0;
  const [length, secondLow, secondHigh] = shape;
  for (let k = 1; k < length; k++) {
    if (i + k >= bytes.length) return -1;
    const next = bytes[i + k]!;
    const [low, high] = k === 1 ? [secondLow, secondHigh] : [0x80, 0xbf];
    if (next < low || next > high) return 0;
  }
  return length;
}

/** Length and the allowed range of the second byte of a sequence led by `lead` (>= 0x80); undefined: no sequence. */
function sequenceShape(lead: number): [number, number, number] | undefined {
  if (lead >= 0xc2 && lead <= 0xdf) return [2, 0x80, 0xbf];
  if (lead === 0xe0) return [3, 0xa0, 0xbf];
  if (lead === 0xed) return [3, 0x80, 0x9f];
  if (lead >= 0xe1 && lead <= 0xef) return [3, 0x80, 0xbf];
  if (lead === 0xf0) return [4, 0x90, 0xbf];
  if (lead >= 0xf1 && lead <= 0xf3) return [4, 0x80, 0xbf];
  if (lead === 0xf4) return [4, 0x80, 0x8f];
  return undefined;
}

export type Utf8Result = { ok: true; text: string } | { ok: false; byteOffset: number; byte: number };

/** Decodes `bytes` as UTF-8, refusing any ill-formed sequence (and naming where it begins). */
export function decodeUtf8Strictly(bytes: Uint8Array): Utf8Result {
  try {
    return { ok: true, text: fatalDecoder.decode(bytes) };
  } catch {
    const byteOffset = firstIllFormedOffset(bytes);
    // The decoder and the table agree (a test checks it on random bytes); -1 here would be a defect in one of them.
    const at = byteOffset < 0 ? 0 : byteOffset;
    return { ok: false, byteOffset: at, byte: bytes[at] ?? 0 };
  }
}

/** `0xFF`: how a byte is shown in a message. */
export function hexByte(byte: number): string {
  return `0x${byte.toString(16).toUpperCase().padStart(2, '0')}`;
}

/**
 * The charset a Content-Type declares (lower case, quotes removed), or undefined when it declares none. The
 * `charset` parameter is case-insensitive (RFC 9110 §8.3.2).
 */
export function declaredCharset(contentType: string | undefined): string | undefined {
  if (!contentType) return undefined;
  const given = new Set<string>();
  for (const part of contentType.split(';').slice(1)) {
    const eq = part.indexOf('=');
    if (eq < 0) continue;
    if (part.slice(0, eq).trim().toLowerCase() !== 'charset') continue;
    const charset = part
      .slice(eq + 1)
      .trim()
      .replace(/^"(.*)"$/, '$1')
      .toLowerCase();
    given.add(charset === 'utf8' ? 'utf-8' : charset);
  }
  // A parameter given twice is an error (RFC 6838 §4.3): "charset=utf-8; charset=latin1" was read as UTF-8 by its
  // first value. Two different values come back together, which names no charset, so the body is refused.
  return given.size === 0 ? undefined : [...given].join(', ');
}

export const isUtf8Charset = (charset: string | undefined): boolean => charset === undefined || charset === 'utf-8' || charset === 'utf8';
