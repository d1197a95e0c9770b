/**
 * What the commands print, as a user reads it (issue 19 item 6, progress lines): counts in the right number ("1 row",
 * "1 partition"), one digit grouping ("1,480"), no estimate of the time left before there is work to judge it by,
 * the sweep job's counts, forget's rewritten rows and verify's checks in words (never a camelCase key or a table
 * name). Runs `cpreg` as a child process on an embedded directory; the names are invented.
 */
import { writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { Writable } from 'node:stream';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { countOf, progressReporter } from '../../../services/ingest/cli-support.ts';
import { createMigratedDataDir, makeTempDir, removeTempDir } from '../../support/index.ts';
import { runCli } from '../../support/cli.ts';

const CAMEL_CASE = /\b[a-z]+[A-Z][A-Za-z]*\b/;
const SNAKE_CASE = /\b[a-z]+_[a-z_]+\b/;
const WRONG_NUMBER = /\b1 (rows|vendor rows|entities|contracts|mentions|partitions|counterparties|review items)\b/;

/** A non-terminal stream that keeps what is written. */
function captured(): { stream: NodeJS.WriteStream; text: () => string } {
  let text = '';
  const stream = new Writable({
    write(chunk, _encoding, done) {
      text += String(chunk);
      done();
    },
  }) as unknown as NodeJS.WriteStream;
  return { stream, text: () => text };
}

describe('progress lines', () => {
  it('say "1 entity" and "1 vendor row", and guess no time left from the first item', () => {
    const own = captured();
    progressReporter('  own entities', 'entities', own.stream, 0).update({ done: 1, fraction: 1 / 7 });
    expect(own.text()).toBe('  own entities: 1 entity (14%)\n');
    const vendor = captured();
    const reporter = progressReporter('reconcile', 'vendor rows', vendor.stream, 0);
    reporter.update({ done: 1, fraction: 1 / 160 });
    reporter.update({ done: 1480, fraction: 0.5 });
    const lines = vendor.text().trim().split('\n');
    expect(lines[0]).toBe('reconcile: 1 vendor row (1%)');
    expect(lines[1]).toMatch(/^reconcile: 1,480 vendor rows \((\d[\d,]*\/s, )?50%\)$/);
    expect(vendor.text()).not.toContain('left');
  });

  it('count with one grouping and the right number', () => {
    expect(countOf(1, 'partition')).toBe('1 partition');
    expect(countOf(1480, 'row')).toBe('1,480 rows');
    expect(countOf(2, 'counterparty')).toBe('2 counterparties');
    expect(countOf(0, 'entity')).toBe('0 entities');
  });
});

describe('cpreg commands print words', () => {
  let dir: string;
  let db: string;
  beforeAll(async () => {
    dir = makeTempDir('cpreg-wording-');
    db = await createMigratedDataDir();
    const rows = ['Ravelstone Pumps Ltd', 'Corvath Mills GmbH', 'Tessaly Freight AS', 'Quenby Orchard Holdings Ltd'];
    writeFileSync(join(dir, 'one.ndjson'), `${JSON.stringify({ externalId: 'm0', text: rows[0], country: 'GB' })}\n`);
    writeFileSync(
      join(dir, 'rest.ndjson'),
      rows
        .slice(1)
        .map((text, i) => JSON.stringify({ externalId: `m${i + 1}`, text, country: i === 0 ? 'DE' : i === 1 ? 'NO' : 'GB' }))
        .join('\n') + '\n',
    );
    writeFileSync(join(dir, 'vendors.csv'), 'Vendor ID,Vendor Name,Country\nV-1,Ravelstone Pumps Ltd,GB\n');
  }, 120_000);
  afterAll(() => {
    removeTempDir(dir);
    removeTempDir(db);
  });

  it('ingest and reconcile: one row reads "1 row", one vendor row "1 vendor row"', async () => {
    const one = await runCli(['ingest', join(dir, 'one.ndjson'), '--source', 'words', '--db', db], { timeoutMs: 120_000 });
    expect(one.code, one.stderr).toBe(0);
    expect(one.stderr).not.toMatch(WRONG_NUMBER);
    expect(one.stderr).toMatch(/ingest: 1 row\b/);
    // The summary says each outcome in words ("own entity", "new counterparty"), never its key (own_entity).
    expect(one.stdout).toMatch(/^ {2}new counterparty +1$/m);
    expect(one.stdout).toMatch(/^ {2}own entity +0$/m);
    expect(one.stdout).not.toMatch(SNAKE_CASE);
    const rest = await runCli(['ingest', join(dir, 'rest.ndjson'), '--source', 'words', '--db', db], { timeoutMs: 120_000 });
    expect(rest.code, rest.stderr).toBe(0);
    const reconcile = await runCli(['reconcile', join(dir, 'vendors.csv'), '--db', db], { timeoutMs: 120_000 });
    expect(reconcile.code, reconcile.stderr).toBe(0);
    expect(reconcile.stderr).toMatch(/reconcile: 1 vendor row\b/);
    expect(reconcile.stderr).not.toMatch(WRONG_NUMBER);
    expect(reconcile.stderr).not.toContain('left');
  }, 300_000);

  it('export says how many rows of what it wrote, grouped like the progress lines', async () => {
    const out = join(dir, 'links.csv');
    const run = await runCli(['export', 'links', '--out', out, '--db', db], { timeoutMs: 120_000 });
    expect(run.code, run.stderr).toBe(0);
    expect(run.stdout).toBe(`exported 4 rows of mention links to ${out}\n`);
  }, 120_000);

  it('the sweep job prints its counts in words and "1 partition"', async () => {
    const run = await runCli(['sweep', '--as-job', '--partition-size', '1000', '--db', db], { timeoutMs: 180_000 });
    expect(run.code, run.stderr).toBe(0);
    expect(run.stdout).toMatch(/counterparties scanned\s+4\n/);
    expect(run.stdout).toContain('duplicate review items filed');
    expect(run.stdout).toMatch(/^1 partition$/m);
    expect(run.stdout).not.toMatch(CAMEL_CASE);
    expect(run.stdout).not.toMatch(WRONG_NUMBER);
  }, 180_000);

  it('verify names each check by what holds; the JSON keeps the ids', async () => {
    const run = await runCli(['verify', '--db', db], { timeoutMs: 120_000 });
    expect(run.code, run.stdout + run.stderr).toBe(0);
    expect(run.stdout).toContain('ok:   every merged id leads to an active counterparty');
    expect(run.stdout).toContain('ok:   replaying the history from empty gives the register as it is');
    expect(run.stdout).not.toMatch(SNAKE_CASE);
    const json = await runCli(['verify', '--db', db, '--json'], { timeoutMs: 120_000 });
    expect((JSON.parse(json.stdout) as { checks: { check: string }[] }).checks.map((c) => c.check)).toContain('redirect_chain_broken');
  }, 240_000);

  it('forget says what the rewritten rows hold, not the tables they are in', async () => {
    const list = await runCli(['export', 'register', '--format', 'ndjson', '--db', db], { timeoutMs: 120_000 });
    const target = list.stdout
      .trim()
      .split('\n')
      .map((line) => JSON.parse(line) as Record<string, unknown>)
      .find((row) => Object.values(row).includes('Quenby Orchard Holdings Ltd'));
    expect(target, list.stdout).toBeDefined();
    const id = String(target!.counterparty_id);
    const run = await runCli(['forget', id, '--organisation', '--reason', 'erasure request ER-1', '--db', db], { timeoutMs: 120_000 });
    expect(run.code, run.stderr).toBe(0);
    expect(run.stdout).toMatch(/rewrote .*\b1 name\b/);
    expect(run.stdout).toMatch(/\b1 mention\b/);
    expect(run.stdout).not.toMatch(SNAKE_CASE);
    expect(run.stdout).not.toMatch(WRONG_NUMBER);
  }, 120_000);
});
