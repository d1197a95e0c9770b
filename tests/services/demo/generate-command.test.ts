// `cpreg generate` end to end, as a user runs it: a child process writing a file.
import { execFile } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync, existsSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { promisify } from 'node:util';
import { parse } from 'csv-parse/sync';
import { afterAll, describe, expect, it } from 'vitest';
import { generateNames } from '../../../services/demo/generate-names.ts';

const run = promisify(execFile);
const dir = mkdtempSync(join(tmpdir(), 'cpreg-generate-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

function cpreg(...args: string[]): Promise<{ stdout: string; stderr: string }> {
  return run(process.execPath, ['bin/cpreg.js', ...args], { cwd: process.cwd(), timeout: 60_000 });
}

describe('cpreg generate', () => {
  it('writes the CSV, the same bytes for the same seed, the rows generateNames yields', async () => {
    const a = join(dir, 'a.csv');
    const b = join(dir, 'b.csv');
    const c = join(dir, 'c.csv');
    const first = await cpreg('generate', '--names', '3000', '--seed', '5', '--out', a, '--json');
    await cpreg('generate', '--names', '3000', '--seed', '5', '--out', b);
    await cpreg('generate', '--names', '3000', '--seed', '6', '--out', c);
    const summary = JSON.parse(first.stdout) as { rows: number; entities: number; seed: number };
    expect(summary.rows).toBe(3000);
    expect(summary.seed).toBe(5);
    const text = readFileSync(a, 'utf8');
    expect(readFileSync(b, 'utf8')).toBe(text);
    expect(readFileSync(c, 'utf8')).not.toBe(text);
    expect(existsSync(`${a}.partial`)).toBe(false);
    const rows = parse(text, { columns: true }) as Array<Record<string, string>>;
    expect(Object.keys(rows[0]!)).toEqual(['entity_id', 'name', 'country', 'variant_kind', 'sibling_of']);
    expect(rows).toHaveLength(3000);
    const expected = [...generateNames(3000, 5)];
    expect(rows.map((r) => [r.entity_id, r.name, r.country, r.variant_kind, r.sibling_of])).toEqual(
      expected.map((r) => [r.entityId, r.name, r.country, r.variantKind, r.siblingOf ?? '']),
    );
    expect(new Set(rows.filter((r) => r.variant_kind === 'original').map((r) => r.entity_id)).size).toBe(summary.entities);
  });

  it('names the flag and the limit when --names is not a whole number in range', async () => {
    await expect(cpreg('generate', '--names', 'lots', '--out', join(dir, 'x.csv'))).rejects.toMatchObject({
      code: 1,
      stderr: expect.stringContaining('--names: expected a whole number from 0 to 10000000'),
    });
    await expect(cpreg('generate', '--names', '10', '--seed', '-3', '--out', join(dir, 'x.csv'))).rejects.toMatchObject({ code: 1 });
    expect(existsSync(join(dir, 'x.csv'))).toBe(false);
  });

  it('says which file it could not write, and leaves no partial file', async () => {
    const out = join(dir, 'missing-folder', 'x.csv');
    await expect(cpreg('generate', '--names', '10', '--out', out)).rejects.toMatchObject({
      code: 1,
      stderr: expect.stringContaining(`--out ${out}`),
    });
    expect(existsSync(`${out}.partial`)).toBe(false);
  });
});
