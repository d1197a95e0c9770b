/**
 * Crash safety of the service: `cpreg serve` on PostgreSQL is killed with SIGKILL at five seeded points while
 * eight clients merge and split over HTTP; it is started again each time. Every change the service acknowledged
 * (2xx with an event id) is in the history with its type, and verify (invariants and replay) passes: a killed
 * request left nothing half-done.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createApiKey } from '../../services/api/auth/keys.ts';
import { createRegisterContext, resolveMention } from '../../services/register/index.ts';
import { verifyRegister } from '../../services/verify/index.ts';
import { seededRandom, type Random } from '../../resolvers/prng.ts';
import { childEnv, startServe } from '../support/cli.ts';
import { isBackendAvailable, openTestDatabase, type TestDatabase } from '../support/index.ts';

const KILLS = 5;
const CLIENTS = 8;
const WORDS = ['Wrenfield', 'Oxcombe', 'Tillmarsh', 'Quenby', 'Harcourt', 'Bellsworth', 'Ravensby', 'Mistley'];

(isBackendAvailable('postgres') ? describe : describe.skip)('crash safety: service killed with SIGKILL mid-merge and mid-split [postgres]', () => {
  let database: TestDatabase;
  let key: string;
  beforeAll(async () => {
    database = await openTestDatabase('postgres');
    key = (await createApiKey(database.db, { scope: 'admin', label: 'crash service test' })).secret;
    const ctx = createRegisterContext(database.db);
    // Counterparties with two mentions each (something to split), distinct enough to stay apart.
    for (let i = 0; i < 60; i++) {
      const text = `${WORDS[i % WORDS.length]} ${WORDS[Math.floor(i / WORDS.length) % WORDS.length]} Works ${i} Ltd`;
      await resolveMention(ctx, { source: 'seed', externalId: `${i}-a`, text }, { actor: 'test' });
      await resolveMention(ctx, { source: 'seed', externalId: `${i}-b`, text }, { actor: 'test' });
    }
  }, 180_000);
  afterAll(async () => {
    await database?.close();
  });

  async function pickActive(rng: Random, n: number): Promise<{ id: number; version: number }[]> {
    const rows = await database.db.selectFrom('counterparty').select(['id', 'version']).where('status', '=', 'active').execute();
    const out = new Map<number, { id: number; version: number }>();
    for (let i = 0; i < n * 4 && out.size < n && rows.length > 0; i++) {
      const r = rng.pick(rows);
      out.set(Number(r.id), { id: Number(r.id), version: Number(r.version) });
    }
    return [...out.values()];
  }

  it(`every acknowledged merge and split survives ${KILLS} kills, and verify passes`, async () => {
    const rng = seededRandom(77);
    const acks: { type: string; eventId: number }[] = [];
    const kills: { afterMs: number; acknowledgedSoFar: number }[] = [];
    for (let k = 0; k < KILLS; k++) {
      const service = await startServe(['--db', database.url!, '--port', '0', '--db-timeout', '5000'], { env: childEnv({ CPREG_RATE_LIMIT_PER_MINUTE: 'off' }) });
      let stop = false;
      const post = async (path: string, body: unknown) => {
        const res = await fetch(`${service.url}${path}`, { method: 'POST', headers: { authorization: `Bearer ${key}`, 'content-type': 'application/json' }, body: JSON.stringify(body), signal: AbortSignal.timeout(20_000) });
        return { status: res.status, body: (await res.json()) as { eventId?: number } };
      };
      const worker = async (w: number) => {
        const wr = seededRandom(k * 100 + w);
        while (!stop) {
          try {
            if (wr.chance(0.5)) {
              const pair = await pickActive(wr, 2);
              if (pair.length < 2) continue;
              const res = await post('/v1/counterparties/merge', { items: pair.map((p) => ({ id: p.id, etag: `"cp${p.id}.v${p.version}"` })), reason: 'crash test' });
              if (res.status < 300 && res.body.eventId) acks.push({ type: 'merged', eventId: res.body.eventId });
            } else {
              const [cp] = await pickActive(wr, 1);
              if (!cp) continue;
              const mentions = await database.db.selectFrom('mention').select('id').where('counterparty_id', '=', cp.id).limit(2).execute();
              if (mentions.length < 2) continue;
              const res = await post(`/v1/counterparties/${cp.id}/split`, { mentionIds: [Number(mentions[0]!.id)], reason: 'crash test' });
              if (res.status < 300 && res.body.eventId) acks.push({ type: 'split', eventId: res.body.eventId });
            }
          } catch {
            // the service was killed under this request: unacknowledged, so it may or may not have happened
          }
        }
      };
      const workers = Array.from({ length: CLIENTS }, (_, w) => worker(w));
      const waitMs = 1500 + rng.int(2500);
      await new Promise((r) => setTimeout(r, waitMs));
      await service.stop('SIGKILL');
      stop = true;
      await Promise.all(workers);
      kills.push({ afterMs: waitMs, acknowledgedSoFar: acks.length });
    }
    expect(acks.length).toBeGreaterThan(0);
    const events = await database.db.selectFrom('history_event').select(['id', 'type']).execute();
    const byId = new Map(events.map((e) => [Number(e.id), e.type]));
    for (const ack of acks) expect(byId.get(ack.eventId), `acknowledged ${ack.type} ${ack.eventId}`).toBe(ack.type);
    const report = await verifyRegister(database.db);
    expect(report.checks.filter((c) => !c.ok)).toEqual([]);
    const types = { merged: acks.filter((a) => a.type === 'merged').length, split: acks.filter((a) => a.type === 'split').length };
    process.stdout.write(`crash-service: kills ${JSON.stringify(kills)}, acknowledged ${JSON.stringify(types)}, ${report.counts.historyEvents} events replayed\n`);
  }, 300_000);
});
