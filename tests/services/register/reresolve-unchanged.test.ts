/**
 * reresolve over a register the batch built, with the settings unchanged (issue 17 item 9): it changes no outcome,
 * degrades no canonical name and leaves a person's counterparty its mentions. Built like the demo: contracts stored
 * first (their party mentions decided one by one), then the extracted mentions as one batch, some of them a party's
 * name in another letter case that the contract binds, one a typo. All names are invented.
 */
import { beforeAll, expect, it } from 'vitest';
import { describeEachBackend } from '../../support/index.ts';
import { verifyRegister } from '../../../services/verify/verify.ts';
import { writeSettings } from '../../../db/queries/settings.ts';
import { addName, renameCounterparty, reresolve, resolveBatch, storeContract, type RegisterContext } from '../../../services/register/index.ts';
import { sameOutcome } from '../../../services/register/reresolve.ts';
import { WHO, contextFor } from './support.ts';

const CONTRACTS = [
  {
    externalId: 'RU-1',
    text: 'This Consultancy Agreement is made between Quillmere Optics Ltd, a company incorporated in England (the "Client"), and Maren Tolvik (the "Consultant").',
  },
  {
    externalId: 'RU-2',
    text: 'This Supply Agreement is made between Brisworth Agritech Inc., a Delaware corporation (the "Supplier"), and Quillmere Optics Ltd (the "Customer").',
  },
  {
    externalId: 'RU-3',
    text: 'This Services Agreement is made between Carnholt Water Systems, Inc., a Texas corporation (the "Contractor"), and Quillmere Optics Ltd (the "Client").',
  },
];

// The extracted mentions, as the demo's extraction gives them: the person's name typed in lower case inside the
// contract that names her, a typo of a company's name, and a company in capitals and with its legal form in capitals.
const EXTRACTED = [
  { externalId: 'RU-1/2', text: 'maren tolvik', contract: 'RU-1' },
  { externalId: 'RU-4/1', text: 'Brisworth Agritecb Inc.' },
  { externalId: 'RU-5/1', text: 'CARNHOLT WATER SYSTEMS, INC.' },
  { externalId: 'RU-6/1', text: 'Carnholt Water Systems, INC.' },
  { externalId: 'RU-7/1', text: 'CARNHOLT WATER SYSTEMS, INC.' },
];

