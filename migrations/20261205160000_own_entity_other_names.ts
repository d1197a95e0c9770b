/**
 * Other names of our own entities: a trading name, a former name, the legal name in another form or script. Each
 * entity keeps them as a set (`other_names`, a JSON array of `{name, kind}`, no two with the same normalised name),
 * and every place that recognises our own entities tries them beside the legal name.
 *
 * History: the row images of own_entity rows written before this column existed get `other_names: []`, under
 * `cpreg.history_rewrite` (a rewrite that changes no value a user reads), so that replaying the history still gives
 * the state tables row for row and an undo still finds each row as its event left it.
 */
import { sql, type Kysely } from 'kysely';

// Each op of an event, own_entity row images completed with the new column (in their order).
const WITH_COLUMN = `(SELECT jsonb_agg(
    CASE
      WHEN e.op->>'table' <> 'own_entity' THEN e.op
      WHEN e.op ? 'row' AND NOT (e.op->'row' ? 'other_names') THEN jsonb_set(e.op, '{row,other_names}', '[]'::jsonb)
      ELSE e.op
    END ORDER BY e.ord)
  FROM jsonb_array_elements(payload->'ops') WITH ORDINALITY AS e(op, ord))`;

const WITHOUT_COLUMN = `(SELECT jsonb_agg(
    CASE WHEN e.op->>'table' = 'own_entity' AND e.op ? 'row' THEN e.op #- '{row,other_names}' ELSE e.op END ORDER BY e.ord)
  FROM jsonb_array_elements(payload->'ops') WITH ORDINALITY AS e(op, ord))`;

const OWN_ENTITY_EVENTS = `jsonb_typeof(payload->'ops') = 'array' AND payload->'ops' @> '[{"table": "own_entity"}]'::jsonb`;

export async function up(db: Kysely<any>): Promise<void> {
  await sql.raw(`ALTER TABLE own_entity ADD COLUMN other_names jsonb NOT NULL DEFAULT '[]'::jsonb`).execute(db);
  await sql`SELECT set_config('cpreg.history_rewrite', 'on', true)`.execute(db);
  await sql.raw(`UPDATE history_event SET payload = jsonb_set(payload, '{ops}', ${WITH_COLUMN}) WHERE ${OWN_ENTITY_EVENTS}`).execute(db);
}

export async function down(db: Kysely<any>): Promise<void> {
  await sql`SELECT set_config('cpreg.history_rewrite', 'on', true)`.execute(db);
  await sql.raw(`UPDATE history_event SET payload = jsonb_set(payload, '{ops}', ${WITHOUT_COLUMN}) WHERE ${OWN_ENTITY_EVENTS}`).execute(db);
  await sql.raw(`ALTER TABLE own_entity DROP COLUMN other_names`).execute(db);
}
