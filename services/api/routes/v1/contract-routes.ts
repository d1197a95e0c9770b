/** /v1/contracts: store one (with its parties, or given parties), list and search them, read one by id or by source id. */
import { storeContract, type ContractInput } from '../../../register/contracts.ts';
import { applyGivenParties, type GivenParty } from '../../../register/contract-given-parties.ts';
import { normaliseIdentifierOrThrow } from '../../../register/normalise-identifier-or-throw.ts';
import { contractByRef, getContract, searchContracts } from '../../../../db/queries/contracts.ts';
import { ApiError, problemResponses } from '../../errors.ts';
import { ID_PARAM, IDENTIFIER, NAME, PAGE_QUERY, SOURCE_ID, pagedOf } from './schemas.ts';
import { actorOf } from './actor-of.ts';
import { decodeCursor, page } from './cursors.ts';
import { RESOLVE_OUT, RESOLVE_REQUIRED } from './mentions.ts';
import type { FastifyInstance } from 'fastify';
import type { RegisterContext } from '../../../register/context.ts';
import type { AppDeps } from '../../types.ts';
import { MAX_ID_LENGTH, MAX_TITLE_LENGTH } from '../../../../resolvers/vocabulary.ts';

export const CONTRACT_BODY_LIMIT = 1024 * 1024;
const MAX_CONTRACT_TEXT = 1024 * 1024;

const CONTRACT_OUT = {
  type: 'object',
  properties: {
    id: { type: 'integer' },
    source: { type: 'string' },
    externalId: { type: 'string' },
    title: { type: 'string', nullable: true },
    status: { type: 'string' },
    contentHash: { type: 'string' },
    parties: {
      type: 'array',
      items: {
        type: 'object',
        properties: {
          position: { type: 'integer' },
          mentionId: { type: 'integer' },
          text: { type: 'string' },
          role: { type: 'string', nullable: true },
          terms: { type: 'array', items: { type: 'string' } },
          status: { type: 'string' },
          counterpartyId: { type: 'integer', nullable: true },
          ownEntityId: { type: 'integer', nullable: true },
          canonicalName: { type: 'string', nullable: true },
        },
      },
    },
    definedTerms: {
      type: 'array',
      items: { type: 'object', properties: { term: { type: 'string' }, partyIndex: { type: 'integer', nullable: true }, collective: { type: 'boolean' } } },
    },
    createdAt: { type: 'string' },
    updatedAt: { type: 'string' },
  },
} as const;

