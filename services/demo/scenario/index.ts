/**
 * The demo scenario: our invented group, its counterparties, a few hundred contracts in varied drafting
 * styles, the party mentions extracted from them and an ERP vendor master, all with ground truth.
 * Pure and deterministic: the same seed gives the same scenario (writeScenario in ../write-scenario.ts
 * puts it on disk).
 */
import { seededRandom, type Random } from '../../../resolvers/prng.ts';
import { countryOf } from '../name-parts.ts';
import { DEFAULT_COUNTERPARTY_PLAN, GROUP_NAME, inventCounterparties, ownGroup, type CounterpartyPlan } from './entities.ts';
import { partyFromCounterparty, partyFromOwn, writeContract } from './contracts.ts';
import { mentionsOfContract } from './mentions.ts';
import { buildVendorMaster } from './vendors.ts';
import type { OwnEntity, Scenario, ScenarioContract, ScenarioCounterparty } from './types.ts';

export type * from './types.ts';
export { DRAFTING_STYLES, MENTION_STYLES } from './types.ts';
export { CONTRACT_SOURCE } from './contracts.ts';
export { MENTION_SOURCE, splitLegalName } from './mentions.ts';
export { VENDOR_COLUMNS } from './vendors.ts';
export { GROUP_NAME } from './entities.ts';

export interface ScenarioOptions {
  contracts?: number;
  counterparties?: Partial<CounterpartyPlan>;
  vendorOnly?: number;
}

export function generateScenario(seed = 1, options: ScenarioOptions = {}): Scenario {
  const contractCount = options.contracts ?? 300;
  const plan = { ...DEFAULT_COUNTERPARTY_PLAN, ...options.counterparties };
  if (contractCount < plan.total) {
    throw new RangeError(`contracts: need at least one contract per counterparty (${plan.total}), got ${contractCount}`);
  }
  // Separate streams, so that a change in one part does not reshuffle the others.
  const rnd = (stream: number): Random => seededRandom((seed * 1_000_003 + stream) >>> 0);
  const ownEntities = ownGroup(rnd(1));
  const counterparties = inventCounterparties(rnd(2), plan);
  const contracts = writeContracts(rnd(3), ownEntities, counterparties, contractCount);
  const lookup = { counterparties: new Map(counterparties.map((c) => [c.id, c])), ownEntities: new Map(ownEntities.map((e) => [e.id, e])) };
  const mentionRnd = rnd(4);
  const mentions = contracts.flatMap((c) => mentionsOfContract(c, lookup, mentionRnd));
  const vendorMaster = buildVendorMaster(rnd(5), counterparties, options.vendorOnly ?? 24);
  return { seed, group: { name: GROUP_NAME }, ownEntities, counterparties, contracts, mentions, vendorMaster };
}

/** Our entity that signs with a counterparty: the one in its country, else the US company for US
 * counterparties, the Dutch one for other EU countries, the top company for the rest. */
function ownFor(c: ScenarioCounterparty, own: OwnEntity[]): OwnEntity {
  const country = countryOf(c.jurisdiction);
  const local = own.find((e) => countryOf(e.jurisdiction) === country);
  if (local) return local;
  if (['SE', 'IT', 'ES'].includes(country)) return own.find((e) => e.jurisdiction === 'NL')!;
  return own[0]!;
}

function writeContracts(rnd: Random, own: OwnEntity[], counterparties: ScenarioCounterparty[], count: number): ScenarioContract[] {
  // Every counterparty signs at least once; the rest follow a skewed popularity so that some are busy.
  const order = shuffled(counterparties, rnd);
  const weights = order.map((_, rank) => 1 / (rank + 1) ** 0.9);
  const total = weights.reduce((a, b) => a + b, 0);
  const chooseBusy = (): ScenarioCounterparty => {
    let x = rnd.next() * total;
    for (let i = 0; i < order.length; i++) {
      x -= weights[i]!;
      if (x < 0) return order[i]!;
    }
    return order[order.length - 1]!;
  };
  const assigned = [...shuffled(counterparties, rnd), ...Array.from({ length: count - counterparties.length }, chooseBusy)];
  const byId = new Map(counterparties.map((c) => [c.id, c]));
  const contracts: ScenarioContract[] = [];
  const start = Date.UTC(2019, 0, 1);
  const span = Date.UTC(2025, 5, 30) - start;
  const dated = assigned.map((c) => ({ c, date: new Date(start + Math.floor(rnd.next() * (span / 86_400_000)) * 86_400_000) }));
  dated.sort((a, b) => a.date.getTime() - b.date.getTime());
  dated.forEach(({ c, date }, i) => {
    const others = [partyFromCounterparty(c, rnd)];
    // A subsidiary's contract is sometimes guaranteed by its parent: a three-party contract.
    const parent = c.parentId ? byId.get(c.parentId) : undefined;
    if (parent && rnd.chance(0.5)) others.push(partyFromCounterparty(parent, rnd));
    const externalId = `CTR-${date.getUTCFullYear()}-${String(i + 1).padStart(4, '0')}`;
    contracts.push(writeContract({ externalId, date, own: partyFromOwn(ownFor(c, own), rnd), others }, rnd));
  });
  return contracts;
}

function shuffled<T>(items: readonly T[], rnd: Random): T[] {
  const out = [...items];
  for (let i = out.length - 1; i > 0; i--) {
    const j = rnd.int(i + 1);
    [out[i], out[j]] = [out[j]!, out[i]!];
  }
  return out;
}
