/** Contracts, their parties (with roles and terms) and defined terms. */
import { sql, type RawBuilder } from 'kysely';
import type { Queryable } from './util.ts';
import { id, idOrNull, iso } from './util.ts';

export interface ContractPartyView {
  position: number;
  mentionId: number;
  text: string;
  role: string | null;
  terms: string[];
  status: string;
  counterpartyId: number | null;
  ownEntityId: number | null;
  canonicalName: string | null;
}

export interface ContractView {
  id: number;
  source: string;
  externalId: string;
  title: string | null;
  status: string;
  contentHash: string;
  parties: ContractPartyView[];
  definedTerms: { term: string; partyIndex: number | null; collective: boolean }[];
  createdAt: string;
  updatedAt: string;
}

/** A contract as its source system names it: (source, external id), the contract's unique key. */
export interface ContractByRef {
  id: number;
  status: string;
  contentHash: string;
  parsed: unknown;
}

/**
 * The condition that finds a contract by its key (source, external id), on the contract table under `alias`: the one
 * place it is written, for contractByRef and for contractToStore, which reads the contract in the same statement as
 * our own entities' names. A fragment of SQL rather than a query builder: a builder nested in a statement is handed
 * to the plugins a second time, as if it were a statement of its own.
 */
function isContractOf(alias: string, source: string, externalId: string): RawBuilder<boolean> {
  return sql<boolean>`${sql.ref(`${alias}.source`)} = ${source} AND ${sql.ref(`${alias}.external_id`)} = ${externalId}`;
}

/** A contract by its (source, external id): id, status, content hash and parsed parties and terms. */
export async function contractByRef(db: Queryable, source: string, externalId: string): Promise<ContractByRef | undefined> {
  const row = await db
    .selectFrom('contract')
    .select(['id', 'status', 'content_hash', 'parsed'])
    .where(isContractOf('contract', source, externalId))
    .executeTakeFirst();
  return row ? { id: id(row.id), status: row.status, contentHash: row.content_hash, parsed: row.parsed } : undefined;
}

/** A contract with its parties and defined terms, in one statement (it is read once for every contract stored). */
export async function getContract(db: Queryable, contractId: number): Promise<ContractView | undefined> {
  const result = await sql<{
    id: string | number;
    source: string;
    external_id: string;
    title: string | null;
    status: string;
    content_hash: string;
    created_at: unknown;
    updated_at: unknown;
    parties: {
      position: number;
      mention_id: string | number;
      text: string;
      role: string | null;
      terms: string[];
      status: string;
      counterparty_id: string | number | null;
      own_entity_id: string | number | null;
      canonical_name: string | null;
    }[];
    defined_terms: { term: string; party_index: number | null; collective: boolean }[];
  }>`
    SELECT k.id, k.source, k.external_id, k.title, k.status, k.content_hash, k.created_at, k.updated_at,
      (SELECT coalesce(json_agg(json_build_object('position', p.position, 'mention_id', p.mention_id, 'text', m.text, 'role', p.role,
                'terms', p.terms, 'status', m.status, 'counterparty_id', m.counterparty_id, 'own_entity_id', m.own_entity_id,
                'canonical_name', c.canonical_name) ORDER BY p.position), '[]'::json)
         FROM contract_party p
         JOIN mention m ON m.id = p.mention_id
         LEFT JOIN counterparty c ON c.id = m.counterparty_id
         WHERE p.contract_id = k.id) AS parties,
      (SELECT coalesce(json_agg(json_build_object('term', t.term, 'party_index', t.party_index, 'collective', t.collective) ORDER BY t.id), '[]'::json)
         FROM defined_term t WHERE t.contract_id = k.id) AS defined_terms
    FROM contract k
    WHERE k.id = ${contractId}`.execute(db);
  const row = result.rows[0];
  if (!row) return undefined;
  const json = <T>(value: T | string): T => (typeof value === 'string' ? (JSON.parse(value) as T) : value);
  return {
    id: id(row.id),
    source: row.source,
    externalId: row.external_id,
    title: row.title,
    status: row.status,
    contentHash: row.content_hash,
    parties: json(row.parties).map((p) => ({
      position: p.position,
      mentionId: id(p.mention_id),
      text: p.text,
      role: p.role,
      terms: json(p.terms),
      status: p.status,
      counterpartyId: idOrNull(p.counterparty_id),
      ownEntityId: idOrNull(p.own_entity_id),
      canonicalName: p.canonical_name,
    })),
    definedTerms: json(row.defined_terms).map((t) => ({ term: t.term, partyIndex: t.party_index, collective: t.collective })),
    createdAt: iso(row.created_at) as string,
    updatedAt: iso(row.updated_at) as string,
  };
}

