/**
 * Our own legal entities: the organisation that runs cpreg. A mention or contract party that resolves to one of
 * them gets status `own_entity` and never becomes a counterparty. Adding and removing one are history events
 * (`created` / `withdrawn` with entity `own_entity`), so a replay rebuilds them too.
 *
 * An own entity may be declared with other names (a trading name, a former name, its legal name in another form):
 * a contract or a mention naming it by one of them is ours too. They are kept as a set: a name whose normalised
 * form is already there (or is the legal name's) is not added twice. Adding an entity that is already listed adds
 * the other names it did not have yet (event `name_added`).
 */
import type { ActorInput, RegisterContext } from './context.ts';
import type { ChangeSet } from './state/change-set.ts';
import { RegisterError, invalid, notFound } from './errors.ts';
import { commitWritten } from './history/commit.ts';
import { checkName } from './check-name.ts';
import { normaliseIdentifierOrThrow, type IdentifierInput } from './normalise-identifier-or-throw.ts';
import { write } from './transaction.ts';
import { analyse } from './matching/analysis.ts';
import { findOwnEntityId, listOwnEntities, type OwnEntityView } from '../../db/queries/own-entities.ts';
import type { OwnEntityOtherName } from '../../db/tables/register-tables.ts';
import { OWN_ENTITY_NAME_KINDS, type OwnEntityNameKind } from '../../resolvers/vocabulary.ts';

/** At most this many other names per own entity (the API's maxItems says the same). */
export const MAX_OWN_ENTITY_OTHER_NAMES = 50;

export interface OwnEntityInput {
  name: string;
  /** ISO 3166-1 alpha-2 or ISO 3166-2. */
  country?: string;
  identifiers?: IdentifierInput[];
  /** Other names it is known by: a trading name (`trade`), a former name, … (OWN_ENTITY_NAME_KINDS). */
  otherNames?: { name: string; kind: OwnEntityNameKind }[];
}

/** The checked other names, without repeats (by normalised name) and without the legal name itself. */
function checkOtherNames(input: OwnEntityInput, normalised: string): (OwnEntityOtherName & { normalised: string })[] {
  const given = input.otherNames ?? [];
  if (given.length > MAX_OWN_ENTITY_OTHER_NAMES) {
    throw invalid('otherNames', `has ${given.length} names; at most ${MAX_OWN_ENTITY_OTHER_NAMES} may be given`);
  }
  const seen = new Set([normalised]);
  const out: (OwnEntityOtherName & { normalised: string })[] = [];
  given.forEach((n, i) => {
    const name = checkName(`otherNames/${i}/name`, n.name);
    if (!(OWN_ENTITY_NAME_KINDS as readonly string[]).includes(n.kind)) {
      throw invalid(`otherNames/${i}/kind`, `must be one of ${OWN_ENTITY_NAME_KINDS.join(', ')}`);
    }
    const key = analyse(name, input.country).normalised;
    if (seen.has(key)) return;
    seen.add(key);
    out.push({ name, kind: n.kind, normalised: key });
  });
  return out;
}

export async function addOwnEntity(
  ctx: RegisterContext,
  input: OwnEntityInput,
  who: ActorInput,
): Promise<{ eventId: number | null; ownEntityId: number; created: boolean; otherNamesAdded: string[] }> {
  const name = checkName('name', input.name);
  if (input.country !== undefined && !/^[A-Z]{2}(?:-[A-Z0-9]{1,3})?$/.test(input.country)) {
    throw new RegisterError('INVALID_INPUT', `country: "${input.country}" is not ISO 3166-1 alpha-2 or ISO 3166-2 (e.g. DE, US-DE)`, {
      field: 'country',
    });
  }
  const identifiers = (input.identifiers ?? []).map((id, i) => normaliseIdentifierOrThrow(`identifiers/${i}`, id, input.country));
  const normalised = analyse(name, input.country).normalised;
  const others = checkOtherNames(input, normalised);
  return write(ctx, async (cs) => {
    const at = ctx.now();
    const existing = await findOwnEntityId(cs.trx, normalised);
    if (existing !== undefined) return addOtherNames(cs, existing, others, at, who);
    const row = await cs.insert('own_entity', {
      name,
      normalised,
      country: input.country ?? null,
      identifiers,
      other_names: others.map(({ name: n, kind }) => ({ name: n, kind })),
      created_at: at.toISOString(),
      removed_at: null,
    });
    const eventId = await commitWritten(cs, {
      type: 'created',
      actor: who.actor,
      at,
      reason: who.reason,
      requestId: who.requestId,
      details: { entity: 'own_entity', ownEntityId: row.id, name, ...(others.length > 0 ? { otherNames: others.map((o) => o.name) } : {}) },
    });
    return { eventId, ownEntityId: row.id, created: true, otherNamesAdded: others.map((o) => o.name) };
  });
}

/** An entity already listed: the other names it does not have yet are added to its set (no event when none is new). */
async function addOtherNames(
  cs: ChangeSet,
  ownEntityId: number,
  others: (OwnEntityOtherName & { normalised: string })[],
  at: Date,
  who: ActorInput,
): Promise<{ eventId: number | null; ownEntityId: number; created: false; otherNamesAdded: string[] }> {
  const row = await cs.require('own_entity', ownEntityId);
  const had = new Set(row.other_names.map((o) => analyse(o.name, row.country).normalised));
  const added = others.filter((o) => !had.has(o.normalised));
  if (added.length === 0) return { eventId: null, ownEntityId, created: false, otherNamesAdded: [] };
  if (row.other_names.length + added.length > MAX_OWN_ENTITY_OTHER_NAMES) {
    throw invalid(
      'otherNames',
      `would give own entity ${ownEntityId} ${row.other_names.length + added.length} other names; at most ${MAX_OWN_ENTITY_OTHER_NAMES} are kept`,
    );
  }
  await cs.update('own_entity', ownEntityId, { other_names: [...row.other_names, ...added.map(({ name, kind }) => ({ name, kind }))] });
  const eventId = await commitWritten(cs, {
    type: 'name_added',
    actor: who.actor,
    at,
    reason: who.reason,
    requestId: who.requestId,
    details: { entity: 'own_entity', ownEntityId, name: row.name, otherNames: added.map((o) => o.name) },
  });
  return { eventId, ownEntityId, created: false, otherNamesAdded: added.map((o) => o.name) };
}

/** Removes an own entity from the list (mentions already resolved to it keep their status and reference). */
export async function removeOwnEntity(ctx: RegisterContext, ownEntityId: number, who: ActorInput): Promise<{ eventId: number | null }> {
  return write(ctx, async (cs) => {
    const at = ctx.now();
    const row = await cs.get('own_entity', ownEntityId);
    if (!row) throw notFound('own entity', ownEntityId);
    if (row.removed_at !== null) return { eventId: null };
    await cs.update('own_entity', ownEntityId, { removed_at: at.toISOString() });
    const eventId = await commitWritten(cs, {
      type: 'withdrawn',
      actor: who.actor,
      at,
      reason: who.reason,
      requestId: who.requestId,
      details: { entity: 'own_entity', ownEntityId, name: row.name },
    });
    return { eventId };
  });
}

export function ownEntities(ctx: RegisterContext, options: { includeRemoved?: boolean } = {}): Promise<OwnEntityView[]> {
  return listOwnEntities(ctx.db, options);
}
