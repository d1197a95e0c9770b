/**
 * `cpreg contracts import <folder|file.zip|file> [--source files] [--recursive] [--rejects <file>] [--db] [--json]`:
 * the PDF, Word and text contracts of a folder or a zip become contracts, parties and counterparties through the
 * register's contract path, with progress on stderr, a rejects file and a summary whose counts reconcile.
 */
import type { Command } from 'commander';
import { MAX_ID_LENGTH } from '../../../resolvers/vocabulary.ts';
import { CliError } from '../cli-error.ts';
import { countOf } from '../count-words.ts';
import { DB_OPTION_HELP } from './serve.ts';
import type { ImportFilesSummary as Summary } from '../../contract-files/import-files.ts';
import { stopOnInterrupt } from '../stop-on-interrupt.ts';
import { outcomeWords } from '../outcome-words.ts';

interface ImportCliOptions {
  source: string;
  recursive?: boolean;
  rejects?: string;
  db?: string;
  json?: boolean;
}

export const PROPOSALS_CAUTION = 'Extraction and party parsing are proposals: the signed document stands.';

export default function register(program: Command): void {
  const contracts = program.command('contracts').description('work with many contracts at once');
  contracts
    .command('import')
    .description('import the PDF, Word (.docx) and text contracts of a folder, a zip or one file (run again: only new or changed files are imported)')
    .argument('<target>', 'a folder, a .zip archive, or one .pdf, .docx, .txt or .md file (the type is read from the content)')
    .option('--source <name>', "the source the contracts are stored under (with each file's path as its external id)", 'files')
    .option('--recursive', 'also read the subfolders of a folder (an archive is always read whole)')
    .option('--rejects <file>', 'where the files not imported are listed with their reasons (default: <target>.rejects.csv)')
    .option('--db <target>', DB_OPTION_HELP)
    .option('--json', 'print the summary as JSON')
    .showHelpAfterError(true)
    .action(async (target: string, options: ImportCliOptions) => {
      if (options.source.trim() === '' || options.source.length > MAX_ID_LENGTH) {
        throw new CliError(`--source: expected a name of 1 to ${MAX_ID_LENGTH} characters`);
      }
      const { importContractFiles } = await import('../../contract-files/import-files.ts');
      const { ArchiveRefusedError, TargetError } = await import('../../contract-files/find-documents.ts');
      const { withDatabase, cliActor, progressReporter } = await import('../../ingest/cli-support.ts');
      const rejectsFile = options.rejects ?? `${trimSeparators(target)}.rejects.csv`;
      const stop = stopOnInterrupt('stopping after the current file (Ctrl-C again to quit at once; run the same command to go on)');
      const progress = progressReporter('import', 'files');
      try {
        const summary = await withDatabase(options.db, 'cpreg contracts import', 'writes', (db) =>
          importContractFiles({
            db,
            target,
            source: options.source,
            actor: cliActor(),
            recursive: options.recursive,
            rejectsFile,
            shouldStop: stop.requested,
            onProgress: (p) =>
              progress.update({
                done: p.done,
                fraction: p.total > 0 ? p.done / p.total : undefined,
                note: p.tally.files.rejected > 0 ? `${p.tally.files.rejected} rejected` : undefined,
              }),
          }),
        );
        progress.finish();
        const seconds = summary.elapsedMs / 1000;
        if (options.json) {
          process.stdout.write(`${JSON.stringify({ ...summary, seconds, filesPerSecond: summary.files.read / seconds, caution: PROPOSALS_CAUTION })}\n`);
        } else {
          process.stdout.write(`${formatSummary(summary, seconds).join('\n')}\n`);
        }
        if (summary.status === 'interrupted') process.exitCode = 130;
      } catch (error) {
        progress.finish();
        if (error instanceof ArchiveRefusedError || error instanceof TargetError) throw new CliError(error.message, 1, { cause: error });
        throw error;
      } finally {
        stop.release();
      }
    });
}

/** "contracts/" → "contracts": the rejects file goes beside the folder, not into it. */
function trimSeparators(path: string): string {
  let end = path.length;
  while (end > 1 && (path[end - 1] === '/' || path[end - 1] === '\\')) end--;
  return path.slice(0, end);
}

function formatSummary(s: Summary, seconds: number): string[] {
  const row = (label: string, n: number, note = ''): string => `  ${label.padEnd(22)} ${String(n).padStart(7)}${note ? `  ${note}` : ''}`;
  const f = s.files;
  const lines = [
    `contracts import from ${s.target} ${s.status}: ${f.read} files read in ${seconds.toFixed(1)} s (${(f.read / Math.max(seconds, 0.001)).toFixed(1)} files/s)`,
    row('imported', f.imported, `(new ${f.new}; changed files, stored as new versions: ${f.changed})`),
    row('unchanged', f.unchanged),
    row('rejected', f.rejected),
  ];
  for (const [reason, n] of Object.entries(s.rejectedBy)) lines.push(row(`  ${reason}`, n));
  lines.push(row('= read', f.read));
  if (s.skippedFolders > 0) lines.push(`${countOf(s.skippedFolders, 'subfolder')} not read (add --recursive to read them)`);
  const parties = Object.entries(s.parties).map(([status, n]) => `${outcomeWords(status)} ${n.toLocaleString('en-US')}`);
  if (parties.length > 0) lines.push(`parties of the imported contracts: ${parties.join(', ')}`);
  lines.push(f.rejected > 0 ? `files not imported, with their reasons: ${s.rejectsFile}` : 'no file rejected');
  if (s.status === 'interrupted') lines.push('interrupted: run the same command again to go on (files already imported count as unchanged)');
  lines.push(PROPOSALS_CAUTION);
  return lines;
}
