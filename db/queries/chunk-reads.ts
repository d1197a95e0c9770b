/**
 * What a batch reads for all its mentions at once, one statement per kind instead of one per mention
 * (services/register/batch-decide.ts, batch-write.ts): the contracts they name with their parties' mentions, the
 * cannot-links of the stored ones, and, inside a chunk's transaction, the open review items of its stored mentions
 * (locked, after the mentions themselves).
 */
import { sql } from 'kysely';
import type { Transaction } from 'kysely';
import type { Database } from '../types.ts';
import type { Queryable } from './util.ts';
import { id } from './util.ts';

/** A contract as a mention's decision reads it. */
export interface ContractOfRef {
  id: number;
  source: string;
  externalId: string;
  status: string;
  parsed: unknown;
}

/** The contracts stored under these (source, external id) keys, whatever their status (those not stored are absent). */
export async function contractsByRefs(db: Queryable, refs: readonly { source: string; externalId: string }[]): Promise<ContractOfRef[]> {
  if (refs.length === 0) return [];
  const result = await sql<{ id: unknown; source: string; external_id: string; status: string; parsed: unknown }>`
    SELECT c.id, c.source, c.external_id, c.status, c.parsed FROM contract c
    JOIN unnest(${sql.val(refs.map((r) => r.source))}::text[], ${sql.val(refs.map((r) => r.externalId))}::text[]) AS k(source, external_id)
      ON c.source = k.source AND c.external_id = k.external_id`.execute(db);
  return result.rows.map((r) => ({ id: id(r.id), source: r.source, externalId: r.external_id, status: r.status, parsed: r.parsed }));
}

/** The ids of the active contracts under these keys, by `JSON.stringify([source, externalId])`. */
export async function activeContractIdsByRefs(db: Queryable, refs: readonly { source: string; externalId: string }[]): Promise<Map<string, number>> {
  const rows = await contractsByRefs(db, refs);
  return new Map(rows.filter((r) => r.status === 'active').map((r) => [JSON.stringify([r.source, r.externalId]), r.id]));
}

/** The mention of each party of these contracts, by contract and then by the party's position. */
export async function partyMentionsOfContracts(db: Queryable, contractIds: readonly number[]): Promise<Map<number, Map<number, number>>> {
  const out = new Map<number, Map<number, number>>(contractIds.map((c) => [c, new Map()]));
  if (contractIds.length === 0) return out;
  const rows = await db
    .selectFrom('contract_party')
    .select(['contract_id', 'position', 'mention_id'])
    .where('contract_id', 'in', [...contractIds])
    .execute();
  for (const r of rows) out.get(id(r.contract_id))?.set(r.position, id(r.mention_id));
  return out;
}

/** The counterparties each of these mentions must not join (mention-level cannot-links), by mention. */
export async function cannotLinksOfMentions(db: Queryable, mentionIds: readonly number[]): Promise<Map<number, number[]>> {
  const out = new Map<number, number[]>(mentionIds.map((m) => [m, []]));
  if (mentionIds.length === 0) return out;
  const rows = await db
    .selectFrom('cannot_link')
    .select(['counterparty_id', 'mention_id'])
    .where('mention_id', 'in', [...mentionIds])
    .execute();
  for (const r of rows) if (r.mention_id !== null) out.get(id(r.mention_id))?.push(id(r.counterparty_id));
  return out;
}

/** The open review items of these mentions, every column, locked in id order. */
export async function lockOpenItemsOfMentions(trx: Transaction<Database>, mentionIds: readonly number[]): Promise<Record<string, unknown>[]> {
  if (mentionIds.length === 0) return [];
  const result = await sql<Record<string, unknown>>`
    SELECT * FROM review_item WHERE mention_id IN (${sql.join([...mentionIds])}) AND status = 'open' ORDER BY id FOR UPDATE`.execute(trx);
  return result.rows;
}
