/** Matcher settings (thresholds and learned weights): one row, read on every resolution (never cached). */
import type { Queryable } from './util.ts';

export interface StoredSettings {
  linkAt: number;
  newAt: number;
  weights: Record<string, unknown>;
  version: number;
  updatedBy: string;
}

export async function readSettings(db: Queryable): Promise<StoredSettings | undefined> {
  const row = await db.selectFrom('matcher_settings').selectAll().where('id', '=', 'current').executeTakeFirst();
  return row ? settingsView(row) : undefined;
}

/** The settings of a matcher_settings row, as read by kysely or as JSON (row_to_json). */
export function settingsView(row: { link_at: number; new_at: number; weights: Record<string, unknown>; version: number; updated_by: string }): StoredSettings {
  return { linkAt: row.link_at, newAt: row.new_at, weights: row.weights, version: row.version, updatedBy: row.updated_by };
}

export async function writeSettings(
  db: Queryable,
  settings: { linkAt: number; newAt: number; weights: Record<string, unknown>; updatedBy: string },
): Promise<number> {
  const row = await db
    .insertInto('matcher_settings')
    .values({
      id: 'current',
      link_at: settings.linkAt,
      new_at: settings.newAt,
      weights: JSON.stringify(settings.weights),
      updated_by: settings.updatedBy,
    })
    .onConflict((oc) =>
      oc.column('id').doUpdateSet((eb) => ({
        link_at: eb.ref('excluded.link_at'),
        new_at: eb.ref('excluded.new_at'),
        weights: eb.ref('excluded.weights'),
        updated_by: eb.ref('excluded.updated_by'),
        updated_at: new Date(),
        version: eb(eb.ref('matcher_settings.version'), '+', 1),
      })),
    )
    .returning('version')
    .executeTakeFirstOrThrow();
  return row.version;
}
