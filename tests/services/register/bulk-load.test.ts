/**
 * The bulk loader (services/register/bulk-load.ts) through COPY on PostgreSQL leaves exactly what its statement
 * path leaves: the state tables row for row, the blocking keys and their counts, the history events (ids, ops,
 * every column), a history that replays into an empty database, and an undo that takes a chunk back the same way.
 * The rows include invented hostile names (tabs, newlines, backslashes, COPY's null marker, non-BMP characters, a
 * lone surrogate). The reference is the statement path itself, which the replay and undo suites already check.
 */
import { sql, type Kysely } from 'kysely';
import { afterAll, beforeAll, expect, it, vi } from 'vitest';
import { describeBackends, describePostgres, openTestDatabase, withTestDatabase, type TestDatabase } from '../../support/index.ts';
import type { Database } from '../../../db/types.ts';
import type * as CopyRowsModule from '../../../db/queries/copy-rows.ts';
import { createRegisterContext, replayHistory, stateSnapshot, undoEvent } from '../../../services/register/index.ts';
import { LOAD_CHUNK, loadCounterparties, type LoadRow } from '../../../services/register/bulk-load.ts';
import { generateNames } from '../../../services/demo/generate-names.ts';

/** Tables each COPY went to, in order (the real copyRows runs). */
const copied = vi.hoisted(() => ({ tables: [] as string[] }));
vi.mock('../../../db/queries/copy-rows.ts', async (importOriginal) => {
  const actual = await importOriginal<typeof CopyRowsModule>();
  return {
    ...actual,
    copyRows: async (...args: Parameters<typeof actual.copyRows>) => {
      copied.tables.push(args[1].table);
      return actual.copyRows(...args);
    },
  };
});

const WHO = { actor: 'test:bulk-load', reason: 'vendor master migration' };
const AT = new Date('2026-03-04T05:06:07.089Z');

/** Invented names that COPY's text format must escape or carry through (checkName trims the ends, so inside). */
const HOSTILE: LoadRow[] = [
  { name: 'Tabbed\tHarrowgate Mills Ltd', country: 'GB' },
  { name: 'Newline\nBrackwater Freight\r\nGmbH', country: 'DE' },
  { name: 'Back\\slash Quarry \\N Partners', country: null },
  { name: '\\N', country: null },
  { name: 'Dot \\. Endmarker Ltd', country: 'US-DE' },
  { name: 'Quote "Orvelle" & \'Sons\' plc', country: 'GB' },
  { name: 'Mathematical 𝔘𝔫𝔦𝔬𝔫 Trading 𠀋 Co 😀', country: 'JP' },
  { name: 'Lone \ud800 Surrogate Kft', country: 'HU' },
  { name: 'Zürcher Kühlhaus AG — Ωmega', country: 'CH' },
  { name: 'NULL', country: null },
  { name: '{"json": "lookalike"} Ltd', country: null },
];

/** Enough generated names for two chunks and a part, then the hostile ones. */
function rows(): LoadRow[] {
  const generated = [...generateNames(LOAD_CHUNK * 2 + 37, 7)].map((r) => ({ name: r.name, country: r.country }));
  return [...generated, ...HOSTILE];
}

async function load(db: Kysely<Database>, via: 'copy' | 'statements', oneTransaction = false): Promise<number> {
  return loadCounterparties(createRegisterContext(db, { now: () => AT }), rows(), WHO, { source: 'vendor-master', via, oneTransaction });
}

/** The schema objects a one-transaction load drops and builds again: indexes, constraints, triggers and their state. */
async function schemaObjects(db: Kysely<Database>) {
  return {
    indexes: (await sql`SELECT tablename, indexname, indexdef FROM pg_indexes WHERE schemaname = current_schema() ORDER BY 1, 2`.execute(db)).rows,
    constraints: (
      await sql`SELECT conrelid::regclass::text AS tbl, conname, pg_get_constraintdef(oid) AS def, convalidated FROM pg_constraint
        WHERE connamespace = current_schema()::regnamespace ORDER BY 1, 2`.execute(db)
    ).rows,
    triggers: (await sql`SELECT tgrelid::regclass::text AS tbl, tgname, tgenabled FROM pg_trigger WHERE NOT tgisinternal ORDER BY 1, 2`.execute(db)).rows,
  };
}

async function everything(db: Kysely<Database>) {
  return {
    state: await stateSnapshot(db),
    keyCounts: (await sql<{ key: string; names: number; counterparties: number }>`SELECT * FROM blocking_key_count ORDER BY key`.execute(db)).rows,
    analyses: (await sql`SELECT * FROM counterparty_name_analysis ORDER BY name_id`.execute(db)).rows,
    events: (await sql`SELECT * FROM history_event ORDER BY id`.execute(db)).rows,
    sequences: (await sql`SELECT sequencename, last_value FROM pg_sequences ORDER BY sequencename`.execute(db)).rows,
  };
}

