/**
 * Opening the register for a command-line job: the database (migrated to the latest schema) and a context.
 * The actor of a CLI change is `cli:<operating-system user>`.
 */
import { userInfo } from 'node:os';
import { openDatabase, type OpenedDatabase } from '../../db/open-database.ts';
import { migrateToLatest } from '../../db/migrate.ts';
import { createRegisterContext, type RegisterContext } from './context.ts';

export function cliActor(): string {
  let name = process.env.USER ?? process.env.USERNAME ?? 'unknown';
  try {
    name = userInfo().username || name;
  } catch {
    // No passwd entry (some containers): the environment's name stands.
  }
  return `cli:${name}`;
}

export async function openRegister(target: string | undefined, command: string): Promise<{ ctx: RegisterContext; database: OpenedDatabase }> {
  const database = await openDatabase(target, { command });
  try {
    await migrateToLatest(database.db);
  } catch (error) {
    await database.close();
    throw error;
  }
  return { ctx: createRegisterContext(database.db), database };
}
