/**
 * Candidate pairs of a batch without comparing all pairs. Records sharing a blocking key are paired; a block
 * larger than `maxBlockSize` (a common word such as "university") is not paired exhaustively: its members are
 * sorted by core name and each is paired with its `window` neighbours on either side (sorted neighbourhood,
 * Hernández & Stolfo 1995). One more sorted neighbourhood over every record's core name catches near-identical
 * names that share no whole word ("microsfot" / "microsoft"). Inside an oversized block, names of one country are
 * also paired with each other (exhaustively up to `countryBlockSize`, else by a sorted neighbourhood).
 *
 * Cost: Σ over small blocks of size² / 2 plus (keys per record × 2 × window) per record; memory: the key index
 * and the pairs (two Int32 per pair).
 */
import type { IdfTable } from '../compare/index.ts';
import { blockingKeys } from './blocking-keys.ts';
import type { MatchRecord } from './match-record.ts';

export interface CandidateOptions {
  idf?: IdfTable;
  /** Blocks up to this size are paired exhaustively. Default 60 (chosen on ROR dev with the country groups, docs/matching.md). */
  maxBlockSize?: number;
  /** Per key kind (the prefix before ':'), a block size limit that replaces maxBlockSize for that kind. */
  maxBlockSizeByKind?: Readonly<Record<string, number>>;
  /** Neighbours on each side inside an oversized block. Default 4. */
  window?: number;
  /** Neighbours on each side in the global sorted neighbourhood over core names; 0 turns it off. Default 3. */
  globalWindow?: number;
  /** Only these key kinds (the prefix before ':'); default all. For measuring what each kind earns. */
  keyKinds?: readonly string[];
  /**
   * Inside an oversized block, members of one country are also paired with each other: exhaustively when at most
   * this many, else by a sorted neighbourhood of `countryWindow` within the country. 0 turns it off. Default 100
   * (ROR dev, with maxBlockSize 60: PC on Latin-script pairs sharing a word 0.931 → 0.964 for 1.11 times the
   * pairs; docs/matching.md).
   * Names of one organisation usually carry one country; two that share only a common word ("university",
   * "center") are then found among that word's names in the same country, not among all of them.
   */
  countryBlockSize?: number;
  /** Neighbours on each side inside a country group larger than countryBlockSize; 0: none. Default 0 (on ROR dev a
   * window of 4 added 0.0016 PC for 5 % more pairs; on the generated names, 13 countries, far more pairs). */
  countryWindow?: number;
}

export interface CandidatePairs {
  /** Record indices: pair k is (left[k], right[k]) with left < right. */
  left: Int32Array;
  right: Int32Array;
  count: number;
  blocks: number;
  oversizedBlocks: number;
}

