/**
 * One process at a time per embedded database directory. PGlite keeps the whole cluster in one
 * process's memory and writes it back to the directory: two processes on one directory would
 * overwrite each other's pages, so a second opener is refused at once instead of being left to wait.
 */
import { closeSync, openSync, readFileSync, rmSync, writeSync } from 'node:fs';
import { hostname } from 'node:os';
import { join } from 'node:path';

export const LOCK_FILE_NAME = 'cpreg.lock';

export interface LockHolder {
  pid: number;
  host: string;
  command: string;
  startedAt: string;
}

export interface DirectoryLock {
  readonly path: string;
  readonly holder: LockHolder;
  release(): void;
}

/** Thrown when another live process holds the directory. */
export class DatabaseLockedError extends Error {
  constructor(
    readonly directory: string,
    readonly holder: LockHolder | undefined,
  ) {
    super(
      `the embedded database ${directory} is in use by ${describeHolder(holder)}; ` +
        `stop that process or point --db at another directory` +
        (holder && holder.host !== hostname() ? ` (the holder runs on another host: if it is gone, delete ${join(directory, LOCK_FILE_NAME)})` : ''),
    );
    this.name = 'DatabaseLockedError';
  }
}

export function describeHolder(holder: LockHolder | undefined): string {
  if (!holder) return 'another process (unreadable lock file)';
  return `process ${holder.pid} on ${holder.host} (${holder.command}, since ${holder.startedAt})`;
}

export interface AcquireOptions {
  command?: string;
  /** Told when a stale lock is taken over (default: stderr). */
  onMessage?: (line: string) => void;
}

/** Takes the lock of `directory` (which must exist) or throws DatabaseLockedError. */
export function acquireDirectoryLock(directory: string, options: AcquireOptions = {}): DirectoryLock {
  const path = join(directory, LOCK_FILE_NAME);
  const holder: LockHolder = {
    pid: process.pid,
    host: hostname(),
    command: options.command ?? commandLine(),
    startedAt: new Date().toISOString(),
  };
  const say = options.onMessage ?? ((line: string) => process.stderr.write(`cpreg: ${line}\n`));
  // Two attempts: the second follows the removal of a stale lock.
  for (let attempt = 0; attempt < 2; attempt++) {
    if (tryCreate(path, holder)) return makeLock(path, holder);
    const existing = readHolder(path);
    if (existing === 'missing') continue; // released between our attempt and the read
    if (existing !== undefined && isAlive(existing)) throw new DatabaseLockedError(directory, existing);
    if (attempt === 1) throw new DatabaseLockedError(directory, existing);
    say(`taking over the lock of ${directory}: its holder ${describeHolder(existing)} is no longer running`);
    rmSync(path, { force: true });
  }
  throw new DatabaseLockedError(directory, undefined);
}

function tryCreate(path: string, holder: LockHolder): boolean {
  let fd: number;
  try {
    fd = openSync(path, 'wx'); // O_CREAT|O_EXCL: atomic, only one creator wins
  } catch (error) {
    if ((error as NodeJS.ErrnoException).code === 'EEXIST') return false;
    throw error;
  }
  try {
    writeSync(fd, `${JSON.stringify(holder)}\n`);
  } finally {
    closeSync(fd);
  }
  return true;
}

/** The holder, `undefined` when the file is unreadable (a crash while writing it), 'missing' when gone. */
function readHolder(path: string): LockHolder | undefined | 'missing' {
  let text: string;
  try {
    text = readFileSync(path, 'utf8');
  } catch (error) {
    if ((error as NodeJS.ErrnoException).code === 'ENOENT') return 'missing';
    throw error;
  }
  try {
    const parsed = JSON.parse(text) as Partial<LockHolder>;
    if (typeof parsed.pid !== 'number' || typeof parsed.host !== 'string') return undefined;
    return {
      pid: parsed.pid,
      host: parsed.host,
      command: String(parsed.command ?? 'unknown command'),
      startedAt: String(parsed.startedAt ?? 'unknown time'),
    };
  } catch {
    return undefined;
  }
}

/** A holder on another host cannot be checked, so it counts as alive (refuse rather than corrupt). */
function isAlive(holder: LockHolder): boolean {
  if (holder.host !== hostname()) return true;
  if (holder.pid === process.pid) return true; // this very process opened it already
  try {
    process.kill(holder.pid, 0);
    return true;
  } catch (error) {
    return (error as NodeJS.ErrnoException).code === 'EPERM'; // alive, owned by another user
  }
}

function makeLock(path: string, holder: LockHolder): DirectoryLock {
  let released = false;
  const release = (): void => {
    if (released) return;
    released = true;
    process.off('exit', release);
    const current = readHolder(path);
    // Only remove our own lock: never one a later process took over.
    if (current !== 'missing' && current?.pid === holder.pid && current.startedAt === holder.startedAt) {
      rmSync(path, { force: true });
    }
  };
  process.on('exit', release);
  return { path, holder, release };
}

function commandLine(): string {
  const args = process.argv.slice(2).join(' ');
  return args ? `cpreg ${args}` : 'cpreg';
}
