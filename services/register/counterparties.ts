/**
 * Counterparties: read (following merges), create, and the manual upkeep of names and identifiers. Every change
 * is one history event.
 */
import type { NameKind } from '../../resolvers/vocabulary.ts';
import { NAME_KINDS } from '../../resolvers/vocabulary.ts';
import type { ActorInput, RegisterContext } from './context.ts';
import { RegisterError, invalid, notFound } from './errors.ts';
import { commitWritten } from './history/commit.ts';
import { addIdentifierRow } from './add-identifier-row.ts';
import { addNameSighting } from './add-name-sighting.ts';
import { checkName } from './check-name.ts';
import { createCounterpartyRow } from './create-counterparty-row.ts';
import { lockActive, survivorFor, survivorOf } from './lock-active.ts';
import { normaliseIdentifierOrThrow, type IdentifierInput } from './normalise-identifier-or-throw.ts';
import { touchCounterparty } from './touch-counterparty.ts';
import type { ChangeSet } from './state/change-set.ts';
import { write } from './transaction.ts';
import * as q from '../../db/queries/counterparties.ts';
import { countNames } from '../../db/queries/names.ts';

export interface ChangeResult {
  counterpartyId: number;
  eventId: number | null;
  version: number;
}

export interface CreateCounterpartyInput {
  name: string;
  kind?: 'organisation' | 'person' | 'unknown';
  jurisdiction?: string;
  otherNames?: { name: string; kind: NameKind }[];
  identifiers?: IdentifierInput[];
}

function checkKind(field: string, kind: unknown): NameKind {
  if (typeof kind !== 'string' || !(NAME_KINDS as readonly string[]).includes(kind)) {
    throw invalid(field, `must be one of ${NAME_KINDS.join(', ')}`);
  }
  return kind as NameKind;
}

function checkVersion(cs: ChangeSet, cp: Record<string, unknown>, expected: number | undefined): void {
  if (expected !== undefined && cp.version !== expected) {
    throw new RegisterError('STALE_VERSION', `counterparty ${String(cp.id)} is at version ${String(cp.version)}, not ${expected}: read it again`, {
      counterpartyId: cp.id,
      version: cp.version,
    });
  }
  void cs;
}

export async function createCounterparty(ctx: RegisterContext, input: CreateCounterpartyInput, who: ActorInput): Promise<ChangeResult> {
  const name = checkName('name', input.name);
  const others = (input.otherNames ?? []).map((n, i) => ({
    name: checkName(`otherNames/${i}/name`, n.name),
    kind: checkKind(`otherNames/${i}/kind`, n.kind),
  }));
  const identifiers = (input.identifiers ?? []).map((id, i) => normaliseIdentifierOrThrow(`identifiers/${i}`, id, input.jurisdiction));
  return write(ctx, async (cs) => {
    const at = ctx.now();
    const cp = await createCounterpartyRow(cs, { name, kind: input.kind, jurisdiction: input.jurisdiction, at });
    const id = cp.id;
    await addNameSighting(cs, id, { name, kind: 'legal', confirmedBy: who.actor, source: 'manual' }, at);
    for (const other of others) await addNameSighting(cs, id, { ...other, source: 'manual' }, at);
    for (const identifier of identifiers) {
      await addIdentifierRow(cs, id, identifier, { source: 'manual', confirmedBy: who.actor }, at);
    }
    const after = await touchCounterparty(cs, id, at);
    const eventId = await commitWritten(cs, {
      type: 'created',
      actor: who.actor,
      at,
      reason: who.reason,
      requestId: who.requestId,
      details: { entity: 'counterparty', counterpartyId: id, name },
    });
    return { counterpartyId: id, eventId, version: after.version };
  });
}

/** A person's rename: the new name is confirmed and stays canonical until a person renames again. */
export async function renameCounterparty(
  ctx: RegisterContext,
  counterpartyId: number,
  input: { name: string; expectedVersion?: number },
  who: ActorInput,
): Promise<ChangeResult> {
  const name = checkName('name', input.name);
  return write(ctx, async (cs) => {
    const at = ctx.now();
    await lockActive(cs, [counterpartyId]);
    const id = survivorFor(cs, counterpartyId);
    const cp = await cs.require('counterparty', id);
    checkVersion(cs, cp, input.expectedVersion);
    const previous = cp.canonical_name;
    await addNameSighting(cs, id, { name, kind: 'legal', confirmedBy: who.actor, source: 'manual' }, at);
    await cs.update('counterparty', id, { canonical_name: name, name_locked_by: who.actor });
    const after = await touchCounterparty(cs, id, at);
    const eventId = await commitWritten(cs, {
      type: 'renamed',
      actor: who.actor,
      at,
      reason: who.reason,
      requestId: who.requestId,
      details: { counterpartyId: id, from: previous, to: name },
    });
    return { counterpartyId: id, eventId, version: after.version };
  });
}

