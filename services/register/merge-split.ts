/**
 * Merge (two or more counterparties into one survivor) and split (chosen mentions out into a new or another
 * counterparty). Each is one history event; both are undone like any event (history/undo.ts).
 */
import type { ActorInput, RegisterContext } from './context.ts';
import { RegisterError, invalid, notFound } from './errors.ts';
import { commitEvent } from './history/commit.ts';
import { addNameSighting, createCounterpartyRow, lockActive, removeNameSighting, survivorFor, touchCounterparty } from './records.ts';
import type { ChangeSet } from './state/change-set.ts';
import type { Row } from './state/tables.ts';
import { write } from './transaction.ts';
import { cannotLinksOf } from '../../db/queries/review.ts';
import { survivorsOf } from '../../db/queries/counterparties.ts';
import { findNameId } from '../../db/queries/names.ts';

/** The ids plus every id ever merged into them (cannot-links may name an old id). */
export async function idsMergedInto(cs: ChangeSet, ids: number[]): Promise<number[]> {
  const all = new Set(ids);
  let frontier = [...ids];
  for (let depth = 0; frontier.length > 0 && depth < 1000; depth++) {
    const rows = await cs.trx.selectFrom('counterparty').select('id').where('merged_into', 'in', frontier).execute();
    frontier = rows.map((r) => Number(r.id)).filter((id) => !all.has(id));
    for (const id of frontier) all.add(id);
  }
  return [...all];
}
import { recordedNameOf, recordedNamesOf } from './mention-names.ts';

export interface MergeInput {
  /** Counterparty ids to merge (two or more; merged ids are followed to their survivors). */
  ids: number[];
  /** Which one survives; default the oldest (lowest id). */
  survivorId?: number;
  /** Optimistic concurrency: the version (ETag) each id was read at; a mismatch refuses the merge. */
  expectedVersions?: Record<number, number>;
  /** Why (kept in the history); the actor's reason is used when absent. */
  reason?: string;
}

export interface MergeResult {
  eventId: number;
  survivorId: number;
  mergedIds: number[];
  version: number;
}

/** Refuses when a cannot-link separates any two of the counterparties (after following merges). */
export async function assertNoCannotLink(cs: ChangeSet, ids: number[]): Promise<void> {
  const links = await cannotLinksOf(cs.trx, await idsMergedInto(cs, ids));
  const survivors = await survivorsOf(
    cs.trx,
    links.flatMap((l) => [l.counterpartyId, l.otherCounterpartyId ?? l.counterpartyId]),
  );
  const set = new Set(ids);
  for (const link of links) {
    if (link.otherCounterpartyId === null) continue;
    const a = survivors.get(link.counterpartyId) ?? link.counterpartyId;
    const b = survivors.get(link.otherCounterpartyId) ?? link.otherCounterpartyId;
    if (a !== b && set.has(a) && set.has(b)) {
      throw new RegisterError('CANNOT_LINK', `counterparties ${a} and ${b} were recorded as different entities; undo that review decision first`, {
        counterpartyIds: [a, b],
      });
    }
  }
}

/** Refuses two different LEIs: an LEI names exactly one legal entity (ISO 17442). */
async function assertCompatibleIdentifiers(cs: ChangeSet, ids: number[]): Promise<void> {
  const rows = await cs.trx
    .selectFrom('counterparty_identifier')
    .select(['counterparty_id', 'value'])
    .where('counterparty_id', 'in', ids)
    .where('scheme', '=', 'lei')
    .execute();
  const values = new Set(rows.map((r) => r.value));
  if (values.size > 1) {
    throw new RegisterError('CONFLICT', `the counterparties hold different LEIs (${[...values].join(', ')}): they are different legal entities`, {
      counterpartyIds: ids,
    });
  }
}

