/**
 * Re-resolution after thresholds or weights change: every mention that no person confirmed (linked, review, new,
 * unbound_term without confirmed_by) is resolved again under the current model, one transaction per mention.
 * A mention whose outcome stays the same is rolled back untouched (no event); every change is one history event.
 *
 * What counts as the same outcome, so that a run with unchanged settings over a register the batch built changes
 * nothing it has no new reason to change:
 * - `new` and `linked` on one counterparty are one outcome: `new` only says the mention's text created it. Writing
 *   it anyway took the mention's name sightings away and added them back as new name rows, which moved the oldest
 *   name and so the canonical name (a typo variant seen as often took over).
 * - A mention that created its counterparty (status `new`) is not matched against that counterparty: the
 *   counterparty is made of its own name, so it always scores it as an exact name, and for a short person's name
 *   that is below linkAt, which sent the mention to review about itself and its contract's other mentions with it.
 *   It moves only when another counterparty now links (at or above linkAt); when another one only comes close, it
 *   stays (the two counterparties are a duplicate question, which `sweep` files for a person).
 */
import type { ActorInput, RegisterContext } from './context.ts';
import { mentionById, unconfirmedMentionIds } from '../../db/queries/mentions.ts';
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

type Outcome = { status: string; counterparty_id: number | null; own_entity_id: number | null };
const onCounterparty = (status: string): boolean => status === 'new' || status === 'linked';

/** Whether the re-decision keeps the mention where it is (see the file header); `created`: the counterparty it created. */
export function sameOutcome(before: Outcome, after: Outcome, created: number | null): boolean {
  if (after.own_entity_id !== before.own_entity_id) return false;
  if (after.status === before.status && after.counterparty_id === before.counterparty_id) return true;
  if (onCounterparty(before.status) && onCounterparty(after.status) && after.counterparty_id === before.counterparty_id) return true;
  // Its own counterparty was left out of the candidates: a new counterparty or a review answers "no other one links".
  return created !== null && (after.status === 'new' || after.status === 'review');
}

export async function reresolveOne(ctx: RegisterContext, mentionId: number, who: ActorInput): Promise<{ changed: boolean; status: string }> {
  try {
    return await write(ctx, async (cs) => {
      const row = await mentionById(cs.trx, mentionId);
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
      const created = m.status === 'new' && m.counterparty_id !== null ? m.counterparty_id : null;
      const result = await resolveWithin(ctx, cs, prepared, who, {
        force: true,
        cause: 'reresolve',
        ...(party ? { party: { contractId: party.contractId, position: party.position, ownEntity: false } } : {}),
        ...(created !== null ? { exclude: [created] } : {}),
        beforeCommit: async () => {
          // Same outcome: roll the whole transaction back so that nothing (not even a sighting count) changes.
          if (sameOutcome(m, await cs.require('mention', mentionId), created)) throw new Unchanged();
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
