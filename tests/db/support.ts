/** A comparable description of the public schema, read from information_schema and pg_catalog. */
import { sql, type Kysely } from 'kysely';

export interface SchemaSnapshot {
  columns: string[];
  indexes: string[];
  constraints: string[];
  extensions: string[];
}

export async function schemaSnapshot(db: Kysely<any>): Promise<SchemaSnapshot> {
  const columns = await sql<{ line: string }>`
    select table_name || '.' || column_name || ' ' || data_type || ' ' || udt_name
           || case when is_nullable = 'YES' then ' null' else ' not null' end
           || coalesce(' default ' || column_default, '') as line
      from information_schema.columns
     where table_schema = 'public'
     order by table_name, column_name`.execute(db);
  const indexes = await sql<{ line: string }>`
    select tablename || ': ' || indexdef as line
      from pg_indexes where schemaname = 'public' order by tablename, indexname`.execute(db);
  const constraints = await sql<{ line: string }>`
    select rel.relname || '.' || con.conname || ': ' || pg_get_constraintdef(con.oid) as line
      from pg_constraint con
      join pg_class rel on rel.oid = con.conrelid
      join pg_namespace ns on ns.oid = rel.relnamespace
     where ns.nspname = 'public'
       -- PostgreSQL 18 (PGlite) also lists NOT NULL as constraints (contype 'n'); 15 does not.
       -- Nullability is compared through the columns instead.
       and con.contype <> 'n'
     order by rel.relname, con.conname`.execute(db);
  const extensions = await sql<{ line: string }>`
    select extname as line from pg_extension where extname <> 'plpgsql' order by extname`.execute(db);
  return {
    columns: columns.rows.map((r) => r.line),
    indexes: indexes.rows.map((r) => r.line),
    constraints: constraints.rows.map((r) => r.line),
    extensions: extensions.rows.map((r) => r.line),
  };
}
