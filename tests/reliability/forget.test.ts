/**
 * Erasure of a natural person: after `forget`, none of the person's names, identifier values, mention texts
 * or addresses is left anywhere in the register, its history, stored idempotent answers or job rows; the
 * structure (ids, links, contracts, counts) is unchanged; the replay still equals the register (verify);
 * the erasure is one `forgotten` event that cannot be undone; the route is admin-only.
 * Every name, IBAN and phone here is invented; the IBAN is the ISO 13616 example format with a valid
 * check (GB82 WEST 1234 5698 7654 32, the example of the IBAN registry, "from memory"), the phone is in
 * London's drama range 020 7946 0xxx (Ofcom's numbers reserved for fiction, from memory).
 */
import { insertChunk, insertJob, insertPartitions } from '../../db/queries/jobs.ts';
import { sql, type Kysely } from 'kysely';
import { beforeAll, expect, it } from 'vitest';
import type { Database } from '../../db/types.ts';
import {
  createCounterparty,
  createRegisterContext,
  mergeCounterparties,
  resolveMention,
  setAsideMention,
  undoEvent,
  type RegisterContext,
} from '../../services/register/index.ts';
import { storeContract } from '../../services/register/contracts.ts';
import { forgetCounterparty } from '../../services/forget/index.ts';
import { verifyRegister } from '../../services/verify/index.ts';
import { describeEachBackend } from '../support/index.ts';
import { keyedApp } from '../services/api/support.ts';

const WHO = { actor: 'test:forget' };
const PERSON = 'Ottilie Vandersnoot';
const IBAN = 'GB82WEST12345698765432';
const PHONE = '+442079460123';
const ADDRESS = '14 Quillet Lane, Marrowby';

/** Everything stored, as text: every state table, the history and its explanations, idempotency records and jobs. */
async function everything(db: Kysely<Database>): Promise<string> {
  const parts: string[] = [];
  for (const table of [
    'counterparty',
    'counterparty_name',
    'counterparty_identifier',
    'blocking_key',
    'mention',
    'contract',
    'defined_term',
    'contract_party',
    'review_item',
    'labelled_pair',
    'cannot_link',
    'counterparty_relation',
    'history_event',
    'explanation',
    'idempotency_record',
    'job',
    'job_chunk',
    'job_partition',
  ]) {
    const rows = await sql<{ j: string }>`SELECT row_to_json(t)::text AS j FROM ${sql.table(table)} t`.execute(db);
    parts.push(...rows.rows.map((r) => r.j));
  }
  return parts.join('\n');
}

async function structure(db: Kysely<Database>) {
  const mentions = await db.selectFrom('mention').select(['id', 'status', 'counterparty_id', 'contract_id']).orderBy('id').execute();
  const cps = await db.selectFrom('counterparty').select(['id', 'status', 'merged_into']).orderBy('id').execute();
  const parties = await db.selectFrom('contract_party').select(['contract_id', 'mention_id', 'role']).orderBy('id').execute();
  const ids = await db.selectFrom('counterparty_identifier').select(['id', 'counterparty_id', 'scheme']).orderBy('id').execute();
  return { mentions, cps, parties, ids };
}

