import { execFile } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { promisify } from 'node:util';
import { afterAll, describe, expect, it } from 'vitest';

// Fixtures: tests/fixtures/ror-sample.csv holds 49 rows (17 organisations, two withdrawn rows) taken from
// ../shared/datasets/ror_org_names.csv (Research Organization Registry data, CC0 1.0; split=test), columns cut
// down; tests/fixtures/ror-bad-rows.csv is 9 of those names with faults added by hand (an extra field, an empty
// name, an empty id, a stray quote).
const run = promisify(execFile);
const cpreg = (args: string[]) => run(process.execPath, ['bin/cpreg.js', 'evaluate', ...args], { cwd: process.cwd() });
const SAMPLE = 'tests/fixtures/ror-sample.csv';
const BAD = 'tests/fixtures/ror-bad-rows.csv';
const out = mkdtempSync(join(tmpdir(), 'cpreg-evaluate-'));
afterAll(() => rmSync(out, { recursive: true, force: true }));

const BASE = ['--id', 'entity_id', '--name', 'name', '--country', 'country', '--exclude', 'status=withdrawn', '--strip-country-qualifier'];

describe('cpreg evaluate', () => {
  it('--json has pairwise, bcubed ({precision, recall, f1}) and ari, over the 47 non-withdrawn rows', async () => {
    const { stdout } = await cpreg([SAMPLE, ...BASE, '--acronym', 'source_name_type=acronym', '--json']);
    const report = JSON.parse(stdout);
    expect(report.rows).toBe(47);
    expect(report.entities).toBe(17);
    expect(report.input.excludedOut).toBe(2);
    // The ROR display qualifier stripped, counted by hand in the fixture: (Japan), (United States), (Norway),
    // (Portugal), (Canada).
    expect(report.input.countryQualifiersStripped).toBe(5);
    for (const key of ['pairwise', 'bcubed'] as const) {
      for (const field of ['precision', 'recall', 'f1']) {
        expect(report[key][field]).toBeGreaterThanOrEqual(0);
        expect(report[key][field]).toBeLessThanOrEqual(1);
      }
    }
    expect(typeof report.ari).toBe('number');
    // CRKN, RCDR, IRIAS, МНИИПУ, POLNAM, HALMED, EMI, KIST (counted in the fixture)
    expect(report.acronymRows).toBe(8);
    expect(report.blocking.byCategory.latin_shared_word.truePairs).toBeGreaterThan(0);
  }, 60_000);

  it('exact baseline: "Norsk Tipping" and "Norsk Tipping (Norway)" meet once the qualifier is stripped', async () => {
    const kept = JSON.parse(
      (await cpreg([SAMPLE, '--id', 'entity_id', '--name', 'name', '--method', 'exact', '--json', '--filter', 'entity_id=02n15q260'])).stdout,
    );
    const stripped = JSON.parse(
      (
        await cpreg([
          SAMPLE,
          '--id',
          'entity_id',
          '--name',
          'name',
          '--method',
          'exact',
          '--json',
          '--filter',
          'entity_id=02n15q260',
          '--strip-country-qualifier',
        ])
      ).stdout,
    );
    // 4 names of one entity: 6 true pairs. Kept: no two normalised names are equal → 0 predicted pairs.
    expect(kept.pairwise.goldPairs).toBe(6);
    expect(kept.pairwise.predictedPairs).toBe(0);
    // Stripped: "norsk tipping" twice → 1 predicted pair, a true one.
    expect(stripped.pairwise.truePositivePairs).toBe(1);
    expect(stripped.pairwise.precision).toBe(1);
  }, 60_000);

  it('--out writes report.json, sweep.csv and a labelled sweep.svg', async () => {
    const { stdout } = await cpreg([SAMPLE, ...BASE, '--out', out]);
    expect(stdout).toMatch(/model: links from [\d.]+ bits, new at or below [-\d.]+/);
    const csv = readFileSync(join(out, 'sweep.csv'), 'utf8').trim().split('\n');
    expect(csv[0]).toBe('link_at,precision,recall,f1');
    expect(csv.length).toBeGreaterThan(2);
    const svg = readFileSync(join(out, 'sweep.svg'), 'utf8');
    expect(svg).toMatch(/^<svg /);
    expect(svg).toContain('link threshold (match score in bits)');
    expect(svg).not.toMatch(/linkAt|match weight/); // our own words, no field names (issue 19 item 6)
    expect(svg).toContain('precision');
    expect(svg).toContain('recall');
    expect(JSON.parse(readFileSync(join(out, 'report.json'), 'utf8')).pairwise).toBeDefined();
  }, 60_000);

  it('reports bad rows with their line numbers and leaves them out of the metrics', async () => {
    const { stdout, stderr } = await cpreg([BAD, '--id', 'entity_id', '--name', 'name', '--method', 'exact', '--json']);
    expect(stderr).toMatch(/ror-bad-rows\.csv:4: unparseable CSV row/);
    expect(stderr).toMatch(/ror-bad-rows\.csv:5: empty name/);
    expect(stderr).toMatch(/ror-bad-rows\.csv:6: empty entity_id/);
    expect(stderr).toMatch(/ror-bad-rows\.csv:7: unparseable CSV row/);
    const report = JSON.parse(stdout);
    expect(report.rows).toBe(5); // 9 data rows − 4 reported
    expect(report.input.problems).toHaveLength(4);
  }, 60_000);

  it('names a missing column and lists the header', async () => {
    await expect(cpreg([SAMPLE, '--id', 'ror_id', '--name', 'name'])).rejects.toMatchObject({
      stderr: expect.stringMatching(/--id ror_id.*the header has: entity_id, name/),
      code: 1,
    });
  });

  it('rejects an unknown method and a malformed --filter', async () => {
    await expect(cpreg([SAMPLE, '--id', 'entity_id', '--name', 'name', '--method', 'fuzzy'])).rejects.toMatchObject({
      stderr: expect.stringMatching(/--method must be one of cpreg, exact, jw/),
    });
    await expect(cpreg([SAMPLE, '--id', 'entity_id', '--name', 'name', '--filter', 'split'])).rejects.toMatchObject({
      stderr: expect.stringMatching(/--filter expects column=value/),
    });
  });
});

