import { mkdtempSync, readFileSync, readdirSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { parse } from 'csv-parse/sync';
import { afterAll, describe, expect, it } from 'vitest';
import { writeScenario, MENTION_CSV_COLUMNS } from '../../../services/demo/write-scenario.ts';

const dir = mkdtempSync(join(tmpdir(), 'cpreg-scenario-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

describe('writeScenario', () => {
  it('writes contracts, mentions, the vendor master and the truth, each complete', async () => {
    const { scenario, files } = await writeScenario(dir, 3);
    expect(readdirSync(join(dir, 'contracts'))).toHaveLength(scenario.contracts.length);
    const ndjson = readFileSync(join(dir, 'contracts.ndjson'), 'utf8')
      .trim()
      .split('\n')
      .map((l) => JSON.parse(l) as { externalId: string; text: string });
    expect(ndjson.map((c) => c.externalId)).toEqual(scenario.contracts.map((c) => c.externalId));
    expect(readFileSync(join(dir, 'contracts', `${ndjson[0]!.externalId}.txt`), 'utf8')).toBe(ndjson[0]!.text);
    const mentions = parse(readFileSync(join(dir, 'mentions.csv'), 'utf8'), { columns: true }) as Array<Record<string, string>>;
    expect(Object.keys(mentions[0]!)).toEqual(MENTION_CSV_COLUMNS);
    expect(mentions.map((m) => m.text)).toEqual(scenario.mentions.map((m) => m.input.text));
    expect(readFileSync(join(dir, 'mentions.ndjson'), 'utf8').trim().split('\n')).toHaveLength(scenario.mentions.length);
    expect(readFileSync(join(dir, 'vendor-master.csv'), 'utf8')).toBe(scenario.vendorMaster.csv);
    const truth = JSON.parse(readFileSync(join(dir, 'truth.json'), 'utf8')) as { seed: number; mentions: unknown[]; vendorMaster: { duplicates: unknown[] } };
    expect(truth.seed).toBe(3);
    expect(truth.mentions).toHaveLength(scenario.mentions.length);
    expect(truth.vendorMaster.duplicates).toHaveLength(scenario.vendorMaster.truth.duplicates.length);
    expect(files).toContain('truth.json');
  });
});
