/**
 * Token rarity for soft TF-IDF and for the informative-core rule, counted over the same names `cpreg evaluate`
 * counts: the register's names plus the names being resolved with them (the batch, or a whole job). N is the number
 * of those names and df the number holding the token, so a word is common in the register exactly when it would
 * be common in an evaluation of the same names (issue 15 item 7: one decision logic).
 *
 * - A "name" here is one distinct name per company: the register counts counterparties (not their several
 *   spellings), a batch counts its distinct names. Otherwise one company written five ways would make its own
 *   words common, and its spellings would stop linking to each other (a job of one supplier's spellings).
 * - The register's counts come from its blocking keys (t:<token>): the counterparties holding the key, kept by
 *   triggers beside the names holding it (blocking_key_count), so a count is one primary-key lookup. A token whose
 *   names reach DF_CAP counts DF_CAP, and is counted as common at any register size (atLeastCommonWhenCapped).
 * - The register's N is its highest counterparty id: counterparties are never deleted (merged ones stay as rows),
 *   and reading it is one index probe where a count(*) would scan a million rows.
 * - A job's partitions run at different times, so what the register holds when one runs depends on the others.
 *   The planner therefore freezes N (register at planning time + the whole job) and, with each mention, the counts
 *   of its tokens that the job holds at least twice; a partition adds only its own names for its other tokens,
 *   which no other partition holds. Its mentions' tokens then weigh as the plan weighed them, whatever order the
 *   partitions run in (a candidate name's token that none of the partition's mentions holds is read as it stands).
 *
 * Each token's weight depends on its own count and N only, so a table built from more tokens than a comparison
 * uses gives the same weights (what lets a batch read the counts of all its tokens once: matching/batch-reads.ts).
 */
import { idfTableFromFrequencies, type IdfTable } from '../../../resolvers/compare/index.ts';
import { COMMON_TOKEN_SHARE } from '../../../resolvers/score/index.ts';
import type { Queryable } from '../../../db/queries/util.ts';
import { KEY_COUNT_CAP, tokenCountsAndSize } from '../../../db/queries/rarity-counts.ts';

/** Token counts are read up to the key-count table's cap. */
export const DF_CAP = KEY_COUNT_CAP;

/**
 * Capped document frequency of each distinct token in the register, in counterparties (see the header): read from
 * blocking_key_count, whose names and counterparties per key triggers keep (migrations/20261205102000_blocking_key_count.ts,
 * 20261205113000_blocking_key_counterparties.ts). A key at the cap answers its capped names count.
 */
export async function documentFrequencies(db: Queryable, tokens: Iterable<string>): Promise<Map<string, number>> {
  return (await rarityCounts(db, tokens)).frequencies;
}

/** How many counterparties the register holds (its highest counterparty id: see the header). */
export async function registerSize(db: Queryable): Promise<number> {
  return (await rarityCounts(db, [])).registerSize;
}

/** What one rarity read answers: the counts of the tokens asked for, and the register's size. */
export interface RarityCounts {
  frequencies: Map<string, number>;
  registerSize: number;
}

/**
 * The document frequencies of `tokens` and the register's size in ONE statement (a single resolve's round trips
 * set its latency: issue 18). The size travels as the row whose token is NULL.
 */
export async function rarityCounts(db: Queryable, tokens: Iterable<string>): Promise<RarityCounts> {
  return rarityOfCounts(await tokenCountsAndSize(db, [...new Set(tokens)], DF_CAP));
}

/** Counts as read from blocking_key_count (tokenCountsAndSize, or with the candidates) as the register weighs them. */
export function rarityOfCounts({ counts, size }: { counts: ReadonlyMap<string, number>; size: number }): RarityCounts {
  const frequencies = new Map<string, number>();
  for (const [token, df] of counts) frequencies.set(token, Math.min(DF_CAP, df));
  return { frequencies, registerSize: size };
}

