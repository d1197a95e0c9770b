/** Read queries of the public interface that no register module offers: network, groups, search fallback. */
import { sql } from 'kysely';
import type { Queryable } from './util.ts';
import { composedEvidence } from './explanations.ts';
import { toMentionView, type MentionView } from './mentions.ts';

export interface NetworkParty {
  contractId: number;
  role: string | null;
  counterpartyId: number | null;
  ownEntityId: number | null;
  name: string;
}

/** The other parties (counterparties and own entities) of every contract the counterparty is party to. */
export async function otherPartiesOf(db: Queryable, counterpartyId: number): Promise<NetworkParty[]> {
  const result = await sql<{
    contract_id: string | number;
    role: string | null;
    counterparty_id: string | number | null;
    own_entity_id: string | number | null;
    name: string;
  }>`
    SELECT DISTINCT p2.contract_id, p2.role, m2.counterparty_id, m2.own_entity_id,
           coalesce(c2.canonical_name, o.name, m2.text) AS name
    FROM mention m
    JOIN contract_party p ON p.mention_id = m.id
    JOIN contract k ON k.id = p.contract_id AND k.status = 'active'
    JOIN contract_party p2 ON p2.contract_id = p.contract_id
    JOIN mention m2 ON m2.id = p2.mention_id
    LEFT JOIN counterparty c2 ON c2.id = m2.counterparty_id
    LEFT JOIN own_entity o ON o.id = m2.own_entity_id
    WHERE m.counterparty_id = ${counterpartyId} AND m.status IN ('linked', 'new')
      AND m2.status IN ('linked', 'new', 'own_entity')
      AND coalesce(m2.counterparty_id, -1) <> ${counterpartyId}
    ORDER BY 1, 3, 4
    LIMIT 2000`.execute(db);
  return result.rows.map((r) => ({
    contractId: Number(r.contract_id),
    role: r.role,
    counterpartyId: r.counterparty_id === null ? null : Number(r.counterparty_id),
    ownEntityId: r.own_entity_id === null ? null : Number(r.own_entity_id),
    name: r.name,
  }));
}

/** Active counterparties after `afterId` with their linked mentions (the grouped view), `limit` counterparties. */
export async function counterpartyGroups(
  db: Queryable,
  afterId: number,
  limit: number,
  mentionsPerGroup: number,
): Promise<{ id: number; canonicalName: string; jurisdiction: string | null; version: number; mentionCount: number; mentions: MentionView[] }[]> {
  const cps = await db
    .selectFrom('counterparty')
    .select(['id', 'canonical_name', 'jurisdiction', 'version'])
    .where('status', '=', 'active')
    .where('id', '>', afterId)
    .orderBy('id')
    .limit(limit)
    .execute();
  if (cps.length === 0) return [];
  const ids = cps.map((c) => Number(c.id));
  const mentions = await sql<Record<string, unknown>>`
    SELECT * FROM (
      SELECT m.*, ${composedEvidence('m')} AS full_evidence, row_number() OVER (PARTITION BY m.counterparty_id ORDER BY m.id) AS rn,
             count(*) OVER (PARTITION BY m.counterparty_id) AS total
      FROM mention m WHERE m.counterparty_id = ANY(${sql.val(ids)}::bigint[]) AND m.status IN ('linked', 'new')
    ) x WHERE rn <= ${mentionsPerGroup} ORDER BY counterparty_id, id`.execute(db);
  const byCp = new Map<number, { total: number; list: MentionView[] }>();
  for (const row of mentions.rows) {
    const cp = Number(row.counterparty_id);
    const entry = byCp.get(cp) ?? { total: Number(row.total), list: [] };
    entry.list.push(toMentionView(row as never));
    byCp.set(cp, entry);
  }
  return cps.map((c) => {
    const id = Number(c.id);
    const entry = byCp.get(id);
    return {
      id,
      canonicalName: c.canonical_name,
      jurisdiction: c.jurisdiction,
      version: Number(c.version),
      mentionCount: entry?.total ?? 0,
      mentions: entry?.list ?? [],
    };
  });
}

/**
 * Names close to a partial query by trigram similarity or prefix (pg_trgm; both backends load it): the search
 * box's fallback while a word is still being typed and matches no blocking key yet.
 */
export async function namesLike(db: Queryable, folded: string, limit: number): Promise<{ counterpartyId: number; name: string; similarity: number }[]> {
  if (folded.length === 0) return [];
  const prefix = `${folded.replaceAll('\\', '\\\\').replaceAll('%', '\\%').replaceAll('_', '\\_')}%`;
  const result = await sql<{ counterparty_id: string | number; name: string; sim: number }>`
    SELECT n.counterparty_id, n.name, similarity(n.normalised, ${folded}) AS sim
    FROM counterparty_name n JOIN counterparty c ON c.id = n.counterparty_id AND c.status = 'active'
    WHERE n.normalised % ${folded} OR n.normalised LIKE ${prefix}
    ORDER BY sim DESC, n.counterparty_id
    LIMIT ${limit}`.execute(db);
  return result.rows.map((r) => ({ counterpartyId: Number(r.counterparty_id), name: r.name, similarity: Number(r.sim) }));
}
