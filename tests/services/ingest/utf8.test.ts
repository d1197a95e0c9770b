/**
 * firstIllFormedOffset (Unicode Table 3-7) against the WHATWG fatal UTF-8 decoder (Node's TextDecoder, the
 * reference): on random bytes both agree whether the input is well-formed, and the bytes before the offset
 * decode while the sequence at the offset does not.
 */
import fc from 'fast-check';
import { expect, it } from 'vitest';
import { Readable } from 'node:stream';
import { declaredCharset, decodeUtf8Strictly, firstIllFormedOffset } from '../../../services/ingest/utf8.ts';
import { Utf8Watch } from '../../../services/ingest/utf8-watch.ts';

const fatal = new TextDecoder('utf-8', { fatal: true });
const wellFormed = (bytes: Uint8Array): boolean => {
  try {
    fatal.decode(bytes);
    return true;
  } catch {
    return false;
  }
};

// Bytes biased towards UTF-8 lead and continuation bytes, so that near-valid sequences are common.
const byte = fc.oneof(
  fc.integer({ min: 0, max: 0x7f }),
  fc.integer({ min: 0x80, max: 0xbf }),
  fc.integer({ min: 0xc0, max: 0xff }),
  fc.constantFrom(0xe0, 0xed, 0xf0, 0xf4, 0xc2, 0xef),
);
const bytes = fc.oneof(
  fc.array(byte, { maxLength: 40 }).map((a) => Uint8Array.from(a)),
  fc.tuple(fc.string({ unit: 'binary', maxLength: 20 }), fc.array(byte, { maxLength: 4 }), fc.string({ unit: 'binary', maxLength: 20 })).map(([a, b, c]) => {
    const enc = new TextEncoder();
    return Uint8Array.from([...enc.encode(a), ...b, ...enc.encode(c)]);
  }),
);

it('agrees with the fatal TextDecoder on random bytes, and the offset is where decoding first fails', () => {
  fc.assert(
    fc.property(bytes, (b) => {
      const offset = firstIllFormedOffset(b);
      expect(offset < 0).toBe(wellFormed(b));
      if (offset >= 0) {
        expect(wellFormed(b.subarray(0, offset))).toBe(true);
        const result = decodeUtf8Strictly(b);
        expect(result).toMatchObject({ ok: false, byteOffset: offset });
      }
    }),
    { numRuns: 5000, seed: 11 },
  );
});

it('names the start of each kind of ill-formed sequence (offsets counted by hand)', () => {
  expect(firstIllFormedOffset(Uint8Array.from([0x41, 0xff]))).toBe(1);
  expect(firstIllFormedOffset(Uint8Array.from([0x41, 0x42, 0xc0, 0xaf]))).toBe(2); // overlong "/"
  expect(firstIllFormedOffset(Uint8Array.from([0xe2, 0x82]))).toBe(0); // "€" cut short at the end
  expect(firstIllFormedOffset(Uint8Array.from([0x41, 0xed, 0xa0, 0x80]))).toBe(1); // CESU-8 U+D800
  expect(firstIllFormedOffset(Uint8Array.from([0xe2, 0x82, 0xac, 0xf0, 0x9f, 0x98, 0x80]))).toBe(-1); // "€😀"
});

it('reads the charset parameter case-insensitively, quoted or not', () => {
  expect(declaredCharset('application/json')).toBeUndefined();
  expect(declaredCharset('application/json; Charset="UTF-8"')).toBe('utf-8');
  expect(declaredCharset('application/json;charset=latin1; x=y')).toBe('latin1');
});

it('the stream watch finds the same first ill-formed offset however the bytes are cut into chunks, and passes every byte on', async () => {
  await fc.assert(
    fc.asyncProperty(bytes, fc.array(fc.integer({ min: 1, max: 7 }), { minLength: 1, maxLength: 20 }), async (b, sizes) => {
      const chunks: Buffer[] = [];
      for (let at = 0, k = 0; at < b.length; k++) {
        const size = sizes[k % sizes.length]!;
        chunks.push(Buffer.from(b.subarray(at, at + size)));
        at += size;
      }
      const watch = new Utf8Watch();
      const out: Buffer[] = [];
      for await (const piece of Readable.from(chunks).pipe(watch)) out.push(piece as Buffer);
      expect(Buffer.concat(out).equals(Buffer.from(b))).toBe(true);
      expect(watch.firstIn(0, b.length)?.offset ?? -1).toBe(firstIllFormedOffset(b));
    }),
    { numRuns: 1000, seed: 12 },
  );
});
