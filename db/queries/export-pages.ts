/**
 * The keyset pages the exports read (services/export/exports.ts): one function per export kind, each answering at
 * most `limit` rows with ids above `afterId`, in id order. The service turns rows into export columns.
 */
import { sql } from 'kysely';
import type { Queryable } from './util.ts';

export interface RegisterExportRow {
  id: number;
  canonical_name: string;
  kind: string;
  jurisdiction: string | null;
  version: number;
  created_at: Date;
  updated_at: Date;
  /** `name (kind); …` in name id order, null without names. */
  names: string | null;
  /** `scheme:value; …` in identifier id order, null without identifiers. */
  identifiers: string | null;
  mention_count: number | string;
  contract_count: number | string;
}

/** Active counterparties with their names, identifiers and the counts of their linked or new mentions and contracts. */
export async function registerExportPage(db: Queryable, afterId: number, limit: number): Promise<RegisterExportRow[]> {
  const result = await sql<RegisterExportRow>`
    SELECT c.id, c.canonical_name, c.kind, c.jurisdiction, c.version, c.created_at, c.updated_at,
      (SELECT string_agg(n.name || ' (' || n.kind || ')', '; ' ORDER BY n.id) FROM counterparty_name n WHERE n.counterparty_id = c.id) AS names,
      (SELECT string_agg(i.scheme || ':' || i.value, '; ' ORDER BY i.id) FROM counterparty_identifier i WHERE i.counterparty_id = c.id) AS identifiers,
      (SELECT count(*) FROM mention m WHERE m.counterparty_id = c.id AND m.status IN ('linked', 'new')) AS mention_count,
      (SELECT count(DISTINCT p.contract_id) FROM mention m JOIN contract_party p ON p.mention_id = m.id WHERE m.counterparty_id = c.id AND m.status IN ('linked', 'new')) AS contract_count
    FROM counterparty c WHERE c.status = 'active' AND c.id > ${afterId} ORDER BY c.id LIMIT ${limit}`.execute(db);
  return result.rows;
}

/** Every mention with the canonical name of its counterparty (null when it has none). */
export async function linkExportPage(db: Queryable, afterId: number, limit: number) {
  return db
    .selectFrom('mention as m')
    .leftJoin('counterparty as c', 'c.id', 'm.counterparty_id')
    .select([
      'm.id',
      'm.source',
      'm.external_id',
      'm.text',
      'm.contract_source',
      'm.contract_external_id',
      'm.role',
      'm.status',
      'm.counterparty_id',
      'c.canonical_name',
      'm.score',
      'm.confirmed_by',
    ])
    .where('m.id', '>', afterId)
    .orderBy('m.id')
    .limit(limit)
    .execute();
}

export async function historyExportPage(db: Queryable, afterId: number, limit: number) {
  return db.selectFrom('history_event').selectAll().where('id', '>', afterId).orderBy('id').limit(limit).execute();
}

/** Review items with the mention's text and both counterparties' canonical names. */
export async function reviewExportPage(db: Queryable, afterId: number, limit: number) {
  return db
    .selectFrom('review_item as r')
    .leftJoin('mention as m', 'm.id', 'r.mention_id')
    .leftJoin('counterparty as l', 'l.id', 'r.left_counterparty_id')
    .leftJoin('counterparty as rt', 'rt.id', 'r.right_counterparty_id')
    .select([
      'r.id',
      'r.kind',
      'r.status',
      'r.score',
      'r.mention_id',
      'm.text as mention_text',
      'r.left_counterparty_id',
      'l.canonical_name as left_name',
      'r.right_counterparty_id',
      'rt.canonical_name as right_name',
      'r.decision',
      'r.decided_by',
      'r.reason',
      'r.created_at',
    ])
    .where('r.id', '>', afterId)
    .orderBy('r.id')
    .limit(limit)
    .execute();
}
