/**
 * Storing a contract reads what it needs once and writes its rows set-based (services/register/contracts.ts): the
 * stored contract with our own entities in one statement, the ids of the rows it adds in one, the contract with its
 * defined terms and its event in one, the mentions and amendments waiting for it in one, and the stored contract
 * read back in one; each party is one resolve. Counted are the statements sent through Kysely (BEGIN and COMMIT are
 * driver calls, not counted). The ceilings are this register's own figures, counted when these reads and writes were
 * folded (not from a source): before, 26 statements for a two-party contract with two defined terms and 28 with four
 * (one INSERT per term, the contract looked up by its key twice and once more by the file import, the terms read
 * back), 15 after whatever the number of terms, 13 since a party's resolve reads its stored mention in the statement
 * of its locks (services/register/batch-decide.ts), 11 since a party's resolve that creates its counterparty draws
 * the ids of its rows with its locks and the counterparty's in its write (state/change-set.ts reserveAndLock). Names
 * and texts are invented.
 */
import { mkdirSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { expect, it } from 'vitest';
import { describeBackends, makeTempDir, removeTempDir, withTestDatabase } from '../../support/index.ts';
import { createRegisterContext, storeContract } from '../../../services/register/index.ts';
import { importContractFiles } from '../../../services/contract-files/import-files.ts';
import { StatementLog, WHO } from './support.ts';

/** An invented two-party agreement; `extra` adds collective defined terms (more terms, the same parties). */
function agreement(supplier: string, customer: string, extra = false): string {
  return [
    'SUPPLY AGREEMENT',
    '',
    'This Supply Agreement is made on 3 March 2026 between:',
    `(1) ${supplier}, a company incorporated in England and Wales ("Supplier"); and`,
    `(2) ${customer}, a company registered in Germany ("Customer")${extra ? ', each a "Party" and together the "Parties"' : ''}.`,
    '',
    '1. Supply. The Supplier shall supply brackets to the Customer.',
    '',
    `Signed for and on behalf of ${supplier}`,
    `Signed for and on behalf of ${customer}`,
  ].join('\n');
}

const insertsTerms = (s: string) => /insert into "defined_term"/i.test(s);
/** A read of the contract table by its key (source, external id); a mention's contract_source does not count. */
const readsContractByKey = (s: string) => /\bcontract\b/i.test(s) && /(?:^|[\s."(])source"? = \$\d+ and (?:"?\w+"?\.)?"?external_id"? = \$\d+/i.test(s);

describeBackends('contract round trips', (backend) => {
  it('stores a new two-party contract in 11 statements, however many defined terms it has', async () => {
    await withTestDatabase(backend, async ({ db }) => {
      const log = new StatementLog();
      const ctx = createRegisterContext(db.withPlugin(log));
      const counts: number[] = [];
      for (const [i, extra] of [false, true].entries()) {
        log.statements.length = 0;
        const stored = await storeContract(
          ctx,
          { source: 'rt', externalId: `C-${i}`, text: agreement(`Vantmoor Sailcloth ${i} Ltd`, `Quorrelby Dyeworks ${i} GmbH`, extra) },
          WHO,
        );
        expect(stored.parties.map((p) => p.status)).toEqual(['new', 'new']);
        expect(stored.contract.definedTerms.length).toBe(extra ? 4 : 2);
        // The terms are written with the contract (one statement for all), and the contract is read by its key once.
        expect(log.statements.filter(insertsTerms)).toHaveLength(1);
        expect(log.statements.filter(readsContractByKey)).toHaveLength(1);
        counts.push(log.statements.length);
      }
      expect(counts).toEqual([11, 11]);
    });
  });

  it('imports files with no statement of its own beyond the contract path', async () => {
    await withTestDatabase(backend, async ({ db }) => {
      const dir = makeTempDir('cpreg-round-trips-');
      try {
        const folder = join(dir, 'files');
        mkdirSync(folder);
        for (let i = 0; i < 3; i++) writeFileSync(join(folder, `supply-${i}.txt`), agreement(`Brackwater Pumps ${i} Ltd`, `Ostlund Mill ${i} AB`));
        const log = new StatementLog();
        const summary = await importContractFiles({
          db: db.withPlugin(log),
          target: folder,
          source: 'drive',
          actor: WHO.actor,
          rejectsFile: join(dir, 'rejects.csv'),
        });
        expect(summary.files).toMatchObject({ read: 3, imported: 3, new: 3 });
        expect(log.statements.filter(readsContractByKey)).toHaveLength(3);
        expect(log.statements.length).toBe(3 * 11);
      } finally {
        removeTempDir(dir);
      }
    });
  });
});
