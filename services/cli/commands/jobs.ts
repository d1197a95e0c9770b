/**
 * `cpreg jobs show <id> [--watch] [--json] [--db]`: a job's status, its partitions by state and, when it has
 * ended, its result. With --watch, a progress bar (partitions done) until the job ends.
 */
import type { Command } from 'commander';
import type { Kysely } from 'kysely';
import type { Database } from '../../../db/types.ts';
import type { JobRow } from '../../../db/queries/jobs.ts';
import type { JobQueue } from '../../../db/job-queue.ts';
import { CliError } from '../cli-error.ts';
import { countOf } from '../count-words.ts';
import { DB_OPTION_HELP } from './serve.ts';
import { OUTCOME_WORDS } from '../outcome-words.ts';

interface ShowOptions {
  db?: string;
  watch?: boolean;
  json?: boolean;
}

/** Follows a job with a progress bar on stderr (mentions in finished partitions of all planned); answers the ended job. */
export async function followJob(db: Kysely<Database>, jobId: number, label: string): Promise<JobRow> {
  const { watchJob } = await import('../../jobs/watch-job.ts');
  const { progressReporter } = await import('../../ingest/cli-support.ts');
  const bar = progressReporter(label, 'mentions');
  let hinted = false;
  const started = Date.now();
  try {
    return await watchJob(db, jobId, {
      onProgress: ({ job, partitions }) => {
        const stage = String(job.progress.stage ?? job.status);
        bar.update({
          done: partitions.mentionsDone,
          fraction: partitions.mentions > 0 ? partitions.mentionsDone / partitions.mentions : 0,
          note: `${stage}: ${partitions.done.toLocaleString('en-US')} of ${countOf(partitions.total, 'partition')} done${partitions.running > 0 ? `, ${partitions.running.toLocaleString('en-US')} running` : ''}`,
        });
        if (!hinted && job.status === 'queued' && Date.now() - started > 15_000) {
          hinted = true;
          process.stderr.write(`\ncpreg: job ${jobId} is still queued: is a worker running? (cpreg worker --db <the same database>)\n`);
        }
      },
    });
  } finally {
    bar.finish();
  }
}

/**
 * Submits a partitioned job and, unless `wait` is false, follows it to its end and prints it. On PostgreSQL this
 * process only submits (workers run the steps); on the embedded database it runs them itself.
 */
export async function submitAndFollow(
  target: string | undefined,
  command: string,
  options: { json?: boolean; wait: boolean; label: string },
  submit: (deps: { db: Kysely<Database>; queue: JobQueue }) => Promise<number>,
): Promise<void> {
  const { withDatabase } = await import('../../ingest/cli-support.ts');
  const { resolveTarget, isPostgresUrl } = await import('../../../db/open-database.ts');
  const { startJobs } = await import('../../jobs/start-jobs.ts');
  const url = resolveTarget(target);
  const postgres = isPostgresUrl(url);
  await withDatabase(target, command, 'writes', async (db) => {
    const log = (level: string, fields: Record<string, unknown>, message: string): void => {
      if (level !== 'info') process.stderr.write(`cpreg: ${message} ${String((fields.err as Error | undefined)?.message ?? '')}\n`);
    };
    const jobs = await startJobs({ db, backend: postgres ? 'postgres' : 'pglite', url, work: !postgres, log });
    try {
      const jobId = await submit({ db, queue: jobs.queue });
      if (!options.wait) {
        process.stdout.write(options.json ? `${JSON.stringify({ jobId })}\n` : `job ${jobId} submitted; follow it with: cpreg jobs show ${jobId} --watch\n`);
        return;
      }
      process.stderr.write(`cpreg: job ${jobId} submitted\n`);
      const job = await followJob(db, jobId, options.label);
      process.stdout.write(options.json ? `${JSON.stringify(job)}\n` : `${describeJob(job).join('\n')}\n`);
      if (job.status === 'failed') process.exitCode = 1;
    } finally {
      await jobs.stop();
    }
  });
}

