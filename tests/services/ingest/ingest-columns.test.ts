/**
 * Issue 19 item 5, ingest meets a real file, through `cpreg ingest` as a user runs it: columns no field reads are
 * named in a warning (Ref and Doc were dropped silently), a missing id column is warned about with the column that
 * looks like one, `--map externalId=Ref` makes a re-sent row with another text an update of its mention, and a
 * "Tax ID" column gets its scheme per value and country as reconcile reads it (not one fixed scheme that refuses
 * every other country's number). Names and numbers are invented; the numbers only fit the formats
 * resolvers/identifiers checks (DE VAT: 9 digits after the prefix, no check digit; US EIN: 9 digits, not 00).
 */
import { writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { makeTempDir, removeTempDir, withTestDatabase } from '../../support/index.ts';
import { runCli } from '../../support/cli.ts';

const SLOW = 180_000;
const HEADER = 'Ref,Party,Doc,Tax ID,Country';
const ROWS = [
  'V-1,Quillmere Fabrication GmbH,K-77,DE123456789,DE',
  'V-2,Orvane Trading Inc.,K-78,12-3456789,US',
  'V-3,Lanterbay Conseil SARL,K-79,12345678901,FR',
];

describe('cpreg ingest on a file with columns of its own', () => {
  let dir: string;
  let db: string;
  beforeAll(() => {
    dir = makeTempDir('cpreg-ingest-columns-');
    db = join(dir, 'db');
  });
  afterAll(() => removeTempDir(dir));

  it(
    'names the columns it does not read and warns that rows get content ids, suggesting the id-like column',
    async () => {
      const file = join(dir, 'unmapped.csv');
      writeFileSync(file, `${HEADER}\n${ROWS[0]}\n`);
      const run = await runCli(['ingest', file, '--source', 'erp-a', '--db', db, '--json'], { timeoutMs: SLOW });
      expect(run.code, run.stderr).toBe(0);
      expect(run.stderr).toContain('warning: 2 columns not read: "Ref", "Doc"');
      expect(run.stderr).toContain('no column is read as the row id');
      expect(run.stderr).toContain('add --map externalId=Ref');
      expect(JSON.parse(run.stdout).warnings).toHaveLength(2);
    },
    SLOW,
  );

  it(
    '--map externalId=Ref and contract=Doc read every column: no warning, ids from the file, tax ids by value and country',
    async () => {
      const file = join(dir, 'mapped.csv');
      writeFileSync(file, `${HEADER}\n${ROWS.join('\n')}\n`);
      const args = ['ingest', file, '--source', 'erp-b', '--map', 'externalId=Ref', '--map', 'contract=Doc', '--map', 'taxId=Tax ID', '--db', db, '--json'];
      const run = await runCli(args, { timeoutMs: SLOW });
      expect(run.code, run.stderr).toBe(0);
      expect(run.stderr).not.toContain('warning');
      expect(JSON.parse(run.stdout).counts.rejected).toBe(0);

      // The same row re-sent with another text is the same mention, updated (not a second mention).
      const resend = join(dir, 'resend.csv');
      writeFileSync(resend, `${HEADER}\nV-1,Quillmere Fabrication AG,K-77,DE123456789,DE\n`);
      const again = await runCli(['ingest', resend, '--source', 'erp-b', '--map', 'externalId=Ref', '--map', 'contract=Doc', '--db', db, '--json'], {
        timeoutMs: SLOW,
      });
      expect(again.code, again.stderr).toBe(0);

      await withTestDatabase(
        { at: db },
        async (opened) => {
          const rows = await opened.db
            .selectFrom('mention')
            .select(['external_id', 'text', 'identifiers', 'contract_external_id'])
            .where('source', '=', 'erp-b')
            .orderBy('external_id')
            .execute();
          expect(rows.map((r) => r.external_id)).toEqual(['V-1', 'V-2', 'V-3']);
          expect(rows[0]!.text).toBe('Quillmere Fabrication AG');
          expect(rows[0]!.contract_external_id).toBe('K-77');
          const schemes = rows.map((r) =>
            (r.identifiers as Array<{ scheme: string; label?: string }>).map((i) => (i.label ? `${i.scheme}/${i.label}` : i.scheme)),
          );
          // DE prefix → VAT; no prefix with country US → US EIN; no prefix with FR (no tax-id scheme by country) → kept, labelled.
          expect(schemes).toEqual([['vat'], ['us_ein'], ['other/tax id']]);
        },
        { command: 'ingest columns test' },
      );
    },
    SLOW,
  );
});
