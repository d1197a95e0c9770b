/**
 * Issue 17, job submissions: POST /v1/jobs/ingest and /v1/jobs/contracts with an Idempotency-Key store their 202
 * answer in the transaction that creates the job. A process that dies after that (while it reads the upload, or
 * before it answers) leaves that answer behind, so a retry is answered with the same job instead of a second one.
 * Before, such a claim had no answer and no stamp: ten minutes later the retry took it over and made a second job.
 * The dead process is reproduced by calling the submission as the route does and stopping before the route's own
 * answer (the queue "dies" on its first send), then ageing the claim. Names are invented.
 */
import { createHash } from 'node:crypto';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, expect, it } from 'vitest';
import { describeEachBackend } from '../../support/database.ts';
import { ABANDONED_AFTER_MS, claimIdempotencyKey } from '../../../services/api/auth/idempotency.ts';
import { answerJobCreated } from '../../../services/api/routes/v1/answer-job-created.ts';
import { submitIngestJob } from '../../../services/jobs/submit-ingest.ts';
import { submitContractsJob } from '../../../services/jobs/submit-contracts.ts';
import type { JobQueue } from '../../../db/job-queue.ts';
import { inventedContract, zipOf } from '../contract-files/support.ts';
import { keyedApp, type KeyedApp } from './support.ts';

/** A queue whose process stops at its first send: nothing after it in the submission runs. */
const dyingQueue = { kind: 'in-process', send: async () => Promise.reject(new Error('the process stopped here')) } as unknown as JobQueue;

describeEachBackend('idempotency: a job submission whose answer was lost', (t) => {
  let k: KeyedApp;
  let dir: string;
  beforeAll(async () => {
    k = await keyedApp(t.db(), t.backend);
    dir = mkdtempSync(join(tmpdir(), 'cpreg-lost-job-'));
  });
  afterAll(async () => {
    await k?.app.close();
    rmSync(dir, { recursive: true, force: true });
  });

  /** The write key's id, as the idempotency claim names it (the secret is cpreg_<id>_<random>). */
  const writeKeyId = (): string => k.keys.write.split('_')[1]!;
  const jobCount = async (): Promise<number> =>
    Number(
      (
        await t
          .db()
          .selectFrom('job')
          .select((eb) => eb.fn.countAll<number>().as('n'))
          .executeTakeFirstOrThrow()
      ).n,
    );
  const age = (key: string) =>
    t
      .db()
      .updateTable('idempotency_record')
      .set({ created_at: new Date(Date.now() - ABANDONED_AFTER_MS - 60_000) })
      .where('idempotency_key', '=', key)
      .execute();

  it('POST /v1/jobs/ingest: the retry gets the same job, and no second job is made', async () => {
    const body = `${JSON.stringify({ externalId: 'lost-1', text: 'Harrowgate Lanterns Ltd' })}\n`;
    const url = '/v1/jobs/ingest?source=lostanswer';
    const claim = { keyId: writeKeyId(), key: 'lost-job-ingest-1' };
    const hash = createHash('sha256').update(body).digest('hex'); // as the route hashes the upload
    expect((await claimIdempotencyKey(t.db(), { ...claim, method: 'POST', path: url, hash })).kind).toBe('claimed');
    const file = join(dir, 'upload.ndjson');
    writeFileSync(file, body);
    await expect(
      submitIngestJob(
        { db: t.db(), queue: dyingQueue },
        { file, format: 'ndjson', source: 'lostanswer', actor: 'test', inputName: 'upload', onJobCreated: answerJobCreated(claim) },
      ),
    ).rejects.toThrow('the process stopped here');
    const made = await t.db().selectFrom('job').select('id').orderBy('id', 'desc').executeTakeFirstOrThrow();
    await age(claim.key);
    const before = await jobCount();

    const retry = await k.call('write', {
      method: 'POST',
      url,
      payload: body,
      headers: { 'content-type': 'application/x-ndjson', 'idempotency-key': claim.key },
    });
    expect(retry.statusCode, retry.body).toBe(202);
    expect(retry.headers['idempotent-replayed']).toBe('true');
    expect(retry.json().id).toBe(Number(made.id));
    expect(retry.headers.location).toBe(`/v1/jobs/${Number(made.id)}`);
    expect(await jobCount()).toBe(before);
  });

  it('POST /v1/jobs/contracts: the retry gets the same job, and no second job is made', async () => {
    const zip = zipOf({ 'lost/hinges.txt': Buffer.from(inventedContract('Calderholt Wire Ltd')) });
    const url = '/v1/jobs/contracts?source=lostanswer';
    const claim = { keyId: writeKeyId(), key: 'lost-job-contracts-1' };
    // As the route hashes a zip body: its kind, then the bytes.
    const hash = createHash('sha256').update(`POST ${url} zip\u0000`).update(zip).digest('hex');
    expect((await claimIdempotencyKey(t.db(), { ...claim, method: 'POST', path: url, hash })).kind).toBe('claimed');
    const file = join(dir, 'upload.zip');
    writeFileSync(file, zip);
    const submitted = await submitContractsJob(
      { db: t.db(), queue: dyingQueue },
      { file, source: 'lostanswer', actor: 'test', inputName: 'upload.zip', onJobCreated: answerJobCreated(claim) },
    );
    await submitted.staged; // staging stops at the dying queue; the route never answered
    await age(claim.key);
    const before = await jobCount();

    const retry = await k.call('write', { method: 'POST', url, payload: zip, headers: { 'content-type': 'application/zip', 'idempotency-key': claim.key } });
    expect(retry.statusCode, retry.body).toBe(202);
    expect(retry.headers['idempotent-replayed']).toBe('true');
    expect(retry.json().id).toBe(submitted.jobId);
    expect(await jobCount()).toBe(before);
  });

  it('a submission that fails in this process gives its key back: the retry submits again', async () => {
    const url = '/v1/jobs/contracts?source=lostanswer';
    const headers = { 'content-type': 'application/zip', 'idempotency-key': 'lost-job-refused-1' };
    const refused = await k.call('write', { method: 'POST', url, payload: Buffer.from('not a zip at all'), headers });
    expect(refused.statusCode).toBe(422);
    expect(
      await t.db().selectFrom('idempotency_record').select('key_id').where('idempotency_key', '=', 'lost-job-refused-1').executeTakeFirst(),
    ).toBeUndefined();
  });
});
