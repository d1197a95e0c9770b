/**
 * POST /v1/counterparties (create by hand) and PATCH /v1/counterparties/:id (If-Match): rename, jurisdiction, names and
 * identifiers, every field checked before anything is written.
 */
import {
  addIdentifier,
  addName,
  createCounterparty,
  getCounterparty,
  removeIdentifier,
  removeName,
  renameCounterparty,
} from '../../../register/counterparties.ts';
import { checkJurisdiction, setJurisdiction } from '../../../register/jurisdiction.ts';
import { checkName } from '../../../register/check-name.ts';
import { normaliseIdentifierOrThrow } from '../../../register/normalise-identifier-or-throw.ts';
import { NAME_KINDS } from '../../../../resolvers/vocabulary.ts';
import { ApiError, problemResponses } from '../../errors.ts';
import { CHANGE_RESULT, COUNTERPARTY_OUT, COUNTRY, ID, ID_PARAM, IDENTIFIER, NAME, REASON } from './schemas.ts';
import { actorOf } from './actor-of.ts';
import { etagOf, requireIfMatch, withEtag } from './etags.ts';
import type { FastifyInstance } from 'fastify';
import type { RegisterContext } from '../../../register/context.ts';

const TAGS = ['counterparties'];

interface IdParams {
  id: number;
}

export function counterpartyEditRoutes(app: FastifyInstance, ctx: RegisterContext): void {
  app.post<{ Body: CreateBody }>(
    '/v1/counterparties',
    {
      config: { scope: 'admin' },
      schema: {
        summary: 'Create a counterparty by hand',
        description: 'The name is `canonicalName`, the field GET answers; `name` is its earlier spelling, still accepted. Send exactly one of the two.',
        tags: TAGS,
        body: {
          type: 'object',
          additionalProperties: false,
          properties: {
            canonicalName: { ...NAME, description: 'the canonical name, the field GET answers (required unless the deprecated name is sent)' },
            name: { ...NAME, deprecated: true, description: 'the earlier name of canonicalName, still accepted; send one of the two' },
            kind: { type: 'string', enum: ['organisation', 'person', 'unknown'] },
            jurisdiction: COUNTRY,
            otherNames: {
              type: 'array',
              maxItems: 100,
              items: {
                type: 'object',
                required: ['name', 'kind'],
                additionalProperties: false,
                properties: { name: NAME, kind: { type: 'string', enum: [...NAME_KINDS] } },
              },
            },
            identifiers: { type: 'array', maxItems: 100, items: IDENTIFIER },
            reason: REASON,
          },
          example: {
            canonicalName: 'Harrowgate Tooling Ltd',
            jurisdiction: 'GB',
            identifiers: [{ scheme: 'gb_company', value: '01234567' }],
            reason: 'onboarded by procurement',
          },
        },
        response: { 201: CHANGE_RESULT, ...problemResponses(409) },
      },
    },
    async (request, reply) => {
      const { reason, canonicalName, name, ...rest } = request.body;
      const given = oneCanonicalName(canonicalName, name);
      const result = await createCounterparty(ctx, { ...rest, name: given }, actorOf(request, reason));
      const etag = etagOf(result.counterpartyId, result.version);
      reply.code(201).header('location', `/v1/counterparties/${result.counterpartyId}`).header('etag', etag);
      return { ...result, etag };
    },
  );

  app.patch<{ Params: IdParams; Body: PatchBody }>(
    '/v1/counterparties/:id',
    {
      config: { scope: 'admin' },
      schema: {
        summary: 'Change a counterparty: rename, set its jurisdiction, add or remove names and identifiers (If-Match required)',
        description:
          'Send If-Match with the ETag read from GET. Every field is checked before anything is written; the changes are then applied in the order of the fields below, each one history event. A 412 means someone changed the counterparty since you read it.',
        tags: TAGS,
        params: ID_PARAM,
        headers: { type: 'object', properties: { 'if-match': { type: 'string', maxLength: 100 } } },
        body: {
          type: 'object',
          additionalProperties: false,
          minProperties: 1,
          properties: {
            canonicalName: { ...NAME, description: 'the new canonical name, the field GET answers (confirmed: the rules keep it)' },
            name: { ...NAME, deprecated: true, description: 'the earlier name of canonicalName, still accepted; send one of the two' },
            jurisdiction: {
              ...COUNTRY,
              nullable: true,
              description: 'ISO 3166-1 alpha-2 or ISO 3166-2 code; null clears it. Identifiers added in the same request are read under it.',
            },
            addNames: {
              type: 'array',
              maxItems: 100,
              items: {
                type: 'object',
                required: ['name', 'kind'],
                additionalProperties: false,
                properties: { name: NAME, kind: { type: 'string', enum: [...NAME_KINDS] } },
              },
            },
            removeNameIds: { type: 'array', maxItems: 100, items: ID },
            addIdentifiers: { type: 'array', maxItems: 100, items: IDENTIFIER },
            removeIdentifierIds: { type: 'array', maxItems: 100, items: ID },
            reason: REASON,
          },
          example: {
            canonicalName: 'Brackenridge Fabrication, Inc.',
            jurisdiction: 'US-DE',
            addNames: [{ name: 'Brackenridge Fab', kind: 'trade' }],
            reason: 'trade name from the invoice',
          },
        },
        response: { 200: COUNTERPARTY_OUT, ...problemResponses(404, 409, 412, 428) },
      },
    },
    async (request, reply) => {
      const id = request.params.id;
      const expected = requireIfMatch(request, id);
      const body = request.body;
      const who = actorOf(request, body.reason);
      // Check every field first, so that a bad field stops the request before anything is written.
      if (body.name !== undefined && body.canonicalName !== undefined) throw bothNames();
      const newName = body.canonicalName ?? body.name;
      if (newName !== undefined) checkName(body.canonicalName !== undefined ? 'canonicalName' : 'name', newName);
      const jurisdiction = body.jurisdiction === undefined ? undefined : checkJurisdiction('jurisdiction', body.jurisdiction);
      (body.addNames ?? []).forEach((n, i) => checkName(`addNames/${i}/name`, n.name));
      const current = await getCounterparty(ctx, id);
      if (current.merged)
        throw new ApiError('COUNTERPARTY_MERGED', `counterparty ${id} was merged into ${current.counterparty.id}; change the survivor`, {
          extensions: { survivorId: current.counterparty.id },
        });
      (body.addIdentifiers ?? []).forEach((x, i) =>
        normaliseIdentifierOrThrow(`addIdentifiers/${i}`, x, jurisdiction === undefined ? current.counterparty.jurisdiction : jurisdiction),
      );
      for (const nameId of body.removeNameIds ?? []) {
        if (!current.counterparty.names.some((n) => n.id === nameId))
          throw new ApiError('VALIDATION_FAILED', `name ${nameId} is not a name of counterparty ${id}`, {
            errors: [{ pointer: '/removeNameIds', message: `name ${nameId} is not a name of counterparty ${id}` }],
          });
      }
      for (const identifierId of body.removeIdentifierIds ?? []) {
        if (!current.counterparty.identifiers.some((n) => n.id === identifierId))
          throw new ApiError('VALIDATION_FAILED', `identifier ${identifierId} is not an identifier of counterparty ${id}`, {
            errors: [{ pointer: '/removeIdentifierIds', message: `identifier ${identifierId} is not an identifier of counterparty ${id}` }],
          });
      }
      let version = expected;
      if (newName !== undefined) version = (await renameCounterparty(ctx, id, { name: newName, expectedVersion: version }, who)).version;
      if (jurisdiction !== undefined) version = (await setJurisdiction(ctx, id, { jurisdiction, expectedVersion: version }, who)).version;
      for (const n of body.addNames ?? []) version = (await addName(ctx, id, { ...n, expectedVersion: version }, who)).version;
      for (const x of body.addIdentifiers ?? []) version = (await addIdentifier(ctx, id, { ...x, expectedVersion: version }, who)).version;
      for (const nameId of body.removeNameIds ?? []) version = (await removeName(ctx, id, nameId, { ...who, expectedVersion: version })).version;
      for (const identifierId of body.removeIdentifierIds ?? [])
        version = (await removeIdentifier(ctx, id, identifierId, { ...who, expectedVersion: version })).version;
      const after = await getCounterparty(ctx, id);
      reply.header('etag', etagOf(after.counterparty.id, after.counterparty.version));
      return withEtag(after.counterparty);
    },
  );
}