/** What each count of a job's result means, in words (ingest outcomes and the sweep's tallies). */
const RESULT_WORDS: Record<string, string> = {
  ...OUTCOME_WORDS,
  scanned: 'counterparties scanned',
  duplicateItems: 'duplicate review items filed',
  affiliateItems: 'affiliate review items filed',
  skippedExisting: 'already filed, skipped',
  skippedCannotLink: 'under a cannot-link, skipped',
};
/** Result fields the partitions line says in its own words. */
const PARTITION_FIELDS = new Set(['partitions', 'retriedPartitions', 'crossPairs']);

/** A result field in words: the table above, else its name split into words ("elapsedMs" → "elapsed ms"). */
export function resultWords(key: string): string {
  return (
    RESULT_WORDS[key] ??
    key
      .replace(/([a-z0-9])([A-Z])/g, '$1 $2')
      .replaceAll('_', ' ')
      .toLowerCase()
  );
}

export function describeJob(job: JobRow): string[] {
  const lines = [`job ${job.id} (${job.kind}) ${job.status}${job.error ? `: ${job.error}` : ''}`];
  const result = job.result as Record<string, unknown> | null;
  const rows: [string, number][] = [];
  if (result?.counts) {
    const counts = result.counts as Record<string, number>;
    for (const [k, v] of Object.entries(counts)) if (k !== 'read') rows.push([resultWords(k), v]);
    rows.push(['= read', counts.read ?? 0]);
  } else if (result) {
    for (const [k, v] of Object.entries(result)) if (typeof v === 'number' && !PARTITION_FIELDS.has(k)) rows.push([resultWords(k), v]);
  }
  const width = Math.max(18, ...rows.map(([label]) => label.length));
  for (const [label, v] of rows) lines.push(`  ${label.padEnd(width)} ${v.toLocaleString('en-US').padStart(9)}`);
  if (result && typeof result.partitions === 'number') {
    const merges = Array.isArray(result.merges) ? result.merges.length : 0;
    lines.push(
      `${countOf(result.partitions, 'partition')}${typeof result.retriedPartitions === 'number' ? ` (${result.retriedPartitions.toLocaleString('en-US')} run again after a failure)` : ''}` +
        `${typeof result.crossPairs === 'number' ? `; ${countOf(result.crossPairs, 'linking pair')} across partitions, ${countOf(merges, 'merge')} in the final pass` : ''}`,
    );
  }
  const rejected = Array.isArray(result?.rejected) ? (result.rejected as { line: number; reason: string }[]) : [];
  for (const r of rejected.slice(0, 20)) lines.push(`  rejected line ${r.line}: ${r.reason}`);
  if (rejected.length > 20) lines.push(`  … ${countOf(rejected.length - 20, 'more rejected line')} in --json`);
  return lines;
}

export default function register(program: Command): void {
  const jobs = program.command('jobs').description('batch jobs (ingest and sweep run as partitioned jobs)');
  jobs
    .command('show')
    .description('show a job: status, partitions, result')
    .argument('<id>', 'the job id')
    .option('--watch', 'follow the job with a progress bar until it ends')
    .option('--db <target>', DB_OPTION_HELP)
    .option('--json', 'print the job as JSON')
    .showHelpAfterError(true)
    .action(async (idText: string, options: ShowOptions) => {
      const jobId = Number(idText);
      if (!Number.isSafeInteger(jobId) || jobId < 1) throw new CliError(`<id> ${idText}: expected a job id (a whole number)`);
      const { withDatabase } = await import('../../ingest/cli-support.ts');
      const { readJob, partitionTally } = await import('../../../db/queries/jobs.ts');
      await withDatabase(options.db, 'cpreg jobs show', 'reads', async (db) => {
        const job = options.watch ? await followJob(db, jobId, `job ${jobId}`) : await readJob(db, jobId);
        if (!job) throw new CliError(`job ${jobId} does not exist`);
        const partitions = await partitionTally(db, jobId);
        if (options.json) process.stdout.write(`${JSON.stringify({ ...job, partitions })}\n`);
        else
          process.stdout.write(
            `${[...describeJob(job), `partitions: ${partitions.done} done, ${partitions.running} running, ${partitions.queued} queued of ${partitions.total}`].join('\n')}\n`,
          );
      });
    });
}
