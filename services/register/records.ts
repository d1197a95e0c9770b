/**
 * Building blocks shared by every register change, all inside one ChangeSet: create a counterparty, add a name
 * or an identifier, keep the canonical name by the rules, bump the version (the ETag), follow merges.
 */
import type { IdentifierScheme, NameKind } from '../../resolvers/vocabulary.ts';
import { isStrongScheme } from '../../resolvers/vocabulary.ts';
import { normaliseIdentifier } from '../../resolvers/identifiers/index.ts';
import type { ChangeSet, Db } from './state/change-set.ts';
import type { StateRow, StateValues } from './state/tables.ts';
import { chooseCanonicalName, type NameCandidate } from './canonical-name.ts';
import { RegisterError, invalid, notFound } from './errors.ts';
import { analyse } from './matching/analysis.ts';
import { holdersOf } from '../../db/queries/identifiers.ts';
import { MAX_MERGE_CHAIN, mergeChainEnds } from '../../db/queries/counterparties.ts';

export interface NameSighting {
  name: string;
  kind: NameKind;
  source?: string | null;
  mentionId?: number | null;
  contractId?: number | null;
  confirmedBy?: string | null;
}

export interface IdentifierInput {
  scheme: string;
  value: string;
  label?: string;
}

export interface NormalisedIdentifier {
  scheme: IdentifierScheme;
  value: string;
  label?: string;
}

import { MAX_NAME_LENGTH } from '../../resolvers/vocabulary.ts';

export function checkName(field: string, name: unknown): string {
  if (typeof name !== 'string') throw invalid(field, 'must be a string');
  const trimmed = name.trim();
  if (trimmed.length === 0) throw invalid(field, 'must not be empty');
  if ([...trimmed].length > MAX_NAME_LENGTH) throw invalid(field, `is longer than ${MAX_NAME_LENGTH} characters`);
  return trimmed;
}

export function normaliseIdentifierOrThrow(field: string, input: IdentifierInput, country?: string | null): NormalisedIdentifier {
  const result = normaliseIdentifier(input, country ? { defaultCountry: country } : {});
  if (!result.ok) throw invalid(field, result.reason);
  return result.identifier;
}

export interface NewCounterparty {
  name: string;
  kind?: 'organisation' | 'person' | 'unknown';
  jurisdiction?: string | null;
  at: Date;
}

/** The values of a new counterparty row (without its id): what createCounterpartyRow inserts, and the bulk loader's COPY. */
export function counterpartyValues(values: NewCounterparty): StateValues<'counterparty'> {
  const at = values.at.toISOString();
  return {
    canonical_name: values.name,
    kind: values.kind ?? 'organisation',
    jurisdiction: values.jurisdiction ?? null,
    status: 'active',
    merged_into: null,
    name_locked_by: null,
    version: 1,
    created_at: at,
    updated_at: at,
  };
}

export async function createCounterpartyRow(cs: ChangeSet, values: NewCounterparty): Promise<StateRow<'counterparty'>> {
  return cs.insert('counterparty', counterpartyValues(values));
}

/** The values of a new name row (without its id): what addNameSighting inserts, and the bulk loader's COPY. */
export function nameValues(counterpartyId: number, sighting: NameSighting, at: Date): StateValues<'counterparty_name'> {
  const analysis = analyse(sighting.name);
  return {
    counterparty_id: counterpartyId,
    name: sighting.name,
    normalised: analysis.normalised,
    kind: sighting.kind,
    legal_form: analysis.legalForm?.family ?? null,
    seen_count: 1,
    source: sighting.source ?? null,
    mention_id: sighting.mentionId ?? null,
    contract_id: sighting.contractId ?? null,
    confirmed_by: sighting.confirmedBy ?? null,
    created_at: at.toISOString(),
  };
}

/** Adds a sighting of a name: a new row, or one more sighting of the same (name, kind). */
export async function addNameSighting(cs: ChangeSet, counterpartyId: number, sighting: NameSighting, at: Date): Promise<StateRow<'counterparty_name'>> {
  // The counterparty's names as the ChangeSet holds them (locked on first use), the buffer's new ones with them.
  const existing = (await cs.namesOf(counterpartyId)).find((n) => n.name === sighting.name && n.kind === sighting.kind)?.id;
  if (existing !== undefined) {
    const row = await cs.require('counterparty_name', existing);
    const patch: StateValues<'counterparty_name'> = { seen_count: row.seen_count + 1 };
    if (sighting.confirmedBy && !row.confirmed_by) patch.confirmed_by = sighting.confirmedBy;
    return cs.update('counterparty_name', existing, patch);
  }
  return cs.insert('counterparty_name', nameValues(counterpartyId, sighting, at));
}

