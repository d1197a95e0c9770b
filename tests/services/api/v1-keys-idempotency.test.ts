/**
 * POST /v1/keys with an Idempotency-Key: the secret is shown once and stored only as its digest. The stored
 * idempotent answer used to hold the secret in plain text, and a replay within 24 hours showed it again. Now the
 * replay answers that the key was created (id and metadata, `secretWithheld: true`) without the secret, and no
 * text or JSON column of any table in schema public holds it, nor a backup of the database. Labels are invented.
 */
import { spawnSync } from 'node:child_process';
import { afterAll, beforeAll, expect, it } from 'vitest';
import { sql, type Kysely } from 'kysely';
import type { Database } from '../../../db/types.ts';
import { digest } from '../../../services/api/auth/keys.ts';
import { claimIdempotencyKey, SECRET_NOT_STORED, storeIdempotentAnswer } from '../../../services/api/auth/idempotency.ts';
import { describeEachBackend, type TestDatabase } from '../../support/database.ts';
import { dumpEmbedded } from '../../../db/open-database.ts';
import { keyedApp, type KeyedApp } from './support.ts';

type Ctx = { db(): Kysely<Database> };

/** Every (table, column) of schema public whose value is text or JSON. */
async function textColumns(ctx: Ctx): Promise<{ table: string; column: string }[]> {
  const rows = await sql<{ table_name: string; column_name: string }>`
    SELECT c.table_name, c.column_name
    FROM information_schema.columns c
    JOIN information_schema.tables t ON t.table_schema = c.table_schema AND t.table_name = c.table_name AND t.table_type = 'BASE TABLE'
    WHERE c.table_schema = 'public'
      AND (c.data_type IN ('text', 'character varying', 'character', 'json', 'jsonb') OR (c.data_type = 'ARRAY' AND c.udt_name IN ('_text', '_varchar', '_json', '_jsonb')))
    ORDER BY c.table_name, c.column_name`.execute(ctx.db());
  return rows.rows.map((r) => ({ table: r.table_name, column: r.column_name }));
}

/** The `table.column`s in which `needle` occurs (as text, so inside JSON too). */
async function whereFound(ctx: Ctx, needle: string): Promise<string[]> {
  const found: string[] = [];
  for (const { table, column } of await textColumns(ctx)) {
    const hit = await sql<{ n: string }>`SELECT count(*) AS n FROM ${sql.table(table)} WHERE strpos(${sql.ref(column)}::text, ${needle}) > 0`.execute(ctx.db());
    if (Number(hit.rows[0]!.n) > 0) found.push(`${table}.${column}`);
  }
  return found;
}

/** The bytes a backup of this database holds: the embedded data directory archive, or a plain pg_dump. */
async function backupBytes(database: TestDatabase): Promise<Buffer> {
  if (database.backend === 'pglite') return Buffer.from(await (await dumpEmbedded(database)).arrayBuffer());
  const dump = spawnSync('pg_dump', ['--format=plain', '--no-owner', database.url!], { maxBuffer: 512 * 1024 * 1024 });
  if (dump.status !== 0) throw new Error(`pg_dump failed: ${dump.stderr.toString()}`);
  return dump.stdout;
}

describeEachBackend('POST /v1/keys with an Idempotency-Key: the secret is shown once, never stored', (ctx) => {
  let k: KeyedApp;
  beforeAll(async () => {
    k = await keyedApp(ctx.db(), ctx.backend);
  });
  afterAll(async () => {
    await k?.app.close();
  });

  it('replays the creation without the secret, and no table holds the secret', async () => {
    const request = {
      method: 'POST' as const,
      url: '/v1/keys',
      payload: { scope: 'write', label: 'Brackenholt invoice feed' },
      headers: { 'idempotency-key': 'create-key-brackenholt-1' },
    };
    const first = await k.call('admin', request);
    expect(first.statusCode).toBe(201);
    const created = first.json() as { id: string; label: string; scope: string; createdAt: string; secret: string };
    expect(created.secret).toMatch(/^cpreg_k[0-9a-f]{12}_[\w-]{43}$/);
    const secret = created.secret;

    const replay = await k.call('admin', request);
    expect(replay.statusCode).toBe(201);
    expect(replay.headers['idempotent-replayed']).toBe('true');
    expect(replay.headers.location).toBe(`/v1/keys/${created.id}`);
    expect(replay.body).not.toContain(secret);
    const replayed = replay.json() as Record<string, unknown>;
    expect(replayed).not.toHaveProperty('secret');
    expect(replayed).toMatchObject({
      id: created.id,
      label: created.label,
      scope: 'write',
      createdAt: created.createdAt,
      revokedAt: null,
      secretWithheld: true,
    });
    expect(replayed.detail).toContain('shown once');

    // One key was created, and the secret shown the first time works.
    expect(await ctx.db().selectFrom('api_key').select('id').where('label', '=', created.label).execute()).toHaveLength(1);
    expect((await k.app.inject({ method: 'GET', url: '/v1/me', headers: { authorization: `Bearer ${secret}` } })).statusCode).toBe(200);

    // Every text and JSON column of every table in schema public: the secret is nowhere; its digest is in api_key.
    const columns = await textColumns(ctx);
    expect(columns.map((c) => `${c.table}.${c.column}`)).toEqual(expect.arrayContaining(['api_key.secret_hash', 'idempotency_record.response']));
    expect(await whereFound(ctx, secret)).toEqual([]);
    // The random part alone too (a key split or re-encoded would still leak it).
    expect(await whereFound(ctx, secret.slice(secret.lastIndexOf('_') + 1))).toEqual([]);
    // The scan does see the stored answer and the key: it finds what is meant to be there.
    expect(await whereFound(ctx, created.id)).toEqual(expect.arrayContaining(['api_key.id', 'idempotency_record.response']));
    expect(await whereFound(ctx, digest(secret))).toEqual(['api_key.secret_hash']);

    // A backup holds neither: the embedded database's archive (what `cpreg backup --out` gzips, services/backup), or
    // on PostgreSQL what pg_dump writes (docs/operations.md; plain format, so that its text can be searched).
    const backup = await backupBytes(ctx.database());
    expect(backup.includes(created.id)).toBe(true);
    expect(backup.includes(digest(secret))).toBe(true);
    expect(backup.includes(secret)).toBe(false);
    expect(backup.includes(secret.slice(secret.lastIndexOf('_') + 1))).toBe(false);
  });

  it('never stores a whole API key in an idempotent answer, whichever route sent it', async () => {
    const claim = { keyId: 'k000000000001', key: 'stored-answer-guard-1' };
    const leaked = `cpreg_k0123456789ab_${'A'.repeat(43)}`;
    expect((await claimIdempotencyKey(ctx.db(), { ...claim, method: 'POST', path: '/v1/elsewhere', hash: 'h' })).kind).toBe('claimed');
    await storeIdempotentAnswer(ctx.db(), claim, {
      statusCode: 200,
      contentType: 'application/json',
      headers: {},
      body: JSON.stringify({ note: `key ${leaked} here` }),
    });
    const replay = await claimIdempotencyKey(ctx.db(), { ...claim, method: 'POST', path: '/v1/elsewhere', hash: 'h' });
    expect(replay.kind).toBe('replay');
    const body = replay.kind === 'replay' ? replay.answer.body : '';
    expect(JSON.parse(body)).toEqual({ note: `key ${SECRET_NOT_STORED} here` });
    expect(await whereFound(ctx, leaked)).toEqual([]);
  });
});
