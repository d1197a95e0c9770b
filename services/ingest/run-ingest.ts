/**
 * Batch ingest of a CSV or NDJSON file: streamed (csv-parse / line reader with back-pressure, so memory does
 * not grow with the file), resolved in batches through the register's batch resolution, with every row
 * accounted for:
 *
 *   read = linked + review + new + own_entity + not_a_party + unbound_term + collective_term
 *          + already_ingested + rejected
 *
 * Rejected rows go to the rejects file (line number, reason, the row as read), among them rows holding text the
 * database cannot store (NUL, a lone UTF-16 surrogate), named by field. The run and its counts are
 * stored in ingest_run (updated after every batch, so an interrupted run shows how far it got). Running the
 * same file again resumes: rows already stored with the same content count as already_ingested.
 */
import { createReadStream, statSync } from 'node:fs';
import type { Kysely } from 'kysely';
import type { Database } from '../../db/types.ts';
import { finishIngestRun, insertIngestRun, updateIngestRunCounts } from '../../db/queries/ingest-runs.ts';
import { createRegisterContext, type RegisterContext } from '../register/context.ts';
import { resolveBatch } from '../register/batch.ts';
import { timed, type StageTimes } from '../register/stage-times.ts';
import { prepareMention } from '../register/resolve/prepare.ts';
import { mentionKey, type MentionInput } from '../../resolvers/vocabulary.ts';
import type { FieldMap } from './mapping.ts';
import { RejectsWriter } from './rejects.ts';
import { unstorableRowReason } from './unstorable-text.ts';
import { emptyCounts, unaccounted, type IngestCounts } from './ingest-counts.ts';
import { storedHashes } from './stored-hashes.ts';
import { formatOf, rowsOf, type IngestFormat } from './rows-of.ts';

export interface IngestOptions {
  db: Kysely<Database>;
  file: string;
  format?: IngestFormat;
  source: string;
  map?: FieldMap;
  /** Where rejected rows go (a CSV: line, reason, row); created only when a row is rejected. */
  rejectsFile: string;
  actor: string;
  batchSize?: number;
  /** Called after every batch. */
  onProgress?: (progress: IngestProgress) => void;
  /** Checked between batches: when it answers true the run stops cleanly as `interrupted`. */
  shouldStop?: () => boolean;
  ctx?: RegisterContext;
  /** Told what the file's header leaves unread (also listed in the summary's `warnings`). */
  onWarning?: (message: string) => void;
  /**
   * Filled with the milliseconds each stage took (services/register/stage-times.ts): the batch's own stages, `resume`
   * (which rows are stored already), `record` (the run's counts after each batch) and `file` (reading and checking
   * the file's rows: the rest of the run's time).
   */
  stages?: StageTimes;
}

export interface IngestProgress {
  runId: number;
  counts: IngestCounts;
  bytesRead: number;
  totalBytes: number;
  elapsedMs: number;
}

export interface IngestSummary extends IngestProgress {
  status: 'finished' | 'interrupted';
  rejectsFile: string | null;
  /** read minus the sum of the outcome counts: always 0 (the run fails loudly otherwise). */
  unaccounted: number;
  /** Columns not read, a missing id column (services/ingest/mapping.ts columnWarnings). */
  warnings: string[];
}

