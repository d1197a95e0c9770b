/**
 * Errors Node's HTTP parser raises before fastify sees a request (fastify's `clientErrorHandler` option): a
 * request line and headers larger than Node's limit (431), a client too slow to send its request (408), and
 * malformed framing (400: a bad request line, a bad header, two Content-Lengths, broken chunked encoding). Fastify's
 * default answers `{"error":"Bad Request","message":"Client Error"}`; this answers a problem document with a
 * code. There is no request yet, so the answer is written to the socket by hand, and the connection is closed
 * (after a framing error the stream cannot be trusted to hold a next request).
 * Not covered, because no answer can be written: a connection the client already reset, and a socket on which an
 * answer has begun (docs/errors.md says so).
 */
import { STATUS_CODES, maxHeaderSize } from 'node:http';
import type { Socket } from 'node:net';
import type { FastifyInstance } from 'fastify';
import { PROBLEM_MEDIA_TYPE, problem, type Problem } from './errors.ts';

interface ClientError extends Error {
  code?: string;
}

function problemFor(error: ClientError): Problem {
  if (error.code === 'HPE_HEADER_OVERFLOW') {
    return problem('HEADERS_TOO_LARGE', `the request line and headers exceed ${maxHeaderSize} bytes (a long query string counts)`, undefined, {
      limitBytes: maxHeaderSize,
    });
  }
  if (error.code === 'ERR_HTTP_REQUEST_TIMEOUT') return problem('REQUEST_TIMEOUT', 'the request was not received completely in time');
  // The parser's reason code (HPE_…) names the rule that failed; its message may quote the caller's bytes.
  return problem('BAD_REQUEST', 'the request is not well-formed HTTP/1.1 (request line, headers, Content-Length or chunked encoding)', undefined, {
    ...(error.code ? { parserError: error.code } : {}),
  });
}

export function clientErrorHandler(this: FastifyInstance, error: ClientError, socket: Socket): void {
  if (error.code === 'ECONNRESET' || socket.destroyed) return;
  const body = problemFor(error);
  this.log.debug({ code: body.code, parserError: error.code }, 'client error before a request');
  const answering = (socket as Socket & { _httpMessage?: { headersSent?: boolean } })._httpMessage?.headersSent === true;
  if (socket.writable && !answering) {
    const json = JSON.stringify(body);
    socket.write(
      `HTTP/1.1 ${body.status} ${STATUS_CODES[body.status] ?? ''}\r\nContent-Type: ${PROBLEM_MEDIA_TYPE}\r\nContent-Length: ${Buffer.byteLength(json)}\r\nConnection: close\r\n\r\n${json}`,
    );
  }
  socket.destroy(error);
}
