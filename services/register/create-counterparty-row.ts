/** A new counterparty row, inside a ChangeSet, and its values (shared with the bulk loader's COPY). */
import type { ChangeSet } from './state/change-set.ts';
import type { StateRow, StateValues } from './state/tables.ts';

export interface NewCounterparty {
  name: string;
  kind?: 'organisation' | 'person' | 'unknown';
  jurisdiction?: string | null;
  at: Date;
}

/** The values of a new counterparty row (without its id): what createCounterpartyRow inserts, and the bulk loader's COPY. */
export function counterpartyValues(values: NewCounterparty): StateValues<'counterparty'> {
  const at = values.at.toISOString();
  return {
    canonical_name: values.name,
    kind: values.kind ?? 'organisation',
    jurisdiction: values.jurisdiction ?? null,
    status: 'active',
    merged_into: null,
    name_locked_by: null,
    version: 1,
    created_at: at,
    updated_at: at,
  };
}

export async function createCounterpartyRow(cs: ChangeSet, values: NewCounterparty): Promise<StateRow<'counterparty'>> {
  return cs.insert('counterparty', counterpartyValues(values));
}