describePostgres('bulk load through COPY (PostgreSQL)', () => {
  let viaCopy: TestDatabase;
  let viaStatements: TestDatabase;
  let inOne: TestDatabase;
  let copiedByChunks: string[] = [];
  beforeAll(async () => {
    viaCopy = await openTestDatabase('postgres');
    viaStatements = await openTestDatabase('postgres');
    inOne = await openTestDatabase('postgres');
    copied.tables.length = 0;
    expect(await load(viaStatements.db, 'statements')).toBe(rows().length);
    expect(copied.tables).toEqual([]);
    expect(await load(viaCopy.db, 'copy')).toBe(rows().length);
    copiedByChunks = [...copied.tables];
    copied.tables.length = 0;
    expect(await load(inOne.db, 'copy', true)).toBe(rows().length);
  }, 240_000);
  afterAll(async () => {
    await viaCopy?.close();
    await viaStatements?.close();
    await inOne?.close();
  });

  it('sends every chunk through COPY, parents first (in chunks and in one transaction)', () => {
    const chunks = Math.ceil(rows().length / LOAD_CHUNK);
    expect(copied.tables).toEqual(copiedByChunks);
    expect(copiedByChunks).toEqual(
      Array.from({ length: chunks }, () => ['counterparty', 'counterparty_name', 'blocking_key', 'counterparty_name_analysis', 'history_event']).flat(),
    );
  });

  it('leaves the state tables, keys, key counts, events and sequences of the statement path, row for row', async () => {
    const a = await everything(viaCopy.db);
    const b = await everything(viaStatements.db);
    expect(a.state.counterparty.length).toBe(rows().length);
    expect(a.events.length).toBe(Math.ceil(rows().length / LOAD_CHUNK));
    expect(a.keyCounts.length).toBeGreaterThan(rows().length);
    expect(a).toEqual(b);
  });

  it('in one transaction leaves the same rows, key counts (as the triggers count), events and sequences, and the schema as it was', async () => {
    expect(await everything(inOne.db)).toEqual(await everything(viaStatements.db));
    expect(await schemaObjects(inOne.db)).toEqual(await schemaObjects(viaStatements.db));
  });

  it('in one transaction, a bad row in a later chunk leaves nothing of the load and the schema as it was', async () => {
    await withTestDatabase('postgres', async (opened) => {
      const before = await schemaObjects(opened.db);
      const good = [...generateNames(LOAD_CHUNK, 3)].map((r) => ({ name: r.name, country: r.country }));
      await expect(
        loadCounterparties(createRegisterContext(opened.db), [...good, { name: 'Pellmoor Dyes Ltd', country: 'XX-NOWHERE' }], WHO, {
          source: 'test',
          oneTransaction: true,
        }),
      ).rejects.toThrow(new RegExp(`line ${LOAD_CHUNK + 1}: country.*\\(nothing of the load was written: it is one transaction\\)`));
      const count = await sql<{ n: number }>`SELECT (SELECT count(*) FROM counterparty) + (SELECT count(*) FROM blocking_key_count) AS n`.execute(opened.db);
      expect(Number(count.rows[0]!.n)).toBe(0);
      expect(await schemaObjects(opened.db)).toEqual(before);
    });
  }, 120_000);

  it('stores the hostile names as given (a lone surrogate as U+FFFD, as a text parameter stores it)', async () => {
    const stored = await sql<{ canonical_name: string }>`SELECT canonical_name FROM counterparty ORDER BY id DESC LIMIT ${HOSTILE.length}`.execute(viaCopy.db);
    const expected = HOSTILE.map((r) => r.name.replace('\ud800', '\ufffd')).reverse();
    expect(stored.rows.map((r) => r.canonical_name)).toEqual(expected);
  });

  it('leaves a history that replays into an empty database, state equal row for row', async () => {
    await withTestDatabase('postgres', async (target) => {
      await replayHistory(viaCopy.db, target.db, createRegisterContext(viaCopy.db).derived);
      expect(await stateSnapshot(target.db)).toEqual(await stateSnapshot(viaCopy.db));
    });
  }, 120_000);

  it('undoes a loaded chunk as the statement path does', async () => {
    const last = async (db: Kysely<Database>) => Number((await sql<{ id: string }>`SELECT max(id) AS id FROM history_event`.execute(db)).rows[0]!.id);
    const ctx = (db: Kysely<Database>) => createRegisterContext(db, { now: () => AT });
    await undoEvent(ctx(viaCopy.db), await last(viaCopy.db), WHO);
    await undoEvent(ctx(viaStatements.db), await last(viaStatements.db), WHO);
    const a = await everything(viaCopy.db);
    expect(a.state.counterparty.filter((c) => c.status === 'active').length).toBe(LOAD_CHUNK * 2);
    expect(a).toEqual(await everything(viaStatements.db));
  }, 120_000);

  it('in one transaction on a register that holds names already, adds the counts the triggers add (run last: it loads more into two of the databases)', async () => {
    const more = [...generateNames(LOAD_CHUNK + 11, 8)].map((r) => ({ name: r.name, country: r.country }));
    const ctx = (db: Kysely<Database>) => createRegisterContext(db, { now: () => AT });
    // The statement path's database had its last chunk undone above: the same undo here first.
    const last = Number((await sql<{ id: string }>`SELECT max(id) AS id FROM history_event`.execute(inOne.db)).rows[0]!.id);
    await undoEvent(ctx(inOne.db), last, WHO);
    expect(await everything(inOne.db)).toEqual(await everything(viaStatements.db));
    await loadCounterparties(ctx(inOne.db), more, WHO, { source: 'second', oneTransaction: true });
    await loadCounterparties(ctx(viaStatements.db), more, WHO, { source: 'second', via: 'statements' });
    expect(await everything(inOne.db)).toEqual(await everything(viaStatements.db));
  }, 120_000);
  it('in one transaction counts a key past the cap (1,000) as the triggers do, on a register holding it already', async () => {
    // Invented names sharing one word: 600 in the register, 2,100 more loaded (the chunked load's trigger reaches
    // the cap in its second chunk and leaves the key alone after it).
    const named = (from: number, n: number) => Array.from({ length: n }, (_, i) => ({ name: `Corvath Millbrook ${from + i}`, country: null }));
    const counts = async (db: Kysely<Database>) =>
      (await sql<{ key: string; names: number; counterparties: number }>`SELECT * FROM blocking_key_count ORDER BY key`.execute(db)).rows;
    await withTestDatabase('postgres', async (one) => {
      await withTestDatabase('postgres', async (chunked) => {
        for (const [db, oneTransaction] of [
          [one.db, true],
          [chunked.db, false],
        ] as const) {
          await loadCounterparties(createRegisterContext(db), named(0, 600), WHO, { source: 'first' });
          await loadCounterparties(createRegisterContext(db), named(600, LOAD_CHUNK + 100), WHO, { source: 'second', oneTransaction });
        }
        const a = await counts(one.db);
        expect(a.find((k) => k.key === 't:corvath')).toEqual({ key: 't:corvath', names: 1000, counterparties: 1000 });
        expect(a).toEqual(await counts(chunked.db));
      });
    });
  }, 180_000);
});