/** One fewer sighting of a name (a mention moved away); the row goes when nobody has seen it any more. */
export async function removeNameSighting(cs: ChangeSet, counterpartyId: number, name: string, kind: NameKind): Promise<void> {
  // The counterparty's names as the ChangeSet holds them (locked on first use).
  const held = await cs.namesOf(counterpartyId);
  const existing = held.find((n) => n.name === name && n.kind === kind)?.id;
  if (existing === undefined) return;
  const row = await cs.require('counterparty_name', existing);
  const count = row.seen_count - 1;
  // A counterparty keeps at least one name: the last one stays with a zero count.
  if (count <= 0 && !row.confirmed_by && held.length > 1) {
    await cs.delete('counterparty_name', existing);
    return;
  }
  await cs.update('counterparty_name', existing, { seen_count: Math.max(0, count) });
}

/** Adds an identifier; a strong one already held by another active counterparty is refused, naming it. */
export async function addIdentifierRow(
  cs: ChangeSet,
  counterpartyId: number,
  identifier: NormalisedIdentifier,
  origin: { source?: string | null; mentionId?: number | null; confirmedBy?: string | null },
  at: Date,
): Promise<StateRow<'counterparty_identifier'> | undefined> {
  // Read ahead with a chunk's locks (batch-write.ts), kept in step with this ChangeSet's writes; else read now:
  // the stored holders, then those added in this ChangeSet's buffer (not written yet).
  const holders = cs.prefetched.holdersOf(identifier) ?? [
    ...(await holdersOf(cs.trx, [identifier])).map((h) => h.counterpartyId),
    ...cs.unwritten('counterparty_identifier').flatMap((r) => (r.scheme === identifier.scheme && r.value === identifier.value ? [r.counterparty_id] : [])),
  ];
  if (holders.includes(counterpartyId)) return undefined;
  const strong = isStrongScheme(identifier.scheme);
  if (strong && holders.length > 0) {
    const other = holders[0]!;
    throw new RegisterError(
      'IDENTIFIER_TAKEN',
      `${identifier.scheme} ${identifier.value} already belongs to counterparty ${other}; merge the two if they are one entity`,
      { scheme: identifier.scheme, value: identifier.value, counterpartyId: other },
    );
  }
  return cs.insert('counterparty_identifier', {
    counterparty_id: counterpartyId,
    scheme: identifier.scheme,
    value: identifier.value,
    label: identifier.label ?? null,
    strong,
    source: origin.source ?? null,
    mention_id: origin.mentionId ?? null,
    confirmed_by: origin.confirmedBy ?? null,
    created_at: at.toISOString(),
  });
}

/** Re-applies the canonical-value rules and bumps the version (every change to a counterparty changes its ETag). */
export async function touchCounterparty(cs: ChangeSet, counterpartyId: number, at: Date): Promise<StateRow<'counterparty'>> {
  const cp = await cs.require('counterparty', counterpartyId);
  const patch: StateValues<'counterparty'> = { version: cp.version + 1, updated_at: at.toISOString() };
  if (cp.status === 'active' && !cp.name_locked_by) {
    const names = await cs.namesOf(counterpartyId);
    const chosen = chooseCanonicalName(
      names.map((n) => ({ ...n, id: Number(n.id) }) as NameCandidate),
      cp.canonical_name,
    );
    if (chosen) patch.canonical_name = chosen.name;
  }
  return cs.update('counterparty', counterpartyId, patch);
}

/** Follows merged_into to the active survivor (without locking); `merged` says the id given is not the survivor. */
export async function survivorOf(db: Db, counterpartyId: number): Promise<{ id: number; merged: boolean } | undefined> {
  const ends = await mergeChainEnds(db, [counterpartyId]);
  if (!ends.has(counterpartyId)) return undefined;
  const end = ends.get(counterpartyId);
  if (!end) throw new Error(`counterparty ${counterpartyId}: merge chain longer than ${MAX_MERGE_CHAIN} links (a cycle?)`);
  return { id: end.id, merged: end.links > 0 };
}

/**
 * Locks counterparties and returns them, following merges: callers that were handed a merged id act on the
 * survivor. Locks are taken in id order; a survivor found later is locked afterwards (deadlocks are retried).
 */
export async function lockActive(cs: ChangeSet, ids: number[]): Promise<Map<number, StateRow<'counterparty'>>> {
  const out = new Map<number, StateRow<'counterparty'>>();
  let pending = [...new Set(ids)];
  for (let round = 0; pending.length > 0 && round < 100; round++) {
    const rows = await cs.lock('counterparty', pending);
    const found = new Set(rows.map((r) => r.id));
    for (const id of pending) if (!found.has(id)) throw notFound('counterparty', id);
    const next: number[] = [];
    for (const row of rows) {
      if (row.status === 'active') out.set(row.id, row);
      // A counterparty that is not active was merged: it names its survivor.
      else next.push(row.merged_into!);
    }
    // Map each requested id to its survivor: the caller reads `survivorFor` below.
    for (const row of rows) if (row.status !== 'active') cs.aliases.set(row.id, row.merged_into!);
    pending = next.filter((id) => !out.has(id));
  }
  return out;
}

export function survivorFor(cs: ChangeSet, id: number): number {
  let current = id;
  for (let i = 0; i < 1000 && cs.aliases.has(current); i++) current = cs.aliases.get(current)!;
  return current;
}
