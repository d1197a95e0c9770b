/**
 * Reviewers' decisions improve the next resolution of like cases, shown on the demo's invented scenario (seed 1).
 *
 * The standard demo (300 contracts) leaves 15 review items; the same scenario at 1,000 contracts leaves more than
 * 50, so a person can work the first 50 of the ranked queue. Each is decided by the scenario's ground truth (the
 * answer a careful reviewer gives: "same" when the candidate is the mention's true counterparty, "not a party" for a
 * signer or a place, else "different"). Then, without any other change:
 *   - a fresh mention written like a decided one (the same name, nothing else known) links at once to the
 *     counterparty the person chose, where before the decisions such a mention went to review;
 *   - resolving the queue's undecided items again links the like cases among them, each to its true counterparty;
 *   - the register's accuracy against the ground truth keeps its precision and gains recall.
 * The rule doing it is services/register/resolve/confirmed-name.ts; the expected values are the scenario's own
 * truth (services/demo/scenario), not figures typed here.
 *
 * One backend (the embedded one, always present): the build stores 1,000 contracts and 2,790 mentions, minutes on a
 * busy machine, so the time limits are generous ceilings that only catch hangs.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { generateScenario, MENTION_SOURCE, type MentionTruth, type Scenario } from '../../../services/demo/scenario/index.ts';
import { summariseDemo, type DemoSummary } from '../../../services/demo/summarise-demo.ts';
import {
  addOwnEntity,
  createRegisterContext,
  decideReview,
  rankOpenReviewItems,
  reresolveOne,
  resolveBatch,
  resolveMention,
  storeContract,
  type RegisterContext,
} from '../../../services/register/index.ts';
import { analyse } from '../../../services/register/matching/analysis.ts';
import { getReviewItem } from '../../../db/queries/review.ts';
import { getMention, type MentionView } from '../../../db/queries/mentions.ts';
import { mentionOutcomes } from '../../../db/queries/demo-summary.ts';
import { openTestDatabase, type TestDatabase } from '../../support/index.ts';

const CONTRACTS = 1000;
const DECIDED = 50;
const BUILD_MS = 30 * 60_000;
const WHO = { actor: 'test:reviewer' };

const normalised = (text: string): string => analyse(text).normalised;

/** What truthOf needs of a mention: as stored, or as db/queries/demo-summary.ts mentionOutcomes reads it. */
type MentionRef = { source: string; externalId: string; text: string; contractExternalId: string | null };

const refOf = (m: MentionView): MentionRef => ({
  source: m.source,
  externalId: m.externalId,
  text: m.text,
  contractExternalId: m.contract?.externalId ?? null,
});

/** The true counterparty (scenario id) of a mention, or its kind when it names none. */
function truthOf(scenario: Scenario, mention: MentionRef): string {
  if (mention.source === MENTION_SOURCE) {
    const t: MentionTruth | undefined = truthByExternalId(scenario).get(mention.externalId);
    return t === undefined ? 'unknown' : t.kind === 'counterparty' ? t.counterpartyId : t.kind;
  }
  // A party read from a contract: the contract's true party written that way, else a signer or another word.
  const contract = scenario.contracts.find((c) => c.externalId === mention.contractExternalId);
  const fold = (s: string) => s.replace(/\s+/g, ' ').trim();
  const party = contract?.parties.find((p) => fold(p.nameInText) === fold(mention.text));
  if (!party) return 'not_a_party';
  return party.ref.kind === 'counterparty' ? party.ref.id : 'own_entity';
}

const truthMaps = new WeakMap<Scenario, Map<string, MentionTruth>>();
function truthByExternalId(scenario: Scenario): Map<string, MentionTruth> {
  let map = truthMaps.get(scenario);
  if (!map) truthMaps.set(scenario, (map = new Map(scenario.mentions.map((m) => [m.input.externalId, m.truth]))));
  return map;
}

/** Each register counterparty's scenario id: the true entity of most of the mentions linked to it automatically. */
async function scenarioIdsOf(ctx: RegisterContext, scenario: Scenario): Promise<Map<number, string>> {
  const votes = new Map<number, Map<string, number>>();
  for (const m of await mentionOutcomes(ctx.db)) {
    if (m.counterparty_id === null || (m.status !== 'linked' && m.status !== 'new')) continue;
    const truth = truthOf(scenario, { source: m.source, externalId: m.external_id, text: m.text, contractExternalId: m.contract_external_id });
    const inner = votes.get(m.counterparty_id) ?? new Map<string, number>();
    inner.set(truth, (inner.get(truth) ?? 0) + 1);
    votes.set(m.counterparty_id, inner);
  }
  return new Map([...votes].map(([cp, inner]) => [cp, [...inner].sort((x, y) => y[1] - x[1])[0]![0]]));
}

