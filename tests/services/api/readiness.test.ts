/**
 * Readiness: a database that answers but whose schema is not at the expected migration (created again empty,
 * restored from an older backup) makes /healthz answer 503 SCHEMA_NOT_READY, and a request that meets a missing
 * table answers the same code instead of 500; after `migrate` the service is ready again without a restart.
 */
import { afterAll, beforeAll, expect, it } from 'vitest';
import { sql } from 'kysely';
import { describeEachBackend } from '../../support/database.ts';
import { createMigrator, migrateToLatest, schemaState } from '../../../db/migrate.ts';
import { keyedApp, type KeyedApp } from './support.ts';

describeEachBackend('readiness follows the schema', (t) => {
  let k: KeyedApp;
  beforeAll(async () => {
    k = await keyedApp(t.db(), t.backend);
  });
  afterAll(async () => {
    await k?.app.close();
  });

  it('healthz says 503 SCHEMA_NOT_READY while a migration is missing, and 200 once migrate ran', async () => {
    expect((await k.app.inject({ method: 'GET', url: '/healthz' })).statusCode).toBe(200);
    const { rows } = await sql<{ name: string }>`SELECT name FROM kysely_migration ORDER BY name DESC LIMIT 1`.execute(t.db());
    // The last migration undone through its own down (as an older backup would leave the schema), so that migrate
    // can apply it again: a migration is not written to run twice over its own tables.
    const { error } = await createMigrator(t.db()).migrateDown();
    expect(error).toBeUndefined();
    expect((await schemaState(t.db())).missing).toEqual([rows[0]!.name]);
    const down = await k.app.inject({ method: 'GET', url: '/healthz' });
    expect(down.statusCode).toBe(503);
    expect(down.headers['content-type']).toMatch(/application\/problem\+json/);
    expect(down.json()).toMatchObject({ code: 'SCHEMA_NOT_READY' });
    expect(down.json().detail).toContain('1 migration(s) not applied');
    expect(down.headers['retry-after']).toBe('5');
    await migrateToLatest(t.db());
    expect((await k.app.inject({ method: 'GET', url: '/healthz' })).statusCode).toBe(200);
  });

  it('a request meeting a missing table answers 503 SCHEMA_NOT_READY, not 500', async () => {
    await sql`DROP TABLE review_item CASCADE`.execute(t.db());
    const answer = await k.call('read', { method: 'GET', url: '/v1/review-items' });
    expect(answer.statusCode, answer.body).toBe(503);
    expect(answer.json()).toMatchObject({ code: 'SCHEMA_NOT_READY' });
  });
});
