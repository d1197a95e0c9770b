/**
 * The demo's measured accuracy: what the register did with each mention, compared with the scenario's ground
 * truth. Computed every time from the truth and the register's state (never written by hand):
 * - the mention → counterparty assignment as a clustering, scored with resolvers/evaluate (pairwise
 *   precision/recall/F1 and B-cubed, Bagga & Baldwin 1998). Only automatic links count as placed together:
 *   a mention in review or set aside stands alone in the predicted partition (it costs recall, not precision);
 * - status accuracy for the mentions that must NOT become counterparties (own entities, not parties, terms
 *   the contract never defines, collective terms).
 */
import { bcubed, contingency, pairwiseFromContingency, type PairwiseScores, type PrecisionRecall } from '../../resolvers/evaluate/index.ts';
import type { ResolutionStatus } from '../../resolvers/vocabulary.ts';
import type { MentionStyle, MentionTruth } from './scenario/index.ts';

/** What the register holds for one mention (merged counterparty ids already followed to their survivor). */
export interface ObservedMention {
  status: ResolutionStatus;
  counterpartyId: number | null;
  /** The scenario id of the own entity it resolved to (mapped by the caller), when status is own_entity. */
  ownEntityRef?: string | null;
}

export interface EvaluatedMention {
  truth: MentionTruth;
  style?: MentionStyle;
  /** Undefined when the register has no such mention (it was never stored: counted as a miss). */
  observed?: ObservedMention;
}

export interface StatusAccuracy {
  total: number;
  correct: number;
  accuracy: number;
  /** Predicted statuses of the wrong ones, e.g. { new: 2 }. */
  wrong: Record<string, number>;
}

export interface DemoAccuracy {
  mentions: number;
  /** Mentions of real counterparties, and what happened to them. */
  counterpartyMentions: { total: number; linkedOrNew: number; review: number; other: number };
  pairwise: PairwiseScores;
  bcubed: PrecisionRecall;
  /**
   * Share of counterparty mentions linked to THE counterparty of their entity: the one holding most of the
   * entity's mentions, when most of that counterparty's mentions are this entity.
   */
  assignedCorrectly: number;
  status: {
    own_entity: StatusAccuracy;
    not_a_party: StatusAccuracy;
    unbound_term: StatusAccuracy;
    collective_term: StatusAccuracy;
  };
  /** Per mention style: counterparty mentions assigned correctly, or status right for the other kinds. */
  byStyle: Record<string, { total: number; correct: number }>;
}

const AUTOMATIC: ReadonlySet<ResolutionStatus> = new Set<ResolutionStatus>(['linked', 'new']);
type StatusKind = keyof DemoAccuracy['status'];

export function measureAccuracy(items: readonly EvaluatedMention[]): DemoAccuracy {
  const gold: string[] = [];
  const predicted: string[] = [];
  const counterpartyMentions = { total: 0, linkedOrNew: 0, review: 0, other: 0 };
  items.forEach((item, i) => {
    const auto = item.observed && AUTOMATIC.has(item.observed.status) && item.observed.counterpartyId !== null;
    const isCounterparty = item.truth.kind === 'counterparty';
    if (isCounterparty) {
      counterpartyMentions.total++;
      if (auto) counterpartyMentions.linkedOrNew++;
      else if (item.observed?.status === 'review') counterpartyMentions.review++;
      else counterpartyMentions.other++;
    }
    // The universe: every mention that truly names a counterparty or was linked to one.
    if (!isCounterparty && !auto) return;
    gold.push(item.truth.kind === 'counterparty' ? `t:${item.truth.counterpartyId}` : `t-alone:${i}`);
    predicted.push(auto ? `p:${item.observed!.counterpartyId}` : `p-alone:${i}`);
  });
  const table = contingency(gold, predicted);
  const truthOf = majorityOf(predicted, gold);
  const clusterOf = majorityOf(gold, predicted);

  const status = { own_entity: emptyStatus(), not_a_party: emptyStatus(), unbound_term: emptyStatus(), collective_term: emptyStatus() };
  const byStyle: DemoAccuracy['byStyle'] = {};
  let assigned = 0;
  for (const item of items) {
    let correct: boolean;
    if (item.truth.kind === 'counterparty') {
      const o = item.observed;
      const p = `p:${o?.counterpartyId}`;
      const t = `t:${item.truth.counterpartyId}`;
      // Right when its counterparty is mostly this entity AND this entity's mentions mostly sit in that counterparty.
      correct = o !== undefined && AUTOMATIC.has(o.status) && o.counterpartyId !== null && truthOf.get(p) === t && clusterOf.get(t) === p;
      if (correct) assigned++;
    } else {
      const kind: StatusKind = item.truth.kind;
      correct = statusRight(item.truth, item.observed);
      const s = status[kind];
      s.total++;
      if (correct) s.correct++;
      else {
        const got = item.observed?.status ?? 'missing';
        const label = got === 'own_entity' && kind === 'own_entity' ? 'own_entity (another)' : got;
        s.wrong[label] = (s.wrong[label] ?? 0) + 1;
      }
    }
    if (item.style) {
      const entry = (byStyle[item.style] ??= { total: 0, correct: 0 });
      entry.total++;
      if (correct) entry.correct++;
    }
  }
  for (const s of Object.values(status)) s.accuracy = s.total === 0 ? 1 : s.correct / s.total;
  return {
    mentions: items.length,
    counterpartyMentions,
    pairwise: pairwiseFromContingency(table),
    bcubed: bcubed(gold, predicted),
    assignedCorrectly: counterpartyMentions.total === 0 ? 1 : assigned / counterpartyMentions.total,
    status,
    byStyle,
  };
}

function emptyStatus(): StatusAccuracy {
  return { total: 0, correct: 0, accuracy: 0, wrong: {} };
}

function statusRight(truth: MentionTruth, observed: ObservedMention | undefined): boolean {
  if (!observed) return false;
  switch (truth.kind) {
    case 'own_entity':
      // The right status, and when the caller could tell which own entity, the right one.
      return observed.status === 'own_entity' && (observed.ownEntityRef === undefined || observed.ownEntityRef === truth.ownEntityId);
    case 'not_a_party':
      return observed.status === 'not_a_party';
    case 'unbound_term':
      return observed.status === 'unbound_term';
    case 'collective_term':
      return observed.status === 'collective_term';
    default:
      return false;
  }
}

/** For each label of `keys`, the label of `values` most of its items carry (ties: the first seen). */
function majorityOf(keys: readonly string[], values: readonly string[]): Map<string, string> {
  const counts = new Map<string, Map<string, number>>();
  keys.forEach((k, i) => {
    const inner = counts.get(k) ?? new Map<string, number>();
    inner.set(values[i]!, (inner.get(values[i]!) ?? 0) + 1);
    counts.set(k, inner);
  });
  const out = new Map<string, string>();
  for (const [p, inner] of counts) {
    let best = '';
    let bestCount = -1;
    for (const [g, n] of inner) {
      if (n > bestCount) {
        best = g;
        bestCount = n;
      }
    }
    out.set(p, best);
  }
  return out;
}
