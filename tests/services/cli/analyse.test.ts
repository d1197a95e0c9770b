/** `cpreg analyse` run as a child process, as a user would: JSON shape, --country narrowing, limits and flags. */
import { describe, expect, it } from 'vitest';
import { runCli } from '../../support/cli.ts';

const analyse = (...args: string[]) => runCli(['analyse', ...args]);

describe('cpreg analyse', () => {
  it('--json prints the whole NameAnalysis (resolvers/analyse/types.ts) of an invented name', async () => {
    const result = await analyse('Halvern Textiles Ltd', '--country', 'GB', '--json');
    expect(result.code).toBe(0);
    const analysis = JSON.parse(result.stdout) as Record<string, unknown>;
    expect(Object.keys(analysis).sort()).toEqual(
      ['aliases', 'alternatives', 'core', 'input', 'kind', 'legalForm', 'normalised', 'partyStatus', 'qualifiers', 'related', 'tokens'].sort(),
    );
    expect(analysis.input).toBe('Halvern Textiles Ltd');
    expect(analysis.core).toBe('halvern textiles');
    expect(analysis.tokens).toEqual(['halvern', 'textiles']);
    expect(analysis.partyStatus).toBe('party');
    expect(analysis.kind).toBe('organisation');
    // "Ltd" in GB is (among others) the private limited company, ELF H0PO (../shared/reference/worked-examples.json
    // iso20275_elf_examples, from the GLEIF ELF code list v1.5).
    expect(analysis.legalForm).toMatchObject({ text: 'Ltd', family: 'ltd', jurisdictions: ['GB'] });
    expect((analysis.legalForm as { elfCodes: string[] }).elfCodes).toContain('H0PO');
  });

  it('--country narrows "SA" to the code of that country: QVPB in FR, MVII in CH', async () => {
    // ../shared/reference/worked-examples.json iso20275_elf_examples: "FR SA" = QVPB (Société anonyme, FR);
    // "CH AG/SA/SA" = MVII (one code, French and Italian rows abbreviated SA) — GLEIF ELF code list v1.5.
    const fr = await analyse('Société Exemple SA', '--country', 'FR', '--json');
    const ch = await analyse('Société Exemple SA', '--country', 'CH', '--json');
    const any = await analyse('Société Exemple SA', '--json');
    expect([fr.code, ch.code, any.code]).toEqual([0, 0, 0]);
    const codes = (stdout: string) => (JSON.parse(stdout) as { legalForm: { elfCodes: string[] } }).legalForm.elfCodes;
    expect(codes(fr.stdout)).toEqual(['QVPB']);
    expect(codes(ch.stdout)).toEqual(['MVII']);
    // Without a country, "SA" stands for the codes of every country that uses it, both of these among them.
    expect(codes(any.stdout)).toEqual(expect.arrayContaining(['QVPB', 'MVII']));
    expect(codes(any.stdout).length).toBeGreaterThan(2);
  });

  it('the text form names the legal form and its code', async () => {
    const result = await analyse('Société Exemple SA', '--country', 'FR');
    expect(result.code).toBe(0);
    expect(result.stdout).toMatch(/^legal form: +SA \(family sa; ELF QVPB; FR\)$/m);
    expect(result.stdout).toMatch(/^core: +societe exemple$/m);
  });

  it('a name over 1,000 characters is refused naming the limit, and nothing is printed on stdout', async () => {
    // The 1,000-character limit on names is cpreg's own (docs/api.md, Limits).
    const ok = await analyse('a'.repeat(1000), '--json');
    expect(ok.code).toBe(0);
    const result = await analyse('a'.repeat(1001));
    expect(result.code).not.toBe(0);
    expect(result.stdout).toBe('');
    expect(result.stderr).toContain('1001 characters is over the limit of 1000');
    expect(result.stderr.trim().split('\n')).toHaveLength(1);
  });

  it('a country that is not an ISO 3166 code is refused naming --country', async () => {
    const result = await analyse('Exemple SA', '--country', 'France');
    expect(result.code).not.toBe(0);
    expect(result.stderr).toContain('--country');
    expect(result.stderr).toContain('"France"');
  });

  it('an unknown flag names it and lists the valid ones', async () => {
    const result = await analyse('Exemple SA', '--contry', 'FR');
    expect(result.code).not.toBe(0);
    expect(result.stderr).toContain("unknown option '--contry'");
    for (const flag of ['--country', '--json', '--help']) expect(result.stderr).toContain(flag);
  });

  it('says the party status in words on the terminal (it printed the key needs_binding); --json keeps the key', async () => {
    // "the Supplier" is a role word that names a party only through a contract's definitions (docs/analyse.md, party filter).
    const text = await analyse('the Supplier');
    expect(text.code).toBe(0);
    expect(text.stdout).toMatch(/^party: +needs binding: a role, term or pronoun .* \(a role or collective word\); kind unknown$/m);
    expect(text.stdout).not.toMatch(/\b[a-z]+_[a-z_]+\b/);
    const json = JSON.parse((await analyse('the Supplier', '--json')).stdout) as { partyStatus: string; partyReason: string };
    expect(json).toMatchObject({ partyStatus: 'needs_binding', partyReason: 'role_word' });
  });
});
