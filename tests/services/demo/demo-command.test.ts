/**
 * `cpreg demo` as a user runs it (a child process): a fresh build with --no-serve --json whose accuracy figures
 * are recomputed here independently from truth.json and the register, then a serving run stopped with Ctrl-C
 * (SIGINT): the server closes, the database closes and another process can open it.
 * The build loads the whole invented scenario (300 contracts, 868 mentions): minutes on a busy machine, so the
 * time limits here are generous ceilings that only catch hangs.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { spawn } from 'node:child_process';
import { existsSync, mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { parse } from 'csv-parse/sync';
import { join } from 'node:path';
import { LOCK_FILE_NAME } from '../../../db/lock.ts';
import { measureAccuracy } from '../../../services/demo/accuracy.ts';
import type { VendorMasterSummary } from '../../../services/demo/run-demo-vendors.ts';
import { CPREG_BIN, REPO_ROOT, childEnv, runCli } from '../../support/cli.ts';
import { withTestDatabase } from '../../support/index.ts';

const BUILD_TIMEOUT_MS = 15 * 60_000;

interface TruthFile {
  mentions: Array<{ source: string; externalId: string; truth: { kind: string; counterpartyId?: string } }>;
  vendorMaster: { duplicates: Array<{ vendorIds: [string, string] }>; vendorsWithoutContract: string[] };
}

describe('measureAccuracy on a worked example', () => {
  it('scores automatic links as a clustering and the other kinds by status', () => {
    // Hand-worked (definitions of pairwise precision/recall and of B-cubed, Bagga & Baldwin 1998):
    // truth A,A,B linked to counterparties 1,1,1 → predicted pairs 3, true pairs 1: P = 1/3, R = 1/1.
    // The universe also holds the unbound term wrongly linked alone to counterparty 2 (its own singleton in truth).
    // B-cubed precision: items of A see 2/3 each, the B item 1/3, the unbound term 1/1 → (2/3 + 2/3 + 1/3 + 1) / 4
    // = 2/3; recall 1 (every truth cluster sits inside one predicted cluster).
    const linked = (id: number) => ({ status: 'linked' as const, counterpartyId: id });
    const a = measureAccuracy([
      { truth: { kind: 'counterparty', counterpartyId: 'A' }, observed: linked(1) },
      { truth: { kind: 'counterparty', counterpartyId: 'A' }, observed: linked(1) },
      { truth: { kind: 'counterparty', counterpartyId: 'B' }, observed: linked(1) },
      { truth: { kind: 'not_a_party', reason: 'signer' }, observed: { status: 'not_a_party', counterpartyId: null } },
      { truth: { kind: 'unbound_term' }, observed: { status: 'new', counterpartyId: 2 } },
    ]);
    expect(a.pairwise.precision).toBeCloseTo(1 / 3, 12);
    expect(a.pairwise.recall).toBe(1);
    expect(a.bcubed.precision).toBeCloseTo(2 / 3, 12);
    expect(a.bcubed.recall).toBe(1);
    // A holds most of counterparty 1 and most of A sits in 1: the two A mentions are right, the B one is not.
    expect(a.assignedCorrectly).toBeCloseTo(2 / 3, 12);
    expect(a.status.not_a_party).toMatchObject({ total: 1, correct: 1 });
    expect(a.status.unbound_term).toMatchObject({ total: 1, correct: 0, wrong: { new: 1 } });
  });

  it('counts a mention in review as unplaced (recall), never as a wrong link (precision)', () => {
    const a = measureAccuracy([
      { truth: { kind: 'counterparty', counterpartyId: 'A' }, observed: { status: 'linked', counterpartyId: 1 } },
      { truth: { kind: 'counterparty', counterpartyId: 'A' }, observed: { status: 'review', counterpartyId: null } },
    ]);
    // One gold pair, no predicted pair: precision 1 by the empty-denominator convention, recall 0.
    expect(a.pairwise).toMatchObject({ precision: 1, recall: 0, predictedPairs: 0, goldPairs: 1 });
    expect(a.counterpartyMentions).toEqual({ total: 2, linkedOrNew: 1, review: 1, other: 0 });
  });
});

describe('cpreg demo (child process)', () => {
  let root: string;
  let dbDir: string;
  let filesDir: string;
  let summary: {
    seed: number;
    counterparties: number;
    truthCounterparties: number;
    mentions: { total: number; byStatus: Record<string, number> };
    reviewQueue: number;
    busiest: Array<{ id: number; contracts: number }>;
    vendorMaster: VendorMasterSummary;
    accuracy: {
      mentions: ReturnType<typeof measureAccuracy>;
      contractParties: ReturnType<typeof measureAccuracy> & { found: number; expected: number };
    };
  };

  beforeAll(async () => {
    root = mkdtempSync(join(tmpdir(), 'cpreg-demo-test-'));
    dbDir = join(root, 'demo');
    filesDir = join(root, 'demo-scenario');
    const run = await runCli(['demo', '--db', dbDir, '--no-serve', '--json'], { timeoutMs: BUILD_TIMEOUT_MS });
    if (run.code !== 0) throw new Error(`cpreg demo failed (${run.code}):\n${run.stderr}`);
    const lines = run.stdout.trim().split('\n');
    expect(lines).toHaveLength(1); // --no-serve --json: the summary only
    summary = JSON.parse(lines[0]!);
  }, BUILD_TIMEOUT_MS);

  afterAll(() => {
    if (root) rmSync(root, { recursive: true, force: true });
  });

  it('builds the scenario and summarises it: every extracted mention stored, counts that add up', () => {
    const truth = JSON.parse(readFileSync(join(filesDir, 'truth.json'), 'utf8')) as TruthFile;
    expect(summary.seed).toBe(1);
    expect(summary.mentions.total).toBe(truth.mentions.length);
    const byStatus = Object.values(summary.mentions.byStatus).reduce((a, b) => a + b, 0);
    expect(byStatus).toBe(summary.mentions.total);
    expect(summary.counterparties).toBeGreaterThan(0);
    expect(summary.busiest.length).toBeGreaterThan(0);
    expect(summary.busiest[0]!.contracts).toBeGreaterThanOrEqual(summary.busiest.at(-1)!.contracts);
    expect(summary.accuracy.contractParties.expected).toBeGreaterThan(0);
  });

  it('reports accuracy figures that truth.json and the register reproduce (recomputed here by pair enumeration)', async () => {
    const truth = JSON.parse(readFileSync(join(filesDir, 'truth.json'), 'utf8')) as TruthFile;
    const rows: Array<{ external_id: string; status: string; counterparty_id: number | string | null }> = await withTestDatabase(
      { at: dbDir },
      (database) => database.db.selectFrom('mention').select(['external_id', 'status', 'counterparty_id']).where('source', '=', 'extraction').execute(),
      { command: 'demo test' },
    );
    const byId = new Map(rows.map((r) => [r.external_id, r]));
    // Independent of resolvers/evaluate: enumerate every pair of mentions that the register linked automatically.
    const linked = truth.mentions
      .map((m) => ({ m, r: byId.get(m.externalId) }))
      .filter(({ r }) => r !== undefined && (r.status === 'linked' || r.status === 'new') && r.counterparty_id !== null);
    let predictedPairs = 0;
    let truePairs = 0;
    for (let i = 0; i < linked.length; i++) {
      for (let j = i + 1; j < linked.length; j++) {
        if (Number(linked[i]!.r!.counterparty_id) !== Number(linked[j]!.r!.counterparty_id)) continue;
        predictedPairs++;
        const a = linked[i]!.m.truth;
        const b = linked[j]!.m.truth;
        if (a.kind === 'counterparty' && b.kind === 'counterparty' && a.counterpartyId === b.counterpartyId) truePairs++;
      }
    }
    const reported = summary.accuracy.mentions;
    expect(reported.pairwise.predictedPairs).toBe(predictedPairs);
    expect(reported.pairwise.truePositivePairs).toBe(truePairs);
    expect(reported.pairwise.precision).toBeCloseTo(truePairs / predictedPairs, 12);
    // Status accuracy of the mentions that are not parties, straight from the truth and the stored status.
    const notParties = truth.mentions.filter((m) => m.truth.kind === 'not_a_party');
    const right = notParties.filter((m) => byId.get(m.externalId)?.status === 'not_a_party').length;
    expect(reported.status.not_a_party).toMatchObject({ total: notParties.length, correct: right });
  });

  it('reports vendor-master findings that the written reconciliation report reproduces', () => {
    const truth = JSON.parse(readFileSync(join(filesDir, 'truth.json'), 'utf8')) as TruthFile;
    const report = parse(readFileSync(join(filesDir, summary.vendorMaster.reportFile), 'utf8'), { columns: true }) as Array<Record<string, string>>;
    const pairs = new Set(report.filter((r) => r.paired_vendor_row_id).map((r) => [r.vendor_row_id, r.paired_vendor_row_id].sort().join('|')));
    const found = truth.vendorMaster.duplicates.filter((d) => pairs.has([...d.vendorIds].sort().join('|'))).length;
    expect(summary.vendorMaster.truth.duplicates).toMatchObject({ planted: truth.vendorMaster.duplicates.length, found });
    const noContract = new Set(report.filter((r) => r.finding === 'vendor_without_contract' && !r.paired_vendor_row_id).map((r) => r.vendor_row_id));
    expect(summary.vendorMaster.truth.vendorsWithoutContract.found).toBe(truth.vendorMaster.vendorsWithoutContract.filter((v) => noContract.has(v)).length);
    expect(Object.values(summary.vendorMaster.byFinding).reduce((a, b) => a + b, 0)).toBe(report.length);
  });

  it('meets floors set a little under the figures measured on seed 1', () => {
    // Measured 2026-12-02 on seed 1, on two states of the resolvers an hour apart: extracted mentions pairwise
    // precision 0.892 and 0.998 (recall 0.685 and 0.609), B-cubed precision 0.935 and 0.997, own-entity status
    // 0.974; contract parties pairwise precision 1.000 (recall 0.998 and 0.921), 604/604 true parties read.
    // Floors sit a little under the lower figure, so that a regression fails and the drift of work in progress
    // does not; the recall floors only catch a collapse.
    const m = summary.accuracy.mentions;
    expect(m.pairwise.precision).toBeGreaterThanOrEqual(0.85);
    expect(m.pairwise.recall).toBeGreaterThanOrEqual(0.5);
    expect(m.bcubed.precision).toBeGreaterThanOrEqual(0.9);
    expect(m.status.own_entity.accuracy).toBeGreaterThanOrEqual(0.93);
    expect(m.status.collective_term.accuracy).toBeGreaterThanOrEqual(0.9);
    // Issue 16 item 4: signers' names taken for parties are kept out; measured 85/85 on seed 1 on 2026-12-04
    // (63/85 before signers were read from "Signed for and on behalf of X by Y, Title" lines).
    const signer = m.byStyle.signer;
    expect(signer === undefined ? 0 : signer.correct / signer.total).toBeGreaterThanOrEqual(0.95);
    // Vendor master, measured on the same two states: 15/15 planted duplicates, 24/24 and 21/24 vendors that never
    // signed, 26/26 and 25/26 signers missing from it, 6/6 look-alikes kept apart.
    const t = summary.vendorMaster.truth;
    expect(t.duplicates.found / t.duplicates.planted).toBeGreaterThanOrEqual(0.9);
    expect(t.vendorsWithoutContract.found / t.vendorsWithoutContract.planted).toBeGreaterThanOrEqual(0.8);
    expect(t.counterpartiesWithoutVendor.found / t.counterpartiesWithoutVendor.planted).toBeGreaterThanOrEqual(0.85);
    expect(t.lookalikes.keptApart / t.lookalikes.planted).toBeGreaterThanOrEqual(0.8);
    const p = summary.accuracy.contractParties;
    expect(p.pairwise.precision).toBeGreaterThanOrEqual(0.97);
    expect(p.pairwise.recall).toBeGreaterThanOrEqual(0.85);
    expect(p.found / p.expected).toBeGreaterThanOrEqual(0.95);
  });

  it("prints the extracted mentions' pairwise precision the README quotes for seed 1", () => {
    // README, "Latest figures": the demo row quotes precision / recall as the demo prints them (one decimal). Only
    // the precision is held exactly here (issue 19 item 7); recall drifts with work in progress (floors above).
    const readme = readFileSync(join(REPO_ROOT, 'README.md'), 'utf8');
    const row = /\| Demo \(seed 1[^|]*extracted mentions: pairwise precision \/ recall; mentions in review \| ([\d.]+) % \/ ([\d.]+) %/.exec(readme);
    expect(row, 'the README has a demo row with precision / recall').not.toBeNull();
    const printed = (summary.accuracy.mentions.pairwise.precision * 100).toFixed(1);
    expect(row![1], `the demo prints pairwise precision ${printed} %: update the README's demo row`).toBe(printed);
  });

  it('registers as many counterparties as the README quotes for seed 1, in both of its demo rows', () => {
    // README, "Latest figures": a row once said 181 counterparties where the demo printed 152. Both
    // rows that quote the count ("N counterparties for the scenario's 150", "N vs 150") must say what it prints.
    const readme = readFileSync(join(REPO_ROOT, 'README.md'), 'utf8');
    const truth = summary.truthCounterparties;
    const quoted = [...readme.matchAll(new RegExp(`\\| Demo \\(seed 1[^|]*\\|[^|]*?(\\d+) (?:counterparties for the scenario's|vs) ${truth}\\b`, 'g'))].map(
      (m) => Number(m[1]),
    );
    expect(quoted, `the README's demo rows quote the register's counterparties against the scenario's ${truth}`).toHaveLength(2);
    for (const n of quoted)
      expect(n, `the demo registers ${summary.counterparties} counterparties: update the README's demo rows`).toBe(summary.counterparties);
  });

  it(
    'serves the built demo with an admin key, and SIGINT stops it cleanly: server closed, database closed and reopenable',
    async () => {
      const child = spawn(process.execPath, [CPREG_BIN, 'demo', '--db', dbDir, '--port', '0', '--json'], { cwd: REPO_ROOT, env: childEnv() });
      let stdout = '';
      let stderr = '';
      child.stdout.on('data', (chunk) => (stdout += chunk));
      child.stderr.on('data', (chunk) => (stderr += chunk));
      const exited = new Promise<{ code: number | null; signal: NodeJS.Signals | null }>((done) => child.on('exit', (code, signal) => done({ code, signal })));
      const listening = await new Promise<{ url: string; apiKey: string }>((resolve, reject) => {
        const timer = setTimeout(() => reject(new Error(`the demo did not start serving in time:\n${stderr}`)), 5 * 60_000);
        child.stdout.on('data', () => {
          const line = stdout.split('\n').find((l) => l.includes('"url"'));
          if (line) {
            clearTimeout(timer);
            resolve(JSON.parse(line));
          }
        });
        void exited.then(({ code }) => reject(new Error(`the demo exited (${code}) before serving:\n${stderr}`)));
      });
      expect(existsSync(join(dbDir, LOCK_FILE_NAME))).toBe(true);
      const me = await fetch(`${listening.url}/v1/me`, { headers: { authorization: `Bearer ${listening.apiKey}` } });
      expect(me.status).toBe(200);
      expect((await me.json()).scope).toBe('admin');
      const first = await fetch(`${listening.url}/v1/counterparties/${summary.busiest[0]!.id}`, { headers: { authorization: `Bearer ${listening.apiKey}` } });
      expect(first.status).toBe(200);
      // Normal use (issue 19 item 1): a contract system posts its own contract with the source the API reference's
      // example uses, the same source the demo's contracts carry. Invented names.
      const posted = await fetch(`${listening.url}/v1/contracts`, {
        method: 'POST',
        headers: { authorization: `Bearer ${listening.apiKey}`, 'content-type': 'application/json' },
        body: JSON.stringify({
          source: 'clm',
          externalId: 'C-2031',
          title: 'Supply Agreement',
          text: 'This Supply Agreement is made between Quillmere Fabrication, Inc. ("Supplier") and Orvane Trading B.V. ("Buyer").',
        }),
      });
      expect(posted.status, await posted.clone().text()).toBeLessThan(300);

      child.kill('SIGINT');
      const { code, signal } = await Promise.race([
        exited,
        new Promise<never>((_, reject) => setTimeout(() => reject(new Error('the demo did not stop within 60 s of SIGINT')), 60_000)),
      ]);
      expect({ code, signal }).toEqual({ code: 0, signal: null });
      expect(stderr).toContain('the database is closed');
      // The server is closed: nothing listens on its port any more.
      await expect(fetch(`${listening.url}/healthz`)).rejects.toThrow();
      // The database is closed and its lock released: another process opens it and sees the demo's key.
      expect(existsSync(join(dbDir, LOCK_FILE_NAME))).toBe(false);
      const keys = await runCli(['keys', 'list', '--db', dbDir, '--json'], { timeoutMs: 120_000 });
      expect(keys.code).toBe(0);
      expect((JSON.parse(keys.stdout) as Array<{ label: string; scope: string }>).some((k) => k.label === 'demo (local admin)' && k.scope === 'admin')).toBe(
        true,
      );

      // The next start reuses the demo with the user's contract in it, and says what was added since it was built.
      const again = await runCli(['demo', '--db', dbDir, '--no-serve', '--json'], { timeoutMs: 10 * 60_000 });
      expect(again.code, again.stderr).toBe(0);
      expect(again.stderr).toContain('reusing the demo database');
      expect(again.stderr).toMatch(/added since it was built \([^)]*\): 1 contract, \d+ mentions? \(source contract:clm\)/);
      expect(again.stderr).not.toContain('another scenario');
      expect(JSON.parse(again.stdout.trim()).seed).toBe(1);
      // "Another scenario" is said only when it is true: another seed is refused, naming the seed the demo was built from.
      const other = await runCli(['demo', '--db', dbDir, '--seed', '2', '--no-serve'], { timeoutMs: 10 * 60_000 });
      expect(other.code).toBe(1);
      expect(other.stderr).toContain('holds the demo built from seed 1, not from seed 2');
    },
    20 * 60_000,
  );
});

describe('cpreg demo interrupted while building', () => {
  it(
    'stops at the next step on SIGINT, closes the database (lock released, reopenable) and says how to resume',
    async () => {
      const root = mkdtempSync(join(tmpdir(), 'cpreg-demo-int-'));
      const dbDir = join(root, 'demo');
      try {
        const child = spawn(process.execPath, [CPREG_BIN, 'demo', '--db', dbDir, '--no-serve'], { cwd: REPO_ROOT, env: childEnv() });
        let stderr = '';
        const exited = new Promise<{ code: number | null }>((done) => child.on('exit', (code) => done({ code })));
        await new Promise<void>((resolve, reject) => {
          const timer = setTimeout(() => reject(new Error(`no contract stored in time:\n${stderr}`)), 5 * 60_000);
          child.stderr.on('data', (chunk) => {
            stderr += chunk;
            // Progress lines name the stage; wait until the contracts stage has started.
            if (/contracts/.test(stderr) && /building the demo/.test(stderr)) {
              clearTimeout(timer);
              resolve();
            }
          });
        });
        child.kill('SIGINT');
        const { code } = await Promise.race([
          exited,
          new Promise<never>((_, reject) => setTimeout(() => reject(new Error('the demo did not stop within 120 s of SIGINT')), 120_000)),
        ]);
        expect(code).toBe(130);
        expect(stderr).toContain('run the demo again');
        expect(existsSync(join(dbDir, LOCK_FILE_NAME))).toBe(false);
        const stored = await withTestDatabase(
          { at: dbDir },
          (database) =>
            database.db
              .selectFrom('contract')
              .select((eb) => eb.fn.countAll<string>().as('n'))
              .executeTakeFirstOrThrow(),
          { command: 'demo test' },
        );
        expect(Number(stored.n)).toBeLessThan(300); // stopped part-way: nothing half-written, the rest on the next run
      } finally {
        rmSync(root, { recursive: true, force: true });
      }
    },
    10 * 60_000,
  );
});
