/**
 * What one resolution reads besides its candidates (services/register/resolve/): the neighbourhood locks of
 * look-alike names, the contract a mention names with the mentions of its parties, a party mention's outcome, and
 * the answer's extras (the open review item of a mention in review).
 */
import { sql } from 'kysely';
import type { Queryable } from './util.ts';
import { id } from './util.ts';

/** Transaction-scoped advisory locks on these keys, taken in one sorted order in one statement. */
export async function lockNeighbourhoodKeys(db: Queryable, keys: readonly string[]): Promise<void> {
  await sql`SELECT pg_advisory_xact_lock(h) FROM (SELECT DISTINCT hashtextextended(k, 0) AS h FROM unnest(${sql.val([...keys])}::text[]) AS t(k) ORDER BY 1) s`.execute(
    db,
  );
}

/** A contract by its source id: id, parsed terms and status. */
export async function contractByRef(db: Queryable, source: string, externalId: string): Promise<{ id: number; parsed: unknown; status: string } | undefined> {
  const row = await db
    .selectFrom('contract')
    .select(['id', 'parsed', 'status'])
    .where('source', '=', source)
    .where('external_id', '=', externalId)
    .executeTakeFirst();
  return row ? { id: id(row.id), parsed: row.parsed, status: row.status } : undefined;
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
