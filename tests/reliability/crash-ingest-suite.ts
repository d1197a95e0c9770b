/**
 * Crash safety of batch ingest: a child `cpreg ingest` of generated mentions is killed with SIGKILL at seeded
 * random points, five times, each time run again; a last run completes. Then every input row is in the register
 * exactly once (one mention per external id, none missing), the last run's summary reconciles (read = the file's
 * rows), and `cpreg verify` passes. PostgreSQL: killed when a seeded random number of rows has been stored.
 * Embedded (PGlite): the child holds the database, so it is killed a seeded time after its first progress line (its
 * first batch counted), and after every kill the database must open again (the lock of the dead holder is taken over).
 */
import { spawn } from 'node:child_process';
import { writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { afterAll, afterEach, beforeAll, beforeEach, expect, it } from 'vitest';
import type { OpenedDatabase } from '../../db/open-database.ts';
import { seededRandom } from '../../resolvers/prng.ts';
import { CPREG_BIN, REPO_ROOT, childEnv, runCli } from '../support/cli.ts';
import {
  createMigratedDataDir,
  createPostgresCopy,
  dropPostgresCopy,
  describePostgres,
  makeTempDir,
  openTestDatabase,
  removeTempDir,
  withTestDatabase,
  type TestBackend,
} from '../support/index.ts';
import { describe } from 'vitest';

const LONG = process.env.CPREG_LONG === '1';
// What is asserted (every row once, counts that reconcile, verify) does not depend on the size, only on the kills
// falling inside the file: npm test uses small files, CPREG_LONG=1 the large ones.
// PostgreSQL: the kill points are fractions of the file (rows stored), so any size keeps them inside it.
// Embedded: each run is killed 0.3-1.8 s after its first progress line, in batches of 100 so that a run commits
// some and the kill points move through the file. With this seed the five waits add up to 6.0 s; a quiet machine
// stored 6,500 rows in five runs killed 3-8 s after each start (29.9 s in all, start-up included), so 8,000 rows
// keep kill 5 inside the file with a wide margin. On a machine too loaded to commit a batch within the wait (load 20
// on 2 cores: 100 rows stored over the five runs) the kills all fall in the same batch, still inside the ingest; a
// kill timed from the start would fall before it there (the first progress line came 49 s after the start).
const SIZE = { postgres: LONG ? 100_000 : 6_000, pglite: LONG ? 30_000 : 8_000 };
const BATCH = { postgres: 500, pglite: 100 };
const KILLS = 5;

const SYLLABLES = [
  'ash',
  'brack',
  'cin',
  'dun',
  'esk',
  'fal',
  'gorse',
  'hol',
  'ivy',
  'jun',
  'kes',
  'larch',
  'mor',
  'nes',
  'orv',
  'pell',
  'quar',
  'ros',
  'sel',
  'tam',
  'ulv',
  'ver',
  'wen',
  'yar',
  'zel',
];
const ENDINGS = ['by', 'mere', 'wood', 'vale', 'ford', 'ton', 'wick', 'holm', 'stead', 'gate'];
const TRADES = ['Tooling', 'Castings', 'Freight', 'Textiles', 'Optics', 'Joinery', 'Ceramics', 'Analytics'];
const FORMS = ['Ltd', 'Limited', 'GmbH', 'Inc.', 'LLC', 'S.A.'];

/** Invented company names: distinct made-up words, so candidate blocks stay small as in real registers. */
function companyName(n: number): string {
  const a = SYLLABLES[n % SYLLABLES.length]!;
  const b = SYLLABLES[Math.floor(n / SYLLABLES.length) % SYLLABLES.length]!;
  const end = ENDINGS[Math.floor(n / 625) % ENDINGS.length]!;
  const word = `${a}${b}${end}`;
  return `${word[0]!.toUpperCase()}${word.slice(1)} ${TRADES[n % TRADES.length]}`;
}

/** Invented mentions: companies written a few ways, so links, reviews and new ones all happen. */
function writeMentions(file: string, size: number): void {
  const rng = seededRandom(size);
  const companies = Math.max(50, Math.floor(size / 4));
  const lines: string[] = [];
  for (let i = 0; i < size; i++) {
    const company = rng.int(companies);
    const form = FORMS[(company + (rng.chance(0.2) ? 1 : 0)) % FORMS.length]!;
    const name = `${companyName(company)} ${form}`;
    lines.push(JSON.stringify({ externalId: `row-${i}`, text: rng.chance(0.1) ? name.toUpperCase() : name, country: company % 3 === 0 ? 'DE' : 'GB' }));
  }
  writeFileSync(file, `${lines.join('\n')}\n`);
}

/**
 * The suite for one backend. Each backend has its own test file (crash-ingest-postgres / crash-ingest-embedded) so
 * that the two heavy halves run in parallel workers instead of one after the other.
 */
export function crashIngestSuite(backend: TestBackend): void {
  // The embedded database is always there; the PostgreSQL half is skipped the one way such suites are.
  (backend === 'postgres' ? describePostgres : describe)(`crash safety: batch ingest killed with SIGKILL [${backend}]`, () => {
    let dir: string;
    let target: string;
    /** PostgreSQL: one connection for the polls of the stored rows, kept for the whole test. */
    let poller: OpenedDatabase | undefined;
    beforeAll(async () => {
      dir = makeTempDir('cpreg-crash-');
      target = backend === 'postgres' ? await createPostgresCopy() : await createMigratedDataDir();
      if (backend === 'postgres') poller = await openTestDatabase({ at: target }, { command: 'crash test' });
    }, 120_000);
    afterAll(async () => {
      await poller?.close();
      removeTempDir(dir);
      if (backend === 'postgres') await dropPostgresCopy(target);
      else removeTempDir(target);
    });

    // Every child the test starts dies with it: when it ends in any way (afterEach, also after a failure or a timeout)
    // and as soon as vitest gives up on it (the test's own signal, aborted on a timeout). A timed-out test's body goes
    // on in the background; a child it would start after that is killed at once (spawn with an aborted signal).
    let children: AbortController;
    beforeEach(() => {
      children = new AbortController();
    });
    afterEach(() => children.abort());

    async function storedRows(): Promise<number> {
      if (!poller) return -1; // embedded: the child holds the directory
      const row = await poller.db
        .selectFrom('mention')
        .select((eb) => eb.fn.countAll<number>().as('n'))
        .where('source', '=', 'crash')
        .executeTakeFirstOrThrow();
      return Number(row.n);
    }

    it(`every row exactly once after ${KILLS} kills, and verify passes`, async ({ signal: testSignal }) => {
      const signal = AbortSignal.any([children.signal, testSignal]);
      const size = SIZE[backend];
      const file = join(dir, 'mentions.ndjson');
      writeMentions(file, size);
      const rng = seededRandom(20261202);
      const started = performance.now();
      const kills: { afterMs: number; stored: number }[] = [];
      for (let k = 0; k < KILLS; k++) {
        const child = spawn(process.execPath, [CPREG_BIN, 'ingest', file, '--source', 'crash', '--db', target, '--batch-size', String(BATCH[backend])], {
          cwd: REPO_ROOT,
          env: childEnv(),
          stdio: ['ignore', 'pipe', 'pipe'],
          signal,
          killSignal: 'SIGKILL',
        });
        // An aborted spawn reports an 'error' (AbortError); the exit below is what the test waits for.
        child.on('error', () => undefined);
        let output = '';
        let counting: () => void = () => undefined;
        // The first progress line ("ingest: 100 rows …") is printed once the first batch has been counted.
        const firstProgress = new Promise<void>((r) => (counting = r));
        child.stdout.on('data', (c) => (output += c));
        child.stderr.on('data', (c) => {
          output += c;
          if (/^ingest: [\d,]+ rows?\b/m.test(output)) counting();
        });
        const exited = new Promise<number | null>((r) => child.once('exit', (code) => r(code)));
        const exitedTrue = exited.then(() => true);
        // A seeded random point: on PostgreSQL when that many rows are stored (polled), on the embedded
        // database (the child holds it) a seeded time after the child's first progress line.
        const t0 = performance.now();
        let done = false;
        if (backend === 'postgres') {
          const point = Math.floor(((k + rng.int(1000) / 1000) / KILLS) * size * 0.9);
          while (!done && (await storedRows()) < point) done = await Promise.race([exitedTrue, new Promise<boolean>((r) => setTimeout(() => r(false), 100))]);
        } else {
          const waitMs = 300 + rng.int(1500);
          done = await Promise.race([exitedTrue, firstProgress.then(() => false)]);
          if (!done) done = await Promise.race([exitedTrue, new Promise<boolean>((r) => setTimeout(() => r(false), waitMs))]);
        }
        if (done) throw new Error(`the ingest finished before kill ${k + 1} (${Math.round(performance.now() - t0)} ms): use a larger file\n${output}`);
        child.kill('SIGKILL');
        await exited;
        kills.push({ afterMs: Math.round(performance.now() - t0), stored: await storedRows() });
      }
      const last = await runCli(['ingest', file, '--source', 'crash', '--db', target, '--batch-size', String(BATCH[backend]), '--json'], {
        timeoutMs: 600_000,
        signal,
      });
      expect(last.code, last.stderr.slice(-2000)).toBe(0);
      const summary = JSON.parse(last.stdout.trim().split('\n').pop()!) as { counts: Record<string, number> };
      expect(summary.counts.read).toBe(size);
      let outcomes = 0;
      for (const [key, value] of Object.entries(summary.counts)) if (key !== 'read') outcomes += value;
      expect(outcomes).toBe(size);
      expect(summary.counts.rejected ?? 0).toBe(0);

      const rows = await withTestDatabase(
        { at: target },
        (opened) => opened.db.selectFrom('mention').select('external_id').where('source', '=', 'crash').execute(),
        {
          command: 'crash test',
        },
      );
      expect(rows.length).toBe(size);
      const ids = new Set(rows.map((r) => r.external_id));
      expect(ids.size).toBe(size);
      for (let i = 0; i < size; i += Math.max(1, Math.floor(size / 500))) expect(ids.has(`row-${i}`)).toBe(true);
      const verify = await runCli(['verify', '--db', target, '--json', '--limit', '5'], { timeoutMs: 600_000, signal });
      expect(verify.code, verify.stdout.slice(0, 3000) + verify.stderr).toBe(0);
      process.stdout.write(
        `crash-ingest [${backend}]: ${size} mentions, kills ${JSON.stringify(kills)}, already ingested on the last run ${summary.counts.already_ingested}, total ${Math.round((performance.now() - started) / 1000)} s\n`,
      );
    }, 900_000);
  });
}