export async function ingestFile(options: IngestOptions): Promise<IngestSummary> {
  const format = formatOf(options.file, options.format);
  const totalBytes = statSync(options.file).size;
  const ctx = options.ctx ?? createRegisterContext(options.db);
  const batchSize = options.batchSize ?? 1000;
  const started = performance.now();
  const runId = await insertIngestRun(options.db, {
    source: options.source,
    inputName: options.file.split(/[\\/]/).pop() ?? options.file,
    actor: options.actor,
  });
  const counts = emptyCounts();
  const rejects = new RejectsWriter(options.rejectsFile);
  const stream = createReadStream(options.file);
  const progress = (): IngestProgress => ({ runId, counts: { ...counts }, bytesRead: stream.bytesRead, totalBytes, elapsedMs: performance.now() - started });
  const reject = (line: number, reason: string, raw: string): void => {
    counts.read++;
    counts.rejected++;
    rejects.write(line, reason, raw);
  };
  const warnings: string[] = [];
  const warn = (message: string): void => {
    warnings.push(message);
    options.onWarning?.(message);
  };
  let batch: { line: number; raw: string; mention: MentionInput; identity: string }[] = [];
  let seen = new Map<string, { line: number; raw: string }>();
  const flush = async (): Promise<void> => {
    if (batch.length === 0) return;
    // Resuming: rows stored before with the same content are counted with one query per batch instead of one
    // per row (the register would answer the same: already ingested, nothing done).
    const stored = await timed(options.stages, 'resume', () =>
      storedHashes(
        options.db,
        batch.map((b) => b.mention),
      ),
    );
    const fresh = batch.filter((b) => {
      const hash = stored.get(mentionKey(b.mention.source, b.mention.externalId));
      if (hash === undefined) return true;
      try {
        if (prepareMention(b.mention).contentHash !== hash) return true;
      } catch {
        return true; // the register names the problem
      }
      counts.read++;
      counts.already_ingested++;
      return false;
    });
    const results =
      fresh.length === 0
        ? []
        : await resolveBatch(
            ctx,
            fresh.map((b) => b.mention),
            { actor: options.actor, reason: `ingest run ${runId}` },
            { stages: options.stages },
          );
    results.forEach((result, i) => {
      const row = fresh[i]!;
      counts.read++;
      if (result.status === 'rejected') {
        counts.rejected++;
        rejects.write(row.line, 'error' in result ? result.error.message : 'rejected', row.raw);
      } else if (result.alreadyIngested) counts.already_ingested++;
      else counts[result.status] = (counts[result.status] ?? 0) + 1;
    });
    batch = [];
    seen = new Map();
    await timed(options.stages, 'record', () => updateIngestRunCounts(options.db, runId, counts));
    options.onProgress?.(progress());
  };
  let status: IngestSummary['status'] = 'finished';
  try {
    for await (const row of rowsOf(options.file, format, options.source, options.map ?? {}, stream, reject, warn)) {
      if (!row.result.ok) {
        reject(row.line, row.result.reason, row.raw);
        continue;
      }
      // Text PostgreSQL cannot store (NUL, a lone surrogate) would fail the whole batch's statement, and the
      // rerun at the same place: the row is refused by its line, as the job staging does.
      const unstorable = unstorableRowReason(row.result.mention);
      if (unstorable) {
        reject(row.line, unstorable, row.raw);
        continue;
      }
      const earlier = seen.get(row.result.identity);
      if (earlier) {
        // The same row twice in one batch: an exact repeat is already ingested; a different row with the same
        // external id cannot be both, so the later one is refused and named.
        if (earlier.raw === row.raw) {
          counts.read++;
          counts.already_ingested++;
        } else reject(row.line, `same external id as line ${earlier.line} with other content`, row.raw);
        continue;
      }
      seen.set(row.result.identity, { line: row.line, raw: row.raw });
      batch.push({ line: row.line, raw: row.raw, mention: row.result.mention, identity: row.result.identity });
      if (batch.length >= batchSize) {
        await flush();
        if (options.shouldStop?.()) {
          status = 'interrupted';
          break;
        }
      }
    }
    if (status === 'finished') await flush();
  } catch (error) {
    stream.destroy();
    await rejects.close();
    await finishIngestRun(options.db, runId, { status: 'failed', counts, error: (error as Error).message });
    throw error;
  }
  stream.destroy();
  await rejects.close();
  const gap = unaccounted(counts);
  await finishIngestRun(options.db, runId, { status, counts, error: gap === 0 ? null : `${gap} rows unaccounted` });
  if (gap !== 0) throw new Error(`ingest run ${runId}: ${gap} rows read but not accounted for (a defect: please report it)`);
  if (options.stages) {
    const timedMs = Object.values(options.stages).reduce((a, b) => a + b, 0);
    options.stages.file = Math.max(0, performance.now() - started - timedMs);
  }
  return {
    ...progress(),
    bytesRead: status === 'finished' ? totalBytes : stream.bytesRead,
    status,
    rejectsFile: rejects.written > 0 ? options.rejectsFile : null,
    unaccounted: gap,
    warnings,
  };
}
