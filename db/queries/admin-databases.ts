/**
 * Creating and dropping whole databases beside a server's own (the benches' throw-away databases): statements run
 * on a connection to the administrative URL, since a database cannot drop itself. Names are checked, not quoted
 * blindly, so a caller's typo cannot reach the server as SQL.
 */
import pg from 'pg';

/** Lower-case letters, digits and underscores, starting with a letter or underscore; PostgreSQL keeps 63 bytes. */
const DATABASE_NAME = /^[a-z_][a-z0-9_]{0,62}$/;

function checkedName(name: string): string {
  if (!DATABASE_NAME.test(name)) {
    throw new Error(`database name "${name}": expected 1 to 63 lower-case letters, digits or underscores, starting with a letter or underscore`);
  }
  return `"${name}"`;
}

/** The URL of database `name` on the server of `adminUrl` (same credentials and options). */
export function databaseUrl(adminUrl: string, name: string): string {
  const url = new URL(adminUrl);
  url.pathname = `/${name}`;
  return url.toString();
}

async function onAdmin(adminUrl: string, statements: readonly string[]): Promise<void> {
  const admin = new pg.Client({ connectionString: adminUrl });
  await admin.connect();
  try {
    for (const statement of statements) await admin.query(statement);
  } finally {
    await admin.end();
  }
}

/** A new empty database `name` (one a crashed run left behind is dropped first); returns its URL. */
export async function createFreshDatabase(adminUrl: string, name: string): Promise<string> {
  const quoted = checkedName(name);
  await onAdmin(adminUrl, [`DROP DATABASE IF EXISTS ${quoted} WITH (FORCE)`, `CREATE DATABASE ${quoted}`]);
  return databaseUrl(adminUrl, name);
}

/** Drops database `name`, closing any connection still open to it; nothing happens when it does not exist. */
export async function dropDatabaseIfExists(adminUrl: string, name: string): Promise<void> {
  await onAdmin(adminUrl, [`DROP DATABASE IF EXISTS ${checkedName(name)} WITH (FORCE)`]);
}
