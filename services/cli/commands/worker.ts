/**
 * `cpreg worker [--db <postgres://…>] [--concurrency <n>] [--json]`: takes the steps of partitioned jobs (plan,
 * partitions, final pass) from the job queue in PostgreSQL until stopped. Run any number, on any machines, against
 * one database; a worker stopped with SIGINT / SIGTERM finishes its current partition first, and a worker that
 * dies has its partition run again elsewhere once the queue's expiry passes (CPREG_QUEUE_EXPIRE_S, default 900 s).
 */
import type { Command } from 'commander';
import { CliError } from '../cli-error.ts';
import { DB_OPTION_HELP, parseSlots } from './serve.ts';

interface WorkerCliOptions {
  db?: string;
  concurrency: number;
  json?: boolean;
}

export default function register(program: Command): void {
  program
    .command('worker')
    .description('take job partitions from the PostgreSQL job queue until stopped (run as many as you like)')
    .option('--db <target>', DB_OPTION_HELP)
    .option('--concurrency <n>', 'partitions this worker runs at once', parseSlots, 1)
    .option('--json', 'log one JSON line per job step instead of plain lines')
    .showHelpAfterError(true)
    .action(async (options: WorkerCliOptions) => {
      if (options.concurrency < 1) throw new CliError('--concurrency: expected at least 1');
      const { resolveTarget, isPostgresUrl } = await import('../../../db/open-database.ts');
      const { startJobs } = await import('../../jobs/start-jobs.ts');
      const target = resolveTarget(options.db);
      if (!isPostgresUrl(target)) {
        throw new CliError(
          `the worker needs PostgreSQL (--db postgres://… or DATABASE_URL), and ${target} is an embedded database: its jobs run inside \`cpreg serve\` or the command that submits them`,
        );
      }
      const { openCommandDatabase } = await import('../open-command-database.ts');
      const database = await openCommandDatabase(options.db, 'cpreg worker', { writes: true });
      const say = (line: string): void => void process.stderr.write(`${line}\n`);
      const log = (level: 'info' | 'warn' | 'error', fields: Record<string, unknown>, message: string): void => {
        const err = fields.err as Error | undefined;
        if (options.json)
          process.stdout.write(`${JSON.stringify({ time: new Date().toISOString(), level, message, ...fields, ...(err ? { err: err.message } : {}) })}\n`);
        else
          say(
            `cpreg worker: ${message} ${Object.entries(fields)
              .map(([k, v]) => `${k}=${k === 'err' ? (v as Error).message : JSON.stringify(v)}`)
              .join(' ')}`,
          );
      };
      const jobs = await startJobs({ db: database.db, backend: database.backend, url: target, work: true, concurrency: options.concurrency, log });
      say(`cpreg: worker ${jobs.deps.worker} taking jobs from ${database.description} (${options.concurrency} at once; stop with Ctrl-C)`);
      await new Promise<void>((resolve) => {
        const onSignal = (signal: NodeJS.Signals): void => {
          process.off('SIGINT', onSignal);
          process.off('SIGTERM', onSignal);
          say(`cpreg: worker stopping (${signal}); the current partition finishes first`);
          resolve();
        };
        process.on('SIGINT', onSignal);
        process.on('SIGTERM', onSignal);
      });
      await jobs.stop();
      await database.close();
      say('cpreg: worker stopped');
    });
}