/** Moves everything of `loserId` onto `survivorId` and marks the loser merged. Both must be locked. */
export async function mergeInto(cs: ChangeSet, survivorId: number, loserId: number, at: Date): Promise<void> {
  const iso = at.toISOString();
  const names = await cs.trx.selectFrom('counterparty_name').select(['id', 'name', 'kind']).where('counterparty_id', '=', loserId).orderBy('id').execute();
  for (const n of names) {
    const twin = await findNameId(cs.trx, survivorId, n.name, n.kind);
    const row = await cs.require('counterparty_name', Number(n.id));
    if (twin !== undefined) {
      const keep = await cs.require('counterparty_name', twin);
      const patch: Row = { seen_count: (keep.seen_count as number) + (row.seen_count as number) };
      if (!keep.confirmed_by && row.confirmed_by) patch.confirmed_by = row.confirmed_by;
      await cs.update('counterparty_name', twin, patch);
      await cs.delete('counterparty_name', Number(n.id));
    } else {
      await cs.update('counterparty_name', Number(n.id), { counterparty_id: survivorId });
    }
  }
  const identifiers = await cs.trx
    .selectFrom('counterparty_identifier')
    .select(['id', 'scheme', 'value'])
    .where('counterparty_id', '=', loserId)
    .orderBy('id')
    .execute();
  for (const i of identifiers) {
    const twin = await cs.trx
      .selectFrom('counterparty_identifier')
      .select('id')
      .where('counterparty_id', '=', survivorId)
      .where('scheme', '=', i.scheme)
      .where('value', '=', i.value)
      .executeTakeFirst();
    await cs.require('counterparty_identifier', Number(i.id));
    if (twin) await cs.delete('counterparty_identifier', Number(i.id));
    else await cs.update('counterparty_identifier', Number(i.id), { counterparty_id: survivorId });
  }
  const mentions = await cs.trx.selectFrom('mention').select('id').where('counterparty_id', '=', loserId).orderBy('id').execute();
  await cs.lock(
    'mention',
    mentions.map((m) => Number(m.id)),
  );
  for (const m of mentions) await cs.update('mention', Number(m.id), { counterparty_id: survivorId, updated_at: iso });
  const relations = await cs.trx
    .selectFrom('counterparty_relation')
    .selectAll()
    .where((eb) => eb.or([eb('from_counterparty_id', '=', loserId), eb('to_counterparty_id', '=', loserId)]))
    .orderBy('id')
    .execute();
  for (const r of relations) {
    const from = Number(r.from_counterparty_id) === loserId ? survivorId : Number(r.from_counterparty_id);
    const to = Number(r.to_counterparty_id) === loserId ? survivorId : Number(r.to_counterparty_id);
    await cs.require('counterparty_relation', Number(r.id));
    const duplicate =
      from !== to &&
      (await cs.trx
        .selectFrom('counterparty_relation')
        .select('id')
        .where('from_counterparty_id', '=', from)
        .where('to_counterparty_id', '=', to)
        .where('type', '=', r.type)
        .where('id', '<>', r.id)
        .executeTakeFirst());
    // A relation between the two merged records, or one the survivor already has, has nothing left to say.
    if (from === to || duplicate) await cs.delete('counterparty_relation', Number(r.id));
    else await cs.update('counterparty_relation', Number(r.id), { from_counterparty_id: from, to_counterparty_id: to });
  }
  // Open review items between the two are answered by the merge itself.
  const open = await cs.trx
    .selectFrom('review_item')
    .select('id')
    .where('status', '=', 'open')
    .where('mention_id', 'is', null)
    .where((eb) =>
      eb.or([
        eb.and([eb('left_counterparty_id', '=', survivorId), eb('right_counterparty_id', '=', loserId)]),
        eb.and([eb('left_counterparty_id', '=', loserId), eb('right_counterparty_id', '=', survivorId)]),
      ]),
    )
    .execute();
  for (const item of open) {
    await cs.require('review_item', Number(item.id));
    await cs.update('review_item', Number(item.id), { status: 'obsolete' });
  }
  const loser = await cs.require('counterparty', loserId);
  await cs.update('counterparty', loserId, {
    status: 'merged',
    merged_into: survivorId,
    version: (loser.version as number) + 1,
    updated_at: iso,
  });
  cs.aliases.set(loserId, survivorId);
}

export async function mergeCounterparties(ctx: RegisterContext, input: MergeInput, who: ActorInput): Promise<MergeResult> {
  if (!Array.isArray(input.ids) || input.ids.length < 2) throw invalid('ids', 'name at least two counterparties to merge');
  return write(ctx, async (cs) => {
    const at = ctx.now();
    const requested = [...new Set(input.ids)];
    if (input.expectedVersions) {
      const rows = await cs.lock('counterparty', requested);
      for (const row of rows) {
        const expected = input.expectedVersions[row.id as number];
        if (expected !== undefined && expected !== row.version) {
          throw new RegisterError(
            'STALE_VERSION',
            `counterparty ${String(row.id)} changed since it was read (version ${String(row.version)}, not ${expected})`,
            {
              counterpartyId: row.id,
              version: row.version,
            },
          );
        }
      }
    }
    const active = await lockActive(cs, requested);
    const ids = [...new Set(requested.map((id) => survivorFor(cs, id)))].sort((a, b) => a - b);
    for (const id of ids) if (!active.has(id)) throw notFound('counterparty', id);
    if (ids.length < 2) {
      throw new RegisterError('CONFLICT', `counterparties ${requested.join(', ')} are already one counterparty (${ids[0]})`, {
        survivorId: ids[0],
      });
    }
    const survivorId = input.survivorId === undefined ? ids[0]! : survivorFor(cs, input.survivorId);
    if (!ids.includes(survivorId)) throw invalid('survivorId', `must be one of the merged counterparties (${ids.join(', ')})`);
    await assertNoCannotLink(cs, ids);
    await assertCompatibleIdentifiers(cs, ids);
    const losers = ids.filter((id) => id !== survivorId);
    for (const loser of losers) await mergeInto(cs, survivorId, loser, at);
    const after = await touchCounterparty(cs, survivorId, at);
    const eventId = await commitEvent(cs, {
      type: 'merged',
      actor: who.actor,
      at,
      reason: input.reason ?? who.reason,
      requestId: who.requestId,
      details: { survivorId, mergedIds: losers },
    });
    return { eventId, survivorId, mergedIds: losers, version: after.version as number };
  });
}

