/**
 * The match model in force: read from matcher_settings on every resolution (never cached in-process, so that
 * every instance uses the same thresholds the moment they change); the built-in model until one is stored.
 */
import { parseMatchModel, type MatchModel } from '../../../resolvers/score/index.ts';
import { DEFAULT_MATCH_MODEL } from '../../../resolvers/score/defaultModel.ts';
import { readSettings } from '../../../db/queries/settings.ts';
import type { Queryable } from '../../../db/queries/util.ts';

export async function currentModel(db: Queryable): Promise<{ model: MatchModel; version: number }> {
  const stored = await readSettings(db);
  if (!stored) return { model: DEFAULT_MATCH_MODEL, version: 0 };
  const weights = stored.weights as Partial<MatchModel>;
  const base = weights && typeof weights === 'object' && 'features' in weights ? parseMatchModel({ ...weights, linkAt: stored.linkAt, newAt: stored.newAt }) : DEFAULT_MATCH_MODEL;
  return { model: { ...base, linkAt: stored.linkAt, newAt: stored.newAt }, version: stored.version };
}
