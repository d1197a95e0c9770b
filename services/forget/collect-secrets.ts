/**
 * Gathers the personal values of an erased counterparty's cluster (names, identifier values, mention texts and
 * addresses), from the current state and from every history event that touches it, each with its replacement.
 */
import type { Transaction } from 'kysely';
import type { Database } from '../../db/types.ts';
import { analyse } from '../register/matching/analysis.ts';
import { canonicalRow, type Row } from '../register/state/tables.ts';
import type { Op } from '../register/state/change-set.ts';
import { historyPageTouching, mentionRowsById, ownedStateRows } from '../../db/queries/erasure-reads.ts';
import type { Secrets } from './secrets.ts';

/** Every personal value of the cluster, now and in its history, with its replacement. */
export async function collectSecrets(trx: Transaction<Database>, cluster: number[], mentionIds: number[], pseudonym: string, token: string): Promise<Secrets> {
  const secrets: Secrets = new Map();
  let identifierCount = 0;
  let nameCount = 0;
  // Each distinct name gets its own pseudonym (names are unique per counterparty and kind); its normalised
  // form gets the pseudonym's normalised form, so blocking keys and the name stay in step.
  const addName = (value: unknown, normalised?: unknown) => {
    if (typeof value !== 'string' || value.trim() === '') return;
    let replacement = secrets.get(value);
    if (replacement === undefined) {
      replacement = nameCount === 0 ? pseudonym : `${pseudonym} ${nameCount + 1}`;
      nameCount++;
      secrets.set(value, replacement);
    }
    if (typeof normalised === 'string' && normalised.trim() !== '' && !secrets.has(normalised)) secrets.set(normalised, analyse(replacement).normalised);
  };
  const addIdentifier = (value: unknown) => {
    if (typeof value === 'string' && value.trim() !== '' && !secrets.has(value)) secrets.set(value, `forgotten-${token}-${++identifierCount}`);
  };
  const addAddress = (value: unknown) => {
    if (typeof value === 'string' && value.trim() !== '' && !secrets.has(value)) secrets.set(value, `[address forgotten ${token}]`);
  };
  const inCluster = (value: unknown) => value !== null && value !== undefined && cluster.includes(Number(value));
  const mentionSet = new Set(mentionIds);
  const visit = (table: string, row: Row | undefined, refs: Row = {}) => {
    if (!row) return;
    const cp = row.counterparty_id ?? refs.counterparty_id;
    if (table === 'counterparty' && inCluster(row.id ?? refs.id)) addName(row.canonical_name);
    if (table === 'counterparty_name' && inCluster(cp)) {
      addName(row.name, row.normalised);
    }
    if (table === 'counterparty_identifier' && inCluster(cp)) addIdentifier(row.value);
    if (table === 'mention' && (inCluster(cp) || mentionSet.has(Number(row.id ?? refs.id)))) {
      addName(row.text);
      addAddress(row.address);
      for (const identifier of (Array.isArray(row.identifiers) ? row.identifiers : []) as { value?: unknown }[]) addIdentifier(identifier.value);
    }
  };
  // Current state first (identifier values stored normalised), then everything the history ever held.
  for (const table of ['counterparty', 'counterparty_name', 'counterparty_identifier'] as const) {
    for (const row of await ownedStateRows(trx, table, cluster)) visit(table, canonicalRow(table, row));
  }
  for (const row of await mentionRowsById(trx, mentionIds)) visit('mention', canonicalRow('mention', row));
  for await (const event of historyTouching(trx, cluster, mentionIds)) {
    for (const op of (event.payload as { ops?: Op[] }).ops ?? []) {
      if (op.op === 'update') {
        visit(op.table, { ...op.refs, ...op.before, id: op.id }, op.refs);
        visit(op.table, { ...op.refs, ...op.after, id: op.id }, op.refs);
      } else visit(op.table, op.row);
    }
  }
  return secrets;
}

async function* historyTouching(trx: Transaction<Database>, cluster: number[], mentionIds: number[]) {
  let after = 0;
  for (;;) {
    const page = await historyPageTouching(trx, cluster, mentionIds, after, 500);
    if (page.length === 0) return;
    yield* page;
    after = page[page.length - 1]!.id;
  }
}
