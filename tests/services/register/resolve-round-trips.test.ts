/**
 * A single resolve reads what its decision needs once: our own entities, the candidates, and the token counts with
 * the register's size in one statement (services/register/matching/idf.ts, batch-reads.ts). Counted here are the
 * statements a resolve sends through Kysely (BEGIN and COMMIT are driver calls and not counted), and which of them
 * read token rarity. The figures are this register's own, counted when the reads were folded (not from a source):
 * the point is that each rarity read happens once, and that a resolve that links or asks takes four statements: the
 * locks with the stored mention, the settings, our own entities and the ids of the rows it may add; the candidates
 * with the token counts and the register's size; the row locks of the counterparty it links or asks about; the
 * write, which draws the event's id (11 before they were first folded, 5 before the stored mention joined the
 * locks). One that creates a counterparty locks no row, and its write draws the counterparty's id: three. Names
 * are invented.
 */
import { expect, it } from 'vitest';
import { describeBackends, withTestDatabase } from '../../support/index.ts';
import { addOwnEntity, createRegisterContext, resolveMention } from '../../../services/register/index.ts';
import { StatementLog, WHO } from './support.ts';

const isRarityRead = (statement: string) => statement.includes("c.key = 't:' || t.token");
const isCandidateRead = (statement: string) => statement.includes('WITH q AS');
const isSizeRead = (statement: string) => /max\(id\)/i.test(statement);

describeBackends('single resolve round trips', (backend) => {
  it('reads token counts and the register size once, in one statement, with an own entity to check', async () => {
    await withTestDatabase(backend, async ({ db }) => {
      const setup = createRegisterContext(db);
      await addOwnEntity(setup, { name: 'Harlowe Group Holdings plc', country: 'GB' }, WHO);
      for (const [i, text] of ['Brackwater Pumps Ltd', 'Brackwater Valves Ltd', 'Ostlund Mill AB'].entries()) {
        await resolveMention(setup, { source: 'seed', externalId: String(i), text }, WHO);
      }
      const log = new StatementLog();
      const ctx = createRegisterContext(db.withPlugin(log));
      const result = await resolveMention(ctx, { source: 'rt', externalId: '1', text: 'Brackwater Pumps Limited' }, WHO);
      expect(result.status).toBe('linked');
      const rarity = log.statements.filter(isRarityRead);
      expect({ rarity: rarity.length, size: log.statements.filter(isSizeRead).length }).toEqual({ rarity: 1, size: 1 });
      expect(isSizeRead(rarity[0]!)).toBe(true);
      expect(isCandidateRead(rarity[0]!)).toBe(true);
      // 14 statements when each rarity read was two statements and ran once per check (own entity, candidates).
      // 5 when the stored mention was read by a statement of its own before the locks.
      expect(log.statements.length).toBe(4);
      const first = log.statements[0]!;
      expect([/pg_advisory_xact_lock/, /FROM mention m/, /matcher_settings/, /own_entity/].filter((re) => !re.test(first))).toEqual([]);
      expect(log.statements.filter((s) => /FOR UPDATE/.test(s) && /nextval/.test(s))).toHaveLength(1);
      // The event's id, drawn in the write, is the id of the event stored for this resolve.
      const event = await db.selectFrom('history_event').select(['id', 'mention_ids']).where('id', '=', result.eventId!).executeTakeFirstOrThrow();
      expect(event.mention_ids.map(Number)).toContain(result.mentionId);
    });
  });

  it('takes three statements for a new counterparty and four for a review, and links a later mention to the first', async () => {
    await withTestDatabase(backend, async ({ db }) => {
      const setup = createRegisterContext(db);
      await resolveMention(setup, { source: 'seed', externalId: '1', text: 'Quorrelby Dyeworks GmbH', country: 'DE' }, WHO);
      const log = new StatementLog();
      const ctx = createRegisterContext(db.withPlugin(log));
      const created = await resolveMention(ctx, { source: 'rt', externalId: 'n', text: 'Vantmoor Sailcloth Ltd', country: 'GB' }, WHO);
      expect(created.status).toBe('new');
      // Four before the counterparty's id was drawn by the write (the third statement drew it alone).
      expect(log.statements.length).toBe(3);
      expect(log.statements.filter((s) => /FOR UPDATE/.test(s))).toHaveLength(0);
      // The id the write drew is the stored counterparty's, in its rows and in its event.
      const mention = await db.selectFrom('mention').select('counterparty_id').where('id', '=', created.mentionId).executeTakeFirstOrThrow();
      expect(Number(mention.counterparty_id)).toBe(created.counterpartyId);
      const names = await db.selectFrom('counterparty_name').select('counterparty_id').where('counterparty_id', '=', created.counterpartyId!).execute();
      expect(names.length).toBeGreaterThan(0);
      const event = await db.selectFrom('history_event').select(['counterparty_ids', 'payload']).where('id', '=', created.eventId!).executeTakeFirstOrThrow();
      expect(event.counterparty_ids.map(Number)).toEqual([created.counterpartyId]);
      expect(JSON.stringify(event.payload)).not.toMatch(/45035996\d{8}/);
      log.statements.length = 0;
      // An abbreviated word with nothing else known: between newAt and linkAt (see the built-in model's weights).
      const asked = await resolveMention(ctx, { source: 'rt', externalId: 'r', text: 'Quorrelby Dyew.' }, WHO);
      expect(asked.status).toBe('review');
      expect(log.statements.length).toBe(4);
      const again = await resolveMention(ctx, { source: 'rt', externalId: 'l', text: 'VANTMOOR SAILCLOTH LIMITED', country: 'GB' }, WHO);
      expect(again).toMatchObject({ status: 'linked', counterpartyId: created.counterpartyId });
    });
  });
});
