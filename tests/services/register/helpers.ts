/** Helpers for the register suites: a context over a test database, and a state comparison that names tables. */
import type { Kysely } from 'kysely';
import { expect } from 'vitest';
import type { Database } from '../../../db/types.ts';
import { createRegisterContext, type RegisterContext, type StateSnapshot } from '../../../services/register/index.ts';

export const WHO = { actor: 'test:register' };

export function contextFor(db: Kysely<Database>): RegisterContext {
  return createRegisterContext(db);
}

/** Deletes every register row (children first) so that a suite can start from an empty register. */
export async function emptyRegister(db: Kysely<Database>): Promise<void> {
  for (const table of [
    'labelled_pair',
    'cannot_link',
    'review_item',
    'contract_party',
    'blocking_key',
    'counterparty_relation',
    'counterparty_identifier',
    'counterparty_name',
    'defined_term',
  ] as const) {
    await db.deleteFrom(table).execute();
  }
  await db.updateTable('mention').set({ counterparty_id: null, own_entity_id: null, contract_id: null }).execute();
  await db.deleteFrom('mention').execute();
  await db.deleteFrom('contract').execute();
  await db.updateTable('counterparty').set({ merged_into: null, status: 'active' }).execute();
  await db.deleteFrom('counterparty').execute();
  await db.deleteFrom('own_entity').execute();
  await db.deleteFrom('matcher_settings').execute();
}

/** Compares two snapshots table by table, so that a failure names the table that differs. */
export function expectSameState(actual: StateSnapshot, expected: StateSnapshot): void {
  for (const table of Object.keys(expected) as (keyof StateSnapshot)[]) {
    expect({ table, rows: actual[table] }).toEqual({ table, rows: expected[table] });
  }
}