export function candidatePairs(records: readonly MatchRecord[], options: CandidateOptions = {}): CandidatePairs {
  const maxBlockSize = options.maxBlockSize ?? 60;
  const window = options.window ?? 4;
  const globalWindow = options.globalWindow ?? 3;
  const kinds = options.keyKinds ? new Set(options.keyKinds) : null;
  const countryBlockSize = options.countryBlockSize ?? 100;
  const countryWindow = options.countryWindow ?? 0;
  const n = records.length;

  const keyIndex = new Map<string, number>();
  const blocks: number[][] = [];
  const blockKeys: string[] = [];
  const keysOf: number[][] = new Array(n);
  for (let i = 0; i < n; i++) {
    const ids: number[] = [];
    for (const key of blockingKeys(records[i] as MatchRecord, options.idf)) {
      if (kinds && !kinds.has(key.slice(0, key.indexOf(':')))) continue;
      let id = keyIndex.get(key);
      if (id === undefined) {
        id = blocks.length;
        keyIndex.set(key, id);
        blocks.push([]);
        blockKeys.push(key);
      }
      (blocks[id] as number[]).push(i);
      ids.push(id);
    }
    keysOf[i] = ids;
  }

  // Oversized blocks: members in core-name order, and each member's position in that order.
  const sortedPosition = new Map<number, Map<number, number>>();
  const countryGroups = new Map<number, Map<number, CountryGroup>>();
  const byCore = (x: number, y: number): number => compareCore(records, x, y);
  let oversizedBlocks = 0;
  const limitOf = (id: number): number => {
    const byKind = options.maxBlockSizeByKind;
    if (!byKind) return maxBlockSize;
    const key = blockKeys[id] as string;
    return byKind[key.slice(0, key.indexOf(':'))] ?? maxBlockSize;
  };
  blocks.forEach((members, id) => {
    if (members.length <= limitOf(id)) return;
    oversizedBlocks++;
    members.sort(byCore);
    sortedPosition.set(id, new Map(members.map((m, p) => [m, p])));
    if (countryBlockSize > 0) countryGroups.set(id, groupByCountry(records, members));
  });
  const globalOrder = globalWindow > 0 ? Array.from({ length: n }, (_, i) => i).sort(byCore) : [];
  const globalPosition = new Int32Array(n);
  globalOrder.forEach((m, p) => (globalPosition[m] = p));

  const out = new PairBuffer();
  const stamp = new Int32Array(n).fill(-1);
  const emit = (i: number, j: number): void => {
    if (j <= i || stamp[j] === i) return;
    stamp[j] = i;
    out.push(i, j);
  };
  for (let i = 0; i < n; i++) {
    for (const id of keysOf[i] as number[]) {
      const members = blocks[id] as number[];
      const positions = sortedPosition.get(id);
      if (!positions) {
        for (const j of members) emit(i, j);
        continue;
      }
      const p = positions.get(i) as number;
      for (let q = Math.max(0, p - window); q <= Math.min(members.length - 1, p + window); q++) emit(i, members[q] as number);
      const group = countryGroups.get(id)?.get(i);
      if (!group) continue;
      if (group.members.length <= countryBlockSize) {
        for (const j of group.members) emit(i, j);
      } else {
        const g = group.position.get(i) as number;
        for (let q = Math.max(0, g - countryWindow); q <= Math.min(group.members.length - 1, g + countryWindow); q++) emit(i, group.members[q] as number);
      }
    }
    if (globalWindow > 0) {
      const p = globalPosition[i] as number;
      for (let q = Math.max(0, p - globalWindow); q <= Math.min(n - 1, p + globalWindow); q++) emit(i, globalOrder[q] as number);
    }
  }
  return { ...out.finish(), blocks: blocks.length, oversizedBlocks };
}

interface CountryGroup {
  /** Members of one country in core-name order, and each one's position. */
  members: number[];
  position: Map<number, number>;
}

/** Members (already in core-name order) grouped by country; members without a country are in no group. */
function groupByCountry(records: readonly MatchRecord[], members: readonly number[]): Map<number, CountryGroup> {
  const byCountry = new Map<string, CountryGroup>();
  const out = new Map<number, CountryGroup>();
  for (const m of members) {
    const country = (records[m] as MatchRecord).country;
    if (!country) continue;
    let group = byCountry.get(country);
    if (!group) {
      group = { members: [], position: new Map() };
      byCountry.set(country, group);
    }
    group.position.set(m, group.members.length);
    group.members.push(m);
    out.set(m, group);
  }
  return out;
}

function compareCore(records: readonly MatchRecord[], x: number, y: number): number {
  const ra = records[x] as MatchRecord;
  const rb = records[y] as MatchRecord;
  const a = ra.analysis.core;
  const b = rb.analysis.core;
  // Ties broken by id, so that the neighbourhoods (and the pairs) do not depend on the input order.
  if (a !== b) return a < b ? -1 : 1;
  return ra.id < rb.id ? -1 : ra.id > rb.id ? 1 : x - y;
}

/** Growable pair storage: two Int32Arrays doubled as needed (no per-pair objects). */
class PairBuffer {
  private left = new Int32Array(1024);
  private right = new Int32Array(1024);
  private count = 0;

  push(i: number, j: number): void {
    if (this.count === this.left.length) {
      const left = new Int32Array(this.left.length * 2);
      const right = new Int32Array(this.right.length * 2);
      left.set(this.left);
      right.set(this.right);
      this.left = left;
      this.right = right;
    }
    this.left[this.count] = i;
    this.right[this.count] = j;
    this.count++;
  }

  finish(): { left: Int32Array; right: Int32Array; count: number } {
    return { left: this.left.subarray(0, this.count), right: this.right.subarray(0, this.count), count: this.count };
  }
}
