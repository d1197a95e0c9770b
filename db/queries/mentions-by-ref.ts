/**
 * Mentions by their identity as the source sends it (source, externalId): the one lookup, in bulk, and a one-row
 * wrapper over it. A resolve, a batch, an ingest resume and a job's planner all read stored mentions this way.
 */
import { sql } from 'kysely';
import type { Queryable } from './util.ts';

/** A mention's identity as its source sends it. */
export interface MentionRef {
  source: string;
  externalId: string;
}

/** A stored mention (every column, as the driver reads it) with the body of its explanation (null when its evidence is inline). */
export type StoredMentionRow = Record<string, unknown> & {
  id: unknown;
  source: string;
  external_id: string;
  content_hash: string;
  counterparty_id: unknown;
  explanation_body: Record<string, unknown> | null;
};

/** Identities per statement: a whole job's mentions are looked up at once by its planner. */
const REF_LOOKUP_CHUNK = 5000;

/**
 * The stored mentions under these identities (those not stored are absent; order not given). One statement per
 * chunk of identities, a join with the unnested pairs, which the (source, external_id) unique index answers on
 * both backends.
 */
export async function mentionsByRef(db: Queryable, refs: readonly MentionRef[]): Promise<StoredMentionRow[]> {
  const out: StoredMentionRow[] = [];
  for (let start = 0; start < refs.length; start += REF_LOOKUP_CHUNK) {
    const slice = refs.slice(start, start + REF_LOOKUP_CHUNK);
    const result = await sql<StoredMentionRow>`
      SELECT m.*, e.body AS explanation_body FROM mention m
      LEFT JOIN explanation e ON e.id = m.explanation_id
      JOIN unnest(${sql.val(slice.map((r) => r.source))}::text[], ${sql.val(slice.map((r) => r.externalId))}::text[]) AS k(source, external_id)
        ON m.source = k.source AND m.external_id = k.external_id`.execute(db);
    out.push(...result.rows);
  }
  return out;
}

/** The stored mention under one identity, as mentionsByRef reads it: a query to nest in another statement. */
export function storedMention(ref: MentionRef) {
  return sql<StoredMentionRow>`
    SELECT m.*, e.body AS explanation_body FROM mention m
    LEFT JOIN explanation e ON e.id = m.explanation_id
    WHERE m.source = ${ref.source} AND m.external_id = ${ref.externalId}`;
}

/** The stored mention under one identity, or undefined (one statement, the bulk lookup's). */
export async function mentionByRef(db: Queryable, ref: MentionRef): Promise<StoredMentionRow | undefined> {
  const [row] = await mentionsByRef(db, [ref]);
  return row;
}