describe(`reviewers' decisions on the demo's scenario (seed 1, ${CONTRACTS} contracts)`, () => {
  let database: TestDatabase;
  let ctx: RegisterContext;
  let scenario: Scenario;
  let before: DemoSummary;
  let cpTruth: Map<number, string>;

  beforeAll(async () => {
    database = await openTestDatabase('pglite');
    ctx = createRegisterContext(database.db);
    scenario = generateScenario(1, { contracts: CONTRACTS });
    for (const own of scenario.ownEntities) await addOwnEntity(ctx, { name: own.legalName, country: own.jurisdiction, identifiers: own.identifiers }, WHO);
    for (const c of scenario.contracts) await storeContract(ctx, { source: c.source, externalId: c.externalId, title: c.title, text: c.text }, WHO);
    const inputs = scenario.mentions.map((m) => m.input);
    for (let i = 0; i < inputs.length; i += 250) await resolveBatch(ctx, inputs.slice(i, i + 250), WHO);
    before = await summariseDemo(database.db, scenario);
    cpTruth = await scenarioIdsOf(ctx, scenario);
  }, BUILD_MS);

  afterAll(async () => {
    await database?.close();
  });

  it(
    'settles like cases after the first 50 decisions, without a wrong link',
    async () => {
      const queue = await rankOpenReviewItems(ctx);
      expect(queue.length, 'the scenario at this size must leave more than 50 items').toBeGreaterThan(DECIDED);

      // The first 50 of the ranked queue, decided by the ground truth.
      const confirmed = new Map<string, number>(); // normalised text → counterparty a person linked it to
      const decisions = { same: 0, different: 0, not_a_party: 0 };
      let askedBefore = 0;
      let linkedBefore = 0;
      const decided: { id: number; decision: 'same' | 'different' | 'not_a_party' }[] = [];
      for (const ranked of queue.slice(0, DECIDED)) {
        const item = (await getReviewItem(ctx.db, ranked.id))!;
        expect(item.kind).toBe('mention_link');
        const mention = (await getMention(ctx.db, item.mentionId!))!;
        const truth = truthOf(scenario, refOf(mention));
        const decision = truth === cpTruth.get(item.rightCounterpartyId) ? 'same' : /^cp-/.test(truth) ? 'different' : 'not_a_party';
        decisions[decision]++;
        decided.push({ id: ranked.id, decision });
        const text = normalised(mention.text);
        if (decision !== 'same' || confirmed.has(text)) continue;
        confirmed.set(text, item.rightCounterpartyId);
        // A probe written like this item, before the decisions (the register may already link some of them).
        const probe = await resolveMention(ctx, { source: 'like-case', externalId: `before-${text}`, text: mention.text }, WHO);
        if (probe.status === 'review') askedBefore++;
        if (probe.status === 'linked') linkedBefore++;
      }
      expect(askedBefore, 'like cases a person was asked about before the decisions').toBeGreaterThan(0);
      for (const d of decided) await decideReview(ctx, d.id, { decision: d.decision, reason: 'the scenario ground truth' }, WHO);
      expect(decisions.same, 'the first items hold confirmations to learn from').toBeGreaterThan(0);

      // The same names arriving again: linked at once to the counterparty the person chose, unless another
      // counterparty bears the name too (then a person is still asked: the rule never picks between two).
      let linkedAfter = 0;
      for (const [text, counterpartyId] of confirmed) {
        const probe = await resolveMention(ctx, { source: 'like-case', externalId: `after-${text}`, text }, WHO);
        if (probe.status !== 'linked') continue;
        expect(probe.counterpartyId, text).toBe(counterpartyId);
        linkedAfter++;
      }
      expect(linkedAfter, `like cases linked before the decisions: ${linkedBefore} of ${confirmed.size}`).toBeGreaterThan(linkedBefore);

      // The queue's undecided items resolved again: the like cases among them link, each to its true counterparty.
      const rest = queue.slice(DECIDED);
      let like = 0;
      let likeLinked = 0;
      for (const ranked of rest) {
        const item = (await getReviewItem(ctx.db, ranked.id))!;
        if (item.mentionId === null) continue;
        const mention = (await getMention(ctx.db, item.mentionId))!;
        const isLike = confirmed.get(normalised(mention.text)) === item.rightCounterpartyId;
        const outcome = await reresolveOne(ctx, mention.id, WHO);
        const after = (await getMention(ctx.db, mention.id))!;
        if (after.status === 'linked' || after.status === 'new') {
          expect(cpTruth.get(after.counterpartyId!), `${mention.text} linked to the wrong counterparty`).toBe(truthOf(scenario, refOf(mention)));
        }
        if (isLike) {
          like++;
          if (outcome.changed && after.status === 'linked') likeLinked++;
        }
      }
      expect(like, 'the undecided rest holds like cases').toBeGreaterThan(0);
      expect(likeLinked, `like cases among the ${rest.length} undecided items: ${like}`).toBe(like);

      // Against the ground truth: precision kept, recall gained, the queue shorter by the decided and the like cases.
      const after = await summariseDemo(ctx.db, scenario);
      for (const part of ['mentions', 'contractParties'] as const) {
        expect(after.accuracy[part].pairwise.precision, part).toBeGreaterThanOrEqual(before.accuracy[part].pairwise.precision);
      }
      // The figures, for the notes that quote them (docs/matching.md, "Decisions and like cases").
      console.info(
        JSON.stringify({
          queue: queue.length,
          decisions,
          confirmedNames: confirmed.size,
          probes: { linkedBefore, askedBefore, linkedAfter },
          undecided: { items: rest.length, like, likeLinked },
          precision: [before, after].map((x) => [x.accuracy.mentions.pairwise.precision, x.accuracy.contractParties.pairwise.precision]),
          recall: [before, after].map((x) => [x.accuracy.mentions.pairwise.recall, x.accuracy.contractParties.pairwise.recall]),
          reviewQueue: [before.reviewQueue, after.reviewQueue],
        }),
      );
      const recall = (s: DemoSummary) => s.accuracy.mentions.pairwise.recall + s.accuracy.contractParties.pairwise.recall;
      expect(recall(after)).toBeGreaterThan(recall(before));
      expect(after.reviewQueue).toBeLessThanOrEqual(before.reviewQueue - DECIDED - likeLinked + askedBefore);
    },
    BUILD_MS,
  );
});
