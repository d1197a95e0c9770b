/**
 * blocking_key_count.counterparties: how many counterparties hold each blocking key, beside how many names do
 * (migrations/20261205102000_blocking_key_count.ts). Token rarity counts counterparties (services/register/matching
 * /idf.ts), and without this column a token held by between two names and the cap scanned its key's rows to count
 * them: the document-frequency read of a single resolve cost about 1.3 ms at 1M counterparties (issue 18). Now it
 * is a primary-key lookup.
 *
 * The same statement-level triggers keep both counts (one counting statement per write statement). A counterparty
 * gains a key when its first row with that key appears and loses it when its last one goes: per (key,
 * counterparty) touched, the rows after the statement are counted on the primary key's prefix, and the rows before
 * are those minus the statement's additions plus its removals (an UPDATE that moves rows between counterparties, a
 * merge, is both). Writers of one counterparty's names hold its row lock (a resolve, a batch, a merge, undo), so
 * the count after a statement sees every committed row of that pair. The count after is read when the triggers
 * run, at the end of the whole statement: a statement that both added and removed rows of one pair in two of its
 * WITH parts would be counted wrong, and none does (the write buffer only inserts keys; removals and moves are
 * statements of their own, services/register/state/derived.ts).
 *
 * The cap is the names' cap as before: a key whose names reach it is never updated again, and its counterparties
 * count is then not read (rarity takes the capped names count, as the key scan it replaces did).
 */
import { sql, type Kysely } from 'kysely';

/** Equal to DF_CAP and to the earlier migration's cap when this migration was written; a landed migration keeps its value. */
const KEY_COUNT_CAP = 1000;

/**
 * Per key, the change in names (n) and in counterparties (c) from the statement's rows per (key, counterparty):
 * `pairs` yields key, counterparty_id, added, removed. Keys at the cap are left out before anything is counted.
 */
function deltas(pairs: string): string {
  return `SELECT p.key, sum(p.added - p.removed)::integer AS n,
      sum((h.now > 0)::integer - (h.now - p.added + p.removed > 0)::integer)::integer AS c
    FROM (${pairs}) p
    CROSS JOIN LATERAL (SELECT count(*) AS now FROM blocking_key b WHERE b.key = p.key AND b.counterparty_id = p.counterparty_id) h
    WHERE NOT EXISTS (SELECT 1 FROM blocking_key_count x WHERE x.key = p.key AND x.names >= ${KEY_COUNT_CAP})
    GROUP BY p.key`;
}

/**
 * Adds each key's changes to its counts, in key order (rows locked in that order, as before). A fresh row takes the
 * changes capped; an existing row adds them (negative ones too) within [0, cap]. A key without a row is never
 * decreased. The proposed row may hold a negative change: the clamp is applied on conflict, where it is added.
 */
function applyDeltas(pairs: string): string {
  return `INSERT INTO blocking_key_count AS c (key, names, counterparties)
      SELECT d.key, least(${KEY_COUNT_CAP}, d.n), least(${KEY_COUNT_CAP}, d.c) FROM (${deltas(pairs)}) d
      WHERE (d.n <> 0 OR d.c <> 0)
        AND (d.n > 0 OR EXISTS (SELECT 1 FROM blocking_key_count x WHERE x.key = d.key))
      ORDER BY d.key
      ON CONFLICT (key) DO UPDATE SET
        names = greatest(0, least(${KEY_COUNT_CAP}, c.names + excluded.names)),
        counterparties = greatest(0, least(${KEY_COUNT_CAP}, c.counterparties + excluded.counterparties))
        WHERE c.names < ${KEY_COUNT_CAP}`;
}

const UP = [
  `ALTER TABLE blocking_key_count ADD COLUMN IF NOT EXISTS counterparties integer NOT NULL DEFAULT 0`,
  `CREATE OR REPLACE FUNCTION blocking_key_count_apply() RETURNS trigger LANGUAGE plpgsql AS $$
  BEGIN
    IF TG_OP = 'INSERT' THEN
      ${applyDeltas('SELECT key, counterparty_id, count(*) AS added, 0 AS removed FROM new_rows GROUP BY key, counterparty_id')};
    ELSIF TG_OP = 'DELETE' THEN
      ${applyDeltas('SELECT key, counterparty_id, 0 AS added, count(*) AS removed FROM old_rows GROUP BY key, counterparty_id')};
    ELSE
      ${applyDeltas(`SELECT key, counterparty_id, sum(a) AS added, sum(r) AS removed
        FROM (SELECT key, counterparty_id, 1 AS a, 0 AS r FROM new_rows UNION ALL SELECT key, counterparty_id, 0 AS a, 1 AS r FROM old_rows) u
        GROUP BY key, counterparty_id`)};
    END IF;
    RETURN NULL;
  END $$`,
  // Backfill (the migration runs in one transaction), capped as the trigger caps.
  `UPDATE blocking_key_count c SET counterparties = least(${KEY_COUNT_CAP}, s.n)
    FROM (SELECT key, count(DISTINCT counterparty_id) AS n FROM blocking_key GROUP BY key) s
    WHERE s.key = c.key`,
];

/** The names-only function of migrations/20261205102000_blocking_key_count.ts, restored by down(). */
function namesOnly(deltasOfNames: string): string {
  return `INSERT INTO blocking_key_count AS c (key, names)
      SELECT d.key, least(${KEY_COUNT_CAP}, d.n) FROM (${deltasOfNames}) d
      WHERE d.n <> 0
        AND NOT EXISTS (SELECT 1 FROM blocking_key_count x WHERE x.key = d.key AND x.names >= ${KEY_COUNT_CAP})
        AND (d.n > 0 OR EXISTS (SELECT 1 FROM blocking_key_count x WHERE x.key = d.key))
      ORDER BY d.key
      ON CONFLICT (key) DO UPDATE SET names = greatest(0, least(${KEY_COUNT_CAP}, c.names + excluded.names))
        WHERE c.names < ${KEY_COUNT_CAP}`;
}

const DOWN = [
  `CREATE OR REPLACE FUNCTION blocking_key_count_apply() RETURNS trigger LANGUAGE plpgsql AS $$
  BEGIN
    IF TG_OP = 'INSERT' THEN
      ${namesOnly('SELECT key, count(*)::integer AS n FROM new_rows GROUP BY key')};
    ELSIF TG_OP = 'DELETE' THEN
      ${namesOnly('SELECT key, -count(*)::integer AS n FROM old_rows GROUP BY key')};
    ELSE
      ${namesOnly('SELECT key, sum(n)::integer AS n FROM (SELECT key, 1 AS n FROM new_rows UNION ALL SELECT key, -1 AS n FROM old_rows) u GROUP BY key')};
    END IF;
    RETURN NULL;
  END $$`,
  `ALTER TABLE blocking_key_count DROP COLUMN IF EXISTS counterparties`,
];

export async function up(db: Kysely<any>): Promise<void> {
  for (const statement of UP) await sql.raw(statement).execute(db);
}

export async function down(db: Kysely<any>): Promise<void> {
  for (const statement of DOWN) await sql.raw(statement).execute(db);
}
