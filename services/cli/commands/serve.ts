/**
 * `cpreg serve [--port] [--host] [--db] [--db-timeout <ms>] [--log-level] [--work <n>] [--json]`: runs the HTTP API.
 * Migrates the database first; stops cleanly on SIGINT / SIGTERM.
 */
import { InvalidArgumentError, type Command } from 'commander';
import { CliError } from '../cli-error.ts';

export const DEFAULT_PORT = 8080;
export const DEFAULT_HOST = '127.0.0.1';

export function parsePort(value: string): number {
  const port = Number(value);
  if (!/^\d+$/.test(value) || port > 65535) throw new InvalidArgumentError('expected a port number from 0 to 65535 (0: any free port)');
  return port;
}

export function parseMilliseconds(value: string): number {
  const ms = Number(value);
  if (!/^\d+$/.test(value) || ms < 1 || ms > 600_000) throw new InvalidArgumentError('expected milliseconds from 1 to 600000');
  return ms;
}

export const DB_OPTION_HELP = 'database: a postgres:// URL, a directory for the embedded database, or memory: (default: $DATABASE_URL, else ./data/cpreg)';

interface ServeCliOptions {
  port: number;
  host: string;
  db?: string;
  dbTimeout: number;
  logLevel: string;
  json?: boolean;
  work?: number;
}

export function parseSlots(value: string): number {
  const n = Number(value);
  if (!/^\d+$/.test(value) || n > 64) throw new InvalidArgumentError('expected a whole number from 0 to 64');
  return n;
}

export default function register(program: Command): void {
  program
    .command('serve')
    .description('serve the HTTP API (migrates the database first; stop with Ctrl-C)')
    .showHelpAfterError(true)
    .option('--port <port>', 'TCP port (0: any free port)', parsePort, DEFAULT_PORT)
    .option('--host <host>', 'address to listen on (0.0.0.0 for every interface)', DEFAULT_HOST)
    .option('--db <target>', DB_OPTION_HELP)
    .option('--db-timeout <ms>', 'how long a request waits for the database before answering 503', parseMilliseconds, 5000)
    .option('--log-level <level>', 'fatal, error, warn, info, debug, trace or silent', 'info')
    .option('--json', 'print the address as one JSON line once listening')
    .option('--work <n>', 'on PostgreSQL, job partitions this process also runs at once (0: leave jobs to `cpreg worker` processes)', parseSlots, 1)
    .action(async (options: ServeCliOptions) => {
      await runServe(options, 'cpreg serve');
    });
}

export async function runServe(options: ServeCliOptions, command: string): Promise<void> {
  const { startServer, ListenError } = await import('../../api/server.ts');
  const { DatabaseOpenError } = await import('../../../db/database-errors.ts');
  const { DatabaseLockedError } = await import('../../../db/lock.ts');
  const { MigrationError } = await import('../../../db/migrate.ts');
  let running;
  try {
    running = await startServer({
      db: options.db,
      port: options.port,
      host: options.host,
      dbTimeoutMs: options.dbTimeout,
      logLevel: options.logLevel,
      ...(options.work !== undefined ? { workSlots: options.work } : {}),
      command,
      say: options.json ? (line) => process.stderr.write(`${line}\n`) : undefined,
      onListening: options.json ? (info) => process.stdout.write(`${JSON.stringify(info)}\n`) : undefined,
    });
  } catch (error) {
    if (error instanceof DatabaseOpenError || error instanceof DatabaseLockedError || error instanceof MigrationError || error instanceof ListenError) {
      throw new CliError(error.message, 1, { cause: error });
    }
    throw error;
  }
  await running.stopped;
}