export interface EarlierContractRow {
  id: number;
  source: string;
  externalId: string;
  title: string | null;
  parsed: unknown;
  /** The opening of its text (where a contract states its date and parties). */
  head: string;
}

/** How much of a contract's opening is searched for a reference number and read for its date. */
export const CONTRACT_HEAD_CHARS = 4000;

/**
 * Active contracts other than `excludeId` that an amendment's statement may mean: those carrying the reference number
 * (external id, title or opening, case-insensitive, as a substring: resolvers/terms matchEarlierAgreement then asks
 * for a whole token) and those whose title or heading contains the title it gives. At most 20, oldest first; the
 * caller decides which one, if any, it is.
 */
export async function earlierContractCandidates(
  db: Queryable,
  wanted: { reference?: string; title?: string; excludeId: number },
): Promise<EarlierContractRow[]> {
  if (!wanted.reference && !wanted.title) return [];
  const ref = wanted.reference?.toLowerCase() ?? null;
  const title = wanted.title?.toLowerCase() ?? null;
  const result = await sql<{ id: string | number; source: string; external_id: string; title: string | null; parsed: unknown; head: string }>`
    SELECT id, source, external_id, title, parsed, left(text, ${CONTRACT_HEAD_CHARS}) AS head
    FROM contract
    WHERE status = 'active' AND id <> ${wanted.excludeId}
      AND ((${ref}::text IS NOT NULL AND (lower(external_id) = ${ref} OR strpos(lower(coalesce(title, '')), ${ref}) > 0
             OR strpos(lower(left(text, ${CONTRACT_HEAD_CHARS})), ${ref}) > 0))
        OR (${title}::text IS NOT NULL AND (strpos(lower(coalesce(title, '')), ${title}) > 0
             OR strpos(lower(left(text, 300)), ${title}) > 0)))
    ORDER BY id
    LIMIT 20`.execute(db);
  return result.rows.map((r) => ({ id: id(r.id), source: r.source, externalId: r.external_id, title: r.title, parsed: r.parsed, head: r.head }));
}

/**
 * The other names (former, trade, a/k/a) the contract declares for the party a contract-party mention stands for, as
 * its stored parse gives them; empty for any other mention.
 */
export async function declaredNamesOfPartyMention(db: Queryable, mentionId: number): Promise<{ kind: 'trade' | 'former' | 'also_known_as'; name: string }[]> {
  const row = await db
    .selectFrom('contract_party as p')
    .innerJoin('contract as c', 'c.id', 'p.contract_id')
    .select(['p.position', 'c.parsed'])
    .where('p.mention_id', '=', mentionId)
    .executeTakeFirst();
  if (!row) return [];
  const parties = (row.parsed as { parties?: { aliases?: { kind: 'trade' | 'former' | 'also_known_as'; name: string }[] }[] }).parties ?? [];
  return (parties[row.position]?.aliases ?? []).map((a) => ({ kind: a.kind, name: a.name }));
}

export interface ContractListRow {
  id: number;
  source: string;
  externalId: string;
  title: string | null;
  status: string;
  createdAt: string;
}

/**
 * Contracts after `afterId` in id order, narrowed by source, external id and a text `q` (a case-insensitive
 * substring of the title, with LIKE's wildcards taken literally, or the exact external id). `limit` rows at most.
 */
