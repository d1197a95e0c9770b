/** `cpreg contract parse` lists places, document references and roles under their own headings (issue 16). Invented passage. */
import { mkdtemp, rm, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { runCli } from '../../support/cli.ts';
import { NON_PARTY_SHAPES } from '../../resolvers/terms/corpus/non-party-shapes.ts';

let dir = '';

beforeAll(async () => {
  dir = await mkdtemp(join(tmpdir(), 'cpreg-headings-'));
  const passage = NON_PARTY_SHAPES.find((c) => c.id === 'us-places-state-venue');
  const dpa = NON_PARTY_SHAPES.find((c) => c.id === 'uk-dpa-roles');
  await writeFile(join(dir, 'msa.txt'), passage?.text ?? '');
  await writeFile(join(dir, 'dpa.txt'), dpa?.text ?? '');
});

afterAll(async () => {
  await rm(dir, { recursive: true, force: true });
});

describe('cpreg contract parse headings', () => {
  it('says why each name was left out', async () => {
    const msa = await runCli(['contract', 'parse', join(dir, 'msa.txt')]);
    expect(msa.code).toBe(0);
    expect(msa.stdout).toContain('Places (not parties): the State of New York; the Commonwealth of Massachusetts');
    expect(msa.stdout).toContain('Document references (not parties): Agreement');
    const dpa = await runCli(['contract', 'parse', join(dir, 'dpa.txt')]);
    expect(dpa.stdout).toContain('Roles not bound to a party: Sub-processor');
  });

  it('says how a --mention ended in words (it printed the key unbound_term)', async () => {
    // The passage defines no "Supplier": the mention is a term this contract does not bind.
    const msa = await runCli(['contract', 'parse', join(dir, 'msa.txt'), '--mention', 'the Supplier']);
    expect(msa.code).toBe(0);
    expect(msa.stdout).toMatch(/^Mention "the Supplier": unbound defined term$/m);
  });
});
