/**
 * Reads shared by the mentions of one batch, during its read-only phase (nothing is written until every mention
 * is decided and clustered): our own entities read once, token document frequencies read once per token, and
 * the candidates of every mention fetched in ONE statement (db/queries/blocking-keys.ts candidateDetailsBatch)
 * instead of one per mention. Each value is exactly what the per-mention read would answer on the same snapshot,
 * so the outcomes do not change; the memo lives for one batch only and is never shared between requests.
 */
import type { NameAnalysis } from '../../../resolvers/analyse/index.ts';
import type { Identifier } from '../../../resolvers/vocabulary.ts';
import { candidateDetailsWithTokenCounts, type CandidateDetail } from '../../../db/queries/blocking-keys.ts';
import { listOwnEntities, type OwnEntityView } from '../../../db/queries/own-entities.ts';
import { cannotLinksOfMentions } from '../../../db/queries/chunk-reads.ts';
import { survivorsOf } from '../../../db/queries/counterparties.ts';
import type { Queryable } from '../../../db/queries/util.ts';
import { candidateAnalysis } from './analysis.ts';
import { DF_CAP, NO_BASIS, rarityCounts, rarityOfCounts, type RarityBasis, type RarityCounts, type RarityReads } from './idf.ts';
import { keysOfAnalysis } from './keys.ts';
import type { MatchStats } from './match-stats.ts';

export interface ScoredMemoKey {
  country: string | null;
  identifiers: Identifier[];
  exclude: ReadonlySet<number>;
}

function detailKey(keys: readonly string[], identifiers: readonly { scheme: string; value: string }[], country: string | null, text: string): string {
  return JSON.stringify([keys, identifiers.map((i) => [i.scheme, i.value]), country, text]);
}

/** A probe's country: its own, or its input's (a prepared mention). */
function countryOf(probe: { country?: string | null; input?: { country?: string | null } }): string | null {
  return probe.country ?? probe.input?.country ?? null;
}

export class BatchReads implements RarityReads {
  private own: Promise<OwnEntityView[]> | undefined;
  private size: Promise<number> | undefined;
  /** The names resolved with the register's in this batch (matching/idf.ts): set once, before any scoring. */
  basis: RarityBasis = NO_BASIS;
  private readonly df = new Map<string, number>();
  private readonly details = new Map<string, CandidateDetail[]>();
  /** Scored candidates by analysis object (the same prepared mention is scored in decide and in clustering). */
  private readonly scored = new WeakMap<NameAnalysis, Map<string, unknown>>();

  /** The counterparties (their survivors) each stored mention must not join, read ahead for the whole batch. */
  private readonly cannotJoin = new Map<number, number[]>();

  /** `stats`: counts of the scoring done with these reads, when its caller wants them (matching/match-stats.ts). */
  constructor(
    readonly db: Queryable,
    readonly stats?: MatchStats,
  ) {}

  /** Reads the mention-level cannot-links of these stored mentions in one statement, followed to their survivors in one. */
  async prefetchCannotLinks(mentionIds: readonly number[]): Promise<void> {
    const links = await cannotLinksOfMentions(this.db, mentionIds);
    const linked = [...new Set([...links.values()].flat())];
    const survivors = linked.length === 0 ? new Map<number, number>() : await survivorsOf(this.db, linked);
    for (const [mention, ids] of links)
      this.cannotJoin.set(
        mention,
        ids.map((id) => survivors.get(id) ?? id),
      );
  }

  /** The counterparties a stored mention must not join, when read ahead (prefetchCannotLinks). */
  cannotLinksOf(mentionId: number): readonly number[] | undefined {
    return this.cannotJoin.get(mentionId);
  }

  /** Our own entities as already read on this snapshot (a single resolve reads them with its locks). */
  seedOwnEntities(list: OwnEntityView[]): void {
    this.own = Promise.resolve(list);
  }

  ownEntities(): Promise<OwnEntityView[]> {
    this.own ??= listOwnEntities(this.db);
    return this.own;
  }

  /** The register's size in counterparties (matching/idf.ts), read once per batch (with the first token counts). */
  registerSize(): Promise<number> {
    this.size ??= rarityCounts(this.db, []).then((counts) => counts.registerSize);
    return this.size;
  }

