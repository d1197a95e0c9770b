/**
 * `cpreg reconcile <vendor-master.csv> [--map field=column]... [--out report.csv] [--db] [--json]`: links each
 * vendor row to the register without changing it, writes one CSV row per finding, prints a summary table.
 */
import type { Command } from 'commander';
import { CliError } from '../cli-error.ts';
import { DB_OPTION_HELP } from './serve.ts';

const collect = (value: string, previous: string[]): string[] => [...previous, value];

export default function register(program: Command): void {
  program
    .command('reconcile')
    .description(
      'reconcile an ERP vendor master with the register (read-only): matches, vendors without contracts, counterparties without vendor rows, duplicate vendors',
    )
    .argument('<vendor-master.csv>', 'the vendor master as CSV with a header row')
    .option(
      '--map <field=column>',
      'which column holds a field (repeat): id, name, taxId, registrationNumber, phone, email, iban, street, city, postalCode, country',
      collect,
      [],
    )
    .option('--out <file>', 'write the report (one CSV row per finding) here')
    .option('--db <target>', DB_OPTION_HELP)
    .option('--json', 'print the summary and findings as JSON')
    .showHelpAfterError(true)
    .action(async (file: string, options: { map: string[]; out?: string; db?: string; json?: boolean }) => {
      const { existsSync } = await import('node:fs');
      const { writeFile } = await import('node:fs/promises');
      if (!existsSync(file)) throw new CliError(`${file}: no such file`);
      const { parseVendorMap, VendorMappingError } = await import('../../reconcile/vendor-rows.ts');
      const { readVendorMaster, reconcile, summarise } = await import('../../reconcile/reconcile.ts');
      const { reportCsv } = await import('../../reconcile/report.ts');
      const { withDatabase, progressReporter } = await import('../../ingest/cli-support.ts');
      let map;
      try {
        map = parseVendorMap(options.map);
      } catch (error) {
        throw new CliError((error as Error).message);
      }
      const progress = progressReporter('reconcile', 'vendor rows');
      let result;
      try {
        result = await withDatabase(options.db, 'cpreg reconcile', 'matches', async (db) => {
          const { rows, rejected } = await readVendorMaster(file, map);
          const findings = await reconcile(db, rows, (done) => progress.update({ done, fraction: done / Math.max(1, rows.length) }));
          return { findings, summary: summarise(rows.length + rejected.length, rejected, findings) };
        });
      } catch (error) {
        progress.finish();
        if (error instanceof VendorMappingError) throw new CliError(error.message, 1, { cause: error });
        throw error;
      }
      progress.finish();
      if (options.out) await writeFile(options.out, reportCsv(result.findings), 'utf8');
      if (options.json) {
        process.stdout.write(`${JSON.stringify({ ...result.summary, report: options.out ?? null, findings: result.findings })}\n`);
        return;
      }
      const s = result.summary;
      const lines = [
        `vendor rows read: ${s.rowsRead} (${s.rowsRejected.length} unreadable), linked to a counterparty: ${s.matched}`,
        '',
        `${'finding'.padEnd(28)} ${'rows'.padStart(6)}`,
        ...Object.entries(s.byFinding).map(([k, v]) => `${k.padEnd(28)} ${String(v).padStart(6)}`),
        ...s.rowsRejected.slice(0, 20).map((r) => `line ${r.line}: ${r.reason}`),
        options.out ? `\nreport: ${options.out}` : '\n(add --out report.csv for one row per finding)',
        'The register was not changed.',
      ];
      process.stdout.write(`${lines.join('\n')}\n`);
    });
}
