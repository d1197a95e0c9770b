/**
 * `cpreg evaluate <labelled.csv> --id <column> --name <column>`: clusters every row with one method and measures
 * the clusters against the ground-truth ids (pairwise, B-cubed, ARI), with blocking quality and a linkAt sweep
 * (CSV + SVG in --out). Rows that cannot be used are listed with their line numbers and left out of the metrics.
 */
import type { Command } from 'commander';
import { CliError } from '../cli-error.ts';

interface EvaluateFlags {
  id: string;
  name: string;
  country?: string;
  filter: string[];
  exclude: string[];
  acronym?: string;
  method: string;
  out?: string;
  json?: boolean;
  stripCountryQualifier?: boolean;
  model?: string;
  train?: boolean;
  fixU?: boolean;
  learnFromLabels?: boolean;
  entitySample?: string;
  linkAt?: string;
  newAt?: string;
  saveModel?: string;
  maxBlock?: string;
  window?: string;
  setAsideSharedNames?: boolean;
  throughRegister?: boolean;
  db?: string;
  batchSize?: string;
}

const collect = (value: string, previous: string[]): string[] => [...previous, value];

export default function register(program: Command): void {
  program
    .command('evaluate')
    .description('cluster every row of a labelled CSV and measure the clusters against its ground-truth ids')
    .argument('<labelled.csv>', 'CSV with a header row, one name per row')
    .requiredOption('--id <column>', 'column holding the ground-truth entity id')
    .requiredOption('--name <column>', 'column holding the name')
    .option('--country <column>', 'column holding an ISO 3166 country code (used as a hint and a feature)')
    .option('--filter <column=value>', 'keep only rows where column=value (repeatable; values of one column are alternatives)', collect, [])
    .option('--exclude <column=value>', 'leave out rows where column=value (repeatable)', collect, [])
    .option('--acronym <column=value>', 'rows where column=value are acronyms (default: one upper-case token of 2-10 characters)')
    .option(
      '--method <method>',
      "cpreg (the full pipeline), exact (equal after normalisation), jw (Jaro-Winkler >= 0.9 over all pairs) or jw-candidates (the same over cpreg's candidate pairs)",
      'cpreg',
    )
    .option('--strip-country-qualifier', 'remove a trailing "(Country name)" display qualifier from names before matching')
    .option('--model <file.json>', 'cpreg: match model to score with (default: the built-in model)')
    .option('--train', "cpreg: re-estimate m and u by EM on this file's candidate pairs (labels are not used)")
    .option('--fix-u', 'cpreg with --train: hold u at the random-pair frequencies')
    .option('--learn-from-labels', "cpreg, for tuning: estimate m and u from this file's ground truth (never on the split you report)")
    .option('--entity-sample <fraction>', 'keep a stable subsample of whole entities (by a hash of the id), e.g. 0.3')
    .option('--link-at <bits>', "cpreg: override the model's link threshold (a pair links at this score or above)")
    .option('--new-at <bits>', "cpreg: override the model's new-record threshold (a pair at this score or below is a new record)")
    .option('--save-model <file.json>', 'cpreg: write the model used (trained or loaded) to this file')
    .option('--max-block <n>', 'cpreg: blocks up to this size are paired exhaustively')
    .option('--window <n>', 'cpreg: sorted-neighbourhood window inside oversized blocks')
    .option('--set-aside-shared-names', "leave out rows whose (case-folded name, country) two or more ids share (the LEI data's scoring protocol)")
    .option('--through-register', 'cpreg: ingest the rows into an empty register, as `cpreg ingest` would, and measure the links it stored')
    .option('--db <dir|url>', 'with --through-register: the empty register to use (default: a temporary embedded one, removed after)')
    .option('--batch-size <n>', 'with --through-register: rows per ingest batch (default 1000, as cpreg ingest)')
    .option('--out <folder>', 'write report.json, sweep.csv and sweep.svg (cpreg) into this folder')
    .option('--json', 'print the report as JSON')
    .action(async (file: string, flags: EvaluateFlags) => {
      const { evaluateCommand } = await import('../../evaluate/evaluate-command.ts');
      await evaluateCommand(file, flags).catch((error: unknown) => {
        if (error instanceof CliError) throw error;
        if (error instanceof Error && error.name === 'LabelledFileError') throw new CliError(error.message, 1, { cause: error });
        throw error;
      });
    });
}

export type { EvaluateFlags };
