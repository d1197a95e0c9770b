/**
 * Keeps a database this process created as the template the next new embedded database is copied from
 * (db/embedded-template.ts), seconds faster than initdb and the migrations.
 */
import { existsSync } from 'node:fs';
import { dumpEmbedded, MEMORY_TARGET } from './open-pglite.ts';
import type { OpenedDatabase } from './opened-database.ts';

/**
 * Called once a database this process created is migrated (and before anything else is written to it): keeps it
 * as the template the next new embedded database is copied from. Does nothing on PostgreSQL, in memory, for a
 * database that was itself copied, or when the template exists; never fails the command.
 */
export async function keepAsTemplate(opened: OpenedDatabase): Promise<void> {
  if (opened.backend !== 'pglite' || !opened.created || opened.fromTemplate || opened.description === MEMORY_TARGET) return;
  const { saveTemplate, templateFile } = await import('./embedded-template.ts');
  const file = templateFile();
  if (!file || existsSync(file)) return;
  try {
    const dump = await dumpEmbedded(opened);
    saveTemplate(new Uint8Array(await dump.arrayBuffer()));
  } catch {
    // no template this time: the next new database is made the long way and tries again
  }
}
