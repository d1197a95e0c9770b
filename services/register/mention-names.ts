/**
 * The name a mention contributed to its counterparty, kept in the mention's evidence (`recordedName`), so that
 * moving or withdrawing the mention takes exactly that sighting away again.
 */
import type { NameKind } from '../../resolvers/vocabulary.ts';
import type { Row } from './state/tables.ts';

export interface RecordedName {
  name: string;
  kind: NameKind;
}

export function recordedNameOf(mention: Row): RecordedName | null {
  const evidence = mention.evidence as { recordedName?: RecordedName | null } | null;
  return evidence?.recordedName ?? null;
}
