/**
 * The one walk of merge chains (mergeChainEnds, db/queries/counterparties.ts) and the two readers built on it:
 * survivorsOf (many ids, for the register's batches) and survivorOf (one id, for the API's 308 and the register's
 * reads). Rows are written straight into the table, as a merge leaves them; names are invented.
 */
import { expect, it } from 'vitest';
import { describeEachBackend } from '../support/index.ts';
import { MAX_MERGE_CHAIN, mergeChainEnds, survivorsOf } from '../../db/queries/counterparties.ts';
import { survivorOf } from '../../services/register/lock-active.ts';

describeEachBackend('merge chains', (ctx) => {
  const now = new Date().toISOString();

  async function counterparties(names: string[]): Promise<number[]> {
    const rows = await ctx
      .db()
      .insertInto('counterparty')
      .values(names.map((canonical_name) => ({ canonical_name, created_at: now, updated_at: now })))
      .returning('id')
      .execute();
    return rows.map((r) => Number(r.id));
  }

  async function mergeInto(id: number, survivor: number): Promise<void> {
    await ctx.db().updateTable('counterparty').set({ status: 'merged', merged_into: survivor }).where('id', '=', id).execute();
  }

  it('maps each id to the active end of its chain with the links to it, and leaves out ids that do not exist', async () => {
    const [first, second, end, alone] = await counterparties(['Wrenfield Tiles Ltd', 'Wrenfield Tiling Ltd', 'Wrenfield Holdings Ltd', 'Ostwick Pumps Ltd']);
    await mergeInto(second!, end!);
    await mergeInto(first!, second!);
    const missing = alone! + 1000;
    const ends = await mergeChainEnds(ctx.db(), [first!, second!, end!, alone!, missing, first!]);
    expect(Object.fromEntries(ends)).toEqual({
      [first!]: { id: end, links: 2 },
      [second!]: { id: end, links: 1 },
      [end!]: { id: end, links: 0 },
      [alone!]: { id: alone, links: 0 },
    });
    expect(Object.fromEntries(await survivorsOf(ctx.db(), [first!, alone!, missing]))).toEqual({ [first!]: end, [alone!]: alone });
    expect(await survivorOf(ctx.db(), first!)).toEqual({ id: end, merged: true });
    expect(await survivorOf(ctx.db(), end!)).toEqual({ id: end, merged: false });
    expect(await survivorOf(ctx.db(), missing)).toBeUndefined();
    expect(await mergeChainEnds(ctx.db(), [])).toEqual(new Map());
  });

  it('gives a chain with no active end (a cycle, which the constraints allow) no survivor, and survivorOf says so', async () => {
    const [x, y] = await counterparties(['Loopmere Ltd', 'Loopmere Limited']);
    await mergeInto(x!, y!);
    await mergeInto(y!, x!);
    expect((await mergeChainEnds(ctx.db(), [x!])).get(x!)).toBeNull();
    expect((await survivorsOf(ctx.db(), [x!])).has(x!)).toBe(false);
    await expect(survivorOf(ctx.db(), x!)).rejects.toThrow(`merge chain longer than ${MAX_MERGE_CHAIN} links`);
  });
});
