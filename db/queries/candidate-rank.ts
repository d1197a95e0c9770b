/**
 * How the candidate lookup (db/queries/blocking-keys.ts) ranks the counterparties a probe's keys reach (issue 18:
 * few candidates, and the best among them). First by the rarity of the keys shared (rarityOf: a key held by few names
 * says more than many common ones), a word's t: key and its stem's s: key counted once (keyGroupSql), then their
 * number, then id; of the CANDIDATE_POOL first, those whose country does not conflict with the probe's come first,
 * then by rarity plus SIMILARITY_WEIGHT times the trigram similarity (pg_trgm) of the closest name to the probe's
 * normalised name. The closeness is what finds a typo in the distinctive word: its keys are shared with nobody, so
 * by keys alone the true name ties with every name sharing the common words, and ties went by id.
 */
import { sql } from 'kysely';
import { STEM_LENGTH } from '../../resolvers/block/index.ts';

/** Names a count of REFERENCE_NAMES or more would give a key weight 0; the cap of the count table is far below. */
const REFERENCE_NAMES = 1_000_000;

/**
 * The rarity weight of a key held by `names` names: round(1000 · ln(REFERENCE_NAMES / names)), an integer so that
 * sums (and so ties) do not depend on the order of addition. Counts come from blocking_key_count (kept by triggers,
 * capped: every capped key weighs the same); a key no name holds yet counts as held once. Joined, not read by a
 * subquery per key: the subquery form halved the ingest rate (the planner evaluated it per candidate hit).
 */
export const rarityOf = (names: string) => sql.raw(`round(1000 * ln(${REFERENCE_NAMES}::float8 / greatest(1, coalesce(${names}, 1))))::bigint`);

/**
 * How many of the rarest candidates are reordered by country and closeness before the limit is taken: at 10,000
 * generated names a probe's keys reach a median of 139 counterparties (p99 290); 200 bounds the similarity reads at
 * any register size, and on 1,500 such probes (seed 1) a pool of 200 kept every candidate above newAt in the first 9
 * as ranking every hit did, where a pool of 50 or 100 lost some (issue 18; the simulation is described in
 * docs/register.md).
 */
export const CANDIDATE_POOL = 200;

/**
 * Rarity units (1000 per natural-log unit of key rarity, rarityOf) per unit of trigram similarity: a name 0.1 closer
 * counts as a key e^1 times rarer. Chosen on generated probes (issue 18): with 5,000 to 40,000 every candidate
 * scoring above newAt was inside the first 7 (docs/register.md).
 */
export const SIMILARITY_WEIGHT = 10_000;

/**
 * The evidence group of a key: a word's t: key and its stem's s: key (resolvers/block: the first STEM_LENGTH
 * characters of a longer word) are one group; every other key its own.
 */
export function keyGroupSql(column: string) {
  return sql.raw(
    `CASE WHEN ${column} LIKE 't:%' AND char_length(${column}) > ${2 + STEM_LENGTH} THEN 's:' || left(substr(${column}, 3), ${STEM_LENGTH}) ELSE ${column} END`,
  );
}
