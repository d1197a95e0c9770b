/**
 * The names a mention contributed to its counterparty, kept in the mention's evidence (`recordedName`, and
 * `recordedAliases`: the other names its contract declared for the party, "formerly X"), so that moving or
 * withdrawing the mention takes exactly those sightings away again.
 */
import type { NameKind } from '../../resolvers/vocabulary.ts';
import type { StateRow } from './state/tables.ts';

export interface RecordedName {
  name: string;
  kind: NameKind;
}

export function recordedNameOf(mention: StateRow<'mention'>): RecordedName | null {
  const evidence = mention.evidence as { recordedName?: RecordedName | null } | null;
  return evidence?.recordedName ?? null;
}

/** The mention's own recorded name and the declared names it brought, in that order. */
export function recordedNamesOf(mention: StateRow<'mention'>): RecordedName[] {
  const evidence = mention.evidence as { recordedAliases?: RecordedName[] | null } | null;
  const own = recordedNameOf(mention);
  return [...(own ? [own] : []), ...(evidence?.recordedAliases ?? [])];
}
