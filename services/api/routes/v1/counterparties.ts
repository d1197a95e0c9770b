/**
 * /v1/counterparties: search, read (ETag; 308 for a merged id), create, PATCH with If-Match, merge, split,
 * relations, history, mentions and the relationship network. Every change goes through services/register.
 */
import type { FastifyReply, FastifyRequest } from 'fastify';
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
import { mergeCounterparties } from '../../../register/merge-counterparties.ts';
import { splitCounterparty } from '../../../register/split-counterparty.ts';
import { addRelation, removeRelation } from '../../../register/relations.ts';
import { survivorOf } from '../../../register/records.ts';
import { checkName, normaliseIdentifierOrThrow } from '../../../register/records.ts';
import { analyse } from '../../../register/matching/analysis.ts';
import { currentModel } from '../../../register/matching/model.ts';
import { jsonScore, scoredCandidates } from '../../../register/matching/candidates.ts';
import { eventsOfCounterparty } from '../../../../db/queries/history.ts';
import { mentionsOfCounterparty } from '../../../../db/queries/mentions.ts';
import { activeIdsAfter, getSummaries } from '../../../../db/queries/counterparties.ts';
import { relationEnds } from '../../../../db/queries/relations.ts';
import { NAME_KINDS, RELATION_TYPES } from '../../../../resolvers/vocabulary.ts';
import { ApiError, problemResponses } from '../../errors.ts';
import type { RoutePlugin } from '../../types.ts';
import {
  CHANGE_RESULT,
  COUNTERPARTY_OUT,
  COUNTRY,
  EVENT_OUT,
  ID,
  ID_PARAM,
  IDENTIFIER,
  MENTION_OUT,
  NAME,
  PAGE_QUERY,
  REASON,
  REDIRECT_308,
  RELATION_OUT,
  actorOf,
  decodeCursor,
  encodeCursor,
  etagOf,
  idParams,
  page,
  pagedOf,
  redirectToSurvivor,
  requireIfMatch,
  v1Scope,
  versionFromEtag,
  withEtag,
} from './common.ts';
import { highlightRanges, words } from './highlight.ts';
import { legalFormFamily, withLegalForm } from './legal-form.ts';
import { counterpartyGroups, namesLike, otherPartiesOf } from '../../../../db/queries/counterparty-reads.ts';

export const MAX_SEARCH_RESULTS = 50;
const TAGS = ['counterparties'];

interface IdParams {
  id: number;
}

/** Follows a merged id: answers 308 (and returns undefined) or the active id. */
async function activeOr308(request: FastifyRequest, reply: FastifyReply, db: Parameters<typeof survivorOf>[0], id: number): Promise<number | undefined> {
  const survivor = await survivorOf(db, id);
  if (!survivor) throw new ApiError('NOT_FOUND', `counterparty ${id} does not exist`);
  if (survivor.merged) {
    redirectToSurvivor(reply, request, id, survivor.id);
    return undefined;
  }
  return survivor.id;
}

const SEARCH_HIT = {
  type: 'object',
  properties: {
    id: { type: 'integer' },
    canonicalName: { type: 'string' },
    jurisdiction: { type: 'string', nullable: true },
    legalForm: { type: 'string', nullable: true },
    matchedName: { type: 'string' },
    highlight: {
      type: 'array',
      items: { type: 'array', items: { type: 'integer' }, minItems: 2, maxItems: 2 },
      description: '[start, end) UTF-16 offsets in matchedName',
    },
    score: { type: 'number', nullable: true, description: 'match score of the best name, in bits of evidence (null: found by partial text only)' },
    version: { type: 'integer' },
  },
} as const;