describe('cpreg evaluate: the LEI protocol, the three outcomes, the candidate-pair baseline', () => {
  // Invented names: two entities share "Quarrendon Holdings Ltd" in GB (set aside by the protocol); one entity is
  // written twice; one pair differs only by a series number.
  const csv = join(out, 'invented.csv');
  const rows = [
    'entity_id,name,country',
    'E1,Quarrendon Holdings Ltd,GB',
    'E2,Quarrendon Holdings Ltd,GB',
    'E3,Velmbruck Fabrication Ltd,GB',
    'E3,VELMBRUCK FABRICATION LIMITED,GB',
    'E4,Tollaby Finance II S.r.l.,IT',
    'E5,Tollaby Finance S.r.l.,IT',
  ];
  it('--set-aside-shared-names leaves out the rows two ids share; outcomes add up; jw-candidates runs', async () => {
    writeFileSync(csv, `${rows.join('\n')}\n`);
    const args = [csv, '--id', 'entity_id', '--name', 'name', '--country', 'country', '--json'];
    const all = JSON.parse((await cpreg(args)).stdout);
    const aside = JSON.parse((await cpreg([...args, '--set-aside-shared-names'])).stdout);
    expect(all.rows).toBe(6);
    expect(aside.rows).toBe(4);
    expect(aside.input.setAsideSharedNames).toBe(2);
    const o = aside.outcomes;
    expect(o.linked + o.review + o.new).toBe(4);
    // The two spellings of E3 link; the series pair (E4 / E5) is kept apart: no false pair.
    expect(aside.pairwise).toMatchObject({ truePositivePairs: 1, predictedPairs: 1 });
    const jw = JSON.parse((await cpreg([...args, '--set-aside-shared-names', '--method', 'jw-candidates'])).stdout);
    expect(jw.method).toBe('jw-candidates');
    // JW ≥ 0.9 links the series pair too: a plain string threshold has no rule for a series number.
    expect(jw.pairwise.predictedPairs).toBe(2);
  });
});

describe('cpreg evaluate --through-register', () => {
  it('ingests the rows into an empty register and measures the links it stored, every row accounted for', async () => {
    const { stdout } = await cpreg([SAMPLE, ...BASE, '--through-register', '--batch-size', '20', '--json']);
    const report = JSON.parse(stdout);
    expect(report.rows).toBe(47);
    expect(report.batchSize).toBe(20);
    expect(report.linked + report.new + report.review + report.other).toBe(47);
    // Every stored counterparty was made by a mention of this file: one "new" each.
    expect(report.counterparties).toBe(report.new);
    expect(report.pairwise.goldPairs).toBeGreaterThan(0);
    for (const key of ['pairwise', 'bcubed'] as const) {
      expect(report[key].precision).toBeGreaterThanOrEqual(0);
      expect(report[key].precision).toBeLessThanOrEqual(1);
    }
  }, 120_000);

  it('counts one row as "1 row" (issue 19 item 6: counts in words)', async () => {
    // One usable row and one with an empty name (a fault made by hand for this test).
    const file = join(out, 'one-row.csv');
    writeFileSync(file, 'entity_id,name,country\ne1,Example Holdings GmbH,DE\ne2,,DE\n');
    const { stdout } = await cpreg([file, '--id', 'entity_id', '--name', 'name', '--country', 'country']);
    expect(stdout).toContain(`${file}: 1 row used, 1 row with problems (listed above)`);
    const empty = join(out, 'no-usable-row.csv');
    writeFileSync(empty, 'entity_id,name,country\ne2,,DE\n');
    await expect(cpreg([empty, '--id', 'entity_id', '--name', 'name', '--country', 'country'])).rejects.toMatchObject({
      stderr: expect.stringContaining('no usable rows after filtering (1 row with problems)'),
    });
  }, 60_000);

  it('refuses what does not apply to the register', async () => {
    await expect(cpreg([SAMPLE, ...BASE, '--through-register', '--link-at', '5'])).rejects.toMatchObject({
      stderr: expect.stringMatching(/--link-at does not apply with --through-register/),
    });
    await expect(cpreg([SAMPLE, ...BASE, '--through-register', '--batch-size', '0'])).rejects.toMatchObject({
      stderr: expect.stringMatching(/--batch-size expects a whole number of at least 1/),
    });
  }, 60_000);
});
