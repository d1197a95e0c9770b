/**
 * Candidates for one name from the register, scored: blocking keys and identifier holders (both indexed tables),
 * then resolvers/score on every stored name of each candidate (the best name speaks for the counterparty).
 */
import type { NameAnalysis } from '../../../resolvers/analyse/index.ts';
import type { MatchRecord } from '../../../resolvers/block/index.ts';
import { scorePair, type MatchModel, type PairScore } from '../../../resolvers/score/index.ts';
import type { Identifier } from '../../../resolvers/vocabulary.ts';
import { candidateDetails, type CandidateDetail } from '../../../db/queries/blocking-keys.ts';
import type { Queryable } from '../../../db/queries/util.ts';
import { candidateAnalysis } from './analysis.ts';
import type { BatchReads } from './batch-reads.ts';
import type { MatchStats } from './match-stats.ts';
import { idfFor } from './idf.ts';
import { scoreUpperBound } from './bound.ts';
import type { IdfTable } from '../../../resolvers/compare/index.ts';
import { keysOfAnalysis } from './keys.ts';

/**
 * How many counterparties are fetched per name: those whose country does not conflict first, then by the rarity of
 * the keys they share (a word and its stem counted once) plus the trigram similarity of their closest name
 * (db/queries/candidate-rank.ts). On 1,500 generated probes at 10,000 generated names, every candidate scoring above
 * newAt among all those the keys reach was in the first 7; 9 leaves a margin. The rarity-only ranking missed one
 * in its first 20 in 7 of those probes (a typo in the distinctive word leaves only the common words' keys).
 */
export const MAX_CANDIDATES = 9;

export interface ScoredCandidate {
  counterpartyId: number;
  canonicalName: string;
  matchedName: string;
  score: number;
  pair: PairScore;
}

export interface Probe {
  analysis: NameAnalysis;
  country?: string | null;
  identifiers: Identifier[];
}

export function probeRecord(probe: Probe): MatchRecord {
  return {
    id: 'probe',
    analysis: probe.analysis,
    ...(probe.country ? { country: probe.country } : {}),
    identifiers: probe.identifiers,
  };
}

/**
 * Scores the register's candidates for `probe`, best first: every candidate fetched (the MAX_CANDIDATES ranked
 * first by the rarity of the keys they share and their country). `exclude`: counterparties this name must not join
 * (cannot-links), which are scored anyway but marked by scorePair as cannot_link (score −∞) so that the
 * explanation says why. `reads`: a batch's shared reads (prefetched candidates, token counts, and the candidates a
 * probe already had scored in this batch).
 */
export async function scoredCandidates(
  db: Queryable,
  probe: Probe,
  model: MatchModel,
  exclude: ReadonlySet<number> = new Set(),
  reads?: BatchReads,
): Promise<ScoredCandidate[]> {
  const state = await scoringState(db, probe, model, exclude, reads);
  return state.list(false, false);
}

/**
 * The candidates a decision needs, on current names and, apart, on former names (names of kind `former`, which a
 * contract declared: "formerly X", "f/k/a X"), from the same read. Kept apart, so that a caller always knows a
 * match came through a name the counterparty no longer uses.
 *
 * Each list holds, scored exactly as scoredCandidates would, every candidate that could be the best, a rival at
 * linkAt or a name scoring above newAt: a candidate is left unscored only when its upper bound (matching/bound.ts)
 * is at or below newAt and below the best score found. The best, its score and every score above newAt are
 * therefore those of scoredCandidates; only candidates that cannot matter are missing from the lists.
 */
export async function scoredCandidatesWithFormer(
  db: Queryable,
  probe: Probe,
  model: MatchModel,
  exclude: ReadonlySet<number> = new Set(),
  reads?: BatchReads,
): Promise<{ current: ScoredCandidate[]; former: ScoredCandidate[] }> {
  const state = await scoringState(db, probe, model, exclude, reads);
  return { current: state.list(false, true), former: state.list(true, true) };
}

async function scoringState(
  db: Queryable,
  probe: Probe,
  model: MatchModel,
  exclude: ReadonlySet<number>,
  reads: BatchReads | undefined,
): Promise<ScoringState> {
  const memoKey = { country: probe.country ?? null, identifiers: probe.identifiers, exclude };
  const memo = reads?.scoredFor<ScoringState>(probe.analysis, memoKey);
  if (memo && memo.model === model) return memo;
  const keys = keysOfAnalysis(probe.analysis);
  const country = probe.country ?? null;
  const text = probe.analysis.normalised;
  let details = reads?.detailsFor(keys, probe.identifiers, country, text);
  if (!details) {
    details = await candidateDetails(db, keys, probe.identifiers, { limit: MAX_CANDIDATES, country, text });
    reads?.rememberDetails(keys, probe.identifiers, country, text, details);
  }
  const state = await ScoringState.create(db, probe, details, model, exclude, reads);
  reads?.rememberScored(probe.analysis, memoKey, state);
  return state;
}

/**
 * Scores fetched candidates (in their rank order: rarest shared keys first), best first; equal scores keep the
 * rank order, so a tie goes to the candidate sharing the rarer keys, not to the lower id. Every candidate is
 * scored (the exhaustive list of the fetched ones).
 */
