/**
 * Tables derived from the state tables and kept in step with them by every write, live, in undo and in replay:
 * blocking_key holds the candidate keys of every counterparty name, so that candidate lookup is an index range
 * scan; counterparty_name_analysis holds each name's analysis under its counterparty's jurisdiction, so that
 * candidates are not analysed again. Neither is in the history (both follow from the names, the jurisdictions and
 * the analysis version) and both can be rebuilt (services/register/reanalyse-names.ts).
 */
import type { Transaction } from 'kysely';
import { deleteKeysOfName, insertKeysOfName, moveKeysOfName } from '../../../db/queries/blocking-key-writes.ts';
import { jurisdictionOf, namesOfCounterparty, upsertNameAnalyses } from '../../../db/queries/name-analysis.ts';
import { rowById } from '../../../db/queries/state-rows.ts';
import type { Database } from '../../../db/types.ts';
import type { StoredNameAnalysis } from '../../../db/queries/blocking-keys.ts';
import type { Op } from './change-set.ts';
import { intColumn } from './ops.ts';
import type { Row } from './tables.ts';

export interface DerivedContext {
  /** Candidate keys of one counterparty name (pure, deterministic). */
  nameKeys(name: { name: string; normalised: string; kind: string }): string[];
  /** The stored analysis of one counterparty name under `country`, its counterparty's jurisdiction (pure). */
  nameAnalysis(name: string, country: string | null): StoredNameAnalysis;
}

/** The keys and the stored analysis of one name (a key already there stays; the analysis is replaced). */
export async function insertNameKeys(trx: Transaction<Database>, row: Row, derived: DerivedContext): Promise<void> {
  const keys = [...new Set(derived.nameKeys(row as { name: string; normalised: string; kind: string }))];
  await insertKeysOfName(trx, keys, intColumn(row, 'counterparty_id'), intColumn(row, 'id'));
  await storeNameAnalysis(trx, row, derived);
}

async function storeNameAnalysis(trx: Transaction<Database>, row: Row, derived: DerivedContext): Promise<void> {
  const stored = derived.nameAnalysis(String(row.name), await jurisdictionOf(trx, intColumn(row, 'counterparty_id')));
  await upsertNameAnalyses(trx, [{ name_id: intColumn(row, 'id'), analysis: stored.analysis, analysis_version: stored.version, country: stored.country }]);
}

/** A counterparty's jurisdiction changed: its names are analysed again under the new one. */
async function reanalyseNamesOf(trx: Transaction<Database>, counterpartyId: number, derived: DerivedContext): Promise<void> {
  const country = await jurisdictionOf(trx, counterpartyId);
  const rows = (await namesOfCounterparty(trx, counterpartyId)).map((n) => {
    const stored = derived.nameAnalysis(n.name, country);
    return { name_id: n.id, analysis: stored.analysis, analysis_version: stored.version, country: stored.country };
  });
  await upsertNameAnalyses(trx, rows);
}

export async function syncDerived(trx: Transaction<Database>, op: Op, derived: DerivedContext): Promise<void> {
  if (op.table === 'counterparty' && op.op === 'update' && 'jurisdiction' in op.after) await reanalyseNamesOf(trx, op.id, derived);
  if (op.table !== 'counterparty_name') return;
  if (op.op === 'insert') {
    await insertNameKeys(trx, op.row, derived);
  } else if (op.op === 'delete') {
    await deleteKeysOfName(trx, intColumn(op.row, 'id'));
  } else {
    if ('name' in op.after || 'normalised' in op.after) {
      // The text changed: recompute its keys.
      await deleteKeysOfName(trx, op.id);
      const row = await rowById(trx, 'counterparty_name', op.id);
      if (row) await insertNameKeys(trx, { ...row, id: op.id }, derived);
    } else if ('counterparty_id' in op.after) {
      await moveKeysOfName(trx, op.id, intColumn(op.after, 'counterparty_id'));
      // Its new counterparty's jurisdiction is the one it is analysed under now.
      const row = await rowById(trx, 'counterparty_name', op.id);
      if (row) await storeNameAnalysis(trx, { ...row, id: op.id }, derived);
    }
  }
}
