/**
 * The demo's summary (see run-demo.ts): the register read back after loading the scenario, with the accuracy of its
 * outcomes measured against the scenario's ground truth, for the extracted mentions and for the parties read from
 * the contract texts.
 */
import type { Kysely } from 'kysely';
import type { Database } from '../../db/types.ts';
import { countActive, survivorsOf } from '../../db/queries/counterparties.ts';
import {
  busiestCounterparties,
  countActiveContracts,
  mentionOutcomes,
  type BusiestCounterpartyRow,
  type MentionOutcomeRow,
} from '../../db/queries/demo-summary.ts';
import { listOwnEntities } from '../../db/queries/own-entities.ts';
import { countOpenReviewItems } from '../../db/queries/review.ts';
import { PARTY_SOURCE_PREFIX } from '../register/index.ts';
import type { ResolutionStatus } from '../../resolvers/vocabulary.ts';
import { MENTION_SOURCE, type MentionTruth, type Scenario } from './scenario/index.ts';
import { measureAccuracy, type DemoAccuracy, type EvaluatedMention, type ObservedMention } from './accuracy.ts';
import type { VendorMasterSummary } from './run-demo-vendors.ts';

/** A counterparty named in many contracts (db/queries/demo-summary.ts says what each figure counts). */
export type BusyCounterparty = BusiestCounterpartyRow;

export interface DemoSummary {
  seed: number;
  group: string;
  counterparties: number;
  /** How many counterparties the scenario really has (its ground truth). */
  truthCounterparties: number;
  ownEntities: number;
  contracts: number;
  /** The extracted mentions loaded by batch ingest, by status. */
  mentions: { total: number; byStatus: Partial<Record<ResolutionStatus, number>> };
  /** The parties the register read from the contract texts, by status. */
  contractParties: { total: number; byStatus: Partial<Record<ResolutionStatus, number>> };
  busiest: BusyCounterparty[];
  reviewQueue: number;
  /** The vendor master reconciled against the register; null when it was not reconciled. */
  vendorMaster: VendorMasterSummary | null;
  accuracy: {
    /** Extracted mentions (batch ingest) against their ground truth. */
    mentions: DemoAccuracy;
    /** Parties read from the contract texts against the contracts' true parties (matched by the name as written). */
    contractParties: DemoAccuracy & { found: number; expected: number; extra: number };
  };
}

type MentionRow = MentionOutcomeRow;

export interface SummariseOptions {
  /**
   * Reconciles the vendor master (run-demo-vendors.ts), given each scenario counterparty's register id (the
   * register counterparty holding most of its automatically linked mentions).
   */
  vendorMaster?: (registerIdOf: ReadonlyMap<string, number>) => Promise<VendorMasterSummary>;
}

export async function summariseDemo(db: Kysely<Database>, scenario: Scenario, options: SummariseOptions = {}): Promise<DemoSummary> {
  const rows: MentionRow[] = await mentionOutcomes(db);
  const survivors = await survivorsOf(
    db,
    rows.flatMap((r) => (r.counterparty_id === null ? [] : [Number(r.counterparty_id)])),
  );
  const ownRows = await listOwnEntities(db, { includeRemoved: true });
  const ownRef = new Map<number, string>();
  for (const r of ownRows) {
    const match = scenario.ownEntities.find((o) => o.legalName === r.name);
    if (match) ownRef.set(Number(r.id), match.id);
  }
  const observe = (r: MentionRow): ObservedMention => ({
    status: r.status,
    counterpartyId: r.counterparty_id === null ? null : (survivors.get(Number(r.counterparty_id)) ?? Number(r.counterparty_id)),
    ownEntityRef: r.own_entity_id === null ? null : (ownRef.get(Number(r.own_entity_id)) ?? null),
  });

  const extracted = rows.filter((r) => r.source === MENTION_SOURCE);
  const bySourceId = new Map(extracted.map((r) => [r.external_id, r]));
  const mentionItems: EvaluatedMention[] = scenario.mentions.map((m) => {
    const row = bySourceId.get(m.input.externalId);
    return { truth: m.truth, style: m.style, observed: row ? observe(row) : undefined };
  });

  const partyRows = rows.filter((r) => r.source.startsWith(PARTY_SOURCE_PREFIX));
  const parties = contractPartyItems(scenario, partyRows, observe);

  const vendorMaster = options.vendorMaster ? await options.vendorMaster(registerIds([...mentionItems, ...parties.items])) : null;
  const [counterparties, contracts, review] = await Promise.all([countActive(db), countActiveContracts(db), countOpenReviewItems(db)]);
  return {
    seed: scenario.seed,
    group: scenario.group.name,
    counterparties,
    truthCounterparties: scenario.counterparties.length,
    ownEntities: ownRows.length,
    contracts,
    mentions: { total: extracted.length, byStatus: countStatuses(extracted) },
    contractParties: { total: partyRows.length, byStatus: countStatuses(partyRows) },
    busiest: await busiestCounterparties(db, 5),
    reviewQueue: review,
    vendorMaster,
    accuracy: {
      mentions: measureAccuracy(mentionItems),
      contractParties: { ...measureAccuracy(parties.items), found: parties.found, expected: parties.expected, extra: parties.extra },
    },
  };
}

