/**
 * A large load in one transaction (services/register/bulk-load.ts, `oneTransaction`): blocking_key's indexes, primary
 * key and foreign keys, and counterparty_name's plain indexes, are dropped at the load's start and built again at
 * its end, and the blocking_key count triggers are switched off while it runs, the counts added once from the loaded
 * keys. Row by row, blocking_key was most of a chunk's server time (three random b-tree insertions, two foreign-key
 * lookups and the count trigger's probe per key); built once from the loaded table, each index is one sort and each
 * foreign key one join (the way pg_restore loads a table).
 *
 * The definitions are read from the catalog inside the same transaction (pg_get_indexdef, pg_get_constraintdef), so
 * what is built again is exactly what was dropped, whatever migrations have made it. The tables are locked ACCESS
 * EXCLUSIVE first: until the load commits nobody else reads or writes them, so no other writer can miss the
 * disabled trigger or an index, and a rollback (a bad row, an error) restores all of it with the rows.
 */
import { sql, type Transaction } from 'kysely';
import type { Database } from '../types.ts';
import { KEY_COUNT_CAP } from './rarity-counts.ts';

type Trx = Transaction<Database>;

/** What was dropped, in the order it is built again. */
export interface DroppedIndexes {
  statements: string[];
}

/** The count triggers of migrations/20261205102000_blocking_key_count.ts. */
const COUNT_TRIGGERS = ['blocking_key_count_insert', 'blocking_key_count_delete', 'blocking_key_count_update'];

/** A name from the catalog as a quoted identifier. */
const ident = (name: string): string => `"${name.replaceAll('"', '""')}"`;

/**
 * Locks blocking_key and counterparty_name, drops blocking_key's foreign keys, plain indexes and primary key and
 * counterparty_name's plain indexes (those that back no constraint: its primary and unique keys stay, others refer
 * to them), and disables the count triggers. Answers the statements that put them back (restoreIndexes).
 */
export async function dropIndexesForLoad(trx: Trx): Promise<DroppedIndexes> {
  await sql`LOCK TABLE blocking_key, counterparty_name IN ACCESS EXCLUSIVE MODE`.execute(trx);
  // The foreign keys' other table: dropping and adding them locks it too; taken now, not midway.
  await sql`LOCK TABLE counterparty IN SHARE ROW EXCLUSIVE MODE`.execute(trx);
  const found = await sql<{ kind: 'key' | 'index' | 'foreign'; tbl: string; name: string; def: string }>`
    SELECT CASE c.contype WHEN 'f' THEN 'foreign' ELSE 'key' END AS kind, c.conrelid::regclass::text AS tbl, c.conname AS name,
      pg_get_constraintdef(c.oid) AS def
    FROM pg_constraint c
    WHERE c.conrelid = 'blocking_key'::regclass AND c.contype IN ('p', 'u', 'f')
    UNION ALL
    SELECT 'index', i.indrelid::regclass::text, x.relname, pg_get_indexdef(i.indexrelid)
    FROM pg_index i JOIN pg_class x ON x.oid = i.indexrelid
    WHERE i.indrelid IN ('blocking_key'::regclass, 'counterparty_name'::regclass)
      AND NOT EXISTS (SELECT 1 FROM pg_constraint c WHERE c.conindid = i.indexrelid AND c.conrelid = i.indrelid)
    ORDER BY 1, 2, 3`.execute(trx);
  const of = (kind: string) => found.rows.filter((r) => r.kind === kind);
  const drop = [
    ...of('foreign').map((r) => `ALTER TABLE ${r.tbl} DROP CONSTRAINT ${ident(r.name)}`),
    ...of('index').map((r) => `DROP INDEX ${ident(r.name)}`),
    ...of('key').map((r) => `ALTER TABLE ${r.tbl} DROP CONSTRAINT ${ident(r.name)}`),
    ...COUNT_TRIGGERS.map((t) => `ALTER TABLE blocking_key DISABLE TRIGGER ${ident(t)}`),
  ];
  for (const statement of drop) await sql.raw(statement).execute(trx);
  // Keys first (a foreign key needs nothing of them, but a unique key's index is the cheapest to check with),
  // then the plain indexes, then the foreign keys, each checked by one join over the loaded table.
  const statements = [
    ...of('key').map((r) => `ALTER TABLE ${r.tbl} ADD CONSTRAINT ${ident(r.name)} ${r.def}`),
    ...of('index').map((r) => r.def),
    ...of('foreign').map((r) => `ALTER TABLE ${r.tbl} ADD CONSTRAINT ${ident(r.name)} ${r.def}`),
    ...COUNT_TRIGGERS.map((t) => `ALTER TABLE blocking_key ENABLE TRIGGER ${ident(t)}`),
  ];
  return { statements };
}

/** Builds again what dropIndexesForLoad dropped and switches the count triggers back on. */
export async function restoreIndexes(trx: Trx, dropped: DroppedIndexes): Promise<void> {
  for (const statement of dropped.statements) await sql.raw(statement).execute(trx);
}

/**
 * Adds the keys of the loaded counterparties (ids from `firstCounterpartyId` on: the load drew them after taking
 * its locks, so every blocking_key row from there on is the load's own) to blocking_key_count, as the insert
 * trigger would have: per key, names + the rows, counterparties + the distinct counterparties (all of them new),
 * capped at KEY_COUNT_CAP, a key already at the cap left alone, in key order. A loaded counterparty has one name
 * and each key once, so a key's rows are its distinct counterparties: one count, no count(DISTINCT), whose sort
 * of every loaded key took minutes at 1,000,000.
 *
 * Against the trigger fired once per chunk, the one difference is the counterparties count of a key whose names
 * count reaches the cap during the load (the trigger stops counting it at the chunk where it does): that count is
 * never read (rarity reads the capped names count there, matching/idf.ts).
 */
export async function addLoadedKeyCounts(trx: Trx, firstCounterpartyId: number): Promise<void> {
  await sql`
    INSERT INTO blocking_key_count AS c (key, names, counterparties)
    SELECT d.key, least(${KEY_COUNT_CAP}::int, d.n), least(${KEY_COUNT_CAP}::int, d.n)
    FROM (SELECT key, count(*)::int AS n FROM blocking_key WHERE counterparty_id >= ${firstCounterpartyId} GROUP BY key) d
    WHERE NOT EXISTS (SELECT 1 FROM blocking_key_count x WHERE x.key = d.key AND x.names >= ${KEY_COUNT_CAP}::int)
    ORDER BY d.key
    ON CONFLICT (key) DO UPDATE SET
      names = least(${KEY_COUNT_CAP}::int, c.names + excluded.names),
      counterparties = least(${KEY_COUNT_CAP}::int, c.counterparties + excluded.counterparties)
      WHERE c.names < ${KEY_COUNT_CAP}::int`.execute(trx);
}
