/**
 * The match model in force: read from matcher_settings on every resolution (never cached in-process, so that
 * every instance uses the same thresholds the moment they change); the built-in model until one is stored.
 */
import { DEFAULT_MATCH_MODEL, parseMatchModel, type MatchModel } from '../../../resolvers/score/index.ts';
import { readSettings, type StoredSettings } from '../../../db/queries/settings.ts';
import type { Queryable } from '../../../db/queries/util.ts';

export async function currentModel(db: Queryable): Promise<{ model: MatchModel; version: number }> {
  return modelFromSettings(await readSettings(db));
}

/** The model of stored settings (read by readSettings, or with the locks of a resolve); the built-in one without. */
export function modelFromSettings(stored: StoredSettings | undefined): { model: MatchModel; version: number } {
  if (!stored) return { model: DEFAULT_MATCH_MODEL, version: 0 };
  const weights = stored.weights as Partial<MatchModel>;
  const base =
    weights && typeof weights === 'object' && 'features' in weights
      ? parseMatchModel({ ...weights, linkAt: stored.linkAt, newAt: stored.newAt })
      : DEFAULT_MATCH_MODEL;
  return { model: { ...withCurrentFeatures(base), linkAt: stored.linkAt, newAt: stored.newAt }, version: stored.version };
}

/**
 * A model stored by an earlier version whose features have other levels than today's comparison gives (a level
 * added since, a feature added since) takes the built-in model's parameters for those features: a level the stored
 * model lacks would otherwise weigh nothing.
 */
export function withCurrentFeatures(model: MatchModel): MatchModel {
  const features = { ...model.features };
  let changed = false;
  for (const [name, current] of Object.entries(DEFAULT_MATCH_MODEL.features)) {
    const stored = features[name];
    if (stored && stored.levels.length === current.levels.length && stored.levels.every((l, k) => l === current.levels[k])) continue;
    features[name] = current;
    changed = true;
  }
  return changed ? { ...model, features } : model;
}
