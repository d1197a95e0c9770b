/**
 * The JSON body parser of every route: fastify's own (secure-json-parse, with its __proto__ and constructor
 * checks and its empty-body error), fed only text that was UTF-8 to the last byte. A body declared in another
 * charset answers 415 (the charset is not repeated); a body whose bytes are not UTF-8 answers 400 BODY_NOT_UTF8 naming the
 * byte offset where the first ill-formed sequence begins (member `byteOffset`). Nothing of such a body is read.
 */
import type { FastifyInstance, FastifyRequest } from 'fastify';
import { ApiError } from '../errors.ts';
import { decodeUtf8Strictly, declaredCharset, hexByte, isUtf8Charset } from '../../ingest/utf8.ts';

/** The body's text, or the ApiError that refuses it (a wrong charset, or bytes that are not UTF-8). */
export function bodyText(request: FastifyRequest, bytes: Buffer, what = 'the body'): string {
  const charset = declaredCharset(request.headers['content-type']);
  if (!isUtf8Charset(charset)) {
    throw new ApiError(
      'UNSUPPORTED_MEDIA_TYPE',
      `${what} is declared in a charset other than UTF-8; this API reads JSON in UTF-8 only (RFC 8259 §8.1): send it as UTF-8, with charset=utf-8 or no charset`,
      {
        errors: [{ pointer: '/content-type', message: 'charset must be utf-8 (or absent)', in: 'header' }],
      },
    );
  }
  const decoded = decodeUtf8Strictly(bytes);
  if (!decoded.ok) {
    const line = lineAt(bytes, decoded.byteOffset);
    throw new ApiError(
      'BODY_NOT_UTF8',
      `${what} is not valid UTF-8: the byte ${hexByte(decoded.byte)} at byte offset ${decoded.byteOffset} (line ${line}) begins no well-formed sequence (RFC 3629); nothing was read`,
      {
        extensions: { byteOffset: decoded.byteOffset, line },
      },
    );
  }
  return decoded.text;
}

/** The 1-based line of the byte at `offset` (lines end at LF; the NDJSON batch counts its lines the same way). */
function lineAt(bytes: Buffer, offset: number): number {
  let line = 1;
  for (let i = bytes.indexOf(0x0a); i >= 0 && i < offset; i = bytes.indexOf(0x0a, i + 1)) line++;
  return line;
}

export function useStrictJsonParser(app: FastifyInstance): void {
  const parseJson = app.getDefaultJsonParser('error', 'error');
  app.removeContentTypeParser('application/json');
  app.addContentTypeParser('application/json', { parseAs: 'buffer' }, (request, body, done) => {
    let text: string;
    try {
      text = bodyText(request, body as Buffer);
    } catch (error) {
      done(error as Error, undefined);
      return;
    }
    parseJson(request, text, done);
  });
}
