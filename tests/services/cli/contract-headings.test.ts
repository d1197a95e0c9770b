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
  await writeFile(
    join(dir, 'loan.txt'),
    'This Loan Agreement is made between Harrowgate Lending Ltd (the "Lender") and Pellbrook Joinery Ltd (the "Borrower"). ' +
      'Calderwick Holdings Ltd (the "Guarantor"), which is not a party to this Agreement, has agreed to guarantee the loan.',
  );
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

  it('lists an entity the contract names but excludes under its own heading (issue 16 item 5)', async () => {
    const loan = await runCli(['contract', 'parse', join(dir, 'loan.txt')]);
    expect(loan.code).toBe(0);
    expect(loan.stdout).toMatch(/^Mentioned, not parties to this contract: Calderwick Holdings Ltd \("Guarantor"\)$/m);
    expect(loan.stdout).not.toMatch(/^ {2}\d+\. Calderwick/m);
  });

  it('says how a --mention ended in words (it printed the key unbound_term)', async () => {
    // The passage defines no "Supplier": the mention is a term this contract does not bind.
    const msa = await runCli(['contract', 'parse', join(dir, 'msa.txt'), '--mention', 'the Supplier']);
    expect(msa.code).toBe(0);
    expect(msa.stdout).toMatch(/^Mention "the Supplier": unbound defined term$/m);
  });
});
