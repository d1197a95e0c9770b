/**
 * What one resolution reads besides its candidates (services/register/resolve/): the neighbourhood locks of
 * look-alike names, the mentions of a contract's parties, and the answer's extras (the open review item of a
 * mention in review). The contract a mention names is read by contractByRef (contracts.ts), a party mention's
 * outcome by mentionOutcome (mentions.ts).
 */
import { sql } from 'kysely';
import type { Queryable } from './util.ts';
import { id } from './util.ts';
import { ownEntityView, type OwnEntityView } from './own-entities.ts';
import { settingsView, type StoredSettings } from './settings.ts';
import { storedMention, type MentionRef, type StoredMentionRow } from './mentions-by-ref.ts';
import { drawnIds, idsByTable } from './state-writes.ts';

/**
 * Ids a single resolve draws with its first statement for the rows it may add (an upper bound; one left over is a
 * gap, as a rollback leaves): none when its stored mention has this content (it answers what is stored and writes
 * nothing), and no mention id when it is stored at all.
 */
export interface IdsAhead<T extends string> {
  counts: ReadonlyMap<T, number>;
  /** The mention's content hash; null: drawn whatever is stored (a forced resolve). */
  unlessContentHash: string | null;
}

/** The advisory locks on these keys, one row per lock, taken in one sorted order (a query to run or to nest). */
function neighbourhoodLocks(keys: readonly string[]) {
  return sql`SELECT pg_advisory_xact_lock(h) FROM (SELECT DISTINCT hashtextextended(k, 0) AS h FROM unnest(${sql.val([...keys])}::text[]) AS t(k) ORDER BY 1) s`;
}

/** Transaction-scoped advisory locks on these keys, taken in one sorted order in one statement. */
export async function lockNeighbourhoodKeys(db: Queryable, keys: readonly string[]): Promise<void> {
  await neighbourhoodLocks(keys).execute(db);
}

/**
 * The first statement of a single resolve: its neighbourhood locks (as lockNeighbourhoodKeys) and, in the same
 * statement, what a decision needs besides its candidates: the stored mention under the resolve's (source,
 * externalId) with the body of its explanation (as mentionsByRef reads it), the matcher settings and our own
 * entities (one round trip instead of three). These reads are on the statement's snapshot, taken before the locks
 * are granted, as the stored mention was when it was read by a statement of its own before the locks: none of them
 * is guarded by the name locks (a concurrent insert of the same mention fails on its unique key and the resolve runs
 * again; a change to the settings or to our own entities commits on its own). The candidates, which the locks guard,
 * are read by a later statement, on a snapshot taken after the locks.
 */
export async function lockAndReadDecisionBasics<T extends string>(
  db: Queryable,
  keys: readonly string[],
  ref: MentionRef,
  ahead: IdsAhead<T>,
): Promise<{ settings: StoredSettings | undefined; ownEntities: OwnEntityView[]; stored: StoredMentionRow | undefined; ids: Map<T, number[]> }> {
  const counts = new Map([...ahead.counts].filter(([t, n]) => n > 0 && t !== 'mention'));
  const mentions = ahead.counts.get('mention' as T) ?? 0;
  const tables = [...counts.keys()];
  const settled = ahead.unlessContentHash === null ? sql`false` : sql`EXISTS (SELECT 1 FROM stored WHERE content_hash = ${ahead.unlessContentHash})`;
  const result = await sql<{
    settings: Parameters<typeof settingsView>[0] | null;
    own: Parameters<typeof ownEntityView>[0][];
    stored: StoredMentionRow | null;
    ids: [T, unknown][];
  }>`
    WITH stored AS (${storedMention(ref)})
    SELECT
      (SELECT count(*) FROM (${neighbourhoodLocks(keys)}) locked) AS locks,
      (SELECT row_to_json(s) FROM stored s) AS stored,
      (SELECT row_to_json(m) FROM matcher_settings m WHERE m.id = 'current') AS settings,
      (SELECT coalesce(json_agg(row_to_json(o) ORDER BY o.id), '[]'::json) FROM own_entity o WHERE o.removed_at IS NULL) AS own,
      (SELECT coalesce(json_agg(json_build_array(d.t, d.id)), '[]'::json) FROM (
        ${drawnIds(tables, counts, sql`NOT ${settled}`)}
        UNION ALL ${drawnIds(['mention' as T], new Map([['mention' as T, mentions]]), sql`NOT EXISTS (SELECT 1 FROM stored)`)}) d) AS ids`.execute(db);
  const row = result.rows[0]!;
  const ids = idsByTable(
    [...tables, 'mention' as T],
    row.ids.map(([t, id]) => ({ t, id })),
  );
  return { settings: row.settings ? settingsView(row.settings) : undefined, ownEntities: row.own.map(ownEntityView), stored: row.stored ?? undefined, ids };
}

/** The mention of each party of a contract, by the party's position. */
export async function partyMentionsByPosition(db: Queryable, contractId: number): Promise<Map<number, number>> {
  const parties = await db.selectFrom('contract_party').select(['position', 'mention_id']).where('contract_id', '=', contractId).execute();
  return new Map(parties.map((p) => [p.position, id(p.mention_id)]));
}

/** The newest open review item of a mention, if any. */
export async function newestOpenItemOfMention(db: Queryable, mentionId: number): Promise<number | null> {
  const item = await db
    .selectFrom('review_item')
    .select('id')
    .where('mention_id', '=', mentionId)
    .where('status', '=', 'open')
    .orderBy('id', 'desc')
    .executeTakeFirst();
  return item ? id(item.id) : null;
}