export const counterpartyRoutes: RoutePlugin = (app, deps) => {
  const ctx = v1Scope(app, deps);
  const db = deps.db;

  app.get<{ Querystring: { q?: string; cursor?: string; limit: number } }>(
    '/v1/counterparties',
    {
      config: { scope: 'read' },
      schema: {
        summary: 'Search counterparties (fuzzy, ranked, with highlight ranges); without q: list in id order',
        tags: TAGS,
        querystring: {
          type: 'object',
          additionalProperties: false,
          properties: { q: { type: 'string', maxLength: 1000 }, ...PAGE_QUERY },
        },
        response: {
          200: pagedOf(SEARCH_HIT, {
            items: [
              {
                id: 42,
                canonicalName: 'Brackenridge Fabrication, Inc.',
                jurisdiction: 'US-DE',
                legalForm: 'inc',
                matchedName: 'Brackenridge Fabrication, Inc.',
                highlight: [[0, 12]],
                score: 14.2,
                version: 3,
              },
            ],
            nextCursor: null,
          }),
        },
      },
    },
    async (request) => {
      const { q, limit } = request.query;
      const offset = decodeCursor(request.query.cursor);
      if (!q || q.trim().length === 0) {
        const ids = await activeIdsAfter(db, offset, limit + 1);
        const summaries = await getSummaries(db, ids);
        const items = ids
          .map((id) => summaries.get(id)!)
          .map((s) => ({
            id: s.id,
            canonicalName: s.canonicalName,
            jurisdiction: s.jurisdiction,
            legalForm: legalFormFamily(s.canonicalName),
            matchedName: s.canonicalName,
            highlight: [],
            score: null,
            version: s.version,
          }));
        return page(items, limit);
      }
      const wanted = Math.min(MAX_SEARCH_RESULTS, offset + limit);
      const hits = await search(q.trim(), wanted + 1);
      const shown = hits.slice(offset, offset + limit);
      return { items: shown, nextCursor: hits.length > offset + limit && offset + limit < MAX_SEARCH_RESULTS ? encodeCursor(offset + limit) : null };
    },
  );

  async function search(q: string, wanted: number) {
    const analysis = analyse(q);
    const { model } = await currentModel(db);
    const scored = await scoredCandidates(db, { analysis, identifiers: [] }, model);
    const seen = new Set(scored.map((s) => s.counterpartyId));
    const folded = words(q)
      .map((w) => w.folded)
      .join(' ');
    const partial = (await namesLike(db, folded, wanted)).filter((p) => !seen.has(p.counterpartyId) && (seen.add(p.counterpartyId), true));
    const summaries = await getSummaries(db, [...scored.map((s) => s.counterpartyId), ...partial.map((p) => p.counterpartyId)]);
    const out = [
      ...scored.map((s) => ({ id: s.counterpartyId, matchedName: s.matchedName, score: jsonScore(s.score) })),
      ...partial.map((p) => ({ id: p.counterpartyId, matchedName: p.name, score: null })),
    ]
      .filter((hit) => summaries.get(hit.id)?.status === 'active')
      .slice(0, wanted)
      .map((hit) => {
        const s = summaries.get(hit.id)!;
        return {
          ...hit,
          canonicalName: s.canonicalName,
          jurisdiction: s.jurisdiction,
          legalForm: legalFormFamily(s.canonicalName),
          highlight: highlightRanges(hit.matchedName, q),
          version: s.version,
        };
      });
    return out;
  }

  app.get<{ Params: IdParams }>(
    '/v1/counterparties/:id',
    {
      config: { scope: 'read' },
      schema: {
        summary: 'A counterparty: names, identifiers, jurisdiction, relations, mention count, contracts with roles (ETag)',
        tags: TAGS,
        params: ID_PARAM,
        response: { 200: COUNTERPARTY_OUT, ...REDIRECT_308, ...problemResponses(404) },
      },
    },
    async (request, reply) => {
      const view = await getCounterparty(ctx, request.params.id);
      if (view.merged) return redirectToSurvivor(reply, request, request.params.id, view.counterparty.id);
      reply.header('etag', etagOf(view.counterparty.id, view.counterparty.version));
      return withEtag(view.counterparty);
    },
  );

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

  app.post<{ Body: { items: { id: number; etag: string }[]; survivorId?: number; reason: string } }>(
    '/v1/counterparties/merge',
    {
      config: { scope: 'admin' },
      schema: {
        summary: 'Merge two or more counterparties into one survivor (412 if any changed since read)',
        tags: TAGS,
        body: {
          type: 'object',
          required: ['items', 'reason'],
          additionalProperties: false,
          properties: {
            items: {
              type: 'array',
              minItems: 2,
              maxItems: 100,
              items: {
                type: 'object',
                required: ['id', 'etag'],
                additionalProperties: false,
                properties: { id: ID, etag: { type: 'string', maxLength: 100 } },
              },
            },
            survivorId: ID,
            reason: { ...REASON, minLength: 1 },
          },
          example: {
            items: [
              { id: 42, etag: '"cp42.v3"' },
              { id: 57, etag: '"cp57.v1"' },
            ],
            survivorId: 42,
            reason: 'same EIN on both',
          },
        },
        response: {
          200: {
            type: 'object',
            properties: {
              eventId: { type: 'integer' },
              survivorId: { type: 'integer' },
              mergedIds: { type: 'array', items: { type: 'integer' } },
              version: { type: 'integer' },
              etag: { type: 'string' },
            },
          },
          ...problemResponses(404, 409, 412),
        },
      },
    },
    async (request, reply) => {
      const expectedVersions: Record<number, number> = {};
      request.body.items.forEach((item, i) => {
        const version = versionFromEtag(item.etag, item.id);
        if (version === undefined) {
          throw new ApiError('PRECONDITION_FAILED', `items/${i}/etag ${item.etag} is not an ETag of counterparty ${item.id}; read it again`);
        }
        expectedVersions[item.id] = version;
      });
      const result = await mergeCounterparties(
        ctx,
        { ids: request.body.items.map((i) => i.id), survivorId: request.body.survivorId, expectedVersions },
        actorOf(request, request.body.reason),
      );
      const etag = etagOf(result.survivorId, result.version);
      reply.header('etag', etag);
      return { ...result, etag };
    },
  );

  app.post<{ Params: IdParams; Body: { mentionIds: number[]; targetId?: number; reason: string } }>(
    '/v1/counterparties/:id/split',
    {
      config: { scope: 'admin' },
      schema: {
        summary: 'Move chosen mentions out of a counterparty into a new one or into targetId (If-Match optional)',
        tags: TAGS,
        params: ID_PARAM,
        body: {
          type: 'object',
          required: ['mentionIds', 'reason'],
          additionalProperties: false,
          properties: {
            mentionIds: { type: 'array', minItems: 1, maxItems: 10_000, items: ID },
            targetId: ID,
            reason: { ...REASON, minLength: 1 },
          },
          example: { mentionIds: [311, 312], reason: 'these name the UK subsidiary' },
        },
        response: {
          200: {
            type: 'object',
            properties: {
              eventId: { type: 'integer' },
              sourceId: { type: 'integer' },
              targetId: { type: 'integer' },
              created: { type: 'boolean' },
              movedMentionIds: { type: 'array', items: { type: 'integer' } },
            },
          },
          ...problemResponses(404, 409, 412),
        },
      },
    },
    async (request) => {
      const id = request.params.id;
      const expectedVersion = typeof request.headers['if-match'] === 'string' ? requireIfMatch(request, id) : undefined;
      return splitCounterparty(
        ctx,
        id,
        { mentionIds: request.body.mentionIds, targetId: request.body.targetId, expectedVersion },
        actorOf(request, request.body.reason),
      );
    },
  );

  app.post<{ Params: IdParams; Body: { toId: number; type: (typeof RELATION_TYPES)[number]; since?: string; reason?: string } }>(
    '/v1/counterparties/:id/relations',
    {
      config: { scope: 'admin' },
      schema: {
        summary: 'Add a relation from this counterparty (parent_of, successor_of with since, affiliate_of); never a merge',
        tags: TAGS,
        params: ID_PARAM,
        body: {
          type: 'object',
          required: ['toId', 'type'],
          additionalProperties: false,
          properties: {
            toId: ID,
            type: { type: 'string', enum: [...RELATION_TYPES] },
            since: { type: 'string', maxLength: 10, description: 'YYYY-MM-DD (successor_of)' },
            reason: REASON,
          },
          example: { toId: 57, type: 'parent_of', reason: 'group structure from the annual report' },
        },
        response: {
          201: { type: 'object', properties: { eventId: { type: 'integer', nullable: true }, relationId: { type: 'integer' } } },
          ...problemResponses(404, 409),
        },
      },
    },
    async (request, reply) => {
      const { toId, type, since, reason } = request.body;
      const result = await addRelation(ctx, { fromId: request.params.id, toId, type, ...(since ? { since } : {}) }, actorOf(request, reason));
      reply.code(201);
      return result;
    },
  );

  app.delete<{ Params: { id: number; relationId: number }; Querystring: { reason?: string } }>(
    '/v1/counterparties/:id/relations/:relationId',
    {
      config: { scope: 'admin' },
      schema: {
        summary: 'Remove a relation of this counterparty',
        tags: TAGS,
        params: idParams('id', 'relationId'),
        querystring: { type: 'object', additionalProperties: false, properties: { reason: REASON } },
        response: { 200: { type: 'object', properties: { eventId: { type: 'integer' } } }, ...problemResponses(404, 409) },
      },
    },
    async (request) => {
      const relation = await relationEnds(db, request.params.relationId);
      const survivor = await survivorOf(db, request.params.id);
      const ends = relation ? [relation.from, relation.to] : [];
      if (!relation || !survivor || !ends.includes(survivor.id)) {
        throw new ApiError('NOT_FOUND', `counterparty ${request.params.id} has no relation ${request.params.relationId}`);
      }
      return removeRelation(ctx, request.params.relationId, actorOf(request, request.query.reason));
    },
  );

  app.get<{ Params: IdParams; Querystring: { cursor?: string; limit: number } }>(
    '/v1/counterparties/:id/history',
    {
      config: { scope: 'read' },
      schema: {
        summary: "A counterparty's history, newest first",
        tags: TAGS,
        params: ID_PARAM,
        querystring: { type: 'object', additionalProperties: false, properties: PAGE_QUERY },
        response: { 200: pagedOf(EVENT_OUT), ...REDIRECT_308, ...problemResponses(404) },
      },
    },
    async (request, reply) => {
      const id = await activeOr308(request, reply, db, request.params.id);
      if (id === undefined) return reply;
      const before = decodeCursor(request.query.cursor);
      const events = await eventsOfCounterparty(db, id, { beforeId: before === 0 ? undefined : before, limit: request.query.limit + 1 });
      return page(events, request.query.limit);
    },
  );

  app.get<{ Params: IdParams; Querystring: { cursor?: string; limit: number } }>(
    '/v1/counterparties/:id/mentions',
    {
      config: { scope: 'read' },
      schema: {
        summary: 'The mentions linked to a counterparty, in id order',
        tags: TAGS,
        params: ID_PARAM,
        querystring: { type: 'object', additionalProperties: false, properties: PAGE_QUERY },
        response: { 200: pagedOf(MENTION_OUT), ...REDIRECT_308, ...problemResponses(404) },
      },
    },
    async (request, reply) => {
      const id = await activeOr308(request, reply, db, request.params.id);
      if (id === undefined) return reply;
      const mentions = await mentionsOfCounterparty(db, id, { afterId: decodeCursor(request.query.cursor), limit: request.query.limit + 1 });
      return page(mentions.map(withLegalForm), request.query.limit);
    },
  );

  app.get<{ Params: IdParams }>(
    '/v1/counterparties/:id/network',
    {
      config: { scope: 'read' },
      schema: {
        summary: 'The relationship network: contracts with roles, the other parties of those contracts, and relations',
        tags: TAGS,
        params: ID_PARAM,
        response: {
          200: {
            type: 'object',
            properties: {
              counterparty: { type: 'object', properties: { id: { type: 'integer' }, canonicalName: { type: 'string' } } },
              contracts: COUNTERPARTY_OUT.properties.contracts,
              parties: {
                type: 'array',
                items: {
                  type: 'object',
                  properties: {
                    contractId: { type: 'integer' },
                    role: { type: 'string', nullable: true },
                    counterpartyId: { type: 'integer', nullable: true },
                    ownEntityId: { type: 'integer', nullable: true },
                    name: { type: 'string' },
                  },
                },
              },
              relations: {
                type: 'array',
                items: {
                  ...RELATION_OUT,
                  properties: {
                    ...RELATION_OUT.properties,
                    relatedCounterpartyId: { type: 'integer', description: 'the counterparty at the other end of the relation' },
                    relatedCanonicalName: { type: 'string', description: 'its canonical name' },
                  },
                },
              },
            },
          },
          ...REDIRECT_308,
          ...problemResponses(404),
        },
      },
    },
    async (request, reply) => {
      const id = await activeOr308(request, reply, db, request.params.id);
      if (id === undefined) return reply;
      const view = await getCounterparty(ctx, id);
      const parties = await otherPartiesOf(db, id);
      const relatedId = (r: { fromCounterpartyId: number; toCounterpartyId: number }) =>
        r.fromCounterpartyId === id ? r.toCounterpartyId : r.fromCounterpartyId;
      const related = await getSummaries(db, [...new Set(view.counterparty.relations.map(relatedId))]);
      const relations = view.counterparty.relations.map((r) => ({
        ...r,
        relatedCounterpartyId: relatedId(r),
        relatedCanonicalName: related.get(relatedId(r))?.canonicalName ?? `counterparty #${relatedId(r)}`,
      }));
      return { counterparty: { id, canonicalName: view.counterparty.canonicalName }, contracts: view.counterparty.contracts, parties, relations };
    },
  );

  app.get<{ Querystring: { cursor?: string; limit: number; mentionsPerGroup: number } }>(
    '/v1/counterparty-groups',
    {
      config: { scope: 'read' },
      schema: {
        summary: 'Every active counterparty with its mentions grouped under it, in id order',
        tags: TAGS,
        querystring: {
          type: 'object',
          additionalProperties: false,
          properties: {
            ...PAGE_QUERY,
            limit: { type: 'integer', minimum: 1, maximum: 200, default: 50 },
            mentionsPerGroup: { type: 'integer', minimum: 0, maximum: 1000, default: 100 },
          },
        },
        response: {
          200: pagedOf({
            type: 'object',
            properties: {
              id: { type: 'integer' },
              canonicalName: { type: 'string' },
              jurisdiction: { type: 'string', nullable: true },
              version: { type: 'integer' },
              mentionCount: { type: 'integer' },
              mentions: { type: 'array', items: MENTION_OUT },
            },
          }),
        },
      },
    },
    async (request) => {
      const groups = await counterpartyGroups(db, decodeCursor(request.query.cursor), request.query.limit + 1, request.query.mentionsPerGroup);
      return page(groups, request.query.limit);
    },
  );
};

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
