/** Counterparty ETags (`"cp<id>.v<version>"`): read by GET, required as If-Match by changes. */
import type { FastifyRequest } from 'fastify';
import { ApiError } from '../../errors.ts';

export function etagOf(id: number, version: number): string {
  return `"cp${id}.v${version}"`;
}

/** The version an ETag names for counterparty `id` (weak or strong), or undefined when it names another. */
export function versionFromEtag(etag: string, id: number): number | undefined {
  const match = /^(?:W\/)?"cp(\d+)\.v(\d+)"$/.exec(etag.trim());
  if (!match || Number(match[1]) !== id) return undefined;
  return Number(match[2]);
}

/** If-Match is required on changes to a counterparty: answers the version it names. */
export function requireIfMatch(request: FastifyRequest, id: number): number {
  const header = request.headers['if-match'];
  if (typeof header !== 'string' || header.length === 0) {
    throw new ApiError('PRECONDITION_REQUIRED', `send If-Match with the ETag of counterparty ${id} (GET /v1/counterparties/${id} answers it)`);
  }
  const version = versionFromEtag(header, id);
  if (version === undefined) {
    throw new ApiError('PRECONDITION_FAILED', `If-Match ${header} is not an ETag of counterparty ${id}; read it again`);
  }
  return version;
}

export function withEtag<T extends { id: number; version: number }>(cp: T): T & { etag: string } {
  return { ...cp, etag: etagOf(cp.id, cp.version) };
}
