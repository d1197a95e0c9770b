/** The register's CLI commands on an embedded database: own-entities, sweep and reresolve, with --json. */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { userInfo } from 'node:os';
import { mkdirSync, rmSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { createMigratedDataDir, removeTempDir, withTestDatabase } from '../../support/index.ts';
import { runCli } from '../../support/cli.ts';

// Each CLI run starts the embedded database in a new process (several seconds on a busy machine).
describe('cpreg own-entities, sweep, reresolve', { timeout: 240_000 }, () => {
  let dir: string;
  beforeAll(async () => {
    dir = await createMigratedDataDir();
  });
  afterAll(() => removeTempDir(dir));

  it('adds, lists and removes own entities, recording the CLI user as actor', async () => {
    const added = await runCli(['own-entities', 'add', 'Halvorsen Maritime Holdings AS', '--country', 'NO', '--db', dir, '--json']);
    expect(added.code).toBe(0);
    const result = JSON.parse(added.stdout) as { ownEntityId: number; created: boolean };
    expect(result.created).toBe(true);
    const listed = await runCli(['own-entities', 'list', '--db', dir, '--json']);
    expect(JSON.parse(listed.stdout)).toEqual([expect.objectContaining({ id: result.ownEntityId, name: 'Halvorsen Maritime Holdings AS', country: 'NO' })]);
    const bad = await runCli(['own-entities', 'add', 'Halvorsen Fjord AS', '--country', 'Norway', '--db', dir]);
    expect(bad.code).not.toBe(0);
    expect(bad.stderr).toContain('country');
    const removed = await runCli(['own-entities', 'remove', String(result.ownEntityId), '--db', dir, '--json']);
    expect(removed.code).toBe(0);
    expect(JSON.parse(removed.stdout)).toMatchObject({ ownEntityId: result.ownEntityId });
    await withTestDatabase({ at: dir }, async (opened) => {
      const actors = await opened.db.selectFrom('history_event').select('actor').distinct().execute();
      expect(actors.map((a) => a.actor)).toEqual([`cli:${userInfo().username}`]);
      const own = await opened.db.selectFrom('own_entity').select('removed_at').execute();
      expect(own).toHaveLength(1);
      expect(own[0]!.removed_at).not.toBeNull();
    });
  });

  it('sweep and reresolve print JSON summaries', async () => {
    const swept = await runCli(['sweep', '--db', dir, '--json']);
    expect(swept.code).toBe(0);
    expect(JSON.parse(swept.stdout)).toMatchObject({ scanned: 0, duplicateItems: 0 });
    const again = await runCli(['reresolve', '--db', dir, '--json']);
    expect(again.code).toBe(0);
    expect(JSON.parse(again.stdout)).toMatchObject({ examined: 0, changed: 0, failed: 0 });
    // A register where nothing changed is reported unchanged: a mention that made its counterparty ("new") and
    // finds that same counterparty again is not a change (it was counted as one, new -> linked, with an event each).
    const names = join(dir, '..', `reresolve-${process.pid}.csv`);
    writeFileSync(names, 'id,name,country\nr-1,Cobbleford Valve Ltd,GB\nr-2,Tarnhollow Seed Merchants Ltd,GB\n');
    try {
      const ingested = await runCli(['ingest', names, '--source', 'rr', '--db', dir, '--json']);
      expect(ingested.code, ingested.stderr).toBe(0);
      expect(JSON.parse(ingested.stdout)).toMatchObject({ counts: { new: 2 } });
      const unchanged = await runCli(['reresolve', '--db', dir, '--json']);
      expect(unchanged.code).toBe(0);
      expect(JSON.parse(unchanged.stdout)).toMatchObject({ examined: 2, changed: 0, unchanged: 2, failed: 0 });
    } finally {
      rmSync(names, { force: true });
      rmSync(`${names}.rejects.csv`, { force: true });
    }
    const bad = await runCli(['sweep', '--block-size', 'lots', '--db', dir]);
    expect(bad.code).not.toBe(0);
    expect(bad.stderr).toContain('--block-size');
  });

  it('own-entities add declares trading names; a contract naming our entity by one is ours, not a counterparty (issue 16, item 6)', async () => {
    // Invented names: the own entity "Orvanel Japan K.K." trades as "Orvanel Trading".
    const added = await runCli([
      'own-entities',
      'add',
      'Orvanel Japan K.K.',
      '--country',
      'JP',
      '--trade-name',
      'Orvanel Trading',
      '--also-known-as',
      'Orvanel JP',
      '--db',
      dir,
      '--json',
    ]);
    expect(added.code, added.stderr).toBe(0);
    expect(JSON.parse(added.stdout)).toMatchObject({ created: true, otherNamesAdded: ['Orvanel Trading', 'Orvanel JP'] });
    const listed = await runCli(['own-entities', 'list', '--db', dir]);
    expect(listed.stdout).toContain('Orvanel Japan K.K.\tJP\talso: Orvanel Trading (trade); Orvanel JP (also known as)');
    const folder = join(dir, '..', `own-trading-${process.pid}`);
    mkdirSync(folder, { recursive: true });
    writeFileSync(
      join(folder, 'distribution.txt'),
      'This Distribution Agreement is made on 3 March 2025 between Orvanel Trading, of 4-2 Minato Street, Tokyo (the "Distributor"), ' +
        'and Pellingham Freight Limited, a company incorporated in England and Wales (the "Carrier").\n',
    );
    try {
      const imported = await runCli(['contracts', 'import', folder, '--db', dir, '--json']);
      expect(imported.code, imported.stderr).toBe(0);
      expect(JSON.parse(imported.stdout)).toMatchObject({ parties: { own_entity: 1, new: 1 } });
    } finally {
      rmSync(folder, { recursive: true, force: true });
      rmSync(`${folder}.rejects.csv`, { force: true });
    }
    const names = await withTestDatabase({ at: dir }, (opened) =>
      opened.db.selectFrom('counterparty_name').select('name').where('name', 'like', 'Orvanel%').execute(),
    );
    expect(names).toEqual([]);
  });
});
