/**
 * A reviewer may answer a mention's review item "not a party" (a place, a document word, a signer the register let
 * in): the mention is set aside as no party, and the answer is kept apart from "different" so that it never counts
 * as evidence about names (services/register/review.ts). Widens the CHECK on review_item.decision; the lists are
 * spelled out here so that this migration never changes once landed.
 */
import { sql, type Kysely } from 'kysely';

async function setCheck(db: Kysely<any>, values: string[]): Promise<void> {
  await sql.raw(`ALTER TABLE review_item DROP CONSTRAINT review_item_decision_check`).execute(db);
  await sql.raw(`ALTER TABLE review_item ADD CONSTRAINT review_item_decision_check CHECK (decision IN (${values.map((v) => `'${v}'`).join(', ')}))`).execute(db);
}

export async function up(db: Kysely<any>): Promise<void> {
  await setCheck(db, ['same', 'different', 'not_a_party']);
}

export async function down(db: Kysely<any>): Promise<void> {
  await setCheck(db, ['same', 'different']);
}
