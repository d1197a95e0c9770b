/**
 * `cpreg evaluate --through-register`: the labelled rows go through the register exactly as a user's file would
 * (`cpreg ingest` into an empty register, in its batches), and the links the register stored are measured against
 * the ground truth. runEvaluation measures the matching rules over the whole file at once; this measures what the
 * register does with them (its token counts, its batches, its candidate limits), which is what a user gets.
 */
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { bcubed, pairwiseScores, type PairwiseScores, type PrecisionRecall } from '../../resolvers/evaluate/index.ts';
import { migrateToLatest } from '../../db/migrate.ts';
import { openDatabase } from '../../db/open-database.ts';
import { countByStatus, outcomesOfSource } from '../../db/queries/mentions.ts';
import { countOf } from '../cli/count-words.ts';
import { ingestFile } from '../ingest/run-ingest.ts';
import type { LabelledRow } from './load-labelled-csv.ts';

export const EVALUATION_SOURCE = 'evaluate';

export interface RegisterEvaluation {
  rows: number;
  batchSize: number;
  pairwise: PairwiseScores;
  bcubed: PrecisionRecall;
  linked: number;
  review: number;
  new: number;
  /** Mentions left out of matching (not a party, unbound term …): each counts as its own cluster. */
  other: number;
  reviewShare: number;
  /** Review items whose candidate holds a row of the same entity. */
  reviewTrueMatchShare: number;
  counterparties: number;
  elapsedMs: number;
}

export interface RegisterEvaluationOptions {
  /** An empty register to use (directory or PostgreSQL URL); default a temporary embedded one, removed after. */
  db?: string;
  batchSize?: number;
  log?: (line: string) => void;
}

export async function evaluateThroughRegister(rows: readonly LabelledRow[], options: RegisterEvaluationOptions = {}): Promise<RegisterEvaluation> {
  const scratch = mkdtempSync(join(tmpdir(), 'cpreg-evaluate-'));
  const database = await openDatabase(options.db ?? join(scratch, 'register'), { command: 'evaluate --through-register' });
  try {
    await migrateToLatest(database.db);
    const stored = Object.values(await countByStatus(database.db)).reduce((a, b) => a + b, 0);
    if (stored > 0) throw new Error(`--db ${options.db}: the register already holds ${stored} mentions; --through-register needs an empty one`);
    const file = join(scratch, 'rows.ndjson');
    writeFileSync(
      file,
      rows.map((row, i) => JSON.stringify({ externalId: `row-${i}`, text: row.name, ...(row.country ? { country: row.country } : {}) })).join('\n') + '\n',
    );
    const batchSize = options.batchSize ?? 1000;
    const started = performance.now();
    const summary = await ingestFile({
      db: database.db,
      file,
      format: 'ndjson',
      source: EVALUATION_SOURCE,
      rejectsFile: join(scratch, 'rejects.csv'),
      actor: 'evaluate',
      batchSize,
      onProgress: (p) => options.log?.(`register: ${p.counts.read.toLocaleString('en-US')} of ${rows.length.toLocaleString('en-US')} rows`),
    });
    if (summary.counts.rejected > 0)
      throw new Error(
        `${countOf(summary.counts.rejected, 'row')} ${summary.counts.rejected === 1 ? 'was' : 'were'} rejected by ingest (see its rules); fix the file`,
      );
    const outcomes = await outcomesOfSource(database.db, EVALUATION_SOURCE);
    return measure(rows, outcomes, batchSize, performance.now() - started);
  } finally {
    await database.close();
    rmSync(scratch, { recursive: true, force: true });
  }
}

function measure(
  rows: readonly LabelledRow[],
  outcomes: Awaited<ReturnType<typeof outcomesOfSource>>,
  batchSize: number,
  elapsedMs: number,
): RegisterEvaluation {
  const gold: string[] = [];
  const predicted: string[] = [];
  const goldByCounterparty = new Map<number, Set<string>>();
  let linked = 0;
  let review = 0;
  let fresh = 0;
  for (const o of outcomes) {
    const row = rows[Number(o.externalId.slice('row-'.length))];
    if (!row) throw new Error(`register mention ${o.externalId} is not one of the evaluated rows`);
    gold.push(row.id);
    const clustered = (o.status === 'linked' || o.status === 'new') && o.counterpartyId !== null;
    predicted.push(clustered ? `c${o.counterpartyId}` : `m${o.externalId}`);
    if (clustered) {
      let ids = goldByCounterparty.get(o.counterpartyId!);
      if (!ids) goldByCounterparty.set(o.counterpartyId!, (ids = new Set()));
      ids.add(row.id);
    }
    if (o.status === 'linked') linked++;
    else if (o.status === 'new') fresh++;
    else if (o.status === 'review') review++;
  }
  let reviewTrue = 0;
  for (const [i, o] of outcomes.entries()) {
    if (o.status === 'review' && o.reviewCandidateId !== null && goldByCounterparty.get(o.reviewCandidateId)?.has(gold[i]!)) reviewTrue++;
  }
  return {
    rows: outcomes.length,
    batchSize,
    pairwise: pairwiseScores(gold, predicted),
    bcubed: bcubed(gold, predicted),
    linked,
    review,
    new: fresh,
    other: outcomes.length - linked - review - fresh,
    reviewShare: outcomes.length === 0 ? 0 : review / outcomes.length,
    reviewTrueMatchShare: review === 0 ? 1 : reviewTrue / review,
    counterparties: goldByCounterparty.size,
    elapsedMs,
  };
}
