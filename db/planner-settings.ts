/**
 * Planner settings for the register's own sessions, on both backends (set per connection, never on the server).
 *
 * Why: a resolve joins a few dozen rows of `counterparty` and `counterparty_name` by primary key. With PostgreSQL's
 * default random_page_cost of 4 (a cost model for spinning disks) the planner prices a few dozen index lookups
 * above one pass over a register of 10,000 rows, and chose whole-table scans: the write of one resolve updated its
 * one counterparty through a hash join over the whole table (3.3 ms per table, measured with auto_explain on a
 * 10,000-counterparty register), and the candidate read joined `counterparty` the same way. 1.1 prices an index
 * lookup close to a sequential page, as for a working set held in memory or on SSD (common practice for such
 * storage; the value is the one commonly recommended for SSD, from memory). Measured on that register: the write
 * 4.8 → 1.3 ms, the candidate read 4.4 → 3.8 ms per resolve, with the chosen plans index lookups throughout.
 */
export const PLANNER_SETTINGS: Readonly<Record<string, string>> = { random_page_cost: '1.1' };

/** The settings as `-c name=value` start parameters (PGlite's startParams, a PostgreSQL connection's `options`). */
export function plannerStartParams(): string[] {
  return Object.entries(PLANNER_SETTINGS).flatMap(([name, value]) => ['-c', `${name}=${value}`]);
}

/**
 * A PostgreSQL URL whose `options` parameter carries the planner settings first and the URL's own options after
 * (a later `-c` of the same name wins, so a setting the URL gives keeps its value). The URL is where they must go:
 * the driver lets a URL's parameters override its other connection settings.
 */
export function withPlannerOptions(url: string): string {
  const parsed = new URL(url);
  const own = parsed.searchParams.get('options');
  parsed.searchParams.set('options', [...plannerStartParams(), ...(own ? [own] : [])].join(' '));
  return parsed.toString();
}
