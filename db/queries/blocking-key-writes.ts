/**
 * Keeping blocking_key in step with counterparty names one name at a time (services/register/state/derived.ts: undo,
 * replay and writes that are not buffered; a buffer's flush inserts keys set-based, db/queries/state-writes.ts).
 */
import type { Transaction } from 'kysely';
import type { Database } from '../types.ts';

type Trx = Transaction<Database>;

/** Keys of one name (a key already there stays). */
export async function insertKeysOfName(trx: Trx, keys: readonly string[], counterpartyId: number, nameId: number): Promise<void> {
  if (keys.length === 0) return;
  await trx
    .insertInto('blocking_key')
    .values(keys.map((key) => ({ key, counterparty_id: counterpartyId, name_id: nameId })))
    .onConflict((oc) => oc.doNothing())
    .execute();
}

export async function deleteKeysOfName(trx: Trx, nameId: number): Promise<void> {
  await trx.deleteFrom('blocking_key').where('name_id', '=', nameId).execute();
}

/** A name moved to another counterparty takes its keys along. */
export async function moveKeysOfName(trx: Trx, nameId: number, counterpartyId: number): Promise<void> {
  await trx.updateTable('blocking_key').set({ counterparty_id: counterpartyId }).where('name_id', '=', nameId).execute();
}
