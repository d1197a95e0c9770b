/** Helpers for the register suites: a context over a test database, and a state comparison that names tables. */
import type { Kysely } from 'kysely';
import { expect } from 'vitest';
import type { Database } from '../../../db/types.ts';
import { createRegisterContext, type RegisterContext, type StateSnapshot } from '../../../services/register/index.ts';

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