interface PatchBody {
  canonicalName?: string;
  /** The earlier spelling of canonicalName. */
  name?: string;
  jurisdiction?: string | null;
  addNames?: { name: string; kind: (typeof NAME_KINDS)[number] }[];
  removeNameIds?: number[];
  addIdentifiers?: { scheme: string; value: string; label?: string }[];
  removeIdentifierIds?: number[];
  reason?: string;
}

interface CreateBody {
  canonicalName?: string;
  /** Deprecated spelling of canonicalName. */
  name?: string;
  kind?: 'organisation' | 'person' | 'unknown';
  jurisdiction?: string;
  otherNames?: { name: string; kind: (typeof NAME_KINDS)[number] }[];
  identifiers?: { scheme: string; value: string; label?: string }[];
  reason?: string;
}

/** Both spellings of the one name at once: refused, the same way on POST and PATCH. */
function bothNames(): ApiError {
  return new ApiError('VALIDATION_FAILED', 'send canonicalName only (name is its earlier spelling)', {
    errors: [{ pointer: '/name', message: 'give either canonicalName or name, not both' }],
  });
}

/** The name a new counterparty gets: canonicalName, or its deprecated spelling name; exactly one of them. */
function oneCanonicalName(canonicalName: string | undefined, name: string | undefined): string {
  if (canonicalName !== undefined && name !== undefined) throw bothNames();
  const given = canonicalName ?? name;
  if (given === undefined) {
    throw new ApiError('VALIDATION_FAILED', 'canonicalName is required', {
      errors: [{ pointer: '/canonicalName', message: 'canonicalName is required (or its deprecated spelling name)' }],
    });
  }
  checkName(canonicalName !== undefined ? 'canonicalName' : 'name', given);
  return given;
}
