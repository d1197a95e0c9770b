/**
 * The CPU time of the PostgreSQL backends serving one database, followed while a job runs (backends come and go).
 */
import type { Kysely } from 'kysely';
import type { Database } from '../../db/types.ts';
import { backendPids } from '../../db/queries/server-activity.ts';
import { procCpu } from './proc-cpu.ts';

/**
 * Follows the CPU time of the backends of one database: every `tick` it lists their pids (pg_stat_activity) and
 * reads each one's CPU; a backend's contribution is its last reading minus its first (0 for one born meanwhile).
 */
export class BackendCpu {
  private readonly first = new Map<number, number>();
  private readonly last = new Map<number, number>();
  private readonly born = new Set<number>();
  private started = false;

  constructor(
    private readonly admin: Kysely<Database>,
    private readonly database: string,
    private readonly exclude: number,
  ) {}

  async tick(): Promise<void> {
    for (const pid of await backendPids(this.admin, this.database, this.exclude)) {
      const cpu = procCpu(pid);
      if (!cpu) continue;
      if (!this.first.has(pid)) {
        this.first.set(pid, this.started ? 0 : cpu.own);
        if (this.started) this.born.add(pid);
      }
      this.last.set(pid, cpu.own);
    }
    this.started = true;
  }

  seconds(): number {
    let total = 0;
    for (const [pid, last] of this.last) total += last - (this.first.get(pid) ?? last);
    return total;
  }

  backends(): number {
    return this.last.size;
  }
}