describeEachBackend('forget a person', (t) => {
  let ctx: RegisterContext;
  let personId: number;
  let otherId: number;
  beforeAll(async () => {
    ctx = createRegisterContext(t.db());
    personId = (await createCounterparty(ctx, { name: PERSON, kind: 'person', identifiers: [{ scheme: 'iban', value: IBAN }] }, WHO)).counterpartyId;
    const first = await resolveMention(
      ctx,
      {
        source: 'crm',
        externalId: 'p1',
        text: PERSON,
        address: ADDRESS,
        identifiers: [
          { scheme: 'iban', value: 'GB82 WEST 1234 5698 7654 32' },
          { scheme: 'phone', value: PHONE },
        ],
      },
      WHO,
    );
    expect(first).toMatchObject({ status: 'linked', counterpartyId: personId });
    // A second record of the same person, merged in: the erasure covers every id merged into the survivor.
    const second = await createCounterparty(
      ctx,
      { name: `Dr ${PERSON}`, kind: 'person', identifiers: [{ scheme: 'email_domain', value: 'vandersnoot-family.example' }] },
      WHO,
    );
    await mergeCounterparties(ctx, { ids: [personId, second.counterpartyId], survivorId: personId }, WHO);
    await storeContract(
      ctx,
      {
        source: 'dms',
        externalId: 'c1',
        title: 'Consulting agreement',
        text: `This agreement is made between Harrowgate Lantern Works Ltd ("the Client") and ${PERSON} ("the Consultant").`,
      },
      WHO,
    );
    otherId = (await createCounterparty(ctx, { name: 'Harrowgate Lantern Works Ltd', kind: 'organisation' }, WHO)).counterpartyId;
    // A partitioned job still under way holds the person in its staged rows and in a partition's input.
    const jobId = await insertJob(t.db(), { kind: 'ingest', actor: 'test', status: 'running', params: { partitioned: true } });
    await insertChunk(t.db(), jobId, 0, [{ line: 1, mention: { source: 'upload', externalId: 'u1', text: PERSON, address: ADDRESS } }]);
    await insertPartitions(t.db(), jobId, [
      [{ line: 2, mention: { source: 'upload', externalId: 'u2', text: `${PERSON} (sole trader)`, identifiers: [{ scheme: 'phone', value: PHONE }] } }],
    ]);
  });

  it('leaves none of the personal values anywhere, keeps the structure, records one forgotten event, verify passes', async () => {
    const before = await structure(t.db());
    const text = await everything(t.db());
    // The planted values are really there before (otherwise the test could not fail).
    for (const value of [PERSON, `Dr ${PERSON}`, IBAN, PHONE, ADDRESS, 'vandersnoot-family.example']) expect(text).toContain(value);

    const result = await forgetCounterparty(ctx, personId, { ...WHO, reason: 'erasure request 7' });
    expect(result.counterpartyId).toBe(personId);
    expect(result.pseudonym).toMatch(/^Forgotten Person [0-9A-F]{8}$/);
    expect(result.events).toBeGreaterThan(0);

    const after = await everything(t.db());
    // Case-insensitive: a folded or upper-cased copy (a blocking key, a normalised column) is the person still.
    const folded = after.toLowerCase();
    for (const value of [PERSON, IBAN, 'GB82 WEST 1234 5698 7654 32', PHONE, ADDRESS, 'Vandersnoot', 'vandersnoot-family.example'])
      expect(folded, value).not.toContain(value.toLowerCase());
    expect(after).toContain(result.pseudonym);
    // The other party of the contract keeps its name.
    expect(after).toContain('Harrowgate Lantern Works Ltd');
    expect(await structure(t.db())).toEqual(before);
    const cp = await t.db().selectFrom('counterparty').select('canonical_name').where('id', '=', personId).executeTakeFirstOrThrow();
    expect(cp.canonical_name).toBe(result.pseudonym);

    const event = await t.db().selectFrom('history_event').selectAll().where('id', '=', result.eventId).executeTakeFirstOrThrow();
    expect(event.type).toBe('forgotten');
    expect(event.reason).toBe('erasure request 7');
    await expect(undoEvent(ctx, result.eventId, WHO)).rejects.toMatchObject({ code: 'NOT_UNDOABLE' });

    const report = await verifyRegister(t.db());
    expect(report.checks.filter((c) => !c.ok)).toEqual([]);
  });

  it('also erases review-queue mentions that name the person without being linked: by initial and surname, or pointing at them as a candidate', async () => {
    const name = 'Bartholomew Quenneville';
    const id = (await createCounterparty(ctx, { name, kind: 'person' }, WHO)).counterpartyId;
    // "B. Quenneville" waits in the review queue with the person as its candidate (an open review item).
    const initial = await resolveMention(ctx, { source: 'crm', externalId: 'q1', text: 'B. Quenneville', address: '3 Tollard Steps, Marrowby' }, WHO);
    expect(initial).toMatchObject({ status: 'review', counterpartyId: null });
    // "Quenneville, B." was set aside by a reviewer: no open item points at the person, only its text names them.
    const reversed = await resolveMention(ctx, { source: 'crm', externalId: 'q2', text: 'Quenneville, B.' }, WHO);
    await setAsideMention(ctx, reversed.mentionId, WHO);
    // A company with the same surname, a record of its own: never touched.
    const company = await resolveMention(ctx, { source: 'erp', externalId: 'q3', text: 'Quenneville Freight Ltd' }, WHO);
    expect(company.counterpartyId).not.toBeNull();
    const before = await everything(t.db());
    for (const value of ['B. Quenneville', 'Quenneville, B.', '3 Tollard Steps']) expect(before).toContain(value);

    const result = await forgetCounterparty(ctx, id, { ...WHO, reason: 'erasure request 9' });
    expect(result.unlinkedMentions).toBe(2);
    const after = await everything(t.db());
    for (const value of ['B. Quenneville', 'Quenneville, B.', '3 Tollard Steps', name]) expect(after.toLowerCase(), value).not.toContain(value.toLowerCase());
    // What still holds the surname is the company's own record (its rows, its blocking keys) and nothing else
    // (folded, so no copy escapes).
    const holders = after.split('\n').filter((line) => line.toLowerCase().includes('quenneville'));
    expect(holders.length).toBeGreaterThan(0);
    for (const line of holders)
      expect(line.toLowerCase().includes('quenneville freight') || line.includes(`"counterparty_id":${company.counterpartyId},`), line.slice(0, 200)).toBe(
        true,
      );
    // The review item is still there for a person to decide, now between two pseudonymised records.
    const item = await t
      .db()
      .selectFrom('review_item')
      .select(['status', 'right_counterparty_id'])
      .where('mention_id', '=', initial.mentionId)
      .executeTakeFirstOrThrow();
    expect(item).toMatchObject({ status: 'open', right_counterparty_id: id });
    const mention = await t.db().selectFrom('mention').select('text').where('id', '=', initial.mentionId).executeTakeFirstOrThrow();
    expect(mention.text).toMatch(/^Forgotten Person [0-9A-F]{8}/);
    const report = await verifyRegister(t.db());
    expect(report.checks.filter((c) => !c.ok)).toEqual([]);
  });

  it('refuses an organisation unless asked, and a missing id', async () => {
    await expect(forgetCounterparty(ctx, otherId, WHO)).rejects.toMatchObject({ code: 'CONFLICT', message: expect.stringContaining('organisation') });
    await expect(forgetCounterparty(ctx, 99_999_999, WHO)).rejects.toMatchObject({ code: 'NOT_FOUND' });
  });

  it('POST /v1/counterparties/{id}/forget is admin-only and answers the erasure', async () => {
    const { app, call } = await keyedApp(t.db(), t.backend);
    try {
      const id = (
        await createCounterparty(ctx, { name: 'Wilhelmina Crabtree-Oddy', kind: 'person', identifiers: [{ scheme: 'phone', value: '+442079460456' }] }, WHO)
      ).counterpartyId;
      expect((await call(null, { method: 'POST', url: `/v1/counterparties/${id}/forget`, payload: {} })).statusCode).toBe(401);
      const denied = await call('write', { method: 'POST', url: `/v1/counterparties/${id}/forget`, payload: {} });
      expect(denied.statusCode).toBe(403);
      expect(denied.headers['content-type']).toMatch(/application\/problem\+json/);
      const done = await call('admin', { method: 'POST', url: `/v1/counterparties/${id}/forget`, payload: { reason: 'request 8' } });
      expect(done.statusCode).toBe(200);
      expect(done.json()).toMatchObject({ counterpartyId: id, pseudonym: expect.stringMatching(/^Forgotten Person /) });
      const text = await everything(t.db());
      for (const value of ['Wilhelmina Crabtree-Oddy', 'Crabtree', '+442079460456']) expect(text.toLowerCase(), value).not.toContain(value.toLowerCase());
      const missing = await call('admin', { method: 'POST', url: '/v1/counterparties/98765432/forget', payload: {} });
      expect(missing.statusCode).toBe(404);
      expect(missing.headers['content-type']).toMatch(/application\/problem\+json/);
    } finally {
      await app.close();
    }
  });
});
