/**
 * Builds resolvers/score/default-model.ts, the built-in match model, from labelled data that looks like the job:
 *   - company names keyed by LEI (../shared/datasets/lei_org_names_dev.csv; rows whose name and country two
 *     entities share set aside, as its README's protocol says);
 *   - ROR companies, dev split (../shared/datasets/ror_org_names.csv: org_types has "company", withdrawn dropped,
 *     the "(Country)" display qualifier stripped);
 *   - invented names from the seeded generator (`cpreg generate`, seed 7, 20,000 names, with its hard negatives).
 * Usage: node bin/run-ts.js scripts/build-model.ts [--dry-run]
 * Targets: pairwise precision 0.99 (the LEI goal) of the clusters formed at linkAt, in every dataset at linkAt; at least half of the pairs sent to review true matches in every dataset, within a review band of at least 1 bit (MIN_REVIEW_BAND).
 */
import { writeFileSync } from 'node:fs';
import { resolve } from 'node:path';
import { loadLabelledCsv, type LabelledRow } from '../services/evaluate/load-labelled-csv.ts';
import { setAsideSharedNames } from '../services/evaluate/set-aside-shared-names.ts';
import { estimateModel, labelledPairsOf } from '../services/evaluate/train-model.ts';
import { generateNames } from '../services/demo/generate-names.ts';
import { DEFAULT_MATCH_MODEL } from '../resolvers/score/index.ts';

const datasets = resolve(process.env.CPREG_DATASETS ?? '../shared/datasets');
const targets = { linkPrecision: 0.99, reviewMatchShare: 0.5 };
const GENERATED = { names: 20_000, seed: 7 };

function lei(): LabelledRow[] {
  const loaded = loadLabelledCsv(`${datasets}/lei_org_names_dev.csv`, { idColumn: 'entity_id', nameColumn: 'name', countryColumn: 'country' });
  return setAsideSharedNames(loaded.rows).kept;
}

function rorCompanies(): LabelledRow[] {
  const loaded = loadLabelledCsv(`${datasets}/ror_org_names.csv`, {
    idColumn: 'entity_id',
    nameColumn: 'name',
    countryColumn: 'country',
    filters: [['split', 'dev']],
    excludes: [['status', 'withdrawn']],
    stripCountryQualifier: true,
  });
  return loaded.rows.filter((row) => (row.fields.org_types ?? '').split(';').includes('company'));
}

function generated(): LabelledRow[] {
  const rows: LabelledRow[] = [];
  for (const row of generateNames(GENERATED.names, GENERATED.seed)) {
    rows.push({ line: rows.length + 2, id: row.entityId, name: row.name, originalName: row.name, country: row.country, fields: {} });
  }
  return rows;
}

const sets = [
  { name: 'LEI dev', rows: lei() },
  { name: 'ROR dev companies', rows: rorCompanies() },
  { name: `generated (${GENERATED.names} names, seed ${GENERATED.seed})`, rows: generated() },
];
const labelled = sets.map((set) => {
  const pairs = labelledPairsOf(set);
  let matches = 0;
  for (const m of pairs.matches) matches += m;
  console.error(`${set.name}: ${set.rows.length} names, ${pairs.count} candidate pairs, ${matches} true`);
  return { pairs, matches };
});
const note =
  `labelled candidate pairs, m and u counted per dataset (add-one smoothing) and averaged: ` +
  labelled.map(({ pairs, matches }) => `${pairs.name} ${pairs.count} pairs (${matches} true)`).join('; ') +
  `; linkAt: lowest threshold whose clusters have pairwise precision >= ${targets.linkPrecision} in every dataset; newAt: lowest score with >= ${targets.reviewMatchShare} true matches among review pairs in every dataset` +
  `; rebuild: node bin/run-ts.js scripts/build-model.ts`;
const model = estimateModel(
  labelled.map((l) => l.pairs),
  targets,
  note,
  DEFAULT_MATCH_MODEL,
);
console.error(`linkAt ${model.linkAt}, newAt ${model.newAt}`);
const source = `/**
 * The built-in match model, made by scripts/build-model.ts from labelled company-name data (docs/matching.md →
 * 'Model'); rebuild with: node bin/run-ts.js scripts/build-model.ts
 */
import type { MatchModel } from './match-model.ts';

export const DEFAULT_MATCH_MODEL: MatchModel = ${JSON.stringify(model, null, 2)};
`;
if (process.argv.includes('--dry-run')) process.stdout.write(source);
else writeFileSync(resolve('resolvers/score/default-model.ts'), source);
