/**
 * The evidence a person reads of a mention or a review item: the body of its explanation (stored once and referenced,
 * db/queries/explanations.ts) with the row's own keys over it (recorded names, conflicts), in jsonb's key order: the
 * object the row held inline before explanations had rows of their own, key for key.
 */
import type { ChangeSet } from './state/change-set.ts';
import { asJsonb } from './state/jsonb-image.ts';
import type { Row, StateRow } from './state/tables.ts';

export function composeEvidence(body: Row | null | undefined, own: unknown): Row {
  return asJsonb({ ...(body ?? {}), ...((own as Row | null) ?? {}) }) as Row;
}

/** The whole evidence of a mention or review item row held by a ChangeSet. */
export async function evidenceOf(cs: ChangeSet, row: StateRow<'mention'> | StateRow<'review_item'>): Promise<Row> {
  const id = row.explanation_id ?? null;
  return composeEvidence(id === null ? null : await cs.explanation(id), row.evidence);
}
