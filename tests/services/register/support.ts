/** Helpers for the register suites: a context over a test database, a state comparison that names tables, a statement log, a seeded random workload. */
import {
  PostgresQueryCompiler,
  type Kysely,
  type KyselyPlugin,
  type PluginTransformQueryArgs,
  type PluginTransformResultArgs,
  type QueryResult,
  type RootOperationNode,
  type UnknownRow,
} from 'kysely';
import { expect } from 'vitest';
import type { Database } from '../../../db/types.ts';
import type { Random } from '../../../resolvers/prng.ts';
import {
  addIdentifier,
  addName,
  addRelation,
  createRegisterContext,
  decideReview,
  mergeCounterparties,
  RegisterError,
  removeName,
  renameCounterparty,
  resolveMention,
  setAsideMention,
  splitCounterparty,
  undoEvent,
  unlinkMention,
  withdrawMention,
  type RegisterContext,
  type StateSnapshot,
} from '../../../services/register/index.ts';

export const WHO = { actor: 'test:register' };

export function contextFor(db: Kysely<Database>): RegisterContext {
  return createRegisterContext(db);
}

/** Compares two snapshots table by table, so that a failure names the table that differs. */
export function expectSameState(actual: StateSnapshot, expected: StateSnapshot): void {
  for (const table of Object.keys(expected) as (keyof StateSnapshot)[]) {
    expect({ table, rows: actual[table] }).toEqual({ table, rows: expected[table] });
  }
}

/** Records the SQL text of every statement, compiled (nested fragments included), in order. */
export class StatementLog implements KyselyPlugin {
  readonly statements: string[] = [];
  private readonly compiler = new PostgresQueryCompiler();

  transformQuery(args: PluginTransformQueryArgs): RootOperationNode {
    this.statements.push(this.compiler.compileQuery(args.node, args.queryId).sql);
    return args.node;
  }

  transformResult(args: PluginTransformResultArgs): Promise<QueryResult<UnknownRow>> {
    return Promise.resolve(args.result);
  }
}

/*
 * A random register workload (seeded): resolutions of invented name variants, merges, splits, renames, names and
 * identifiers added and removed, relations, unlink / set aside / withdraw, review decisions and undos. Failures
 * that the register must refuse (blocked undo, cannot-link) are counted, not thrown.
 */
/** Invented stems; each is written a few ways so that links, reviews and new counterparties all happen. */
const STEMS = ['Brindlecombe Optics', 'Quillmarsh Freight', 'Ostrava Pine Joinery', 'Tellisford Bakeries', 'Marrowgate Analytics', 'Hobblestone Paper'];
const FORMS = ['Ltd', 'Limited', 'GmbH', 'Inc.', '', 'LLC'];

export function randomName(rng: Random): string {
  const stem = rng.pick(STEMS);
  const form = rng.pick(FORMS);
  const typo = rng.chance(0.15)
    ? stem
        .replace(/o/, '0')
        .replace('0', 'o')
        .replace(/e(?=[^e]*$)/, '')
    : stem;
  return `${typo}${form ? ` ${form}` : ''}`;
}

async function activeIds(ctx: RegisterContext): Promise<number[]> {
  const rows = await ctx.db.selectFrom('counterparty').select('id').where('status', '=', 'active').orderBy('id').execute();
  return rows.map((r) => Number(r.id));
}

async function linkedMentions(ctx: RegisterContext): Promise<{ id: number; counterpartyId: number }[]> {
  const rows = await ctx.db.selectFrom('mention').select(['id', 'counterparty_id']).where('counterparty_id', 'is not', null).orderBy('id').execute();
  return rows.map((r) => ({ id: Number(r.id), counterpartyId: Number(r.counterparty_id) }));
}

export interface WorkloadStats {
  steps: number;
  refused: Record<string, number>;
  events: number;
}

