/** The I/O side of `cpreg evaluate`: flags → loaded rows → runEvaluation → printed report and --out files. */
import { mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { stringify } from 'csv-stringify/sync';
import { precisionRecallSvg } from '../../resolvers/evaluate/index.ts';
import { DEFAULT_MATCH_MODEL, parseMatchModel, type MatchModel } from '../../resolvers/score/index.ts';
import { CliError } from '../cli/cli-error.ts';
import { countOf } from '../cli/count-words.ts';
import type { EvaluateFlags } from '../cli/commands/evaluate.ts';
import { LabelledFileError, loadLabelledCsv, parseColumnValue, type LabelledRow } from './load-labelled-csv.ts';
import { METHODS, runEvaluation, type EvaluationReport, type Method } from './run-evaluation.ts';
import { formatReport } from './format-report.ts';
import { setAsideSharedNames } from './set-aside-shared-names.ts';
import { evaluateThroughRegister } from './through-register.ts';

export async function evaluateCommand(file: string, flags: EvaluateFlags): Promise<void> {
  if (!(METHODS as readonly string[]).includes(flags.method)) {
    throw new CliError(`--method must be one of ${METHODS.join(', ')}; got "${flags.method}"`);
  }
  const method = flags.method as Method;
  const filters = flags.filter.map((f) => parseColumnValue(f, '--filter'));
  const excludes = flags.exclude.map((f) => parseColumnValue(f, '--exclude'));
  const acronymRule = flags.acronym ? parseColumnValue(flags.acronym, '--acronym') : null;
  const loaded = loadLabelledCsv(file, {
    idColumn: flags.id,
    nameColumn: flags.name,
    ...(flags.country ? { countryColumn: flags.country } : {}),
    filters,
    excludes,
    stripCountryQualifier: flags.stripCountryQualifier === true,
    ...(flags.entitySample !== undefined ? { entitySample: parseFraction(flags.entitySample) } : {}),
  });
  if (acronymRule && !loaded.columns.includes(acronymRule[0])) {
    throw new CliError(`--acronym ${acronymRule[0]}: no such column; the header has: ${loaded.columns.join(', ')}`);
  }
  for (const p of loaded.problems) process.stderr.write(`${file}:${p.line}: ${p.problem}\n`);
  const aside = flags.setAsideSharedNames ? setAsideSharedNames(loaded.rows) : { kept: loaded.rows, setAside: 0 };
  if (flags.setAsideSharedNames && !flags.json)
    process.stderr.write(`  set aside ${countOf(aside.setAside, 'row')} whose name and country two or more entities share\n`);
  const rows = aside.kept;
  if (rows.length === 0) throw new CliError(`${file}: no usable rows after filtering (${countOf(loaded.problems.length, 'row')} with problems)`);
  if (flags.throughRegister) return throughRegisterCommand(rows, flags);
  const model = flags.model ? readModel(flags.model) : DEFAULT_MATCH_MODEL;
  const isAcronym = acronymRule
    ? (row: LabelledRow): boolean => row.fields[acronymRule[0]] === acronymRule[1] || (row.fields[acronymRule[0]] ?? '').split('+').includes(acronymRule[1])
    : (row: LabelledRow): boolean => looksLikeAcronym(row.name);
  const report = runEvaluation(rows, {
    method,
    model,
    train: flags.train === true,
    fixU: flags.fixU === true,
    learnFromLabels: flags.learnFromLabels === true,
    ...(flags.linkAt !== undefined ? { linkAt: parseNumber('--link-at', flags.linkAt) } : {}),
    ...(flags.newAt !== undefined ? { newAt: parseNumber('--new-at', flags.newAt) } : {}),
    blocking: {
      ...(flags.maxBlock !== undefined ? { maxBlockSize: parseNumber('--max-block', flags.maxBlock) } : {}),
      ...(flags.window !== undefined ? { window: parseNumber('--window', flags.window) } : {}),
    },
    isAcronym,
    sweep: method === 'cpreg' && flags.out !== undefined,
    log: flags.json ? () => undefined : (line) => process.stderr.write(`  ${line}\n`),
  });
  const input = {
    file,
    usableRows: rows.length,
    problems: loaded.problems,
    filteredOut: loaded.filteredOut,
    excludedOut: loaded.excludedOut,
    countryQualifiersStripped: loaded.qualifiersStripped,
    setAsideSharedNames: aside.setAside,
  };
  if (flags.saveModel && method === 'cpreg') {
    writeFileSync(flags.saveModel, `${JSON.stringify(report.trainedModel ?? model, null, 2)}\n`);
  }
  if (flags.out) writeOutputs(flags.out, report, input);
  const { trainedModel: _omit, ...printable } = report;
  if (flags.json) process.stdout.write(`${JSON.stringify({ input, ...printable })}\n`);
  else process.stdout.write(formatReport(report, input));
}

function writeOutputs(folder: string, report: EvaluationReport, input: object): void {
  try {
    mkdirSync(folder, { recursive: true });
    const { trainedModel: _omit, ...printable } = report;
    writeFileSync(join(folder, 'report.json'), `${JSON.stringify({ input, ...printable }, null, 2)}\n`);
    if (report.sweep && report.sweep.length > 0) {
      writeFileSync(
        join(folder, 'sweep.csv'),
        stringify(
          report.sweep.map((p) => [p.threshold, p.precision.toFixed(6), p.recall.toFixed(6), p.f1.toFixed(6)]),
          {
            header: true,
            columns: ['link_at', 'precision', 'recall', 'f1'],
          },
        ),
      );
      writeFileSync(
        join(folder, 'sweep.svg'),
        precisionRecallSvg(report.sweep, {
          title: `cpreg: pairwise precision and recall by link threshold (${report.rows} names)`,
          ...(report.model ? { chosen: report.model.linkAt } : {}),
        }),
      );
    }
  } catch (error) {
    throw new CliError(`--out ${folder}: ${(error as Error).message}`, 1, { cause: error });
  }
}

async function throughRegisterCommand(rows: LabelledRow[], flags: EvaluateFlags): Promise<void> {
  if (flags.method !== 'cpreg') throw new CliError('--through-register measures the register itself: leave out --method');
  for (const [set, option] of [
    [flags.model, '--model'],
    [flags.linkAt, '--link-at'],
    [flags.newAt, '--new-at'],
    [flags.train, '--train'],
  ] as const) {
    if (set !== undefined) throw new CliError(`${option} does not apply with --through-register: the register scores with its own model`);
  }
  const batchSize = flags.batchSize === undefined ? undefined : parseNumber('--batch-size', flags.batchSize);
  if (batchSize !== undefined && !(Number.isInteger(batchSize) && batchSize >= 1))
    throw new CliError(`--batch-size expects a whole number of at least 1, got "${flags.batchSize}"`);
  const report = await evaluateThroughRegister(rows, {
    ...(flags.db ? { db: flags.db } : {}),
    ...(batchSize !== undefined ? { batchSize } : {}),
    log: flags.json ? () => undefined : (line) => process.stderr.write(`  ${line}\n`),
  });
  if (flags.json) {
    process.stdout.write(`${JSON.stringify(report)}\n`);
    return;
  }
  const f = (x: number): string => x.toFixed(4);
  process.stdout.write(
    [
      `through the register: ${countOf(report.rows, 'row')} in batches of ${report.batchSize}, ${(report.elapsedMs / 1000).toFixed(1)} s`,
      `  pairwise  precision ${f(report.pairwise.precision)}  recall ${f(report.pairwise.recall)}  F1 ${f(report.pairwise.f1)}`,
      `  B-cubed   precision ${f(report.bcubed.precision)}  recall ${f(report.bcubed.recall)}  F1 ${f(report.bcubed.f1)}`,
      `  linked ${report.linked}, new ${report.new}, review ${report.review} (${(100 * report.reviewShare).toFixed(2)} %, ${(100 * report.reviewTrueMatchShare).toFixed(1)} % true), other ${report.other}`,
      `  counterparties ${report.counterparties}`,
      '',
    ].join('\n'),
  );
}

function readModel(path: string): MatchModel {
  try {
    return parseMatchModel(JSON.parse(readFileSync(path, 'utf8')));
  } catch (error) {
    throw new CliError(`--model ${path}: ${(error as Error).message}`, 1, { cause: error });
  }
}

function parseFraction(text: string): number {
  const value = parseNumber('--entity-sample', text);
  if (!(value > 0 && value <= 1)) throw new CliError(`--entity-sample expects a fraction in (0, 1], got "${text}"`);
  return value;
}

function parseNumber(option: string, text: string): number {
  const value = Number(text);
  if (text.trim() === '' || !Number.isFinite(value)) throw new CliError(`${option} expects a number, got "${text}"`);
  return value;
}

/** One token of 2–10 letters or digits, written in capitals ("NRC", "CNRS", "3M"): the default acronym rule. */
export function looksLikeAcronym(name: string): boolean {
  const text = name.trim();
  if (text.length < 2 || text.length > 10 || text.includes(' ')) return false;
  let letters = 0;
  for (const ch of text) {
    if (ch >= 'A' && ch <= 'Z') letters++;
    else if (ch >= 'a' && ch <= 'z') return false;
    else if (!(ch >= '0' && ch <= '9') && ch !== '&' && ch !== '-' && ch !== '.') return false;
  }
  return letters >= 2;
}

export { LabelledFileError };
