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
export async function lockAndReadDecisionBasics(
  db: Queryable,
  keys: readonly string[],
  ref: MentionRef,
): Promise<{ settings: StoredSettings | undefined; ownEntities: OwnEntityView[]; stored: StoredMentionRow | undefined }> {
  const result = await sql<{
    settings: Parameters<typeof settingsView>[0] | null;
    own: Parameters<typeof ownEntityView>[0][];
    stored: StoredMentionRow | null;
  }>`
    SELECT
      (SELECT count(*) FROM (${neighbourhoodLocks(keys)}) locked) AS locks,
      (SELECT row_to_json(s) FROM (${storedMention(ref)}) s) AS stored,
      (SELECT row_to_json(m) FROM matcher_settings m WHERE m.id = 'current') AS settings,
      (SELECT coalesce(json_agg(row_to_json(o) ORDER BY o.id), '[]'::json) FROM own_entity o WHERE o.removed_at IS NULL) AS own`.execute(db);
  const row = result.rows[0]!;
  return { settings: row.settings ? settingsView(row.settings) : undefined, ownEntities: row.own.map(ownEntityView), stored: row.stored ?? undefined };
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
