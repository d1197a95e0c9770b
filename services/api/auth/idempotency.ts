/**
 * Idempotency-Key on POST (after the IETF httpapi Idempotency-Key header draft): the first request with a key
 * does the work and its answer is stored in the database (idempotency_record), so that any instance answers a
 * retry with the same body with that first answer (header `Idempotent-Replayed: true`) without doing the work
 * again. The same key with another body or route answers 422 IDEMPOTENCY_KEY_REUSED; a retry while the first
 * is still running answers 409 IDEMPOTENCY_KEY_IN_USE. Keys are scoped to the API key that sent them and kept
 * 24 hours. A 5xx answer is not stored (the retry runs again: a failed request changed nothing).
 *
 * The claim row is written before the work and the answer after it, outside the work's transaction; the work's
 * own transaction stamps the claim `work_committed_at` (db/idempotency-scope.ts: register writes and key
 * creation). A retry of a claim left without an answer for ABANDONED_AFTER_MS (its process died) redoes the work
 * only when that stamp is absent; otherwise it answers 409 IDEMPOTENT_ANSWER_LOST instead of doing it twice.
 *
 * An answer that holds a secret shown once (POST /v1/keys) is never stored as it was sent: the route says in
 * `config.idempotentReplay` what a replay answers instead (the key's id and metadata, `secretWithheld: true`),
 * and whatever is stored is searched for whole API keys, each replaced by a marker, so that a route that forgets
 * to say still stores no secret.
 */
import { createHash } from 'node:crypto';
import type { FastifyReply, FastifyRequest } from 'fastify';
import type { Kysely } from 'kysely';
import type { Database } from '../../../db/types.ts';
import { ApiError } from '../errors.ts';
import type { AppPlugin } from '../types.ts';
import { KEY_IN_TEXT } from './keys.ts';
import { canonicalJson } from './canonical-json.ts';
import { currentIdempotencyScope, runInIdempotencyScope } from '../../../db/idempotency-scope.ts';
import {
  deleteIdempotencyClaim,
  deleteIdempotencyRecordsBefore,
  insertIdempotencyClaim,
  selectIdempotencyRecord,
  takeOverIdempotencyClaim,
  updateIdempotencyAnswer,
} from '../../../db/queries/idempotency-records.ts';

export const IDEMPOTENCY_TTL_HOURS = 24;
/** A first request that left no answer this long ago (its instance died) may be taken over. */
export const ABANDONED_AFTER_MS = 10 * 60_000;
const KEY_SHAPE = /^[\x21-\x7e]{1,255}$/;

declare module 'fastify' {
  interface FastifyRequest {
    idempotency: { keyId: string; key: string } | null;
  }
  interface FastifyContextConfig {
    /**
     * For a route whose answer holds a secret shown once: the body a replay answers instead, from the first
     * answer's parsed JSON body (2xx answers only). Without it the answer is stored as sent.
     */
    idempotentReplay?: (body: unknown) => unknown;
    /**
     * The route claims its Idempotency-Key itself, once it has read its upload (jobs/contracts): the app-wide hook
     * leaves every request to it, so a body the route refuses before its claim leaves no stored answer.
     */
    ownIdempotency?: boolean;
  }
}

/** What replaces a whole API key found in an answer about to be stored. */
export const SECRET_NOT_STORED = '[secret not stored]';

/**
 * The request's fingerprint: canonical JSON (keys sorted, so a body resent with its keys in another order is the
 * same request), built iteratively (a deep body cannot overflow the stack; body-depth.ts also refuses one).
 */
export function bodyHash(method: string, path: string, body: unknown): string {
  return createHash('sha256')
    .update(canonicalJson([method, path, body ?? null]))
    .digest('hex');
}

export interface StoredAnswer {
  statusCode: number;
  contentType: string | null;
  headers: Record<string, string>;
  body: string;
}

export type ClaimResult = { kind: 'claimed' } | { kind: 'replay'; answer: StoredAnswer };

