/** GET /v1/counterparties (search, or list in id order) and GET /v1/counterparties/:id (ETag; 308 for a merged id). */
import { getCounterparty } from '../../../register/counterparties.ts';
import { activeIdsAfter, getSummaries } from '../../../../db/queries/counterparties.ts';
import { problemResponses } from '../../errors.ts';
import { COUNTERPARTY_OUT, ID_PARAM, PAGE_QUERY, REDIRECT_308, pagedOf } from './schemas.ts';
import { decodeCursor, encodeCursor, page } from './cursors.ts';
import { etagOf, withEtag } from './etags.ts';
import { redirectToSurvivor } from './redirect-to-survivor.ts';
import { legalFormFamily } from './legal-form.ts';
import type { FastifyInstance } from 'fastify';
import type { RegisterContext } from '../../../register/context.ts';
import type { AppDeps } from '../../types.ts';
import { MAX_NAME_LENGTH } from '../../../../resolvers/vocabulary.ts';
import { MAX_SEARCH_RESULTS, SEARCH_HIT, searchCounterparties } from './search-counterparties.ts';

const TAGS = ['counterparties'];

interface IdParams {
  id: number;
}

export function counterpartyLookupRoutes(app: FastifyInstance, deps: AppDeps, ctx: RegisterContext): void {
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
          properties: { q: { type: 'string', maxLength: MAX_NAME_LENGTH }, ...PAGE_QUERY },
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
      const hits = await searchCounterparties(db, q.trim(), wanted + 1);
      const shown = hits.slice(offset, offset + limit);
      return { items: shown, nextCursor: hits.length > offset + limit && offset + limit < MAX_SEARCH_RESULTS ? encodeCursor(offset + limit) : null };
    },
  );

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
}
