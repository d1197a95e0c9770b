/**
 * One counterparty folded into another: its names (twins summed), identifiers (twins dropped), mentions, relations
 * and the open review items between the two move to the survivor, and the loser is marked merged. The step of
 * every merge (merge-counterparties.ts) and of a "same" review decision on a duplicate (review.ts).
 */
import type { ChangeSet } from './state/change-set.ts';
import type { Row } from './state/tables.ts';
import { findNameId } from '../../db/queries/names.ts';

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
