/**
 * blocking_key_count: how many names hold each blocking key (t:<token> is a token's document frequency), kept
 * current by triggers on blocking_key, so that token rarity and key rarity are one primary-key lookup instead of a
 * count over the key's index range (issue 18). A trigger, not the write path, keeps it: every writer (a resolve,
 * a batch, undo, replay, forget, a bulk load) changes blocking_key and so the count, on both backends.
 *
 * Counting is capped at KEY_COUNT_CAP (the IDF's DF_CAP, services/register/matching/idf.ts): a key at the cap is
 * never updated again, neither up nor down. Common keys ("t:holdings") are what every writer would touch, so once
 * capped they take no row lock at all; every key at the cap counts as equally common, as before. Below the cap,
 * one statement changes its keys' counts in key order (INSERT … SELECT … ORDER BY key locks the rows in that
 * order), so two statements never wait on each other in opposite orders; two transactions whose several
 * statements meet in opposite orders can still deadlock, and the register's write() retries those (40P01).
 *
 * Statement-level triggers with transition tables: one counting statement per write statement, however many
 * keys it wrote. The count of an existing register is filled here (backfill), capped the same way.
 */
import { sql, type Kysely } from 'kysely';

/** Equal to DF_CAP when this migration was written; a landed migration keeps its value. */
const KEY_COUNT_CAP = 1000;

/**
 * Adds each key's change to its count, in key order, skipping keys at the cap. A fresh row takes the change
 * capped; on an existing row the change is added (a negative one too) and the sum kept within [0, cap]. A key
 * without a row is never decreased (it would mean the count table had lost a row; nothing is invented). No CHECK
 * on names: PostgreSQL checks the proposed row (the negative change) before ON CONFLICT turns it into an update.
 */
function applyDeltas(deltas: string): string {
  return `INSERT INTO blocking_key_count AS c (key, names)
      SELECT d.key, least(${KEY_COUNT_CAP}, d.n) FROM (${deltas}) d
      WHERE d.n <> 0
        AND NOT EXISTS (SELECT 1 FROM blocking_key_count x WHERE x.key = d.key AND x.names >= ${KEY_COUNT_CAP})
        AND (d.n > 0 OR EXISTS (SELECT 1 FROM blocking_key_count x WHERE x.key = d.key))
      ORDER BY d.key
      ON CONFLICT (key) DO UPDATE SET names = greatest(0, least(${KEY_COUNT_CAP}, c.names + excluded.names))
        WHERE c.names < ${KEY_COUNT_CAP}`;
}

const STATEMENTS = [
  `CREATE TABLE IF NOT EXISTS blocking_key_count (
    key text PRIMARY KEY,
    names integer NOT NULL
  )`,
  // Changes of one statement, per key (+ rows written, − rows removed); capped keys are left alone, unlocked.
  `CREATE OR REPLACE FUNCTION blocking_key_count_apply() RETURNS trigger LANGUAGE plpgsql AS $$
  BEGIN
    IF TG_OP = 'INSERT' THEN
      ${applyDeltas('SELECT key, count(*)::integer AS n FROM new_rows GROUP BY key')};
    ELSIF TG_OP = 'DELETE' THEN
      ${applyDeltas('SELECT key, -count(*)::integer AS n FROM old_rows GROUP BY key')};
    ELSE
      ${applyDeltas('SELECT key, sum(n)::integer AS n FROM (SELECT key, 1 AS n FROM new_rows UNION ALL SELECT key, -1 AS n FROM old_rows) u GROUP BY key')};
    END IF;
    RETURN NULL;
  END $$`,
  `DROP TRIGGER IF EXISTS blocking_key_count_insert ON blocking_key`,
  `DROP TRIGGER IF EXISTS blocking_key_count_delete ON blocking_key`,
  `DROP TRIGGER IF EXISTS blocking_key_count_update ON blocking_key`,
  `CREATE TRIGGER blocking_key_count_insert AFTER INSERT ON blocking_key
    REFERENCING NEW TABLE AS new_rows FOR EACH STATEMENT EXECUTE FUNCTION blocking_key_count_apply()`,
  `CREATE TRIGGER blocking_key_count_delete AFTER DELETE ON blocking_key
    REFERENCING OLD TABLE AS old_rows FOR EACH STATEMENT EXECUTE FUNCTION blocking_key_count_apply()`,
  `CREATE TRIGGER blocking_key_count_update AFTER UPDATE ON blocking_key
    REFERENCING OLD TABLE AS old_rows NEW TABLE AS new_rows FOR EACH STATEMENT EXECUTE FUNCTION blocking_key_count_apply()`,
  // Backfill (the triggers above see only later writes; the migration runs in one transaction).
  `DELETE FROM blocking_key_count`,
  `INSERT INTO blocking_key_count (key, names)
    SELECT key, least(count(*), ${KEY_COUNT_CAP})::integer FROM blocking_key GROUP BY key`,
];

export async function up(db: Kysely<any>): Promise<void> {
  for (const statement of STATEMENTS) await sql.raw(statement).execute(db);
}

export async function down(db: Kysely<any>): Promise<void> {
  for (const event of ['insert', 'delete', 'update']) await sql.raw(`DROP TRIGGER IF EXISTS blocking_key_count_${event} ON blocking_key`).execute(db);
  await sql.raw(`DROP FUNCTION IF EXISTS blocking_key_count_apply()`).execute(db);
  await sql.raw(`DROP TABLE IF EXISTS blocking_key_count`).execute(db);
}
