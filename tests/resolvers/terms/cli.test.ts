/** `cpreg contract parse` through a child process, as a user runs it; files live in a fresh temp directory. */
import { mkdtemp, rm, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { runCli } from '../../support/cli.ts';
import { CORPUS } from './corpus/contracts.ts';
import { DECLARED_NAME_SHAPES } from './corpus/declared-name-shapes.ts';
import { EARLIER_AGREEMENT_SHAPES } from './corpus/earlier-agreement-shapes.ts';

let dir = '';
const file = (name: string): string => join(dir, name);

beforeAll(async () => {
  dir = await mkdtemp(join(tmpdir(), 'cpreg-contract-'));
  const classic = CORPUS.find((c) => c.id === 'us-license-classic');
  await writeFile(file('license.txt'), classic?.text ?? '');
  await writeFile(file('empty.txt'), '  \n');
  await writeFile(file('formerly.txt'), DECLARED_NAME_SHAPES.find((c) => c.id === 'uk-declared-formerly-trading-as')?.text ?? '');
  await writeFile(file('amendment.txt'), EARLIER_AGREEMENT_SHAPES.find((c) => c.id === 'us-earlier-amendment-meanings-ascribed')?.text ?? '');
  await writeFile(file('prose.txt'), 'The river ran clear all year.\n');
  await writeFile(file('binary.bin'), Buffer.from([0x25, 0x50, 0x44, 0x46, 0x00, 0x01, 0xff, 0xfe]));
  await writeFile(file('latin1.txt'), Buffer.from([0x41, 0x63, 0x6d, 0xe9, 0x20, 0x4c, 0x74, 0x64]));
  await writeFile(file('big.txt'), 'a'.repeat(1024 * 1024 + 1));
});

afterAll(async () => {
  await rm(dir, { recursive: true, force: true });
});

describe('cpreg contract parse', () => {
  it('--json prints the parties in the shape the issue fixes', async () => {
    const r = await runCli(['contract', 'parse', file('license.txt'), '--json']);
    expect(r.stderr).toBe('');
    expect(r.code).toBe(0);
    const out = JSON.parse(r.stdout);
    // Issue 16 adds the signers (a person who signs for a party, with her title) beside the non-party names.
    expect(Object.keys(out).sort()).toEqual(['collectiveTerms', 'notParties', 'parties', 'signers']);
    expect(out.signers).toEqual([{ name: 'Jane Harlow', title: 'Chief Executive Officer', capacity: 'signatory', signsFor: 'BRACKENRIDGE FABRICATION, INC.' }]);
    expect(out.notParties).not.toContain('Chief Executive Officer');
    expect(out.parties.map((p: any) => p.name)).toEqual(['Brackenridge Fabrication, Inc.', 'Pellinore Widgets Ltd']);
    const licensee = out.parties[1];
    for (const key of ['name', 'role', 'terms', 'ownEntity', 'jurisdiction', 'legalForm', 'identifiers', 'aliases', 'related', 'kind']) {
      expect(licensee, key).toHaveProperty(key);
    }
    expect(licensee.role).toBe('Licensee');
    expect(licensee.identifiers).toEqual([{ scheme: 'gb_company', value: '04417782' }]);
    expect(out.collectiveTerms.map((c: any) => c.term)).toEqual(['Party', 'Parties']);
    expect(out.notParties).toContain('Agreement');
  });

  it('lists the signers under their own heading, with title and party, and not again among the other non-parties', async () => {
    // Issue 16 goal: a reviewer sees why each name was left out.
    const r = await runCli(['contract', 'parse', file('license.txt')]);
    expect(r.code).toBe(0);
    expect(r.stdout).toContain('Signers (not parties): Jane Harlow, Chief Executive Officer, for BRACKENRIDGE FABRICATION, INC.');
    expect(r.stdout).not.toMatch(/^Not parties: .*Jane Harlow/mu);
  });

  it('--mention resolves a mention inside the contract (text and JSON)', async () => {
    const text = await runCli(['contract', 'parse', file('license.txt'), '--mention', 'the Licensee']);
    expect(text.code).toBe(0);
    expect(text.stdout).toContain('Mention "the Licensee": bound → Pellinore Widgets Ltd (Licensee)');
    const json = await runCli(['contract', 'parse', file('license.txt'), '--json', '--mention', 'the Distributor']);
    expect(json.code).toBe(0);
    expect(JSON.parse(json.stdout).mention.status).toBe('unbound_term');
  });

  it('shows declared former names, resolves a mention of one, and names the earlier agreement an amendment uses', async () => {
    // Issue 16 items 8 and 9: a reviewer sees why a former name is the party and which agreement's terms bind.
    const former = await runCli(['contract', 'parse', file('formerly.txt'), '--mention', 'Tollaby Cold Storage Ltd']);
    expect(former.code).toBe(0);
    expect(former.stdout).toContain('aliases: former Tollaby Cold Storage Ltd');
    expect(former.stdout).toContain('Mention "Tollaby Cold Storage Ltd": match → Tollaby Logistics Limited (Customer)');
    expect(former.stdout).toContain('is the former name this contract declares for party Tollaby Logistics Limited');
    const amendment = await runCli(['contract', 'parse', file('amendment.txt')]);
    expect(amendment.code).toBe(0);
    expect(amendment.stdout).toContain(
      'Uses the defined terms of an earlier agreement: Master Services Agreement, dated 2024-06-01, reference MSA-2024-017, between Harrowgate Analytics, Inc. and Quillon Freight LLC',
    );
  });

  it('prints an empty result with its reason when no party is found', async () => {
    const r = await runCli(['contract', 'parse', file('prose.txt'), '--json']);
    expect(r.code).toBe(0);
    const out = JSON.parse(r.stdout);
    expect(out.parties).toEqual([]);
    expect(out.reason.code).toBe('no_parties_found');
  });

  it.each([
    ['a missing file', 'missing.txt', 'no such file'],
    ['an empty file', 'empty.txt', 'is empty'],
    ['binary data', 'binary.bin', 'binary'],
    ['text that is not UTF-8', 'latin1.txt', 'not valid UTF-8'],
    ['an over-size file', 'big.txt', 'the limit is 1 MB (1048576 bytes)'],
  ])('refuses %s with one clear line', async (_label, name, message) => {
    const r = await runCli(['contract', 'parse', file(name)]);
    expect(r.code).toBe(1);
    expect(r.stdout).toBe('');
    expect(r.stderr).toContain('<file>');
    expect(r.stderr).toContain(message);
    expect(r.stderr.trim().split('\n')).toHaveLength(1);
  });
});
