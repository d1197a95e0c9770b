/**
 * What a register holds, in counts, and what changed in it after a moment: the demo reads these to tell its own
 * scenario from a user's register and to say what a user added to the demo since it was built.
 */
import type { Kysely } from 'kysely';
import type { Database } from '../types.ts';

export interface RegisterContents {
  contracts: number;
  mentions: number;
  counterparties: number;
  ownEntities: number;
}

async function countRows(db: Kysely<Database>, table: 'contract' | 'mention' | 'counterparty' | 'own_entity'): Promise<number> {
  const row = await db
    .selectFrom(table)
    .select((eb) => eb.fn.countAll<string>().as('n'))
    .executeTakeFirstOrThrow();
  return Number(row.n);
}

export async function registerContents(db: Kysely<Database>): Promise<RegisterContents> {
  const [contracts, mentions, counterparties, ownEntities] = await Promise.all([
    countRows(db, 'contract'),
    countRows(db, 'mention'),
    countRows(db, 'counterparty'),
    countRows(db, 'own_entity'),
  ]);
  return { contracts, mentions, counterparties, ownEntities };
}

/** External id and text of every contract of one source. */
export async function contractTextsOfSource(db: Kysely<Database>, source: string): Promise<Array<{ external_id: string; text: string }>> {
  return db.selectFrom('contract').select(['external_id', 'text']).where('source', '=', source).execute();
}

/** External ids of every mention of one source. */
export async function mentionIdsOfSource(db: Kysely<Database>, source: string): Promise<string[]> {
  const rows = await db.selectFrom('mention').select('external_id').where('source', '=', source).execute();
  return rows.map((r) => r.external_id);
}

/** When the first batch ingest of a source finished (the demo's build ends with its mentions batch). */
export async function firstFinishedIngest(db: Kysely<Database>, source: string): Promise<Date | undefined> {
  const row = await db
    .selectFrom('ingest_run')
    .select((eb) => eb.fn.min('finished_at').as('at'))
    .where('source', '=', source)
    .where('status', '=', 'finished')
    .executeTakeFirst();
  return row?.at ? new Date(row.at as string | Date) : undefined;
}

export interface ChangesSince {
  contracts: number;
  /** New mentions by source. */
  mentionsBySource: Record<string, number>;
  counterparties: number;
  reviewDecisions: number;
  /** Every change recorded in the history (links, merges, renames, decisions…). */
  historyEvents: number;
}

export async function changesSince(db: Kysely<Database>, at: Date): Promise<ChangesSince> {
  const [contracts, mentions, counterparties, decisions, events] = await Promise.all([
    db
      .selectFrom('contract')
      .select((eb) => eb.fn.countAll<string>().as('n'))
      .where('created_at', '>', at)
      .executeTakeFirstOrThrow(),
    db
      .selectFrom('mention')
      .select(['source', (eb) => eb.fn.countAll<string>().as('n')])
      .where('created_at', '>', at)
      .groupBy('source')
      .execute(),
    db
      .selectFrom('counterparty')
      .select((eb) => eb.fn.countAll<string>().as('n'))
      .where('created_at', '>', at)
      .executeTakeFirstOrThrow(),
    db
      .selectFrom('review_item')
      .select((eb) => eb.fn.countAll<string>().as('n'))
      .where('decided_at', '>', at)
      .executeTakeFirstOrThrow(),
    db
      .selectFrom('history_event')
      .select((eb) => eb.fn.countAll<string>().as('n'))
      .where('at', '>', at)
      .executeTakeFirstOrThrow(),
  ]);
  return {
    contracts: Number(contracts.n),
    mentionsBySource: Object.fromEntries(mentions.map((m) => [m.source, Number(m.n)])),
    counterparties: Number(counterparties.n),
    reviewDecisions: Number(decisions.n),
    historyEvents: Number(events.n),
  };
}
