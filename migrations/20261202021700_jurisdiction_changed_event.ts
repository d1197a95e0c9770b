/**
 * History events may record a person's change of a counterparty's jurisdiction (`jurisdiction_changed`,
 * services/register/jurisdiction.ts). Widens the CHECK on history_event.type; the list is spelled out here (not
 * imported) so that this migration never changes once landed.
 */
import { sql, type Kysely } from 'kysely';

const BEFORE = [
  'created',
  'linked',
  'unlinked',
  'set_aside',
  'withdrawn',
  'mention_changed',
  'merged',
  'split',
  'renamed',
  'name_added',
  'name_removed',
  'identifier_added',
  'identifier_removed',
  'relation_added',
  'relation_removed',
  'review_decided',
  'undone',
  'forgotten',
];
const AFTER = [...BEFORE, 'jurisdiction_changed'];

const inList = (values: string[]): string => values.map((v) => `'${v}'`).join(', ');

async function setCheck(db: Kysely<any>, values: string[]): Promise<void> {
  await sql.raw(`ALTER TABLE history_event DROP CONSTRAINT history_event_type_check`).execute(db);
  await sql.raw(`ALTER TABLE history_event ADD CONSTRAINT history_event_type_check CHECK (type IN (${inList(values)}))`).execute(db);
}

export async function up(db: Kysely<any>): Promise<void> {
  await setCheck(db, AFTER);
}

export async function down(db: Kysely<any>): Promise<void> {
  await setCheck(db, BEFORE);
}
