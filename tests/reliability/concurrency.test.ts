/**
 * Concurrency on PostgreSQL: 50 concurrent clients (each its own loop over the register services, sharing one
 * connection pool as the service does) mix resolve, merge, split, undo and review decisions for a bounded time
 * (about 20 s; 120 s under CPREG_LONG=1). Refusals the register is built to give (conflict, undo blocked,
 * already undone…) are counted; any other error fails the run. At the end every acknowledged change is in the
 * history with its type (an undo's target marked undone), and verify (invariants and replay) passes.
 */
import { afterAll, beforeAll, expect, it } from 'vitest';
import {
  createRegisterContext,
  decideReview,
  listReviewItems,
  mergeCounterparties,
  RegisterError,
  resolveMention,
  splitCounterparty,
  undoEvent,
  type RegisterContext,
} from '../../services/register/index.ts';
import { verifyRegister } from '../../services/verify/index.ts';
import { seededRandom, type Random } from '../../resolvers/prng.ts';
import { describePostgres, openTestDatabase, type TestDatabase } from '../support/index.ts';

const LONG = process.env.CPREG_LONG === '1';
const CLIENTS = 50;
const DURATION_MS = LONG ? 120_000 : 20_000;
const WHO = { actor: 'test:concurrency' };

const WORDS = ['Ashcombe', 'Brindle', 'Corvale', 'Dunmere', 'Eskdale', 'Farrow', 'Gildersome', 'Hexley', 'Ingleby', 'Jessop'];
const FORMS = ['Ltd', 'Limited', 'GmbH', 'LLC'];

type Ack = { type: string; eventId: number; undoes?: number };

/**
 * Refusals the register gives by design when clients race (another client merged, split, undid or decided first).
 * TRANSACTION_RETRIES_EXHAUSTED (503) is a capacity answer, not a designed refusal: allowed, but bounded below.
 */
const DESIGNED_REFUSALS = new Set(['UNDO_BLOCKED', 'NOT_FOUND', 'INVALID_INPUT', 'CONFLICT', 'ALREADY_UNDONE', 'CANNOT_LINK']);
const MAX_RETRIES_EXHAUSTED_SHARE = 0.02;

