/**
 * The demo behind `npm start`: loads the invented scenario into a register through the same public paths a
 * user takes (own entities through the register service, contracts as PDF, Word and text files through the
 * contract-file import, which stores them through storeContract — what POST /v1/contracts calls —, the extracted mentions as a batch file through services/ingest), then reads the
 * register back into a summary with the accuracy measured against the scenario's ground truth.
 * Every step is idempotent: loading again into the same database stores nothing twice.
 */
import { join } from 'node:path';
import type { Kysely } from 'kysely';
import type { Database } from '../../db/types.ts';
import { addOwnEntity, createRegisterContext } from '../register/index.ts';
import { DocumentFinder } from '../contract-files/find-documents.ts';
import { storeDocument } from '../contract-files/store-document.ts';
import type { FileReject } from '../../resolvers/files/index.ts';
import { CONTRACT_FILES_DIR, writeContractFiles, type ContractFileType } from './contract-files.ts';
import { ingestFile, type IngestSummary } from '../ingest/run-ingest.ts';
import { MENTION_SOURCE, type Scenario } from './scenario/index.ts';

export type DemoStage = 'own_entities' | 'contracts' | 'mentions' | 'vendor_master';

export interface DemoProgress {
  stage: DemoStage;
  done: number;
  total: number;
}

export interface LoadDemoOptions {
  db: Kysely<Database>;
  scenario: Scenario;
  /** Where writeScenario put the scenario's files (the batch file is read from there). */
  filesDir: string;
  actor: string;
  onProgress?: (progress: DemoProgress) => void;
  /** Checked between steps: when it answers true the load stops early (`interrupted`). */
  shouldStop?: () => boolean;
}

export interface DemoLoad {
  interrupted: boolean;
  ownEntities: { added: number; existing: number };
  contracts: {
    stored: number;
    alreadyStored: number;
    parties: number;
    /** The contract files written, by type. */
    files?: Record<ContractFileType, number>;
    /** Files the import refused (none expected: a defect if any). */
    rejected: FileReject[];
  };
  ingest?: IngestSummary;
  /** Seconds per stage. */
  seconds: Partial<Record<DemoStage, number>>;
}

export async function loadDemo(options: LoadDemoOptions): Promise<DemoLoad> {
  const { db, scenario, actor } = options;
  const ctx = createRegisterContext(db);
  const who = { actor, reason: 'demo scenario' };
  const stop = options.shouldStop ?? (() => false);
  const progress = options.onProgress ?? (() => undefined);
  const load: DemoLoad = {
    interrupted: false,
    ownEntities: { added: 0, existing: 0 },
    contracts: { stored: 0, alreadyStored: 0, parties: 0, rejected: [] },
    seconds: {},
  };
  const timed = async (stage: DemoStage, fn: () => Promise<void>): Promise<void> => {
    const started = performance.now();
    await fn();
    load.seconds[stage] = (performance.now() - started) / 1000;
  };

  await timed('own_entities', async () => {
    for (const [i, own] of scenario.ownEntities.entries()) {
      const added = await addOwnEntity(ctx, { name: own.legalName, country: own.jurisdiction, identifiers: own.identifiers }, who);
      if (added.created) load.ownEntities.added++;
      else load.ownEntities.existing++;
      progress({ stage: 'own_entities', done: i + 1, total: scenario.ownEntities.length });
    }
  });

  await timed('contracts', async () => {
    progress({ stage: 'contracts', done: 0, total: scenario.contracts.length });
    // The contracts as files (PDF, Word, text), read back through the contract-file import: type from the content,
    // text extracted, stored through storeContract under the scenario's own ids and titles.
    const dir = join(options.filesDir, CONTRACT_FILES_DIR);
    const written = await writeContractFiles(dir, scenario.contracts);
    load.contracts.files = written.counts;
    let done = 0;
    for await (const found of new DocumentFinder(dir).documents()) {
      // PGlite answers through microtasks only: without a turn of the event loop a Ctrl-C would not be seen here.
      await new Promise((resolve) => setImmediate(resolve));
      if (stop()) {
        load.interrupted = true;
        return;
      }
      const c = written.files.get(found.path);
      const outcome =
        found.kind === 'document' && c
          ? await storeDocument(ctx, { path: found.path, externalId: c.externalId, title: c.title, text: found.text }, c.source, who, { requireParties: false })
          : {
              kind: 'rejected' as const,
              reason: found.kind === 'rejected' ? found.reason : 'unsupported_type',
              detail: found.kind === 'rejected' ? found.detail : 'not a file the demo wrote',
            };
      if (outcome.kind === 'imported') {
        load.contracts.stored++;
        load.contracts.parties += outcome.parties.length;
      } else if (outcome.kind === 'unchanged') {
        load.contracts.alreadyStored++;
        load.contracts.parties += outcome.partyCount;
      } else load.contracts.rejected.push({ path: found.path, reason: outcome.reason, detail: outcome.detail });
      progress({ stage: 'contracts', done: ++done, total: scenario.contracts.length });
    }
  });
  if (load.interrupted) return load;

  await timed('mentions', async () => {
    const total = scenario.mentions.length;
    progress({ stage: 'mentions', done: 0, total });
    load.ingest = await ingestFile({
      db,
      file: join(options.filesDir, 'mentions.ndjson'),
      source: MENTION_SOURCE,
      rejectsFile: join(options.filesDir, 'mentions.rejects.csv'),
      actor,
      batchSize: 250,
      ctx,
      shouldStop: stop,
      onProgress: (p) => progress({ stage: 'mentions', done: p.counts.read, total }),
    });
    if (load.ingest.status === 'interrupted') load.interrupted = true;
  });
  return load;
}
