/** Helpers for the register suites: a context over a test database, a state comparison that names tables, a statement log. */
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