export function contractRoutes(app: FastifyInstance, deps: AppDeps, ctx: RegisterContext): void {
  const db = deps.db;

  app.post<{ Body: ContractInput & { parties?: GivenParty[] } }>(
    '/v1/contracts',
    {
      config: { scope: 'write' },
      bodyLimit: CONTRACT_BODY_LIMIT,
      schema: {
        summary: 'Store a contract, find its parties and defined terms, and resolve each party into the register',
        description:
          'Body up to 1 MB. The same (source, externalId) with the same text answers the stored contract (alreadyStored). Mentions that named this contract before it arrived are resolved again (reresolved). ' +
          "`parties` (optional): the parties the contract system already knows. They are reconciled with the parties read from the text (`reconciliation`: which given party is which, given parties the text does not name, parties of the text not given, roles and defined terms that differ); the identifiers given for a party the text names are added to its mention, which is resolved again (`identifiersAdded`). The text stays the source of the contract's parties: a given party it does not name is reported, not added.",
        tags: ['contracts'],
        body: {
          type: 'object',
          required: ['source', 'externalId', 'text'],
          additionalProperties: false,
          properties: {
            source: SOURCE_ID,
            externalId: SOURCE_ID,
            title: { type: 'string', maxLength: MAX_TITLE_LENGTH },
            text: { type: 'string', minLength: 1, maxLength: MAX_CONTRACT_TEXT },
            parties: {
              type: 'array',
              maxItems: 50,
              items: {
                type: 'object',
                required: ['name'],
                additionalProperties: false,
                properties: {
                  name: NAME,
                  role: { type: 'string', minLength: 1, maxLength: MAX_ID_LENGTH },
                  definedTerm: { type: 'string', minLength: 1, maxLength: MAX_ID_LENGTH },
                  identifiers: { type: 'array', maxItems: 50, items: IDENTIFIER },
                },
              },
            },
          },
          example: {
            source: 'clm',
            externalId: 'C-2031',
            title: 'Supply Agreement',
            text: 'This Supply Agreement is made between Brackenridge Fabrication, Inc. ("Supplier") and Orvane Trading B.V. ("Buyer")…',
          },
        },
        response: {
          200: {
            type: 'object',
            required: ['contractId', 'alreadyStored', 'parties', 'reresolved'],
            properties: {
              contractId: { type: 'integer' },
              alreadyStored: { type: 'boolean' },
              parties: {
                type: 'array',
                items: {
                  type: 'object',
                  required: [...RESOLVE_REQUIRED, 'position', 'role', 'terms'],
                  properties: {
                    ...RESOLVE_OUT.properties,
                    position: { type: 'integer' },
                    role: { type: 'string', nullable: true },
                    terms: { type: 'array', items: { type: 'string' } },
                  },
                },
              },
              reresolved: { type: 'array', items: RESOLVE_OUT },
              contract: CONTRACT_OUT,
              reconciliation: {
                type: 'object',
                description: 'only when parties were given',
                properties: {
                  matched: { type: 'array', items: { type: 'object', properties: { given: { type: 'integer' }, position: { type: 'integer' } } } },
                  givenNotInText: { type: 'array', items: { type: 'integer' } },
                  parsedNotGiven: { type: 'array', items: { type: 'integer' } },
                  disagreements: {
                    type: 'array',
                    items: {
                      type: 'object',
                      properties: {
                        given: { type: 'integer' },
                        position: { type: 'integer' },
                        field: { type: 'string', enum: ['role', 'definedTerm'] },
                        givenValue: { type: 'string' },
                        parsedValue: { type: 'string', nullable: true },
                      },
                    },
                  },
                },
              },
              identifiersAdded: { type: 'array', items: { type: 'object', properties: { ...RESOLVE_OUT.properties, position: { type: 'integer' } } } },
            },
          },
        },
      },
    },
    async (request) => {
      const { parties: given, ...input } = request.body;
      // Every given identifier is checked before anything is stored.
      (given ?? []).forEach((g, i) => (g.identifiers ?? []).forEach((x, j) => normaliseIdentifierOrThrow(`parties/${i}/identifiers/${j}`, x)));
      const stored = await storeContract(ctx, input, actorOf(request));
      if (!given) return stored;
      return { ...stored, ...(await applyGivenParties(ctx, stored, given, actorOf(request))) };
    },
  );

  app.get<{ Querystring: { q?: string; source?: string; externalId?: string; cursor?: string; limit: number } }>(
    '/v1/contracts',
    {
      config: { scope: 'read' },
      schema: {
        summary: 'Contracts by title or external id (q), or the one with source and externalId; in id order',
        tags: ['contracts'],
        querystring: {
          type: 'object',
          additionalProperties: false,
          properties: { q: { type: 'string', maxLength: MAX_TITLE_LENGTH }, source: SOURCE_ID, externalId: SOURCE_ID, ...PAGE_QUERY },
        },
        response: {
          200: pagedOf({
            type: 'object',
            properties: {
              id: { type: 'integer' },
              source: { type: 'string' },
              externalId: { type: 'string' },
              title: { type: 'string', nullable: true },
              status: { type: 'string' },
              createdAt: { type: 'string' },
            },
          }),
        },
      },
    },
    async (request) => {
      const { q, source, externalId, limit } = request.query;
      const rows = await searchContracts(db, { afterId: decodeCursor(request.query.cursor), limit: limit + 1, source, externalId, q });
      return page(rows, limit);
    },
  );

  app.get<{ Params: { id: number } }>(
    '/v1/contracts/:id',
    {
      config: { scope: 'read' },
      schema: {
        summary: 'A contract with its parties (roles, terms, resolution) and defined terms',
        tags: ['contracts'],
        params: ID_PARAM,
        response: { 200: CONTRACT_OUT, ...problemResponses(404) },
      },
    },
    async (request) => {
      const contract = await getContract(db, request.params.id);
      if (!contract) throw new ApiError('NOT_FOUND', `contract ${request.params.id} does not exist`);
      return contract;
    },
  );

  app.get<{ Querystring: { source: string; externalId: string } }>(
    '/v1/contracts/by-source',
    {
      config: { scope: 'read' },
      schema: {
        summary: 'The contract with this source and external id',
        tags: ['contracts'],
        querystring: {
          type: 'object',
          required: ['source', 'externalId'],
          additionalProperties: false,
          properties: { source: SOURCE_ID, externalId: SOURCE_ID },
        },
        response: { 200: CONTRACT_OUT, ...problemResponses(404) },
      },
    },
    async (request) => {
      const found = await contractByRef(db, request.query.source, request.query.externalId);
      const contract = found === undefined ? undefined : await getContract(db, found.id);
      if (!contract) throw new ApiError('NOT_FOUND', `no contract ${request.query.source}/${request.query.externalId}`);
      return contract;
    },
  );
}