/** Token counts frozen by a job's plan: N and the counts of the tokens the job holds at least twice. */
export interface FrozenRarity {
  documents: number;
  frequencies: Record<string, number>;
}

/** The names counted besides the register's: a batch's own, and a job's frozen counts when it is a partition. */
export interface RarityBasis {
  documents: number;
  frequencies: ReadonlyMap<string, number>;
  frozen?: FrozenRarity;
}

/**
 * A basis from the token lists of the names resolved together (one list per mention). Names with the same tokens
 * count once, as the register keeps one row per spelling; a token counts once a name.
 */
export function basisOf(names: Iterable<readonly string[]>, frozen?: FrozenRarity): RarityBasis {
  const frequencies = new Map<string, number>();
  const seen = new Set<string>();
  let documents = 0;
  for (const tokens of names) {
    const key = tokens.join(' ');
    if (seen.has(key)) continue;
    seen.add(key);
    documents++;
    for (const token of new Set(tokens)) frequencies.set(token, (frequencies.get(token) ?? 0) + 1);
  }
  return { documents, frequencies, ...(frozen ? { frozen } : {}) };
}

export const NO_BASIS: RarityBasis = { documents: 0, frequencies: new Map() };

/**
 * The IDF table for register counts `registerDf` (capped) and `registerCounterparties`, with `basis` added. A token at the
 * cap counts as at least COMMON_TOKEN_SHARE of N, so that it stays common in a register of more than a million
 * names (where the cap alone would make it look rare).
 */
export function idfFromCounts(registerDf: ReadonlyMap<string, number>, registerCounterparties: number, basis: RarityBasis = NO_BASIS): IdfTable {
  const frozen = basis.frozen;
  const documents = frozen ? Math.max(frozen.documents, 1) : registerCounterparties + basis.documents;
  const frequencies = new Map<string, number>();
  for (const [token, stored] of registerDf) {
    const held = frozen?.frequencies[token];
    if (held !== undefined) {
      frequencies.set(token, Math.min(held, documents));
      continue;
    }
    frequencies.set(token, Math.min(documents, atLeastCommonWhenCapped(stored, documents) + (basis.frequencies.get(token) ?? 0)));
  }
  return idfTableFromFrequencies(frequencies, documents);
}

function atLeastCommonWhenCapped(stored: number, documents: number): number {
  return stored >= DF_CAP ? Math.max(stored, Math.ceil(COMMON_TOKEN_SHARE * documents)) : stored;
}

/** What idfFor reads through when a batch is running (matching/batch-reads.ts): cached counts and the batch's basis. */
export interface RarityReads {
  frequencies(tokens: Iterable<string>): Promise<Map<string, number>>;
  registerSize(): Promise<number>;
  readonly basis: RarityBasis;
}

export async function idfFor(db: Queryable, tokens: Iterable<string>, reads?: RarityReads): Promise<IdfTable> {
  if (reads) return idfFromCounts(await reads.frequencies(tokens), await reads.registerSize(), reads.basis);
  const counts = await rarityCounts(db, tokens);
  return idfFromCounts(counts.frequencies, counts.registerSize);
}

/**
 * What a job's plan freezes for its partitions: N over the register and the whole job, and the count of every
 * token in `shared`, the tokens two or more of the job's mentions hold (the others are held by one mention, so by
 * one partition only, which counts them itself).
 */
export function freezeRarity(
  registerDf: ReadonlyMap<string, number>,
  registerCounterparties: number,
  job: RarityBasis,
  shared: ReadonlySet<string>,
): FrozenRarity {
  const idfDocuments = registerCounterparties + job.documents;
  const frequencies: Record<string, number> = {};
  for (const [token, inJob] of job.frequencies) {
    if (!shared.has(token)) continue;
    const stored = registerDf.get(token) ?? 0;
    frequencies[token] = Math.min(idfDocuments, atLeastCommonWhenCapped(stored, idfDocuments) + inJob);
  }
  return { documents: idfDocuments, frequencies };
}