export async function addName(
  ctx: RegisterContext,
  counterpartyId: number,
  input: { name: string; kind: NameKind; expectedVersion?: number },
  who: ActorInput,
): Promise<ChangeResult & { nameId: number }> {
  const name = checkName('name', input.name);
  const kind = checkKind('kind', input.kind);
  return write(ctx, async (cs) => {
    const at = ctx.now();
    await lockActive(cs, [counterpartyId]);
    const id = survivorFor(cs, counterpartyId);
    checkVersion(cs, await cs.require('counterparty', id), input.expectedVersion);
    const row = await addNameSighting(cs, id, { name, kind, confirmedBy: who.actor, source: 'manual' }, at);
    const after = await touchCounterparty(cs, id, at);
    // A new name's id is temporary until the buffer is written: written first, so that the event names the real one.
    await cs.flush();
    const nameId = cs.realId(row.id);
    const eventId = await commitWritten(cs, {
      type: 'name_added',
      actor: who.actor,
      at,
      reason: who.reason,
      requestId: who.requestId,
      details: { counterpartyId: id, nameId, name, kind },
    });
    return { counterpartyId: id, eventId, version: after.version, nameId };
  });
}

export async function removeName(
  ctx: RegisterContext,
  counterpartyId: number,
  nameId: number,
  who: ActorInput & { expectedVersion?: number },
): Promise<ChangeResult> {
  return write(ctx, async (cs) => {
    const at = ctx.now();
    await lockActive(cs, [counterpartyId]);
    const id = survivorFor(cs, counterpartyId);
    checkVersion(cs, await cs.require('counterparty', id), who.expectedVersion);
    const row = await cs.get('counterparty_name', nameId);
    if (!row || row.counterparty_id !== id) throw notFound(`name of counterparty ${id}:`, nameId);
    if ((await countNames(cs.trx, id)) <= 1) throw new RegisterError('CONFLICT', `name ${nameId} is the last name of counterparty ${id}`);
    await cs.delete('counterparty_name', nameId);
    const cp = await cs.require('counterparty', id);
    // Removing the name a person locked as canonical releases the lock: the rules choose again.
    if (cp.name_locked_by && cp.canonical_name === row.name) await cs.update('counterparty', id, { name_locked_by: null });
    const after = await touchCounterparty(cs, id, at);
    const eventId = await commitWritten(cs, {
      type: 'name_removed',
      actor: who.actor,
      at,
      reason: who.reason,
      requestId: who.requestId,
      details: { counterpartyId: id, nameId, name: row.name, kind: row.kind },
    });
    return { counterpartyId: id, eventId, version: after.version };
  });
}

export async function addIdentifier(
  ctx: RegisterContext,
  counterpartyId: number,
  input: IdentifierInput & { expectedVersion?: number },
  who: ActorInput,
): Promise<ChangeResult & { identifierId: number | null }> {
  return write(ctx, async (cs) => {
    const at = ctx.now();
    await lockActive(cs, [counterpartyId]);
    const id = survivorFor(cs, counterpartyId);
    const cp = await cs.require('counterparty', id);
    checkVersion(cs, cp, input.expectedVersion);
    const identifier = normaliseIdentifierOrThrow('identifier', input, cp.jurisdiction);
    const row = await addIdentifierRow(cs, id, identifier, { source: 'manual', confirmedBy: who.actor }, at);
    if (!row) return { counterpartyId: id, eventId: null, version: cp.version, identifierId: null };
    const after = await touchCounterparty(cs, id, at);
    const eventId = await commitWritten(cs, {
      type: 'identifier_added',
      actor: who.actor,
      at,
      reason: who.reason,
      requestId: who.requestId,
      details: { counterpartyId: id, identifierId: row.id, scheme: identifier.scheme, value: identifier.value },
    });
    return { counterpartyId: id, eventId, version: after.version, identifierId: row.id };
  });
}

export async function removeIdentifier(
  ctx: RegisterContext,
  counterpartyId: number,
  identifierId: number,
  who: ActorInput & { expectedVersion?: number },
): Promise<ChangeResult> {
  return write(ctx, async (cs) => {
    const at = ctx.now();
    await lockActive(cs, [counterpartyId]);
    const id = survivorFor(cs, counterpartyId);
    checkVersion(cs, await cs.require('counterparty', id), who.expectedVersion);
    const row = await cs.get('counterparty_identifier', identifierId);
    if (!row || row.counterparty_id !== id) throw notFound(`identifier of counterparty ${id}:`, identifierId);
    await cs.delete('counterparty_identifier', identifierId);
    const after = await touchCounterparty(cs, id, at);
    const eventId = await commitWritten(cs, {
      type: 'identifier_removed',
      actor: who.actor,
      at,
      reason: who.reason,
      requestId: who.requestId,
      details: { counterpartyId: id, identifierId, scheme: row.scheme, value: row.value },
    });
    return { counterpartyId: id, eventId, version: after.version };
  });
}

export interface CounterpartyView {
  /** The id asked for. */
  requestedId: number;
  /** True when the requested id was merged: `counterparty` is its survivor. */
  merged: boolean;
  counterparty: q.CounterpartyDetail;
}

/** Reads a counterparty; a merged id answers its active survivor with `merged: true`. */
export async function getCounterparty(ctx: RegisterContext, counterpartyId: number): Promise<CounterpartyView> {
  const survivor = await survivorOf(ctx.db, counterpartyId);
  if (!survivor) throw notFound('counterparty', counterpartyId);
  const detail = await q.getCounterpartyDetail(ctx.db, survivor.id);
  if (!detail) throw notFound('counterparty', counterpartyId);
  return { requestedId: counterpartyId, merged: survivor.merged, counterparty: detail };
}
