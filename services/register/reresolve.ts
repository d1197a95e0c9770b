/**
 * Re-resolution after thresholds or weights change: every mention that no person confirmed (linked, review, new,
 * unbound_term without confirmed_by) is resolved again under the current model, one transaction per mention.
 * A mention whose outcome stays the same is rolled back untouched (no event); every change is one history event.
 */
import type { ActorInput, RegisterContext } from './context.ts';
import { mentionRow, unconfirmedMentionIds } from '../../db/queries/mentions.ts';
import { partyOfMention } from '../../db/queries/contracts.ts';
import { canonicalRow } from './state/tables.ts';
import { write } from './transaction.ts';
import { prepareMention } from './resolve/prepare.ts';
import { resolveWithin } from './resolve/resolve-mention.ts';

export interface ReresolveSummary {
  examined: number;
  changed: number;
  unchanged: number;
  failed: number;
  /** Final status counts of the changed mentions. */
  byStatus: Record<string, number>;
  errors: { mentionId: number; message: string }[];
}

class Unchanged extends Error {}

export async function reresolveOne(ctx: RegisterContext, mentionId: number, who: ActorInput): Promise<{ changed: boolean; status: string }> {
  try {
    return await write(ctx, async (cs) => {
      const row = await mentionRow(cs.trx, mentionId);
      if (!row) return { changed: false, status: 'missing' };
      const m = canonicalRow('mention', row);
      if (m.confirmed_by || !['linked', 'review', 'new', 'unbound_term'].includes(m.status)) {
        return { changed: false, status: m.status };
      }
      const prepared = prepareMention(
        {
          source: m.source,
          externalId: m.external_id,
          text: m.text,
          ...(m.contract_source ? { contract: { source: m.contract_source, externalId: m.contract_external_id! } } : {}),
          ...(m.role ? { role: m.role } : {}),
          ...(m.country ? { country: m.country } : {}),
          ...(m.address ? { address: m.address } : {}),
          identifiers: m.identifiers,
        },
        { lenientIdentifiers: true },
      );
      const party = await partyOfMention(cs.trx, mentionId);
      const result = await resolveWithin(ctx, cs, prepared, who, {
        force: true,
        cause: 'reresolve',
        ...(party ? { party: { contractId: party.contractId, position: party.position, ownEntity: false } } : {}),
        beforeCommit: async () => {
          const after = await cs.require('mention', mentionId);
          const same = after.status === m.status && after.counterparty_id === m.counterparty_id && after.own_entity_id === m.own_entity_id;
          // A mention that made its counterparty ("new") and now links to that same one has not moved: counting it
          // as a change reported most of a fresh register changed and wrote an event for each.
          const stillItsOwn = m.status === 'new' && after.status === 'linked' && after.counterparty_id === m.counterparty_id;
          // Same outcome: roll the whole transaction back so that nothing (not even a sighting count) changes.
          if (same || stillItsOwn) throw new Unchanged();
        },
      });
      return { changed: true, status: result.status };
    });
  } catch (error) {
    if (error instanceof Unchanged) return { changed: false, status: 'unchanged' };
    throw error;
  }
}

export async function reresolve(
  ctx: RegisterContext,
  who: ActorInput,
  options: { batchSize?: number; onProgress?: (summary: ReresolveSummary) => void } = {},
): Promise<ReresolveSummary> {
  const summary: ReresolveSummary = { examined: 0, changed: 0, unchanged: 0, failed: 0, byStatus: {}, errors: [] };
  let after = 0;
  for (;;) {
    const ids = await unconfirmedMentionIds(ctx.db, after, options.batchSize ?? 500);
    if (ids.length === 0) break;
    for (const id of ids) {
      summary.examined++;
      try {
        const r = await reresolveOne(ctx, id, who);
        if (r.changed) {
          summary.changed++;
          summary.byStatus[r.status] = (summary.byStatus[r.status] ?? 0) + 1;
        } else summary.unchanged++;
      } catch (error) {
        summary.failed++;
        if (summary.errors.length < 100) summary.errors.push({ mentionId: id, message: (error as Error).message });
      }
    }
    after = ids[ids.length - 1]!;
    options.onProgress?.(summary);
  }
  return summary;
}