/** Each true counterparty's register id: the counterparty holding most of its automatically linked mentions. */
function registerIds(items: readonly EvaluatedMention[]): Map<string, number> {
  const votes = new Map<string, Map<number, number>>();
  for (const item of items) {
    const o = item.observed;
    if (item.truth.kind !== 'counterparty' || !o || o.counterpartyId === null || (o.status !== 'linked' && o.status !== 'new')) continue;
    const inner = votes.get(item.truth.counterpartyId) ?? new Map<number, number>();
    inner.set(o.counterpartyId, (inner.get(o.counterpartyId) ?? 0) + 1);
    votes.set(item.truth.counterpartyId, inner);
  }
  const out = new Map<string, number>();
  for (const [truthId, inner] of votes) {
    const best = [...inner].sort((a, b) => b[1] - a[1] || a[0] - b[0])[0]!;
    out.set(truthId, best[0]);
  }
  return out;
}

function countStatuses(rows: readonly MentionRow[]): Partial<Record<ResolutionStatus, number>> {
  const out: Partial<Record<ResolutionStatus, number>> = {};
  for (const r of rows) out[r.status] = (out[r.status] ?? 0) + 1;
  return out;
}

/**
 * The contract parties the register read, paired with the contracts' true parties by the name as written
 * (whitespace folded). A true party the register did not read is a miss; a party it read that is no true
 * party (a signer, a place) is judged as a mention that should not have become a counterparty.
 */
function contractPartyItems(
  scenario: Scenario,
  partyRows: readonly MentionRow[],
  observe: (r: MentionRow) => ObservedMention,
): { items: EvaluatedMention[]; found: number; expected: number; extra: number } {
  const fold = (s: string): string => s.replace(/\s+/g, ' ').trim();
  const byContract = new Map<string, MentionRow[]>();
  for (const r of partyRows) {
    const key = r.contract_external_id ?? '';
    const list = byContract.get(key) ?? [];
    list.push(r);
    byContract.set(key, list);
  }
  const items: EvaluatedMention[] = [];
  let found = 0;
  let expected = 0;
  let extra = 0;
  for (const c of scenario.contracts) {
    const read = [...(byContract.get(c.externalId) ?? [])];
    for (const party of c.parties) {
      expected++;
      const truth: MentionTruth =
        party.ref.kind === 'counterparty' ? { kind: 'counterparty', counterpartyId: party.ref.id } : { kind: 'own_entity', ownEntityId: party.ref.id };
      const at = read.findIndex((r) => fold(r.text) === fold(party.nameInText));
      if (at < 0) {
        items.push({ truth });
        continue;
      }
      found++;
      items.push({ truth, observed: observe(read[at]!) });
      read.splice(at, 1);
    }
    for (const r of read) {
      extra++;
      items.push({ truth: { kind: 'not_a_party', reason: 'signer' }, observed: observe(r) });
    }
  }
  return { items, found, expected, extra };
}