/** Claims `key` for this request, or answers what to do instead (replay, or an error). */
export async function claimIdempotencyKey(
  db: Kysely<Database>,
  input: { keyId: string; key: string; method: string; path: string; hash: string },
): Promise<ClaimResult> {
  if (Math.random() < 0.01) {
    await deleteIdempotencyRecordsBefore(db, new Date(Date.now() - IDEMPOTENCY_TTL_HOURS * 3_600_000));
  }
  if (await insertIdempotencyClaim(db, { ...input, createdAt: new Date() })) return { kind: 'claimed' };
  const row = await selectIdempotencyRecord(db, input);
  if (!row) return claimIdempotencyKey(db, input); // expired and deleted meanwhile
  if (row.method !== input.method || row.path !== input.path || row.body_hash !== input.hash) {
    throw new ApiError(
      'IDEMPOTENCY_KEY_REUSED',
      `this Idempotency-Key was first used for ${row.method} ${row.path} with another body; use a new key for a new request`,
      { extensions: { firstUsedFor: `${row.method} ${row.path}` } },
    );
  }
  if (row.status_code === null || row.response === null) {
    const age = Date.now() - new Date(row.created_at).getTime();
    if (age > ABANDONED_AFTER_MS && row.work_committed_at !== null) {
      // The first request's work was committed (stamped in its transaction) but its process stopped before the
      // answer was stored: doing the work again would do it twice (a second counterparty, a second key).
      throw new ApiError(
        'IDEMPOTENT_ANSWER_LOST',
        'the first request with this Idempotency-Key changed the register, but its answer was lost when its process stopped; it is not done again: read the resource to see the result, and use a new key for a new request',
        { extensions: { workCommittedAt: new Date(row.work_committed_at).toISOString() } },
      );
    }
    if (age > ABANDONED_AFTER_MS) {
      if (await takeOverIdempotencyClaim(db, input, row.created_at, new Date())) return { kind: 'claimed' };
    }
    throw new ApiError('IDEMPOTENCY_KEY_IN_USE', 'a request with this Idempotency-Key is still being processed; retry in a few seconds', {
      headers: { 'retry-after': '2' },
    });
  }
  const stored = (typeof row.response === 'string' ? JSON.parse(row.response) : row.response) as StoredAnswer;
  return { kind: 'replay', answer: stored };
}

export async function storeIdempotentAnswer(db: Kysely<Database>, claim: { keyId: string; key: string }, answer: StoredAnswer): Promise<void> {
  // A secret is shown once and stored only hashed: never kept for a replay, whichever route sent it.
  const stored: StoredAnswer = { ...answer, body: answer.body.replace(KEY_IN_TEXT, SECRET_NOT_STORED) };
  await updateIdempotencyAnswer(db, claim, stored.statusCode, JSON.stringify(stored));
}

/**
 * Gives the key back after a request that failed in this process. `answered`: also when an answer was stored with
 * the work (a job submission stores its 202 in the transaction that creates the job, then may still fail while
 * reading the upload; the failed job stays, and the retry submits again).
 */
export async function releaseIdempotencyKey(db: Kysely<Database>, claim: { keyId: string; key: string }, options: { answered?: boolean } = {}): Promise<void> {
  await deleteIdempotencyClaim(db, claim, options);
}

export function sendStoredAnswer(reply: FastifyReply, answer: StoredAnswer): FastifyReply {
  for (const [name, value] of Object.entries(answer.headers)) reply.header(name, value);
  reply.header('idempotent-replayed', 'true');
  if (answer.contentType) reply.type(answer.contentType);
  return reply.code(answer.statusCode).send(answer.body);
}

const KEPT_HEADERS = ['location', 'etag'];

function isReadable(value: unknown): boolean {
  return typeof value === 'object' && value !== null && typeof (value as { pipe?: unknown }).pipe === 'function';
}

