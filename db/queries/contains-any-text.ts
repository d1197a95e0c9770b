/**
 * A condition for the erasure's searches (db/queries/erasure-*.ts): the text of `expr` holds one of `needles`.
 * strpos, not LIKE: a needle is matched as written, with no wildcard in it to escape.
 */
import { sql, type RawBuilder } from 'kysely';

export function containsAnyText(expr: RawBuilder<unknown>, needles: readonly string[]): RawBuilder<boolean> {
  if (needles.length === 0) return sql<boolean>`false`;
  return sql<boolean>`(${sql.join(
    needles.map((n) => sql`strpos(${expr}, ${n}) > 0`),
    sql` OR `,
  )})`;
}
