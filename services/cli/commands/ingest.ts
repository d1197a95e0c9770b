/**
 * `cpreg ingest <file.csv|file.ndjson> --source <name> [--map field=column]... [--rejects <file>] [--db] [--json]`:
 * streams a batch file into the register with progress, and prints a summary whose counts reconcile.
 */
import type { Command } from 'commander';
import type { FieldMap } from '../../ingest/mapping.ts';
import { CliError } from '../cli-error.ts';
import { DB_OPTION_HELP } from './serve.ts';
import { stopOnInterrupt } from '../stop-on-interrupt.ts';
import { outcomeWords } from '../outcome-words.ts';
import { countOf } from '../count-words.ts';

interface IngestCliOptions {
  source: string;
  map: string[];
  rejects?: string;
  format?: 'csv' | 'ndjson';
  batchSize: string;
  db?: string;
  json?: boolean;
  asJob?: boolean;
  partitionSize: string;
  wait: boolean;
}

const printWarning = (message: string): void => void process.stderr.write(`cpreg ingest: warning: ${message}\n`);

const collect = (value: string, previous: string[]): string[] => [...previous, value];

export default function register(program: Command): void {
  program
    .command('ingest')
    .description('ingest mentions from a CSV or NDJSON file (streamed; progress; rejected rows to a rejects file; run again to resume)')
    .argument('<file>', 'a .csv (with a header row) or .ndjson file')
    .requiredOption('--source <name>', 'the source system the rows come from (part of each row identity)')
    .option(
      '--map <field=column>',
      'which column feeds a field (repeat): externalId, text, contract, contractSource, role, country, address, identifiers, taxId and registrationNumber (scheme told per value and country), source, or an identifier scheme (e.g. lei=LEI)',
      collect,
      [],
    )
    .option('--rejects <file>', 'where rejected rows go (default: <file>.rejects.csv)')
    .option('--format <format>', 'csv or ndjson (default: from the file name)')
    .option('--batch-size <n>', 'rows resolved together', '1000')
    .option('--db <target>', DB_OPTION_HELP)
    .option('--json', 'print the summary as JSON')
    .option(
      '--as-job',
      'run as a partitioned job: on PostgreSQL `cpreg worker` processes resolve the partitions (the result lists up to 1,000 rejected lines instead of a rejects file)',
    )
    .option('--partition-size <n>', 'with --as-job: mentions per partition aimed at', '2000')
    .option('--no-wait', 'with --as-job: print the job id and return at once (follow it with `cpreg jobs show <id> --watch`)')
    .showHelpAfterError(true)
    .action(async (file: string, options: IngestCliOptions) => {
      const { existsSync } = await import('node:fs');
      if (!existsSync(file)) throw new CliError(`${file}: no such file`);
      if (options.format !== undefined && options.format !== 'csv' && options.format !== 'ndjson')
        throw new CliError(`--format ${options.format}: expected csv or ndjson`);
      const batchSize = Number(options.batchSize);
      if (!Number.isInteger(batchSize) || batchSize < 1 || batchSize > 10_000) throw new CliError('--batch-size: expected a whole number from 1 to 10000');
      const { parseMapOptions, MappingError } = await import('../../ingest/mapping.ts');
      const { ingestFile } = await import('../../ingest/run-ingest.ts');
      const { formatOf } = await import('../../ingest/rows-of.ts');
      const { withDatabase, cliActor, progressReporter } = await import('../../ingest/cli-support.ts');
      let map;
      let format;
      try {
        map = parseMapOptions(options.map);
        format = formatOf(file, options.format);
      } catch (error) {
        throw new CliError((error as Error).message);
      }
      if (options.asJob) {
        const partitionSize = Number(options.partitionSize);
        if (!Number.isInteger(partitionSize) || partitionSize < 1 || partitionSize > 1_000_000)
          throw new CliError('--partition-size: expected a whole number from 1 to 1000000');
        await ingestAsJob(file, { ...options, format, map, partitionSize });
        return;
      }
      const rejectsFile = options.rejects ?? `${file}.rejects.csv`;
      const stop = stopOnInterrupt('stopping after the current batch (Ctrl-C again to quit at once; run the same command to resume)');
      const progress = progressReporter('ingest', 'rows');
      try {
        const summary = await withDatabase(options.db, 'cpreg ingest', 'writes', (db) =>
          ingestFile({
            db,
            file,
            format,
            source: options.source,
            map,
            rejectsFile,
            actor: cliActor(),
            batchSize,
            shouldStop: stop.requested,
            onWarning: printWarning,
            onProgress: (p) =>
              progress.update({
                done: p.counts.read,
                fraction: p.totalBytes > 0 ? p.bytesRead / p.totalBytes : undefined,
                note: p.counts.rejected > 0 ? `${p.counts.rejected} rejected` : undefined,
              }),
          }),
        );
        progress.finish();
        if (options.json) {
          process.stdout.write(
            `${JSON.stringify({ ...summary, seconds: summary.elapsedMs / 1000, rowsPerSecond: summary.counts.read / (summary.elapsedMs / 1000) })}\n`,
          );
        } else {
          const c = summary.counts;
          const lines = [
            `ingest run ${summary.runId} ${summary.status}: ${countOf(c.read, 'row')} read in ${(summary.elapsedMs / 1000).toFixed(1)} s (${Math.round(c.read / (summary.elapsedMs / 1000))} rows/s)`,
            ...Object.entries(c)
              .filter(([k]) => k !== 'read')
              .map(([k, v]) => `  ${outcomeWords(k).padEnd(20)} ${v.toLocaleString('en-US').padStart(9)}`),
            `  ${'= read'.padEnd(20)} ${c.read.toLocaleString('en-US').padStart(9)}`,
            summary.rejectsFile ? `rejected rows (line, reason, row): ${summary.rejectsFile}` : 'no rows rejected',
          ];
          if (summary.status === 'interrupted') lines.push('interrupted: run the same command again to resume (rows already stored are not stored twice)');
          process.stdout.write(`${lines.join('\n')}\n`);
        }
        if (summary.status === 'interrupted') process.exitCode = 130;
      } catch (error) {
        progress.finish();
        if (error instanceof MappingError || error instanceof RangeError) throw new CliError(error.message, 1, { cause: error });
        throw error;
      } finally {
        stop.release();
      }
    });
}

async function ingestAsJob(
  file: string,
  options: Omit<IngestCliOptions, 'format' | 'partitionSize' | 'map'> & { format: 'csv' | 'ndjson'; map: FieldMap; partitionSize: number },
): Promise<void> {
  const { cliActor } = await import('../../ingest/cli-support.ts');
  const { submitIngestJob } = await import('../../jobs/submit-ingest.ts');
  const { submitAndFollow } = await import('./jobs.ts');
  await submitAndFollow(options.db, 'cpreg ingest', { json: options.json, wait: options.wait, label: 'ingest' }, (deps) =>
    submitIngestJob(deps, {
      file,
      format: options.format,
      source: options.source,
      map: options.map,
      actor: cliActor(),
      partitionSize: options.partitionSize,
      onWarning: printWarning,
    }),
  );
}
