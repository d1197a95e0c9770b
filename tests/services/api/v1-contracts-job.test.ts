/**
 * POST /v1/jobs/contracts on each backend: a zip made by fflate of documents made by independent writers
 * (tests/services/contract-files/support.ts: pdf-lib, `docx`) is imported as a partitioned job, as application/zip
 * and as multipart/form-data; GET /v1/jobs/{id} shows it staged, stored and finished with counts that reconcile;
 * a body that is no zip is 422 ARCHIVE_REFUSED and an upload over 100 MiB is 413.
 */
import { afterAll, beforeAll, expect, it } from 'vitest';
import { describeEachBackend } from '../../support/database.ts';
import { docxFile, imageOnlyPdf, inventedContract, pdfLibPdf, zipOf } from '../contract-files/support.ts';
import { keyedApp, type KeyedApp } from './support.ts';
import { CONTRACTS_UPLOAD_LIMIT } from '../../../services/api/routes/v1/contracts-job.ts';

describeEachBackend('POST /v1/jobs/contracts', (ctx) => {
  let k: KeyedApp;
  let archive: Buffer;
  beforeAll(async () => {
    k = await keyedApp(ctx.db(), ctx.backend);
    archive = zipOf({
      'signed/supply.pdf': await pdfLibPdf(inventedContract()), // pdf-lib
      'signed/service.docx': await docxFile(inventedContract('Brindlecombe Tools Ltd', 'Tessaline Trading GmbH')), // docx
      'signed/hinges.txt': Buffer.from(inventedContract('Farrowdene Metals Ltd', 'Tessaline Trading GmbH', 'stainless hinges')),
      'signed/scan.pdf': await imageOnlyPdf(), // pdf-lib
      '../outside.txt': Buffer.from(inventedContract()),
    });
  });
  afterAll(async () => k.app.close());

  async function finished(id: number): Promise<Record<string, any>> {
    for (let i = 0; i < 600; i++) {
      const res = await k.call('read', { method: 'GET', url: `/v1/jobs/${id}` });
      const job = res.json();
      if (job.status === 'finished' || job.status === 'failed') return job;
      await new Promise((r) => setTimeout(r, 100));
    }
    throw new Error(`job ${id} did not finish`);
  }

  it('imports a zip body as a partitioned job whose result reconciles and lists contracts and rejects', async () => {
    const res = await k.call('write', {
      method: 'POST',
      url: '/v1/jobs/contracts?source=upload&partitionSize=2',
      payload: archive,
      headers: { 'content-type': 'application/zip' },
    });
    expect(res.statusCode).toBe(202);
    const accepted = res.json();
    expect(accepted).toMatchObject({ kind: 'contracts', params: { source: 'upload', partitioned: true, partitionSize: 2 } });
    expect(res.headers.location).toBe(`/v1/jobs/${accepted.id}`);
    const job = await finished(accepted.id);
    expect(job.status).toBe('finished');
    expect(job.partitions).toMatchObject({ total: 2, done: 2, fractionDone: 1 });
    expect(job.result.files).toEqual({ read: 5, imported: 3, new: 3, changed: 0, unchanged: 0, rejected: 2 });
    expect(job.result.rejectedBy).toEqual({ no_text_layer: 1, unsafe_path: 1 });
    expect(job.result.rejected.map((r: { path: string }) => r.path).sort()).toEqual(['../outside.txt', 'signed/scan.pdf']);
    const paths = job.result.contracts.map((c: { path: string }) => c.path).sort();
    expect(paths).toEqual(['signed/hinges.txt', 'signed/service.docx', 'signed/supply.pdf']);
    // The customer named in all three is one counterparty.
    const customers = job.result.contracts.flatMap((c: { parties: { name: string; counterpartyId: number }[] }) =>
      c.parties.filter((p) => p.name === 'Tessaline Trading GmbH').map((p) => p.counterpartyId),
    );
    expect(customers).toHaveLength(3);
    expect(new Set(customers).size).toBe(1);
    const stored = await k.call('read', { method: 'GET', url: '/v1/contracts?source=upload&externalId=signed/supply.pdf' });
    expect(stored.json().items).toHaveLength(1);
  });

  it('the same files as multipart/form-data are unchanged', async () => {
    const boundary = 'cpregtestboundary';
    const body = Buffer.concat([
      Buffer.from(`--${boundary}\r\nContent-Disposition: form-data; name="archive"; filename="again.zip"\r\nContent-Type: application/zip\r\n\r\n`),
      archive,
      Buffer.from(`\r\n--${boundary}--\r\n`),
    ]);
    const res = await k.call('write', {
      method: 'POST',
      url: '/v1/jobs/contracts?source=upload',
      payload: body,
      headers: { 'content-type': `multipart/form-data; boundary=${boundary}` },
    });
    expect(res.statusCode).toBe(202);
    expect(res.json().params.input).toBe('again.zip');
    const job = await finished(res.json().id);
    expect(job.result.files).toEqual({ read: 5, imported: 0, new: 0, changed: 0, unchanged: 3, rejected: 2 });
  });

  it('takes documents as the file parts of a multipart upload, each named by its file name', async () => {
    const boundary = 'cpregtestfiles';
    const part = (name: string, type: string, content: Buffer) => [
      Buffer.from(`--${boundary}\r\nContent-Disposition: form-data; name="files"; filename="${name}"\r\nContent-Type: ${type}\r\n\r\n`),
      content,
      Buffer.from('\r\n'),
    ];
    const body = Buffer.concat([
      ...part('bolts.pdf', 'application/pdf', await pdfLibPdf(inventedContract('Marlowick Fasteners Ltd'))), // pdf-lib
      ...part('../../nuts.txt', 'text/plain', Buffer.from(inventedContract('Ostrevale Nuts Ltd'))),
      Buffer.from(`--${boundary}--\r\n`),
    ]);
    const res = await k.call('write', {
      method: 'POST',
      url: '/v1/jobs/contracts?source=parts',
      payload: body,
      headers: { 'content-type': `multipart/form-data; boundary=${boundary}` },
    });
    expect(res.statusCode).toBe(202);
    const job = await finished(res.json().id);
    expect(job.result.files).toEqual({ read: 2, imported: 2, new: 2, changed: 0, unchanged: 0, rejected: 0 });
    // A client's path in a file name is cut to the name: nothing is written outside the upload folder.
    expect(job.result.contracts.map((c: { path: string }) => c.path).sort()).toEqual(['bolts.pdf', 'nuts.txt']);
  });

  it('answers a retry with the same Idempotency-Key and upload with the first job; another upload under that key is 422', async () => {
    const small = zipOf({ 'retry/hinges.txt': Buffer.from(inventedContract('Calderholt Wire Ltd')) });
    const headers = { 'content-type': 'application/zip', 'idempotency-key': 'contracts-upload-0001' };
    const first = await k.call('write', { method: 'POST', url: '/v1/jobs/contracts?source=retry', payload: small, headers });
    expect(first.statusCode).toBe(202);
    const again = await k.call('write', { method: 'POST', url: '/v1/jobs/contracts?source=retry', payload: small, headers });
    expect(again.statusCode).toBe(202);
    expect(again.headers['idempotent-replayed']).toBe('true');
    expect(again.json().id).toBe(first.json().id);
    const other = await k.call('write', { method: 'POST', url: '/v1/jobs/contracts?source=retry', payload: archive, headers });
    expect(other.statusCode).toBe(422);
    expect(other.json().code).toBe('IDEMPOTENCY_KEY_REUSED');
    expect((await finished(first.json().id)).result.files.imported).toBe(1);
  });

  it('refuses a body that is no zip (422 ARCHIVE_REFUSED), an upload over 100 MiB (413), and a read-only key (403)', async () => {
    const notZip = await k.call('write', {
      method: 'POST',
      url: '/v1/jobs/contracts',
      payload: await pdfLibPdf(inventedContract()),
      headers: { 'content-type': 'application/zip' },
    });
    expect(notZip.statusCode).toBe(422);
    expect(notZip.json()).toMatchObject({ code: 'ARCHIVE_REFUSED', detail: expect.stringContaining('not a zip archive') });
    const big = await k.call('write', {
      method: 'POST',
      url: '/v1/jobs/contracts',
      payload: Buffer.alloc(CONTRACTS_UPLOAD_LIMIT + 1024 * 1024),
      headers: { 'content-type': 'application/zip' },
    });
    expect(big.statusCode).toBe(413);
    expect(big.json()).toMatchObject({ code: 'PAYLOAD_TOO_LARGE', limitBytes: CONTRACTS_UPLOAD_LIMIT });
    const readOnly = await k.call('read', { method: 'POST', url: '/v1/jobs/contracts', payload: archive, headers: { 'content-type': 'application/zip' } });
    expect(readOnly.statusCode).toBe(403);
  });
});
