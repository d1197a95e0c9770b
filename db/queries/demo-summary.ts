/**
 * What the demo's summary reads from the register (services/demo/summarise-demo.ts): every mention's outcome, the
 * number of active contracts, and the counterparties named in the most contracts.
 */
import type { ResolutionStatus } from '../../resolvers/vocabulary.ts';
import { id, idOrNull, type Queryable } from './util.ts';

export interface MentionOutcomeRow {
  source: string;
  external_id: string;
  text: string;
  status: ResolutionStatus;
  counterparty_id: number | null;
  own_entity_id: number | null;
  contract_external_id: string | null;
}

/** Every mention with its outcome (all of them: the demo's register is small). */
export async function mentionOutcomes(db: Queryable): Promise<MentionOutcomeRow[]> {
  const rows = await db
    .selectFrom('mention')
    .select(['source', 'external_id', 'text', 'status', 'counterparty_id', 'own_entity_id', 'contract_external_id'])
    .execute();
  return rows.map((r) => ({ ...r, counterparty_id: idOrNull(r.counterparty_id), own_entity_id: idOrNull(r.own_entity_id) }));
}

export async function countActiveContracts(db: Queryable): Promise<number> {
  const row = await db
    .selectFrom('contract')
    .select((eb) => eb.fn.countAll<string>().as('n'))
    .where('status', '=', 'active')
    .executeTakeFirstOrThrow();
  return Number(row.n);
}

export interface BusiestCounterpartyRow {
  id: number;
  name: string;
  jurisdiction: string | null;
  /** Distinct contracts it is a party of. */
  contracts: number;
  /** Up to four of its contracts' external ids, in external id order. */
  contractIds: string[];
  /** All its mentions, whatever their status. */
  mentions: number;
}

/** The `limit` active counterparties that are parties of the most contracts (ties by id). */
export async function busiestCounterparties(db: Queryable, limit: number): Promise<BusiestCounterpartyRow[]> {
  const top = await db
    .selectFrom('contract_party as p')
    .innerJoin('mention as m', 'm.id', 'p.mention_id')
    .innerJoin('counterparty as c', 'c.id', 'm.counterparty_id')
    .select(['c.id', 'c.canonical_name', 'c.jurisdiction', (eb) => eb.fn.count<string>('p.contract_id').distinct().as('contracts')])
    .where('c.status', '=', 'active')
    .groupBy(['c.id', 'c.canonical_name', 'c.jurisdiction'])
    .orderBy('contracts', 'desc')
    .orderBy('c.id')
    .limit(limit)
    .execute();
  const out: BusiestCounterpartyRow[] = [];
  for (const t of top) {
    const counterpartyId = id(t.id);
    const contracts = await db
      .selectFrom('contract_party as p')
      .innerJoin('mention as m', 'm.id', 'p.mention_id')
      .innerJoin('contract as k', 'k.id', 'p.contract_id')
      .select('k.external_id')
      .distinct()
      .where('m.counterparty_id', '=', counterpartyId)
      .orderBy('k.external_id')
      .limit(4)
      .execute();
    const mentions = await db
      .selectFrom('mention')
      .select((eb) => eb.fn.countAll<string>().as('n'))
      .where('counterparty_id', '=', counterpartyId)
      .executeTakeFirstOrThrow();
    out.push({
      id: counterpartyId,
      name: t.canonical_name,
      jurisdiction: t.jurisdiction,
      contracts: Number(t.contracts),
      contractIds: contracts.map((k) => k.external_id),
      mentions: Number(mentions.n),
    });
  }
  return out;
}
