/**
 * The read and decide stages of a batch: the stored mentions, the candidates and the token counts of every
 * mention read in bulk, then each mention decided on its own against the register as it stands (read-only). A
 * mention stored with the same content answers its stored result and is not decided again.
 */
import type { MatchModel } from '../../resolvers/score/index.ts';
import { mentionKey } from '../../resolvers/vocabulary.ts';
import { mentionsByRef } from '../../db/queries/mentions-by-ref.ts';
import type { RegisterContext } from './context.ts';
import { basisOf } from './matching/idf.ts';
import { BatchReads } from './matching/batch-reads.ts';
import { MAX_CANDIDATES } from './matching/candidates.ts';
import { decide, type ContractContext } from './resolve/decide.ts';
import { contractContextFor, resultOf } from './resolve/resolve-mention.ts';
import { ChangeSet } from './state/change-set.ts';
import { canonicalRow } from './state/tables.ts';
import type { Pending } from './batch-cluster.ts';
import type { BatchItemResult, Checked } from './batch-check.ts';
import type { BatchOptions } from './batch.ts';
import { timed } from './stage-times.ts';

/** Decides every checked mention; those already stored with the same content get their result in `results`. */
export async function readAndDecide(
  ctx: RegisterContext,
  checked: Checked[],
  results: BatchItemResult[],
  model: MatchModel,
  options: BatchOptions,
): Promise<{ pending: Pending[]; reads: BatchReads }> {
  const pending: Pending[] = [];
  const stages = options.stages;
  // The read-only phase reads in bulk: stored mentions in one statement, the candidates and token counts of every
  // mention in one statement each (matching/batch-reads.ts), each contract once.
  const { stored, reads } = await timed(stages, 'read', async () => {
    const stored = new Map(
      (
        await mentionsByRef(
          ctx.db,
          checked.map((c) => c.prepared.input),
        )
      ).map((row) => [mentionKey(row.source, row.external_id), row]),
    );
    const reads = new BatchReads(ctx.db);
    const toDecide = checked.filter((c) => stored.get(c.key)?.content_hash !== c.prepared.contentHash);
    reads.basis = basisOf(
      toDecide.map((c) => c.prepared.analysis.tokens),
      options.rarity,
    );
    await reads.prefetch(
      toDecide.map((c) => c.prepared),
      MAX_CANDIDATES,
    );
    return { stored, reads };
  });
  const contracts = new Map<string, Promise<ContractContext | null>>();
  await timed(stages, 'decide', async () => {
    for (const { index, prepared, key } of checked) {
      const found = stored.get(key);
      if (found && found.content_hash === prepared.contentHash) {
        results[index] = await resultOf(ctx.db, canonicalRow('mention', found), { alreadyIngested: true, eventId: null, explanation: found.explanation_body });
        continue;
      }
      const ref = prepared.input.contract;
      let contract: ContractContext | null = null;
      if (ref) {
        const refKey = JSON.stringify([ref.source, ref.externalId]);
        if (!contracts.has(refKey))
          contracts.set(
            refKey,
            ctx.db.transaction().execute((trx) => contractContextFor(new ChangeSet(trx, ctx.derived), ref)),
          );
        contract = await contracts.get(refKey)!;
      }
      const outcome = await decide(ctx.db, prepared, model, {
        mentionId: found ? Number(found.id) : null,
        contract,
        party: null,
        contractAwaited: prepared.input.contract !== undefined && contract === null,
        reads,
      });
      pending.push({ index, prepared, key, outcome, stored: found !== undefined });
    }
  });

  return { pending, reads };
}
