/**
 * CPU time read from /proc (Linux): of one process, of the whole PostgreSQL server, of the whole machine. The
 * scale-out bench measures where the CPU time of a job went with these.
 */
import { readdirSync, readFileSync } from 'node:fs';

const TICKS_PER_S = 100; // USER_HZ on Linux (getconf CLK_TCK)

/** [utime+stime, cutime+cstime] of a process in seconds, or undefined when it is gone. */
export function procCpu(pid: number | 'self'): { own: number; children: number } | undefined {
  try {
    const stat = readFileSync(`/proc/${pid}/stat`, 'utf8');
    const f = stat.slice(stat.lastIndexOf(')') + 2).split(' ');
    // After "pid (comm) ": f[0] is field 3 (state); utime is field 14, stime 15, cutime 16, cstime 17.
    return { own: (Number(f[11]) + Number(f[12])) / TICKS_PER_S, children: (Number(f[13]) + Number(f[14])) / TICKS_PER_S };
  } catch {
    return undefined;
  }
}

function procName(pid: string): string | undefined {
  try {
    return readFileSync(`/proc/${pid}/comm`, 'utf8').trim();
  } catch {
    return undefined;
  }
}

/** CPU seconds of every process named postgres, their waited-for children included (the whole server). */
export function serverCpu(): number {
  let total = 0;
  for (const pid of readdirSync('/proc').filter((p) => /^\d+$/.test(p))) {
    if (procName(pid) !== 'postgres') continue;
    const cpu = procCpu(Number(pid));
    if (cpu) total += cpu.own + cpu.children;
  }
  return total;
}

/** Busy and total CPU seconds of the whole machine (/proc/stat, all cores). */
export function machineCpu(): { busy: number; total: number } {
  const cols = readFileSync('/proc/stat', 'utf8').split('\n')[0]!.trim().split(/\s+/).slice(1).map(Number);
  const total = cols.slice(0, 8).reduce((a, b) => a + b, 0);
  const idle = cols[3]! + cols[4]!;
  return { busy: (total - idle) / TICKS_PER_S, total: total / TICKS_PER_S };
}