/** The body stored for replays: the route's `idempotentReplay` of a 2xx JSON answer, else the answer as sent. */
function replayBody(request: FastifyRequest, statusCode: number, sent: string): string {
  const replay = request.routeOptions.config?.idempotentReplay;
  if (!replay || statusCode < 200 || statusCode > 299) return sent;
  let parsed: unknown;
  try {
    parsed = JSON.parse(sent);
  } catch {
    return sent; // not JSON: stored with every key in it replaced (storeIdempotentAnswer)
  }
  return JSON.stringify(replay(parsed));
}

/** The Idempotency-Key header of a request, checked; undefined when absent. */
export function idempotencyKeyOf(request: FastifyRequest): string | undefined {
  const raw = request.headers['idempotency-key'];
  if (raw === undefined) return undefined;
  const value = Array.isArray(raw) ? raw[0] : raw;
  // The draft sends the key as a structured-field string: a quoted value is accepted with or without quotes.
  const key = value?.startsWith('"') && value.endsWith('"') && value.length >= 2 ? value.slice(1, -1) : value;
  if (!key || !KEY_SHAPE.test(key)) {
    throw new ApiError('VALIDATION_FAILED', 'Idempotency-Key must be 1 to 255 visible ASCII characters (a UUID is a good choice)', {
      errors: [{ pointer: '/idempotency-key', message: 'must be 1 to 255 visible ASCII characters', in: 'header' }],
    });
  }
  return key;
}

export const idempotencyPlugin: AppPlugin = (app, deps) => {
  app.decorateRequest('idempotency', null);
  // Every request runs in a scope of its own, so that the transaction that commits its work can stamp its claim
  // (db/idempotency-scope.ts). A callback hook: the rest of the request runs inside `run`.
  app.addHook('onRequest', (_request, _reply, done) => {
    runInIdempotencyScope(done);
  });
  app.addHook('preHandler', async (request, reply) => {
    if (request.method !== 'POST' || !request.apiKey) return;
    const key = idempotencyKeyOf(request);
    if (key === undefined) return;
    // A streamed upload (jobs/ingest, jobs/contracts; a multipart upload is read by its route) is hashed by its
    // route while it is read.
    if (isReadable(request.body) || (request as { isMultipart?: () => boolean }).isMultipart?.() === true) return;
    if (request.routeOptions.config?.ownIdempotency === true) return;
    const path = request.url;
    const claim = { keyId: request.apiKey.id, key };
    const result = await claimIdempotencyKey(deps.db, { ...claim, method: request.method, path, hash: bodyHash(request.method, path, request.body) });
    if (result.kind === 'replay') return sendStoredAnswer(reply, result.answer);
    request.idempotency = claim;
    const scope = currentIdempotencyScope();
    if (scope) scope.claim = claim;
  });
  app.addHook('onSend', async (request, reply, payload) => {
    const claim = request.idempotency;
    if (!claim) return payload;
    request.idempotency = null;
    const scope = currentIdempotencyScope();
    if (scope) scope.claim = undefined;
    if (reply.statusCode >= 500 || isReadable(payload) || reply.getHeader('idempotent-replayed')) {
      await releaseIdempotencyKey(deps.db, claim);
      return payload;
    }
    const headers: Record<string, string> = {};
    for (const name of KEPT_HEADERS) {
      const value = reply.getHeader(name);
      if (value !== undefined) headers[name] = String(value);
    }
    const contentType = reply.getHeader('content-type');
    const sent =
      typeof payload === 'string'
        ? payload
        : Buffer.isBuffer(payload)
          ? payload.toString('utf8')
          : payload === null || payload === undefined
            ? ''
            : JSON.stringify(payload);
    const body = replayBody(request, reply.statusCode, sent);
    await storeIdempotentAnswer(deps.db, claim, {
      statusCode: reply.statusCode,
      contentType: contentType === undefined ? null : String(contentType),
      headers,
      body,
    });
    return payload;
  });
};
