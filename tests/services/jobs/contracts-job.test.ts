/**
 * A contracts job through pg-boss on PostgreSQL, its partitions taken by two job processes at once (as two
 * `cpreg worker`s would): the result reconciles, every partition is done by one of them, the customer that all the
 * contracts name is one counterparty (concurrent partitions create no duplicate), and the register verifies.
 * Documents are made by independent writers (tests/services/contract-files/support.ts: pdf-lib, `docx`, fflate).
 */
import { writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { expect, it } from 'vitest';
import { describePostgres, makeTempDir, openTestDatabase, removeTempDir } from '../../support/index.ts';
import { startJobs } from '../../../services/jobs/start-jobs.ts';
import { submitContractsJob } from '../../../services/jobs/submit-contracts.ts';
import { watchJob } from '../../../services/jobs/watch-job.ts';
import { verifyRegister } from '../../../services/verify/index.ts';
import { docxFile, inventedContract, pdfLibPdf, zipOf } from '../contract-files/support.ts';

const FAST_QUEUE = { retryLimit: 1, retryDelaySeconds: 0, pollingIntervalSeconds: 0.5, maintenanceIntervalSeconds: 2, expireInSeconds: 60 };
const SUPPLIERS = [
  'Quillmoor Fabrication Ltd',
  'Brindlecombe Tools Ltd',
  'Farrowdene Metals Ltd',
  'Marlowick Fasteners Ltd',
  'Ostrevale Castings Ltd',
  'Penderwyn Coatings Ltd',
  'Harrowgate Springs Ltd',
  'Kestlemoor Valves Ltd',
  'Ashcombe Gaskets Ltd',
  'Wrenfield Bearings Ltd',
  'Dunmarsh Pumps Ltd',
  'Calderholt Wire Ltd',
];

// pg-boss lives in PostgreSQL only: this suite has no embedded variant (reported as skipped without PostgreSQL).
describePostgres('contracts job through pg-boss [postgres]', () => {
  it('two job processes share the partitions; one counterparty for the customer all contracts name', { timeout: 180_000 }, async () => {
    const database = await openTestDatabase('postgres');
    const dir = makeTempDir('cpreg-contracts-job-');
    const a = await startJobs({
      db: database.db,
      backend: 'postgres',
      url: database.url!,
      work: true,
      concurrency: 2,
      queueOptions: FAST_QUEUE,
      worker: 'worker-a',
    });
    const b = await startJobs({
      db: database.db,
      backend: 'postgres',
      url: database.url!,
      work: true,
      concurrency: 2,
      queueOptions: FAST_QUEUE,
      worker: 'worker-b',
    });
    try {
      const entries: Record<string, Buffer> = {};
      for (const [i, supplier] of SUPPLIERS.entries()) {
        const text = inventedContract(supplier, 'Tessaline Trading GmbH');
        if (i % 3 === 0)
          entries[`c${i}.pdf`] = await pdfLibPdf(text); // pdf-lib
        else if (i % 3 === 1)
          entries[`c${i}.docx`] = await docxFile(text); // docx
        else entries[`c${i}.txt`] = Buffer.from(text);
      }
      const file = join(dir, 'upload.zip');
      writeFileSync(file, zipOf(entries)); // fflate
      const { jobId, staged } = await submitContractsJob(
        { db: database.db, queue: a.queue },
        { file, source: 'boss', actor: 'test', inputName: 'upload.zip', partitionSize: 2 },
      );
      await staged;
      const job = await watchJob(database.db, jobId, { pollMs: 200 });
      expect(job.status, String(job.error)).toBe('finished');
      const result = job.result as { files: Record<string, number>; partitions: number };
      expect(result.files).toEqual({ read: 12, imported: 12, new: 12, changed: 0, unchanged: 0, rejected: 0 });
      expect(result.partitions).toBe(6);
      const parts = await database.db.selectFrom('job_partition').select(['status', 'worker']).where('job_id', '=', jobId).execute();
      expect(parts.every((p) => p.status === 'done' && (p.worker === 'worker-a' || p.worker === 'worker-b'))).toBe(true);
      const customers = await database.db
        .selectFrom('counterparty')
        .select('id')
        .where('canonical_name', '=', 'Tessaline Trading GmbH')
        .where('status', '=', 'active')
        .execute();
      expect(customers).toHaveLength(1);
      const report = await verifyRegister(database.db);
      expect(report.checks.filter((c) => !c.ok)).toEqual([]);
    } finally {
      await a.stop();
      await b.stop();
      await database.close();
      removeTempDir(dir);
    }
  });
});
