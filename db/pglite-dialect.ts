/**
 * A kysely dialect over an embedded PGlite instance. PGlite is one connection: the driver lends it to one caller
 * at a time (a query, or a whole transaction), so concurrent requests queue instead of interleaving their
 * statements. SQL is PostgreSQL's, so the PostgreSQL adapter, compiler and introspector are used as they are.
 * Written here because the kysely line that declares Node 20 support (0.28) has no PGlite dialect of its own.
 */
import type { PGlite } from '@electric-sql/pglite';
import {
  CompiledQuery,
  PostgresAdapter,
  PostgresIntrospector,
  PostgresQueryCompiler,
  type DatabaseConnection,
  type DatabaseIntrospector,
  type Dialect,
  type DialectAdapter,
  type Driver,
  type Kysely,
  type QueryCompiler,
  type QueryResult,
} from 'kysely';

export class PgliteDialect implements Dialect {
  constructor(private readonly pglite: PGlite) {}
  createAdapter(): DialectAdapter {
    return new PostgresAdapter();
  }
  createDriver(): Driver {
    return new PgliteDriver(this.pglite);
  }
  createQueryCompiler(): QueryCompiler {
    return new PostgresQueryCompiler();
  }
  createIntrospector(db: Kysely<unknown>): DatabaseIntrospector {
    return new PostgresIntrospector(db);
  }
}

class PgliteConnection implements DatabaseConnection {
  constructor(private readonly pglite: PGlite) {}
  async executeQuery<R>(compiled: CompiledQuery): Promise<QueryResult<R>> {
    const result = await this.pglite.query<R>(compiled.sql, [...compiled.parameters], { rowMode: 'object' });
    return {
      rows: result.rows ?? [],
      ...(result.affectedRows !== undefined && result.affectedRows !== null ? { numAffectedRows: BigInt(result.affectedRows) } : {}),
    };
  }
  async *streamQuery<R>(): AsyncIterableIterator<QueryResult<R>> {
    throw new Error('the embedded database does not stream query results; read in pages instead');
  }
}

class PgliteDriver implements Driver {
  private readonly connection: PgliteConnection;
  /** Resolves when the connection is free; each lease chains the next one behind it. */
  private free: Promise<void> = Promise.resolve();
  private release: (() => void) | undefined;

  constructor(private readonly pglite: PGlite) {
    this.connection = new PgliteConnection(pglite);
  }
  async init(): Promise<void> {
    await this.pglite.waitReady;
  }
  async acquireConnection(): Promise<DatabaseConnection> {
    const previous = this.free;
    let release!: () => void;
    this.free = new Promise<void>((resolve) => {
      release = resolve;
    });
    await previous;
    this.release = release;
    return this.connection;
  }
  async releaseConnection(): Promise<void> {
    const release = this.release;
    this.release = undefined;
    release?.();
  }
  async beginTransaction(connection: DatabaseConnection): Promise<void> {
    await connection.executeQuery(CompiledQuery.raw('begin'));
  }
  async commitTransaction(connection: DatabaseConnection): Promise<void> {
    await connection.executeQuery(CompiledQuery.raw('commit'));
  }
  async rollbackTransaction(connection: DatabaseConnection): Promise<void> {
    await connection.executeQuery(CompiledQuery.raw('rollback'));
  }
  async savepoint(connection: DatabaseConnection, name: string): Promise<void> {
    await connection.executeQuery(CompiledQuery.raw(`savepoint ${quoteName(name)}`));
  }
  async rollbackToSavepoint(connection: DatabaseConnection, name: string): Promise<void> {
    await connection.executeQuery(CompiledQuery.raw(`rollback to savepoint ${quoteName(name)}`));
  }
  async releaseSavepoint(connection: DatabaseConnection, name: string): Promise<void> {
    await connection.executeQuery(CompiledQuery.raw(`release savepoint ${quoteName(name)}`));
  }
  async destroy(): Promise<void> {
    if (!this.pglite.closed) await this.pglite.close();
  }
}

function quoteName(name: string): string {
  return `"${name.replaceAll('"', '""')}"`;
}