export async function runWorkload(ctx: RegisterContext, rng: Random, steps: number, prefix: string): Promise<WorkloadStats> {
  const stats: WorkloadStats = { steps: 0, refused: {}, events: 0 };
  let mentionNo = 0;
  const eventIds: number[] = [];
  for (let step = 0; step < steps; step++) {
    stats.steps++;
    const roll = rng.next();
    try {
      if (roll < 0.4) {
        const r = await resolveMention(
          ctx,
          { source: prefix, externalId: `m${mentionNo++}`, text: randomName(rng), ...(rng.chance(0.5) ? { country: rng.pick(['GB', 'DE', 'US']) } : {}) },
          WHO,
        );
        if (r.eventId) eventIds.push(r.eventId);
      } else if (roll < 0.5) {
        const ids = await activeIds(ctx);
        if (ids.length >= 2) eventIds.push((await mergeCounterparties(ctx, { ids: [rng.pick(ids), rng.pick(ids)] }, WHO)).eventId);
      } else if (roll < 0.58) {
        const mentions = await linkedMentions(ctx);
        if (mentions.length > 0) {
          const m = rng.pick(mentions);
          const ids = await activeIds(ctx);
          const target = rng.chance(0.5) ? undefined : rng.pick(ids);
          eventIds.push(
            (await splitCounterparty(ctx, m.counterpartyId, { mentionIds: [m.id], ...(target !== undefined ? { targetId: target } : {}) }, WHO)).eventId,
          );
        }
      } else if (roll < 0.63) {
        const ids = await activeIds(ctx);
        if (ids.length > 0) eventIds.push((await renameCounterparty(ctx, rng.pick(ids), { name: randomName(rng) }, WHO)).eventId!);
      } else if (roll < 0.68) {
        const ids = await activeIds(ctx);
        if (ids.length > 0) {
          const r = await addName(ctx, rng.pick(ids), { name: randomName(rng), kind: rng.pick(['trade', 'former', 'also_known_as'] as const) }, WHO);
          eventIds.push(r.eventId!);
          if (rng.chance(0.5)) eventIds.push((await removeName(ctx, r.counterpartyId, r.nameId, WHO)).eventId!);
        }
      } else if (roll < 0.72) {
        const ids = await activeIds(ctx);
        if (ids.length > 0) {
          const r = await addIdentifier(ctx, rng.pick(ids), { scheme: 'web_domain', value: `${rng.pick(['brindle', 'quill', 'tellis'])}.example` }, WHO);
          if (r.eventId) eventIds.push(r.eventId);
        }
      } else if (roll < 0.76) {
        const ids = await activeIds(ctx);
        if (ids.length >= 2) {
          const r = await addRelation(ctx, { fromId: rng.pick(ids), toId: rng.pick(ids), type: rng.pick(['parent_of', 'affiliate_of'] as const) }, WHO);
          if (r.eventId) eventIds.push(r.eventId);
        }
      } else if (roll < 0.82) {
        const mentions = await linkedMentions(ctx);
        if (mentions.length > 0) {
          const m = rng.pick(mentions);
          const op = rng.pick([unlinkMention, setAsideMention, withdrawMention]);
          const r = await op(ctx, m.id, WHO);
          if (r.eventId) eventIds.push(r.eventId);
        }
      } else if (roll < 0.88) {
        const item = await ctx.db.selectFrom('review_item').select('id').where('status', '=', 'open').orderBy('id').executeTakeFirst();
        if (item) eventIds.push((await decideReview(ctx, Number(item.id), { decision: rng.chance(0.5) ? 'same' : 'different' }, WHO)).eventId);
      } else if (eventIds.length > 0) {
        // Undo the newest standing event, or an older one at random (which may be refused).
        const id = rng.chance(0.6) ? eventIds[eventIds.length - 1]! : rng.pick(eventIds);
        await undoEvent(ctx, id, WHO);
        eventIds.splice(eventIds.indexOf(id), 1);
      }
    } catch (error) {
      if (!(error instanceof RegisterError)) throw error;
      stats.refused[error.code] = (stats.refused[error.code] ?? 0) + 1;
    }
  }
  stats.events = eventIds.length;
  return stats;
}
