/** GET /v1/stats/scores: how recent resolution scores fall around the two thresholds. */
import { recentMentionScores } from '../../../../db/queries/mentions.ts';
import { currentModel } from '../../../register/matching/model.ts';
import type { FastifyInstance } from 'fastify';
import type { AppDeps } from '../../types.ts';

export function scoreStatsRoute(app: FastifyInstance, deps: AppDeps): void {
  const db = deps.db;

  app.get<{ Querystring: { limit: number; buckets: number } }>(
    '/v1/stats/scores',
    {
      config: { scope: 'read' },
      schema: {
        summary: 'Distribution of recent resolution scores, with the two thresholds (linkAt, newAt)',
        tags: ['stats'],
        querystring: {
          type: 'object',
          additionalProperties: false,
          properties: {
            limit: { type: 'integer', minimum: 1, maximum: 100_000, default: 5000, description: 'how many recent scored mentions' },
            buckets: { type: 'integer', minimum: 2, maximum: 200, default: 40 },
          },
        },
        response: {
          200: {
            type: 'object',
            properties: {
              linkAt: { type: 'number' },
              newAt: { type: 'number' },
              count: { type: 'integer' },
              min: { type: 'number', nullable: true },
              max: { type: 'number', nullable: true },
              buckets: {
                type: 'array',
                items: {
                  type: 'object',
                  properties: {
                    from: { type: 'number' },
                    to: { type: 'number' },
                    count: { type: 'integer' },
                    byStatus: { type: 'object', additionalProperties: { type: 'integer' } },
                  },
                },
              },
            },
          },
        },
      },
    },
    async (request) => {
      const { model } = await currentModel(db);
      const rows = await recentMentionScores(db, request.query.limit);
      const scores = rows.map((r) => r.score);
      const min = scores.length ? Math.min(...scores, model.newAt) : null;
      const max = scores.length ? Math.max(...scores, model.linkAt) : null;
      const n = request.query.buckets;
      const width = min === null || max === null || max === min ? 1 : (max - min) / n;
      const buckets = Array.from({ length: min === null ? 0 : n }, (_, i) => ({
        from: min! + i * width,
        to: min! + (i + 1) * width,
        count: 0,
        byStatus: {} as Record<string, number>,
      }));
      rows.forEach((r, i) => {
        const b = buckets[Math.min(n - 1, Math.floor((scores[i]! - min!) / width))]!;
        b.count++;
        b.byStatus[r.status] = (b.byStatus[r.status] ?? 0) + 1;
      });
      return { linkAt: model.linkAt, newAt: model.newAt, count: rows.length, min, max, buckets };
    },
  );
}
