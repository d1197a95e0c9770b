/** `cpreg export register|links|history|review --format csv|ndjson [--out file] [--db] [--json]`: streamed. */
import { once } from 'node:events';
import type { Command } from 'commander';
import { CliError } from '../cli-error.ts';
import { DB_OPTION_HELP } from './serve.ts';

/** What each export holds, as the summary line names it. */
const KIND_WORDS = { register: 'the register', links: 'mention links', history: 'the history', review: 'review items' } as const;

export default function register(program: Command): void {
  program
    .command('export')
    .description('export the register, the links of mentions to counterparties, the history or the review items (streamed)')
    .argument('<kind>', 'register, links, history or review')
    .option('--format <format>', 'csv or ndjson', 'csv')
    .option('--out <file>', 'write to this file (default: standard output)')
    .option('--db <target>', DB_OPTION_HELP)
    .option('--json', 'with --out: print a JSON summary (rows, file) instead of a sentence')
    .showHelpAfterError(true)
    .action(async (kind: string, options: { format: string; out?: string; db?: string; json?: boolean }) => {
      const { EXPORT_KINDS, EXPORT_FORMATS, exportChunks } = await import('../../export/exports.ts');
      if (!(EXPORT_KINDS as readonly string[]).includes(kind)) throw new CliError(`export ${kind}: expected one of ${EXPORT_KINDS.join(', ')}`);
      if (!(EXPORT_FORMATS as readonly string[]).includes(options.format)) throw new CliError(`--format ${options.format}: expected csv or ndjson`);
      const { createWriteStream } = await import('node:fs');
      const { withDatabase, progressReporter, countOf } = await import('../../ingest/cli-support.ts');
      const out = options.out ? createWriteStream(options.out) : process.stdout;
      const progress = progressReporter(`export ${kind}`, 'rows');
      let rows = 0;
      await withDatabase(options.db, 'cpreg export', 'reads', async (db) => {
        for await (const chunk of exportChunks(db, kind as 'register', options.format as 'csv', (n) => {
          rows += n;
          if (options.out) progress.update({ done: rows });
        })) {
          if (!out.write(chunk)) await once(out, 'drain');
        }
      });
      if (options.out) {
        out.end();
        await once(out, 'finish');
        progress.finish();
        const summary = { kind, format: options.format, rows, file: options.out };
        process.stdout.write(
          options.json
            ? `${JSON.stringify(summary)}\n`
            : `exported ${countOf(rows, 'row')} of ${KIND_WORDS[kind as keyof typeof KIND_WORDS]} to ${options.out}\n`,
        );
      }
    });
}