export interface SplitInput {
  mentionIds: number[];
  /** Move into this counterparty; default a new one named after the first moved mention. */
  targetId?: number;
  expectedVersion?: number;
  /** Why (kept in the history); the actor's reason is used when absent. */
  reason?: string;
}

export interface SplitResult {
  eventId: number;
  sourceId: number;
  targetId: number;
  created: boolean;
  movedMentionIds: number[];
}

export async function splitCounterparty(ctx: RegisterContext, counterpartyId: number, input: SplitInput, who: ActorInput): Promise<SplitResult> {
  if (!Array.isArray(input.mentionIds) || input.mentionIds.length === 0) invalidSplit();
  return write(ctx, async (cs) => {
    const at = ctx.now();
    const iso = at.toISOString();
    const wanted = [counterpartyId, ...(input.targetId !== undefined ? [input.targetId] : [])];
    await lockActive(cs, wanted);
    const sourceId = survivorFor(cs, counterpartyId);
    const source = await cs.require('counterparty', sourceId);
    if (input.expectedVersion !== undefined && input.expectedVersion !== source.version) {
      throw new RegisterError('STALE_VERSION', `counterparty ${sourceId} changed since it was read`, { counterpartyId: sourceId });
    }
    const mentionIds = [...new Set(input.mentionIds)].sort((a, b) => a - b);
    const mentions = await cs.lock('mention', mentionIds);
    for (const id of mentionIds) {
      const m = mentions.find((x) => x.id === id);
      if (!m) throw notFound('mention', id);
      if (m.counterparty_id !== sourceId) throw invalid('mentionIds', `mention ${id} is not linked to counterparty ${sourceId}`);
    }
    let targetId: number;
    let created = false;
    if (input.targetId !== undefined) {
      targetId = survivorFor(cs, input.targetId);
      if (targetId === sourceId) throw invalid('targetId', 'must differ from the counterparty being split');
      await assertNoCannotLinkMentions(cs, targetId, mentionIds);
    } else {
      const first = mentions[0]!;
      const name = (recordedNameOf(first)?.name ?? first.text) as string;
      const cp = await createCounterpartyRow(cs, { name, kind: source.kind as 'organisation', jurisdiction: source.jurisdiction as string | null, at });
      targetId = cp.id as number;
      created = true;
    }
    for (const m of mentions) {
      for (const recorded of recordedNamesOf(m)) {
        await removeNameSighting(cs, sourceId, recorded.name, recorded.kind);
        await addNameSighting(cs, targetId, { name: recorded.name, kind: recorded.kind, source: m.source as string, mentionId: m.id as number }, at);
      }
      await cs.update('mention', m.id as number, {
        counterparty_id: targetId,
        status: 'linked',
        confirmed_by: who.actor,
        updated_at: iso,
      });
    }
    if (created) {
      const names = await cs.trx.selectFrom('counterparty_name').select('id').where('counterparty_id', '=', targetId).executeTakeFirst();
      if (!names) {
        const first = mentions[0]!;
        await addNameSighting(
          cs,
          targetId,
          { name: first.text as string, kind: 'observed', source: first.source as string, mentionId: first.id as number },
          at,
        );
      }
    }
    await touchCounterparty(cs, sourceId, at);
    await touchCounterparty(cs, targetId, at);
    const eventId = await commitEvent(cs, {
      type: 'split',
      actor: who.actor,
      at,
      reason: input.reason ?? who.reason,
      requestId: who.requestId,
      details: { sourceId, targetId, created, mentionIds },
    });
    return { eventId, sourceId, targetId, created, movedMentionIds: mentionIds };
  });
}

function invalidSplit(): never {
  throw invalid('mentionIds', 'name at least one mention to move');
}

async function assertNoCannotLinkMentions(cs: ChangeSet, targetId: number, mentionIds: number[]): Promise<void> {
  for (const mentionId of mentionIds) {
    const links = await cannotLinksOf(cs.trx, [], mentionId);
    const survivors = await survivorsOf(
      cs.trx,
      links.map((l) => l.counterpartyId),
    );
    if (links.some((l) => l.mentionId === mentionId && survivors.get(l.counterpartyId) === targetId)) {
      throw new RegisterError('CANNOT_LINK', `mention ${mentionId} was recorded as not being counterparty ${targetId}`, {
        mentionId,
        counterpartyId: targetId,
      });
    }
  }
}
