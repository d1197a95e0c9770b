/**
 * The register's column lists (services/register/state/tables.ts), which decide how every row image in the history is
 * written and read back, describe the migrated database exactly: the same columns for every state table, each of the
 * kind its database type stores (issue 21 item 3: columns were described twice with no test tying them). A column
 * added by a migration and missing here would be left out of history images, so undo and replay would lose it.
 */
import { expect, it } from 'vitest';
import { describeBackends, withTestDatabase } from '../../../support/index.ts';
import { schemaSnapshot } from '../../../db/support.ts';
import { STATE_TABLES, columnKindsOf, type ColumnKind } from '../../../../services/register/state/tables.ts';

/** Which PostgreSQL types (udt_name, as information_schema writes them) each column kind stands for. */
const UDT_OF_KIND: Record<ColumnKind, readonly string[]> = {
  int8: ['int8'],
  int: ['int4', 'int2'],
  num: ['numeric', 'float8', 'float4'],
  text: ['text', 'varchar', 'bpchar'],
  bool: ['bool'],
  ts: ['timestamptz', 'timestamp'],
  json: ['jsonb', 'json'],
};

describeBackends('state table columns', (backend) => {
  it('list every column of every state table, each with the kind its database type stores', async () => {
    await withTestDatabase(backend, async (opened) => {
      const snapshot = await schemaSnapshot(opened.db);
      // Lines read "table.column data_type udt_name null|not null [default …]" (tests/db/support.ts); a data
      // type may hold spaces ("timestamp with time zone"), the udt name does not.
      const live = new Map<string, Map<string, string>>();
      for (const line of snapshot.columns) {
        const [, table, column, udt] = /^([^.\s]+)\.(\S+) .+? (\S+) (?:not )?null/.exec(line) ?? [];
        expect(udt, `a column line this test cannot read: ${line}`).toBeDefined();
        if (!live.has(table!)) live.set(table!, new Map());
        live.get(table!)!.set(column!, udt!);
      }
      for (const table of STATE_TABLES) {
        const kinds = columnKindsOf(table);
        const columns = live.get(table);
        expect(columns, `${table} is a state table but not in the database`).toBeDefined();
        expect(Object.keys(kinds).sort(), `${table}: tables.ts against the migrated database`).toEqual([...columns!.keys()].sort());
        for (const [column, kind] of Object.entries(kinds)) {
          expect(UDT_OF_KIND[kind], `${table}.${column} is ${columns!.get(column)} in the database, ${kind} in tables.ts`).toContain(columns!.get(column));
        }
      }
    });
  });
});
