/** An identifier added to a counterparty inside a ChangeSet; a strong one held elsewhere is refused. */
import { isStrongScheme } from '../../resolvers/vocabulary.ts';
import type { ChangeSet } from './state/change-set.ts';
import type { StateRow } from './state/tables.ts';
import { RegisterError } from './errors.ts';
import { holdersOf } from '../../db/queries/identifiers.ts';
import type { NormalisedIdentifier } from './normalise-identifier-or-throw.ts';

/** Adds an identifier; a strong one already held by another active counterparty is refused, naming it. */
export async function addIdentifierRow(
  cs: ChangeSet,
  counterpartyId: number,
  identifier: NormalisedIdentifier,
  origin: { source?: string | null; mentionId?: number | null; confirmedBy?: string | null },
  at: Date,
): Promise<StateRow<'counterparty_identifier'> | undefined> {
  // Read ahead with a chunk's locks (batch-write.ts), kept in step with this ChangeSet's writes; else read now:
  // the stored holders, then those added in this ChangeSet's buffer (not written yet).
  const holders = cs.prefetched.holdersOf(identifier) ?? [
    ...(await holdersOf(cs.trx, [identifier])).map((h) => h.counterpartyId),
    ...cs.unwritten('counterparty_identifier').flatMap((r) => (r.scheme === identifier.scheme && r.value === identifier.value ? [r.counterparty_id] : [])),
  ];
  if (holders.includes(counterpartyId)) return undefined;
  const strong = isStrongScheme(identifier.scheme);
  if (strong && holders.length > 0) {
    const other = holders[0]!;
    throw new RegisterError(
      'IDENTIFIER_TAKEN',
      `${identifier.scheme} ${identifier.value} already belongs to counterparty ${other}; merge the two if they are one entity`,
      { scheme: identifier.scheme, value: identifier.value, counterpartyId: other },
    );
  }
  return cs.insert('counterparty_identifier', {
    counterparty_id: counterpartyId,
    scheme: identifier.scheme,
    value: identifier.value,
    label: identifier.label ?? null,
    strong,
    source: origin.source ?? null,
    mention_id: origin.mentionId ?? null,
    confirmed_by: origin.confirmedBy ?? null,
    created_at: at.toISOString(),
  });
}
