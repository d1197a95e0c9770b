/** The cheapest round trip to the database: does it answer at all (the health check times it out). */
import { sql } from 'kysely';
import type { Queryable } from './util.ts';

export async function ping(db: Queryable): Promise<void> {
  await sql`select 1`.execute(db);
}
