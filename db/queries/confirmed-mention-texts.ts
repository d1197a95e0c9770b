/**
 * The texts of the mentions a person linked to one counterparty (a review decision "same", or a split that moved
 * them there: `confirmed_by` set, status linked). A merge moves mentions to the survivor, so the survivor's id finds
 * the texts its merged counterparties were confirmed with too. Read by the confirmed-name rule
 * (services/register/resolve/confirmed-name.ts) only when a decision would otherwise ask a person.
 */
import type { Queryable } from './util.ts';

export interface ConfirmedMentionText {
  mentionId: number;
  text: string;
  confirmedBy: string;
}

/** At most `limit` of them, oldest first: a counterparty with more confirmed texts than that is not scanned further. */
export async function confirmedMentionTexts(db: Queryable, counterpartyId: number, limit = 500): Promise<ConfirmedMentionText[]> {
  const rows = await db
    .selectFrom('mention')
    .select(['id', 'text', 'confirmed_by'])
    .where('counterparty_id', '=', counterpartyId)
    .where('status', '=', 'linked')
    .where('confirmed_by', 'is not', null)
    .orderBy('id')
    .limit(limit)
    .execute();
  return rows.map((r) => ({ mentionId: Number(r.id), text: r.text, confirmedBy: r.confirmed_by ?? '' }));
}
