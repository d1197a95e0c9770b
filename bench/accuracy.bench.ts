/**
 * The matcher's judgement beside its goals (the company-names issue), measured exactly as `cpreg evaluate` does
 * (services/evaluate/run-evaluation.ts: the register's own decision rules):
 *  - company names keyed by LEI (../shared/datasets/lei_org_names_dev.csv, its README's protocol: rows whose name and
 *    country two entities share set aside): pairwise precision ≥ 0.99 and F1 ≥ 0.82 on automatic links, at most 10 %
 *    of records sent to review, at least half of review items true matches; and the same rows through the register
 *    itself (`cpreg evaluate --through-register`), against the same precision, F1 and review goals;
 *  - generated names (the scale generator with its hard negatives) at 10,000 and (default mode) 200,000: precision
 *    ≥ 0.98, F1 above plain Jaro–Winkler ≥ 0.9 over the same candidate pairs (the baseline row), review as above;
 *  - ROR test split (companies and all): precision and F1 above the exact and candidate-pair JW baselines;
 *  - the demo (seed 1): pairwise recall ≥ 0.90 at precision ≥ 0.995, review items ≤ 5 % of mentions.
 */
import { spawnSync } from 'node:child_process';
import { existsSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { DEFAULT_MATCH_MODEL } from '../resolvers/score/index.ts';
import { loadLabelledCsv, type LabelledRow } from '../services/evaluate/load-labelled-csv.ts';
import { runEvaluation, type EvaluationReport, type Method } from '../services/evaluate/run-evaluation.ts';
import { evaluateThroughRegister } from '../services/evaluate/through-register.ts';
import { setAsideSharedNames } from '../services/evaluate/set-aside-shared-names.ts';
import { looksLikeAcronym } from '../services/evaluate/evaluate-command.ts';
import type { BenchContext, BenchRow } from './types.ts';

const ROOT = join(dirname(fileURLToPath(import.meta.url)), '..');
const DATASETS = join(ROOT, '..', 'shared', 'datasets');

function evaluate(rows: readonly LabelledRow[], method: Method, isAcronym: (row: LabelledRow) => boolean = (r) => looksLikeAcronym(r.name)): EvaluationReport {
  return runEvaluation(rows, { method, model: DEFAULT_MATCH_MODEL, isAcronym });
}

function judgementRows(
  prefix: string,
  label: string,
  report: EvaluationReport,
  baseline: EvaluationReport,
  goals: { precision?: number; f1?: number; review: boolean },
  size: number,
): BenchRow[] {
  const o = report.outcomes!;
  const rows: BenchRow[] = [
    {
      id: `${prefix}.precision`,
      label: `${label}: pairwise precision of automatic links`,
      value: report.pairwise.precision,
      unit: 'ratio',
      better: 'higher',
      size,
      backend: 'memory',
      baseline: `${prefix}.baseline_precision`,
      ...(goals.precision !== undefined ? { goal: { op: '>=' as const, value: goals.precision } } : {}),
    },
    {
      id: `${prefix}.baseline_precision`,
      label: `${label}: baseline (${baseline.method}) pairwise precision`,
      value: baseline.pairwise.precision,
      unit: 'ratio',
      better: 'higher',
      size,
      backend: 'memory',
    },
    { id: `${prefix}.recall`, label: `${label}: pairwise recall`, value: report.pairwise.recall, unit: 'ratio', better: 'higher', size, backend: 'memory' },
    {
      id: `${prefix}.f1`,
      label: `${label}: pairwise F1 (ratio: against the baseline row)`,
      value: report.pairwise.f1,
      unit: 'f1',
      better: 'higher',
      size,
      backend: 'memory',
      baseline: `${prefix}.baseline_f1`,
      ...(goals.f1 !== undefined ? { goal: { op: '>=' as const, value: goals.f1 } } : {}),
    },
    {
      id: `${prefix}.baseline_f1`,
      label: `${label}: baseline (${baseline.method}) pairwise F1`,
      value: baseline.pairwise.f1,
      unit: 'f1',
      better: 'higher',
      size,
      backend: 'memory',
      extra: { precision: baseline.pairwise.precision, recall: baseline.pairwise.recall },
    },
    {
      id: `${prefix}.review_share`,
      label: `${label}: share of records sent to review`,
      value: o.reviewShare,
      unit: 'ratio',
      better: 'lower',
      size,
      backend: 'memory',
      ...(goals.review ? { goal: { op: '<=' as const, value: 0.1 } } : {}),
    },
    {
      id: `${prefix}.review_true`,
      label: `${label}: share of review items that are true matches`,
      value: o.reviewTrueMatchShare,
      unit: 'ratio',
      better: 'higher',
      size,
      backend: 'memory',
      ...(goals.review ? { goal: { op: '>=' as const, value: 0.5 } } : {}),
    },
  ];
  return rows;
}

export async function run(ctx: BenchContext): Promise<BenchRow[]> {
  const rows: BenchRow[] = [];
  const lei = join(DATASETS, 'lei_org_names_dev.csv');
  if (existsSync(lei)) {
    ctx.log('LEI dev names');
    const kept = setAsideSharedNames(loadLabelledCsv(lei, { idColumn: 'entity_id', nameColumn: 'name', countryColumn: 'country' }).rows).kept;
    rows.push(...judgementRows('lei', 'LEI dev', evaluate(kept, 'cpreg'), evaluate(kept, 'exact'), { precision: 0.99, f1: 0.82, review: true }, kept.length));
    // The same rows through the register itself (`cpreg evaluate --through-register`: ingested in batches of 1,000
    // into an empty embedded register), so that what the register does is measured beside what the rules do.
    ctx.log('LEI dev names through the register');
    const through = await evaluateThroughRegister(kept);
    const size = kept.length;
    rows.push(
      {
        id: 'lei.register.precision',
        label: 'LEI dev through the register: pairwise precision',
        value: through.pairwise.precision,
        unit: 'ratio',
        better: 'higher',
        size,
        backend: 'pglite',
        goal: { op: '>=', value: 0.99 },
      },
      {
        id: 'lei.register.recall',
        label: 'LEI dev through the register: pairwise recall',
        value: through.pairwise.recall,
        unit: 'ratio',
        better: 'higher',
        size,
        backend: 'pglite',
      },
      {
        id: 'lei.register.f1',
        label: 'LEI dev through the register: pairwise F1',
        value: through.pairwise.f1,
        unit: 'f1',
        better: 'higher',
        size,
        backend: 'pglite',
        goal: { op: '>=', value: 0.82 },
      },
      {
        id: 'lei.register.review_share',
        label: 'LEI dev through the register: share of mentions sent to review',
        value: through.reviewShare,
        unit: 'ratio',
        better: 'lower',
        size,
        backend: 'pglite',
        goal: { op: '<=', value: 0.1 },
      },
    );
  } else rows.push({ id: 'lei', label: 'LEI dev names', value: 0, unit: 'ratio', better: 'higher', skipped: `${lei} not found` });

  for (const size of ctx.mode === 'quick' ? [10_000] : [10_000, 200_000]) {
    ctx.log(`generated names: ${size}`);
    const generated: LabelledRow[] = [];
    for (const row of ctx.generator.names(size, ctx.seed))
      generated.push({ line: generated.length + 2, id: row.entityId, name: row.name, originalName: row.name, country: row.country, fields: {} });
    rows.push(
      ...judgementRows(
        `generated.${size}`,
        `generated ${size}`,
        evaluate(generated, 'cpreg'),
        evaluate(generated, 'jw-candidates'),
        { precision: 0.98, review: true },
        size,
      ),
    );
  }

  const ror = join(DATASETS, 'ror_org_names.csv');
  if (existsSync(ror)) {
    ctx.log('ROR test split');
    const test = loadLabelledCsv(ror, {
      idColumn: 'entity_id',
      nameColumn: 'name',
      countryColumn: 'country',
      filters: [['split', 'test']],
      excludes: [['status', 'withdrawn']],
      stripCountryQualifier: true,
    }).rows;
    const acronym = (r: LabelledRow): boolean => (r.fields.source_name_type ?? '').split('+').includes('acronym');
    const cpreg = evaluate(test, 'cpreg', acronym);
    rows.push(...judgementRows('ror_test', 'ROR test', cpreg, evaluate(test, 'jw-candidates', acronym), { review: false }, test.length));
    rows.push({
      id: 'ror_test.exact_f1',
      label: 'ROR test: exact baseline pairwise F1',
      value: evaluate(test, 'exact', acronym).pairwise.f1,
      unit: 'f1',
      better: 'higher',
      size: test.length,
      backend: 'memory',
    });
  }

  ctx.log('demo (seed 1)');
  const demo = spawnSync(process.execPath, [join(ROOT, 'bin', 'cpreg.js'), 'demo', '--no-serve', '--json', '--db', join(ctx.tmpDir, 'demo')], {
    encoding: 'utf8',
    maxBuffer: 64 * 1024 * 1024,
  });
  if (demo.status === 0) {
    const summary = JSON.parse(demo.stdout.trim().split('\n').pop() as string) as {
      mentions: { total: number; byStatus: Record<string, number> };
      accuracy: { mentions: { pairwise: { precision: number; recall: number } } };
    };
    const { precision, recall } = summary.accuracy.mentions.pairwise;
    rows.push(
      {
        id: 'demo.precision',
        label: 'demo: pairwise precision of automatic links',
        value: precision,
        unit: 'ratio',
        better: 'higher',
        backend: 'pglite',
        goal: { op: '>=', value: 0.995 },
      },
      { id: 'demo.recall', label: 'demo: pairwise recall', value: recall, unit: 'ratio', better: 'higher', backend: 'pglite', goal: { op: '>=', value: 0.9 } },
      {
        id: 'demo.review_share',
        label: 'demo: mentions in review',
        value: (summary.mentions.byStatus.review ?? 0) / summary.mentions.total,
        unit: 'ratio',
        better: 'lower',
        backend: 'pglite',
        goal: { op: '<=', value: 0.05 },
      },
    );
  } else rows.push({ id: 'demo', label: 'demo accuracy', value: 0, unit: 'ratio', better: 'higher', skipped: `cpreg demo failed: ${demo.stderr.slice(-300)}` });
  return rows;
}