export async function scoreDetails(
  db: Queryable,
  probe: Probe,
  details: readonly CandidateDetail[],
  model: MatchModel,
  exclude: ReadonlySet<number>,
  reads: BatchReads | undefined,
  withFormer: boolean,
): Promise<{ current: ScoredCandidate[]; former: ScoredCandidate[] }> {
  const state = await ScoringState.create(db, probe, details, model, exclude, reads);
  return { current: state.list(false, false), former: withFormer ? state.list(true, false) : [] };
}

interface AnalysedCandidate {
  id: number;
  canonicalName: string;
  jurisdiction: string | null;
  names: { name: string; former: boolean; analysis: NameAnalysis }[];
  identifiers: Identifier[];
}

/** One probe's fetched candidates, scored lazily: each (candidate, current/former) at most once. */
class ScoringState {
  private readonly scored = [new Map<number, ScoredCandidate | null>(), new Map<number, ScoredCandidate | null>()];
  private readonly bounds: number[][];

  private constructor(
    readonly model: MatchModel,
    private readonly record: MatchRecord,
    private readonly analysed: AnalysedCandidate[],
    private readonly idf: IdfTable,
    private readonly exclude: ReadonlySet<number>,
    private readonly stats: MatchStats | undefined,
  ) {
    // Per candidate, the bound of its best current and of its best former name (−∞ when it has none).
    this.bounds = [false, true].map((former) =>
      analysed.map((candidate) => {
        if (exclude.has(candidate.id)) return Infinity; // scored anyway: the explanation says why it is excluded
        let bound = -Infinity;
        for (const name of candidate.names) if (name.former === former) bound = Math.max(bound, scoreUpperBound(record, this.other(candidate, name), model));
        return bound;
      }),
    );
    if (stats) {
      stats.probes++;
      stats.fetched += analysed.length;
    }
  }

  static async create(
    db: Queryable,
    probe: Probe,
    details: readonly CandidateDetail[],
    model: MatchModel,
    exclude: ReadonlySet<number>,
    reads: BatchReads | undefined,
  ): Promise<ScoringState> {
    const analysed: AnalysedCandidate[] = details.map((cp) => ({
      id: cp.counterpartyId,
      canonicalName: cp.canonicalName,
      jurisdiction: cp.jurisdiction,
      names: cp.names.map((n) => ({ name: n.name, former: n.kind === 'former', analysis: candidateAnalysis(n.name, cp.jurisdiction, n.stored, reads?.stats) })),
      identifiers: cp.identifiers.map((i) => ({ scheme: i.scheme, value: i.value, ...(i.label ? { label: i.label } : {}) }) as Identifier),
    }));
    const tokens = analysed.length === 0 ? [] : [probe.analysis.tokens, ...analysed.flatMap((a) => a.names.map((n) => n.analysis.tokens))].flat();
    const idf = await idfFor(db, tokens, reads);
    return new ScoringState(model, probeRecord(probe), analysed, idf, exclude, reads?.stats);
  }

  /** The scored list, best first (ties in rank order); `forDecision`: leave out what cannot matter (see above). */
  list(former: boolean, forDecision: boolean): ScoredCandidate[] {
    const bounds = this.bounds[former ? 1 : 0]!;
    // Highest bound first (rank order among equals): once a bound cannot matter, no later one can.
    const order = this.analysed.map((_, i) => i).filter((i) => bounds[i]! > -Infinity);
    order.sort((x, y) => bounds[y]! - bounds[x]! || x - y);
    let best = -Infinity;
    const out: { rank: number; candidate: ScoredCandidate }[] = [];
    for (const i of order) {
      if (forDecision && bounds[i]! <= this.model.newAt && bounds[i]! < best) break;
      const candidate = this.score(i, former);
      if (!candidate) continue;
      if (candidate.score !== -Infinity && candidate.score > best) best = candidate.score;
      out.push({ rank: i, candidate });
    }
    out.sort((a, b) => (a.candidate.score === b.candidate.score ? a.rank - b.rank : b.candidate.score - a.candidate.score));
    return out.map((o) => o.candidate);
  }

  private score(i: number, former: boolean): ScoredCandidate | null {
    const memo = this.scored[former ? 1 : 0]!;
    if (memo.has(i)) return memo.get(i)!;
    const candidate = this.analysed[i]!;
    let top: { name: string; pair: PairScore } | undefined;
    for (const name of candidate.names) {
      if (name.former !== former) continue;
      const pair = scorePair(this.record, this.other(candidate, name), this.model, this.idf, { cannotLink: this.exclude.has(candidate.id) });
      if (!top || pair.score > top.pair.score) top = { name: name.name, pair };
    }
    const out = top
      ? { counterpartyId: candidate.id, canonicalName: candidate.canonicalName, matchedName: top.name, score: top.pair.score, pair: top.pair }
      : null;
    if (out && this.stats) this.stats.scored++;
    memo.set(i, out);
    return out;
  }

  private other(candidate: AnalysedCandidate, name: { analysis: NameAnalysis }): MatchRecord {
    return {
      id: `cp:${candidate.id}`,
      analysis: name.analysis,
      ...(candidate.jurisdiction ? { country: candidate.jurisdiction } : {}),
      identifiers: candidate.identifiers,
    };
  }
}

/** A score fit for JSON (±∞ are not JSON numbers): the explanation says which override decided. */
export function jsonScore(score: number): number {
  if (score === Infinity) return 1e6;
  if (score === -Infinity) return -1e6;
  return Math.round(score * 1e6) / 1e6;
}