describeEachBackend('reresolve with unchanged settings', (t) => {
  let ctx: RegisterContext;
  beforeAll(async () => {
    ctx = contextFor(t.db());
    for (const c of CONTRACTS) await storeContract(ctx, { source: 'clm', externalId: c.externalId, text: c.text }, WHO);
    await resolveBatch(
      ctx,
      EXTRACTED.map((m) => ({
        source: 'extraction',
        externalId: m.externalId,
        text: m.text,
        ...(m.contract ? { contract: { source: 'clm', externalId: m.contract } } : {}),
      })),
      WHO,
    );
  });

  const outcomes = () => t.db().selectFrom('mention').select(['id', 'text', 'status', 'counterparty_id', 'own_entity_id']).orderBy('id').execute();
  const counterparties = () => t.db().selectFrom('counterparty').select(['id', 'canonical_name', 'status']).orderBy('id').execute();
  const names = () => t.db().selectFrom('counterparty_name').select(['id', 'counterparty_id', 'name', 'seen_count']).orderBy('id').execute();
  const counterpartyOf = async (text: string) => (await outcomes()).find((m) => m.text === text)!.counterparty_id;

  it('the register holds what the scenario planted before the run', async () => {
    const person = await counterpartyOf('Maren Tolvik');
    expect(person).not.toBeNull();
    expect(await counterpartyOf('maren tolvik')).toBe(person);
    expect(await counterpartyOf('Brisworth Agritecb Inc.')).toBe(await counterpartyOf('Brisworth Agritech Inc.'));
    expect(await counterpartyOf('Carnholt Water Systems, INC.')).toBe(await counterpartyOf('Carnholt Water Systems, Inc.'));
    const canonical = (await counterparties()).map((c) => c.canonical_name);
    expect(canonical).toEqual(expect.arrayContaining(['Maren Tolvik', 'Brisworth Agritech Inc.', 'Carnholt Water Systems, Inc.']));
    // The mentions that created their counterparty are `new`: the case reresolve used to count as a change.
    expect((await outcomes()).filter((m) => m.status === 'new').length).toBeGreaterThan(0);
  });

  it('changes no outcome, no canonical name and no name row; the person keeps her mentions; verify finds nothing', async () => {
    const before = { outcomes: await outcomes(), counterparties: await counterparties(), names: await names() };
    const summary = await reresolve(ctx, WHO);
    expect(summary).toMatchObject({ changed: 0, failed: 0 });
    expect(summary.examined).toBe(before.outcomes.length);
    expect(await outcomes()).toEqual(before.outcomes);
    expect(await counterparties()).toEqual(before.counterparties);
    expect(await names()).toEqual(before.names);
    const person = await counterpartyOf('Maren Tolvik');
    expect((await outcomes()).filter((m) => m.counterparty_id === person).map((m) => m.text)).toEqual(['Maren Tolvik', 'maren tolvik']);
    const report = await verifyRegister(t.db());
    expect(report.checks.filter((c) => !c.ok)).toEqual([]);
    expect(report.checks.map((c) => c.check)).toContain('canonical_name_rule');
  });

  it('after a threshold change it moves what no person decided, and keeps the names a person chose', async () => {
    const brisworth = (await counterpartyOf('Brisworth Agritech Inc.'))!;
    const carnholt = (await counterpartyOf('Carnholt Water Systems, Inc.'))!;
    await renameCounterparty(ctx, brisworth, { name: 'Brisworth Agritech, Inc.' }, WHO);
    await addName(ctx, carnholt, { name: 'CARNHOLT WATER SYSTEMS INC', kind: 'legal' }, WHO);
    const chosen = (await counterparties()).filter((c) => c.id === brisworth || c.id === carnholt).map((c) => c.canonical_name);
    expect(chosen).toEqual(['Brisworth Agritech, Inc.', 'CARNHOLT WATER SYSTEMS INC']);
    // Nothing links any more (linkAt far above any name score): the linked mentions go to review.
    await writeSettings(t.db(), { linkAt: 1000, newAt: 0, weights: {}, updatedBy: WHO.actor });
    try {
      const summary = await reresolve(ctx, WHO);
      expect(summary.failed).toBe(0);
      expect(summary.byStatus.review).toBeGreaterThan(0);
      const after = (await counterparties()).filter((c) => c.id === brisworth || c.id === carnholt).map((c) => c.canonical_name);
      expect(after).toEqual(chosen);
      const report = await verifyRegister(t.db(), { replay: false });
      expect(report.checks.filter((c) => !c.ok)).toEqual([]);
    } finally {
      await t.db().deleteFrom('matcher_settings').execute();
    }
  });
});

// The rule reresolve applies to tell a change from the same outcome (services/register/reresolve.ts).
it('sameOutcome: new and linked on one counterparty are one outcome; a creator stays unless linked elsewhere', () => {
  const at = (status: string, counterparty_id: number | null, own_entity_id: number | null = null) => ({ status, counterparty_id, own_entity_id });
  expect(sameOutcome(at('new', 4), at('linked', 4), null)).toBe(true);
  expect(sameOutcome(at('linked', 4), at('linked', 5), null)).toBe(false);
  expect(sameOutcome(at('linked', 4), at('review', null), null)).toBe(false);
  expect(sameOutcome(at('review', null), at('linked', 4), null)).toBe(false);
  expect(sameOutcome(at('new', 4), at('review', null), 4)).toBe(true);
  expect(sameOutcome(at('new', 4), at('new', 9), 4)).toBe(true);
  expect(sameOutcome(at('new', 4), at('linked', 5), 4)).toBe(false);
  expect(sameOutcome(at('new', 4), at('own_entity', null, 2), 4)).toBe(false);
});