describePostgres('concurrency: 50 clients on PostgreSQL [postgres]', () => {
  let database: TestDatabase;
  let ctx: RegisterContext;
  beforeAll(async () => {
    // 50 clients share 20 connections, so a client may wait for a free one; pg counts that wait toward the
    // connect timeout (5 s by default). On a loaded CI machine the wait passed 5 s and the run failed with
    // "timeout exceeded when trying to connect": this test is about correctness under contention, not
    // capacity, so the wait may be long (the service's own capacity is measured in bench/).
    database = await openTestDatabase('postgres', { poolSize: 20, timeoutMs: 120_000 });
    ctx = createRegisterContext(database.db);
  });
  afterAll(async () => {
    await database?.close();
  });

  async function randomActive(rng: Random, n: number): Promise<number[]> {
    const rows = await database.db.selectFrom('counterparty').select('id').where('status', '=', 'active').orderBy('id', 'desc').limit(60).execute();
    const ids = rows.map((r) => Number(r.id));
    const out = new Set<number>();
    for (let i = 0; i < n * 3 && out.size < n && ids.length > 0; i++) out.add(rng.pick(ids));
    return [...out];
  }

  async function client(id: number, deadline: number, acks: Ack[], refusals: Map<string, number>, failures: string[]): Promise<void> {
    const rng = seededRandom(1000 + id);
    let n = 0;
    while (Date.now() < deadline) {
      const roll = rng.int(100);
      try {
        if (roll < 45) {
          const text = `${rng.pick(WORDS)} ${rng.pick(WORDS)} ${rng.pick(FORMS)}`;
          const r = await resolveMention(ctx, { source: `c${id}`, externalId: String(n++), text }, WHO);
          if (r.eventId !== null) acks.push({ type: 'resolve', eventId: r.eventId });
        } else if (roll < 60) {
          const ids = await randomActive(rng, 2);
          if (ids.length < 2) continue;
          const r = await mergeCounterparties(ctx, { ids, reason: 'concurrency test' }, WHO);
          acks.push({ type: 'merged', eventId: r.eventId });
        } else if (roll < 75) {
          const [cp] = await randomActive(rng, 1);
          if (cp === undefined) continue;
          const mentions = await database.db.selectFrom('mention').select('id').where('counterparty_id', '=', cp).limit(3).execute();
          if (mentions.length < 2) continue;
          const r = await splitCounterparty(ctx, cp, { mentionIds: [Number(mentions[0]!.id)], reason: 'concurrency test' }, WHO);
          acks.push({ type: 'split', eventId: r.eventId });
        } else if (roll < 82) {
          // Undo of an event this client has just made (a new counterparty under a name no one else uses), so
          // that the mix always contains undos that succeed; the branch below undoes others' recent events,
          // which later events often block (a refusal the test counts, not a failure).
          const own = await resolveMention(ctx, { source: `c${id}`, externalId: String(n++), text: `Zerrow${id}x${n} ${rng.pick(FORMS)}` }, WHO);
          if (own.eventId === null) continue;
          acks.push({ type: 'resolve', eventId: own.eventId });
          const r = await undoEvent(ctx, own.eventId, WHO);
          acks.push({ type: 'undone', eventId: r.eventId, undoes: own.eventId });
        } else if (roll < 88) {
          const recent = await database.db
            .selectFrom('history_event')
            .select('id')
            .where('type', 'in', ['merged', 'split', 'linked', 'created'])
            .orderBy('id', 'desc')
            .limit(20)
            .execute();
          if (recent.length === 0) continue;
          const target = Number(rng.pick(recent).id);
          const r = await undoEvent(ctx, target, WHO);
          acks.push({ type: 'undone', eventId: r.eventId, undoes: target });
        } else {
          const items = await listReviewItems(ctx, { limit: 5 });
          if (items.length === 0) continue;
          const item = rng.pick(items);
          const r = await decideReview(ctx, item.id, { decision: rng.chance(0.5) ? 'same' : 'different', reason: 'concurrency test' }, WHO);
          acks.push({ type: 'review_decided', eventId: r.eventId });
        }
      } catch (error) {
        if (error instanceof RegisterError && (DESIGNED_REFUSALS.has(error.code) || error.code === 'TRANSACTION_RETRIES_EXHAUSTED')) {
          refusals.set(error.code, (refusals.get(error.code) ?? 0) + 1);
        } else failures.push(`client ${id}: ${(error as Error).message}`);
      }
    }
  }

  it(
    'every acknowledged change is in the history and verify passes',
    async () => {
      const acks: Ack[] = [];
      const refusals = new Map<string, number>();
      const failures: string[] = [];
      const deadline = Date.now() + DURATION_MS;
      await Promise.all(Array.from({ length: CLIENTS }, (_, i) => client(i, deadline, acks, refusals, failures)));
      expect(failures).toEqual([]);
      // Retries exhausted is bounded: a few under this contention, never a share that would hide a livelock.
      const refused = [...refusals.values()].reduce((a, b) => a + b, 0);
      const attempts = acks.length + refused;
      expect(refusals.get('TRANSACTION_RETRIES_EXHAUSTED') ?? 0).toBeLessThanOrEqual(Math.ceil(attempts * MAX_RETRIES_EXHAUSTED_SHARE));
      // Most operations are acknowledged: refusals by design stay the minority.
      expect(refused).toBeLessThan(acks.length);
      const byType = new Map<string, number>();
      for (const a of acks) byType.set(a.type, (byType.get(a.type) ?? 0) + 1);
      // The mix really happened.
      for (const type of ['resolve', 'merged', 'split', 'undone']) expect(byType.get(type) ?? 0, type).toBeGreaterThan(0);

      const events = await database.db.selectFrom('history_event').select(['id', 'type', 'undoes_event_id']).execute();
      const byId = new Map(events.map((e) => [Number(e.id), e]));
      for (const ack of acks) {
        const event = byId.get(ack.eventId);
        expect(event, `acknowledged ${ack.type} event ${ack.eventId}`).toBeDefined();
        if (ack.type !== 'resolve') expect(event!.type).toBe(ack.type);
        if (ack.undoes !== undefined) expect(Number(event!.undoes_event_id)).toBe(ack.undoes);
      }
      const report = await verifyRegister(database.db);
      expect(report.checks.filter((c) => !c.ok)).toEqual([]);
      process.stdout.write(
        `concurrency: ${CLIENTS} clients, ${DURATION_MS / 1000} s: acknowledged ${JSON.stringify(Object.fromEntries(byType))}, refused ${JSON.stringify(Object.fromEntries(refusals))}, ${report.counts.historyEvents} events replayed\n`,
      );
    },
    DURATION_MS + 240_000,
  );
});