  /**
   * Document frequencies of `tokens`, reading only those not read before in this batch; the first read brings the
   * register's size in the same statement.
   */
  async frequencies(tokens: Iterable<string>): Promise<Map<string, number>> {
    const wanted = [...new Set(tokens)];
    const missing = wanted.filter((t) => !this.df.has(t));
    if (missing.length > 0 || this.size === undefined) {
      const read = rarityCounts(this.db, missing);
      this.size ??= read.then((counts) => counts.registerSize);
      this.remember(await read);
    }
    return new Map(wanted.map((t) => [t, this.df.get(t)!]));
  }

  /** Keeps counts read on this batch's snapshot (the first size read stays: every later one is the same or later). */
  private remember(counts: RarityCounts): void {
    this.size ??= Promise.resolve(counts.registerSize);
    for (const [token, df] of counts.frequencies) if (!this.df.has(token)) this.df.set(token, df);
  }

  /** Fetches the candidates of many probes in one statement (see candidateDetailsWithTokenCounts). */
  async prefetch(
    probes: { analysis: NameAnalysis; identifiers: Identifier[]; country?: string | null; input?: { country?: string | null } }[],
    limit: number,
  ): Promise<void> {
    const todo = new Map<string, { keys: string[]; identifiers: Identifier[]; country: string | null; text: string }>();
    for (const probe of probes) {
      const keys = keysOfAnalysis(probe.analysis);
      const country = countryOf(probe);
      const text = probe.analysis.normalised;
      const key = detailKey(keys, probe.identifiers, country, text);
      if (!this.details.has(key)) todo.set(key, { keys, identifiers: probe.identifiers, country, text });
    }
    if (todo.size === 0) return;
    const entries = [...todo.entries()];
    const tokens = new Set<string>();
    for (const probe of probes) for (const t of probe.analysis.tokens) tokens.add(t);
    // The token counts come in the same statement as the candidates: the probes' tokens and every word of the
    // candidates' stored names (a superset of their analyses' tokens), with the register's size.
    const read = await candidateDetailsWithTokenCounts(
      this.db,
      entries.map(([, p]) => p),
      { limit },
      { tokens: [...tokens].filter((t) => !this.df.has(t)), cap: DF_CAP },
    );
    const found = read.details;
    entries.forEach(([key], i) => this.details.set(key, found[i]!));
    if (read.counts) this.remember(rarityOfCounts(read.counts));
    // The token counts scoring will ask for: the probes' tokens and those of every candidate name; read now only
    // when an analysis gave a token its stored name's words lack (a name stored by another analysis version).
    for (const list of found) {
      for (const cp of list) for (const n of cp.names) for (const t of candidateAnalysis(n.name, cp.jurisdiction, n.stored, this.stats).tokens) tokens.add(t);
    }
    await this.frequencies(tokens);
  }

  /** The candidates fetched for a probe (`text`: its normalised name, which the ranking reads), if any. */
  detailsFor(
    keys: readonly string[],
    identifiers: readonly { scheme: string; value: string }[],
    country: string | null,
    text: string,
  ): CandidateDetail[] | undefined {
    return this.details.get(detailKey(keys, identifiers, country, text));
  }

  rememberDetails(
    keys: readonly string[],
    identifiers: readonly { scheme: string; value: string }[],
    country: string | null,
    text: string,
    details: CandidateDetail[],
  ): void {
    this.details.set(detailKey(keys, identifiers, country, text), details);
  }

  scoredFor<T>(analysis: NameAnalysis, key: ScoredMemoKey): T | undefined {
    return this.scored.get(analysis)?.get(scoredKey(key)) as T | undefined;
  }

  rememberScored(analysis: NameAnalysis, key: ScoredMemoKey, value: unknown): void {
    let byKey = this.scored.get(analysis);
    if (!byKey) this.scored.set(analysis, (byKey = new Map()));
    byKey.set(scoredKey(key), value);
  }
}

function scoredKey(key: ScoredMemoKey): string {
  return JSON.stringify([key.country, key.identifiers.map((i) => [i.scheme, i.value, i.label ?? null]), [...key.exclude].sort((a, b) => a - b)]);
}