export async function searchContracts(
  db: Queryable,
  filter: { afterId: number; limit: number; source?: string; externalId?: string; q?: string },
): Promise<ContractListRow[]> {
  let query = db.selectFrom('contract').select(['id', 'source', 'external_id', 'title', 'status', 'created_at']).where('id', '>', filter.afterId);
  if (filter.source !== undefined) query = query.where('source', '=', filter.source);
  if (filter.externalId !== undefined) query = query.where('external_id', '=', filter.externalId);
  const q = filter.q;
  if (q) {
    const like = `%${q.toLowerCase().replaceAll('\\', '\\\\').replaceAll('%', '\\%').replaceAll('_', '\\_')}%`;
    query = query.where((eb) => eb.or([eb(sql`lower(coalesce(title, ''))`, 'like', like), eb('external_id', '=', q)]));
  }
  const rows = await query.orderBy('id').limit(filter.limit).execute();
  return rows.map((r) => ({ id: id(r.id), source: r.source, externalId: r.external_id, title: r.title, status: r.status, createdAt: iso(r.created_at)! }));
}

/**
 * What storing a contract reads first, in one statement: the stored contract's id and content hash by its (source,
 * external id), if it is stored, and the names of our own entities (not removed, in id order; each legal name followed
 * by its declared other names, a trading name being as much ours as the legal name) its text is parsed with.
 */
export async function contractToStore(
  db: Queryable,
  source: string,
  externalId: string,
): Promise<{ existing: { id: number; contentHash: string } | undefined; ownNames: string[] }> {
  const result = await sql<{ id: string | number | null; content_hash: string | null; own_names: string[] | string }>`
    SELECT k.id, k.content_hash,
      (SELECT coalesce(json_agg(n.name ORDER BY n.id, n.ord), '[]'::json) FROM (
        SELECT o.id, 0 AS ord, o.name FROM own_entity o WHERE o.removed_at IS NULL
        UNION ALL
        SELECT o.id, x.ord, x.other->>'name' FROM own_entity o, jsonb_array_elements(o.other_names) WITH ORDINALITY AS x(other, ord)
        WHERE o.removed_at IS NULL) AS n) AS own_names
    FROM (SELECT 1) AS one
    LEFT JOIN contract k ON ${isContractOf('k', source, externalId)}`.execute(db);
  const row = result.rows[0]!;
  const ownNames = typeof row.own_names === 'string' ? (JSON.parse(row.own_names) as string[]) : row.own_names;
  return { existing: row.id === null ? undefined : { id: id(row.id), contentHash: row.content_hash! }, ownNames };
}

/** The ids of a contract's defined terms, in id order. */
export async function definedTermIdsOf(db: Queryable, contractId: number): Promise<number[]> {
  const rows = await db.selectFrom('defined_term').select('id').where('contract_id', '=', contractId).orderBy('id').execute();
  return rows.map((r) => id(r.id));
}

/** A contract's parties at `position` and after, in position order (a changed text may have fewer). */
export async function partiesFromPosition(db: Queryable, contractId: number, position: number): Promise<{ id: number; mentionId: number }[]> {
  const rows = await db
    .selectFrom('contract_party')
    .select(['id', 'mention_id'])
    .where('contract_id', '=', contractId)
    .where('position', '>=', position)
    .orderBy('position')
    .execute();
  return rows.map((r) => ({ id: id(r.id), mentionId: id(r.mention_id) }));
}

/** The contract party a mention is (its contract, position and row id), if it is one. */
export async function partyOfMention(db: Queryable, mentionId: number): Promise<{ id: number; contractId: number; position: number } | undefined> {
  const row = await db.selectFrom('contract_party').select(['id', 'contract_id', 'position']).where('mention_id', '=', mentionId).executeTakeFirst();
  return row ? { id: id(row.id), contractId: id(row.contract_id), position: row.position } : undefined;
}

/** The mentions that are parties of a contract (unordered). */
export async function partyMentionIdsOf(db: Queryable, contractId: number): Promise<number[]> {
  const rows = await db.selectFrom('contract_party').select('mention_id').where('contract_id', '=', contractId).execute();
  return rows.map((r) => id(r.mention_id));
}
