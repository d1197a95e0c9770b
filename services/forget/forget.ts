/**
 * Erasure of a natural person: every name, identifier value, mention text and address of one counterparty
 * (and of the ids merged into it) is replaced by a pseudonym in the register AND in the history, the one
 * permitted rewrite of the append-only history. Structure stays: ids, links, contracts, roles and counts are
 * untouched, so the register still adds up and `verify` (replay included) still passes.
 *
 * Why rewrite the history too: the history holds row images (names, identifiers) that would otherwise keep
 * the person readable forever. The same replacement is applied to the state rows and to the history
 * images, so that replaying the rewritten history gives the rewritten register exactly.
 *
 * Mentions that name the person without being linked to them — a review-queue mention with the person as its
 * candidate, an unlinked "J. Smith" — are erased with the linked ones (person-mentions.ts), with their history
 * events and review items.
 *
 * The erasure is recorded as a `forgotten` event carrying no personal data (the ids and how many rows and
 * events were rewritten); it cannot be undone (the register refuses to).
 */
import { randomBytes } from 'node:crypto';
import type { Transaction } from 'kysely';
import type { Database } from '../../db/types.ts';
import { write } from '../register/transaction.ts';
import { RegisterError } from '../register/errors.ts';
import type { ActorInput, RegisterContext } from '../register/context.ts';
import { STATE_TABLES } from '../register/state/tables.ts';
import type { Op } from '../register/state/change-set.ts';
import { mentionsNamingPerson } from './person-mentions.ts';
import { counterpartyRedirects } from '../../db/queries/invariant-reads.ts';
import { insertHistoryEvent } from '../../db/queries/history.ts';
import { mentionIdsOfCounterparties, namesOfCounterparties } from '../../db/queries/erasure-reads.ts';
import { collectSecrets } from './collect-secrets.ts';
import { replacer } from './secrets.ts';
import { rebuildKeys, rewriteTable } from './rewrite-table.ts';
import { rewriteExplanations, rewriteHistory } from './rewrite-history.ts';
import { rewriteStoredAnswers } from './rewrite-stored-answers.ts';

export interface ForgetOptions {
  /** Allow erasing a counterparty recorded as an organisation (default: refused; the right applies to persons). */
  allowOrganisation?: boolean;
}

export interface ForgetResult {
  eventId: number;
  counterpartyId: number;
  /** The counterparty ids erased: the one asked for, its survivor and every id merged into it. */
  counterpartyIds: number[];
  pseudonym: string;
  /** State rows rewritten per table. */
  rows: Record<string, number>;
  /** History events whose payload was rewritten. */
  events: number;
  /** Idempotency records and job rows whose stored answers were rewritten. */
  storedAnswers: number;
  /** Mentions erased that were not linked to the person (review-queue mentions naming them; person-mentions.ts). */
  unlinkedMentions: number;
}

export async function forgetCounterparty(ctx: RegisterContext, counterpartyId: number, who: ActorInput, options: ForgetOptions = {}): Promise<ForgetResult> {
  return write(ctx, async (cs) => {
    const trx = cs.trx;
    const cluster = await clusterOf(trx, counterpartyId);
    const rows = await cs.lock('counterparty', cluster);
    const survivor = rows.find((r) => r.status === 'active');
    if (!survivor) throw new RegisterError('NOT_FOUND', `counterparty ${counterpartyId} does not exist`, { counterpartyId });
    if (survivor.kind === 'organisation' && !options.allowOrganisation) {
      throw new RegisterError(
        'CONFLICT',
        `counterparty ${counterpartyId} is recorded as an organisation; erasure is for natural persons (pass allowOrganisation / --organisation to erase it anyway)`,
        { counterpartyId },
      );
    }
    const token = randomBytes(4).toString('hex').toUpperCase();
    const pseudonym = `Forgotten Person ${token}`;
    const linkedIds = await mentionIdsOfCounterparties(trx, cluster);
    // Mentions that name the person without being linked to them (the review queue): erased with the rest.
    const namingIds = await mentionsNamingPerson(trx, cluster, await namesOfCounterparties(trx, cluster));
    const mentionIds = [...new Set([...linkedIds, ...namingIds])].sort((a, b) => a - b);
    const unlinkedMentions = mentionIds.length - linkedIds.length;
    const secrets = await collectSecrets(trx, cluster, mentionIds, pseudonym, token);
    const replace = replacer(secrets);

    const rowCounts: Record<string, number> = {};
    for (const table of STATE_TABLES) {
      const changed = await rewriteTable(trx, table, cluster, mentionIds, secrets, replace);
      if (changed.length > 0) rowCounts[table] = changed.length;
      if (table === 'counterparty_name') await rebuildKeys(trx, changed, ctx);
    }
    const events = await rewriteHistory(trx, cluster, mentionIds, secrets, replace);
    const explanations = await rewriteExplanations(trx, secrets, replace);
    if (explanations > 0) rowCounts.explanation = explanations;
    const storedAnswers = await rewriteStoredAnswers(trx, secrets, replace);

    const at = ctx.now();
    const details = { counterpartyId: Number(survivor.id), counterpartyIds: cluster, pseudonym, rows: rowCounts, events, storedAnswers, unlinkedMentions };
    const eventId = await insertHistoryEvent(trx, {
      type: 'forgotten',
      actor: who.actor,
      at: at.toISOString(),
      reason: who.reason ?? null,
      payload: JSON.stringify({ details, ops: [] satisfies Op[] }),
      counterparty_ids: cluster,
      mention_ids: [],
      undoes_event_id: null,
      request_id: who.requestId ?? null,
    });
    return { eventId, ...details };
  });
}

/** The survivor of `id` and every counterparty whose redirect chain ends in it. */
async function clusterOf(trx: Transaction<Database>, id: number): Promise<number[]> {
  const all = await counterpartyRedirects(trx);
  const next = new Map(all.map((r) => [r.id, r.mergedInto]));
  if (!next.has(id)) return [];
  const end = (start: number): number => {
    let at = start;
    for (let hops = 0; hops <= next.size; hops++) {
      const to = next.get(at);
      if (to === null || to === undefined) return at;
      at = to;
    }
    return at;
  };
  const survivor = end(id);
  return [...next.keys()].filter((k) => end(k) === survivor).sort((a, b) => a - b);
}
