/**
 * A batch reads what its chunks need per kind in one statement, whatever the number of its mentions
 * (services/register/batch-write.ts, matching/batch-reads.ts): the holders of its identifiers, the contracts its
 * mentions name, the cannot-links and the open review items of its stored mentions. Counted are the statements a
 * batch sends through Kysely (BEGIN and COMMIT are driver calls, not counted); the point is that the count does not
 * grow with the number of mentions (the identifier rows a chunk adds draw their ids in one statement too). The figures
 * are this register's own, counted when these reads were folded (not from a source). Names, numbers and texts are invented; the phone numbers are in Ofcom's range kept for drama
 * (020 7946 0xxx), so they are nobody's.
 */
import { expect, it } from 'vitest';
import { describeBackends, withTestDatabase } from '../../support/index.ts';
import { createRegisterContext, resolveBatch, storeContract, unlinkMention, type RegisterContext } from '../../../services/register/index.ts';
import type { MentionInput } from '../../../resolvers/vocabulary.ts';
import { StatementLog, WHO } from './support.ts';
import { inventedContract } from '../contract-files/support.ts';

const FIRST = ['Vant', 'Quor', 'Brack', 'Ostl', 'Helm', 'Marr', 'Tell', 'Hobb', 'Pell'];
const SECOND = ['moor', 'relby', 'water', 'und', 'iston', 'owgate'];
const TRADE = ['Sailcloth', 'Dyeworks', 'Pumps', 'Mill', 'Joinery', 'Freight', 'Bakeries', 'Optics', 'Paper'];

/** The i-th invented company: a name of its own, a company number and a phone number (both invented). */
function company(i: number): { name: string; number: string; phone: string } {
  return {
    name: `${FIRST[i % FIRST.length]}${SECOND[i % SECOND.length]} ${TRADE[(i * 4) % TRADE.length]} Ltd`,
    number: String(4_100_000 + i * 7).padStart(8, '0'),
    phone: `+4420794601${String(i).padStart(2, '0')}`,
  };
}

function mentions(tag: string, n: number, changed: boolean): MentionInput[] {
  return Array.from({ length: n }, (_, i) => {
    const c = company(i);
    return {
      source: tag,
      externalId: String(i),
      text: changed ? c.name.replace(/ Ltd$/, ' Limited') : c.name,
      country: 'GB',
      contract: { source: tag, externalId: `C-${i}` },
      identifiers: [
        { scheme: 'gb_company', value: c.number },
        { scheme: 'phone', value: c.phone },
      ],
    };
  });
}

/** The statements of one batch. */
async function counted(ctx: RegisterContext, log: StatementLog, inputs: MentionInput[]): Promise<number> {
  log.statements.length = 0;
  const results = await resolveBatch(ctx, inputs, WHO);
  expect(results.filter((r) => 'error' in r)).toEqual([]);
  return log.statements.length;
}

describeBackends('batch round trips', (backend) => {
  it('reads identifier holders, contracts, cannot-links and open items per chunk, not per mention', async () => {
    await withTestDatabase(backend, async ({ db }) => {
      const setup = createRegisterContext(db);
      const log = new StatementLog();
      const ctx = createRegisterContext(db.withPlugin(log));
      const counts: Record<string, number[]> = { fresh: [], changed: [], unlinked: [] };
      for (const n of [3, 9]) {
        const tag = `b${n}`;
        for (let i = 0; i < n; i++) {
          await storeContract(
            setup,
            { source: tag, externalId: `C-${i}`, text: inventedContract(`Kelsborne Tiles ${tag} ${i} Ltd`, 'Ardwick Felt GmbH') },
            WHO,
          );
        }
        counts.fresh!.push(await counted(ctx, log, mentions(tag, n, false)));
        counts.changed!.push(await counted(ctx, log, mentions(tag, n, true)));
        // A person says each is not its counterparty: a cannot-link per mention, read again when it is resolved again.
        const stored = await db.selectFrom('mention').select('id').where('source', '=', tag).execute();
        for (const m of stored) await unlinkMention(setup, Number(m.id), WHO);
        counts.unlinked!.push(await counted(ctx, log, mentions(tag, n, false)));
      }
      // Before these reads were folded: 32 and 74 statements for new mentions, 36 and 90 for changed texts, 38 and
      // 98 once unlinked (two holder reads, an identifier id each, four contract reads per mention; a mention lock,
      // an open-item read and a cannot-link read per stored mention, and a survivor read per cannot-link).
      expect(counts).toEqual({ fresh: [13, 13], changed: [16, 16], unlinked: [16, 16] });
    });
    // Twelve contracts and six batches: generous, for a loaded machine (no timing is asserted).
  }, 240_000);
});