describeBackends('bulk load: refused rows', (backend) => {
  it('refuses a bad row of a later chunk after the chunks before it are committed, and says how many', async () => {
    await withTestDatabase(backend, async (opened) => {
      const ctx = createRegisterContext(opened.db);
      const good = [...generateNames(LOAD_CHUNK, 3)].map((r) => ({ name: r.name, country: r.country }));
      const loadedCounts: number[] = [];
      await expect(
        loadCounterparties(ctx, [...good, { name: 'Pellmoor Dyes Ltd', country: 'XX-NOWHERE' }], WHO, {
          source: 'test',
          progress: (n) => loadedCounts.push(n),
        }),
      ).rejects.toThrow(new RegExp(`line ${LOAD_CHUNK + 1}: country.*\\(${LOAD_CHUNK} rows loaded before this chunk; nothing of it was written\\)`));
      expect(loadedCounts).toEqual([LOAD_CHUNK]);
      const count = await sql<{ n: number }>`SELECT count(*)::int AS n FROM counterparty`.execute(opened.db);
      expect(count.rows[0]!.n).toBe(LOAD_CHUNK);
    });
  }, 120_000);

  it('refuses a name holding U+0000 with its line, writing nothing of its chunk', async () => {
    await withTestDatabase(backend, async (opened) => {
      const ctx = createRegisterContext(opened.db);
      const bad = [{ name: 'Caldermoor Works Ltd' }, { name: 'Nul\u0000byte Holdings' }];
      await expect(loadCounterparties(ctx, bad, WHO, { source: 'test', firstLine: 2 })).rejects.toThrow(
        /line 3: name: must not contain the character U\+0000 \(0 rows loaded before this chunk; nothing of it was written\)/,
      );
      const count = await sql<{ n: number }>`SELECT count(*)::int AS n FROM counterparty`.execute(opened.db);
      expect(count.rows[0]!.n).toBe(0);
    });
  }, 60_000);
});
