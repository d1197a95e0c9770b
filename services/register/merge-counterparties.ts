/**
 * Merge: two or more counterparties into one survivor, as one history event (undone like any event: history/undo.ts).
 * Refused across a cannot-link or between two different LEIs.
 */
import type { ActorInput, RegisterContext } from './context.ts';
import { RegisterError, invalid, notFound } from './errors.ts';
import { commitRequested } from './history/commit.ts';
import { lockActive, survivorFor } from './lock-active.ts';
import { touchCounterparty } from './touch-counterparty.ts';
import type { ChangeSet } from './state/change-set.ts';
import { write } from './transaction.ts';
import { assertNoCannotLink } from './assert-no-cannot-link.ts';
import { mergeInto } from './merge-into.ts';
import { leisOf } from '../../db/queries/identifiers.ts';

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

/** Refuses two different LEIs: an LEI names exactly one legal entity (ISO 17442). */
async function assertCompatibleIdentifiers(cs: ChangeSet, ids: number[]): Promise<void> {
  const rows = await leisOf(cs.trx, ids);
  const values = new Set(rows.map((r) => r.value));
  if (values.size > 1) {
    throw new RegisterError('CONFLICT', `the counterparties hold different LEIs (${[...values].join(', ')}): they are different legal entities`, {
      counterpartyIds: ids,
    });
  }
}

export async function mergeCounterparties(ctx: RegisterContext, input: MergeInput, who: ActorInput): Promise<MergeResult> {
  if (!Array.isArray(input.ids) || input.ids.length < 2) throw invalid('ids', 'name at least two counterparties to merge');
  return write(ctx, async (cs) => {
    const at = ctx.now();
    const requested = [...new Set(input.ids)];
    if (input.expectedVersions) {
      const rows = await cs.lock('counterparty', requested);
      for (const row of rows) {
        const expected = input.expectedVersions[row.id];
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
    const eventId = await commitRequested(cs, 'merged', who, at, { survivorId, mergedIds: losers }, input.reason ?? who.reason);
    return { eventId, survivorId, mergedIds: losers, version: after.version };
  });
}
