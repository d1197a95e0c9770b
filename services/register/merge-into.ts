/**
 * One counterparty folded into another: its names (twins summed), identifiers (twins dropped), mentions, relations
 * and the open review items between the two move to the survivor, and the loser is marked merged. The step of
 * every merge (merge-counterparties.ts) and of a "same" review decision on a duplicate (review.ts). Each read
 * follows the moves before it (a twin found among rows moved from an earlier loser), so it reads after a flush.
 */
import type { ChangeSet } from './state/change-set.ts';
import type { StateValues } from './state/tables.ts';
import { findNameId, nameRowsOf } from '../../db/queries/names.ts';
import { findIdentifierId, identifierRowsOf } from '../../db/queries/identifiers.ts';
import { mentionIdsOfCounterparty } from '../../db/queries/mentions.ts';
import { findOtherRelation, relationRowsTouching } from '../../db/queries/relations.ts';
import { openItemsBetween } from '../../db/queries/review.ts';

/** Moves everything of `loserId` onto `survivorId` and marks the loser merged. Both must be locked. */
export async function mergeInto(cs: ChangeSet, survivorId: number, loserId: number, at: Date): Promise<void> {
  const iso = at.toISOString();
  const names = await nameRowsOf(await cs.flushed(), loserId);
  for (const n of names) {
    const twin = await findNameId(await cs.flushed(), survivorId, n.name, n.kind);
    const row = await cs.require('counterparty_name', n.id);
    if (twin !== undefined) {
      const keep = await cs.require('counterparty_name', twin);
      const patch: StateValues<'counterparty_name'> = { seen_count: keep.seen_count + row.seen_count };
      if (!keep.confirmed_by && row.confirmed_by) patch.confirmed_by = row.confirmed_by;
      await cs.update('counterparty_name', twin, patch);
      await cs.delete('counterparty_name', n.id);
    } else {
      await cs.update('counterparty_name', n.id, { counterparty_id: survivorId });
    }
  }
  const identifiers = await identifierRowsOf(await cs.flushed(), loserId);
  for (const i of identifiers) {
    const twin = await findIdentifierId(await cs.flushed(), survivorId, i.scheme, i.value);
    await cs.require('counterparty_identifier', i.id);
    if (twin !== undefined) await cs.delete('counterparty_identifier', i.id);
    else await cs.update('counterparty_identifier', i.id, { counterparty_id: survivorId });
  }
  const mentionIds = await mentionIdsOfCounterparty(await cs.flushed(), loserId);
  await cs.lock('mention', mentionIds);
  for (const m of mentionIds) await cs.update('mention', m, { counterparty_id: survivorId, updated_at: iso });
  const relations = await relationRowsTouching(await cs.flushed(), loserId);
  for (const r of relations) {
    const from = r.from_counterparty_id === loserId ? survivorId : r.from_counterparty_id;
    const to = r.to_counterparty_id === loserId ? survivorId : r.to_counterparty_id;
    await cs.require('counterparty_relation', r.id);
    const duplicate = from !== to && (await findOtherRelation(await cs.flushed(), from, to, r.type, r.id)) !== undefined;
    // A relation between the two merged records, or one the survivor already has, has nothing left to say.
    if (from === to || duplicate) await cs.delete('counterparty_relation', r.id);
    else await cs.update('counterparty_relation', r.id, { from_counterparty_id: from, to_counterparty_id: to });
  }
  // Open review items between the two are answered by the merge itself.
  for (const item of await openItemsBetween(await cs.flushed(), survivorId, loserId)) {
    await cs.require('review_item', item);
    await cs.update('review_item', item, { status: 'obsolete' });
  }
  const loser = await cs.require('counterparty', loserId);
  await cs.update('counterparty', loserId, {
    status: 'merged',
    merged_into: survivorId,
    version: loser.version + 1,
    updated_at: iso,
  });
  cs.aliases.set(loserId, survivorId);
}
