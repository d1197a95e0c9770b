/**
 * Puts a generated scenario on disk in the forms a user would feed to cpreg: contract texts (one file
 * each and one NDJSON), the extracted mentions as a batch file (CSV and NDJSON), the ERP vendor master
 * CSV, the own entities, and the ground truth kept apart in truth.json.
 */
import { mkdir, writeFile } from 'node:fs/promises';
import { join } from 'node:path';
import { stringify } from 'csv-stringify/sync';
import { generateScenario, type Scenario } from './scenario/index.ts';

export const MENTION_CSV_COLUMNS = ['source', 'external_id', 'text', 'contract_source', 'contract_external_id', 'role', 'country', 'identifiers'];

export interface WrittenScenario {
  dir: string;
  /** Paths relative to dir. */
  files: string[];
  scenario: Scenario;
}

export async function writeScenario(dir: string, scenarioOrSeed: Scenario | number = 1): Promise<WrittenScenario> {
  const scenario = typeof scenarioOrSeed === 'number' ? generateScenario(scenarioOrSeed) : scenarioOrSeed;
  await mkdir(join(dir, 'contracts'), { recursive: true });
  const files: Array<[string, string]> = [
    ['own-entities.json', json(scenario.ownEntities)],
    [
      'contracts.ndjson',
      scenario.contracts.map((c) => JSON.stringify({ source: c.source, externalId: c.externalId, title: c.title, text: c.text })).join('\n') + '\n',
    ],
    ...scenario.contracts.map((c): [string, string] => [join('contracts', `${c.externalId}.txt`), c.text]),
    ['mentions.ndjson', scenario.mentions.map((m) => JSON.stringify(m.input)).join('\n') + '\n'],
    ['mentions.csv', mentionsCsv(scenario)],
    ['vendor-master.csv', scenario.vendorMaster.csv],
    [
      'truth.json',
      json({
        seed: scenario.seed,
        group: scenario.group,
        counterparties: scenario.counterparties,
        contracts: scenario.contracts.map((c) => ({ source: c.source, externalId: c.externalId, style: c.style, parties: c.parties })),
        mentions: scenario.mentions.map((m) => ({
          source: m.input.source,
          externalId: m.input.externalId,
          text: m.input.text,
          style: m.style,
          truth: m.truth,
        })),
        vendorMaster: scenario.vendorMaster.truth,
      }),
    ],
  ];
  for (const [name, content] of files) await writeFile(join(dir, name), content, 'utf8');
  return { dir, files: files.map(([name]) => name), scenario };
}

function json(value: unknown): string {
  return `${JSON.stringify(value, null, 2)}\n`;
}

/** Identifiers in one cell as "scheme:value" joined by ";" (labels for scheme other as "other/label:value"). */
function mentionsCsv(scenario: Scenario): string {
  return stringify(
    scenario.mentions.map(({ input }) => [
      input.source,
      input.externalId,
      input.text,
      input.contract?.source ?? '',
      input.contract?.externalId ?? '',
      input.role ?? '',
      input.country ?? '',
      (input.identifiers ?? []).map((i) => `${i.scheme}${i.label ? `/${i.label}` : ''}:${i.value}`).join(';'),
    ]),
    { header: true, columns: MENTION_CSV_COLUMNS },
  );
}
