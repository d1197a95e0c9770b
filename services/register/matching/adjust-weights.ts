/**
 * Reviewers' decisions adjust the weights in force, within bounds (resolvers/score/adjust-from-decisions.ts says
 * how and why bounded). Reads every decided mention or duplicate pair kept in labelled_pair, rebuilds each one's
 * comparison vector from the levels its explanation recorded, and stores the adjusted model as a new settings
 * version (thresholds unchanged). Mentions already resolved keep their outcome until `cpreg reresolve`.
 */
import { adjustFromDecisions, type DecidedVector, type LevelShift, type MatchModel } from '../../../resolvers/score/index.ts';
import { labelledPairs } from '../../../db/queries/review.ts';
import { writeSettings } from '../../../db/queries/settings.ts';
import type { ActorInput, RegisterContext } from '../context.ts';
import { currentModel } from './model.ts';

export interface AdjustWeightsResult {
  /** Decisions read, and how many could be used (their explanation named the levels of today's features). */
  decisions: number;
  used: number;
  shifts: LevelShift[];
  /** The settings version written, or null for a dry run or when nothing moved. */
  version: number | null;
  model: MatchModel;
}

/** The comparison vector a decision's stored explanation describes, or null when it names no level we know. */
export function vectorOfEvidence(model: MatchModel, evidence: Record<string, unknown>): (number | null)[] | null {
  const features = evidence.features;
  if (!Array.isArray(features)) return null;
  const byName = new Map<string, unknown>();
  for (const f of features as { feature?: unknown; level?: unknown }[]) if (typeof f?.feature === 'string') byName.set(f.feature, f.level);
  let known = 0;
  const vector = Object.entries(model.features).map(([name, feature]) => {
    const level = byName.get(name);
    if (typeof level !== 'string') return null;
    const k = feature.levels.indexOf(level);
    if (k < 0) return null;
    known++;
    return k;
  });
  return known > 0 ? vector : null;
}

export async function adjustWeights(ctx: RegisterContext, who: ActorInput, options: { dryRun?: boolean; limit?: number } = {}): Promise<AdjustWeightsResult> {
  const [{ model }, pairs] = await Promise.all([currentModel(ctx.db), labelledPairs(ctx.db, options.limit ?? 100_000)]);
  const decided: DecidedVector[] = [];
  for (const pair of pairs) {
    if (pair.label !== 'same' && pair.label !== 'different') continue;
    const vector = vectorOfEvidence(model, pair.features);
    if (vector) decided.push({ vector, isMatch: pair.label === 'same' });
  }
  const adjusted = adjustFromDecisions(model, decided);
  // Compared shift by shift: the stored model comes back from JSON (jsonb orders keys its own way).
  const unchanged = Object.entries(adjusted.model.features).every(([name, f]) => sameShift(f.shift, model.features[name]?.shift));
  const version =
    options.dryRun || unchanged
      ? null
      : await writeSettings(ctx.db, {
          linkAt: model.linkAt,
          newAt: model.newAt,
          weights: adjusted.model as unknown as Record<string, unknown>,
          updatedBy: who.actor,
        });
  return { decisions: pairs.length, used: decided.length, shifts: adjusted.shifts, version, model: adjusted.model };
}

function sameShift(a: readonly number[] | undefined, b: readonly number[] | undefined): boolean {
  const x = a ?? [];
  const y = b ?? [];
  return x.length === y.length && x.every((v, k) => v === y[k]);
}
