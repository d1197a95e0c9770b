/**
 * Hostile archives through the contract upload route (POST /v1/jobs/contracts), on each backend: what the route
 * answers at once is walked by the matrix of hostile-input.test.ts; this file follows the job to its end, because
 * an archive is read after the 202. An entry whose name holds a NUL (a "zip slip" kind of name, APPNOTE 4.4.17
 * allows any bytes) is refused as unsafe_path while the rest of the archive is imported: its raw name once went
 * into the job's stored result, which PostgreSQL jsonb cannot hold, and the whole upload failed ("unsupported Unicode
 * escape sequence"), so a file could never be imported. An entry marked UTF-8 whose name bytes are not UTF-8 is
 * refused too: its name was stored with U+FFFD as the contract's external id. The contract text is invented (tests/services/contract-files/support.ts).
 */
import { afterAll, beforeAll, expect, it } from 'vitest';
import { describeEachBackend } from '../support/index.ts';
import { zipSync } from 'fflate';
import { inventedContract, zipOf } from '../services/contract-files/support.ts';
import { keyedApp, type KeyedApp } from '../services/api/support.ts';

describeEachBackend('hostile archives through the contract upload route', (t) => {
  let k: KeyedApp;
  beforeAll(async () => {
    k = await keyedApp(t.db(), t.backend);
  });
  afterAll(async () => k?.app.close());

  async function finished(id: number): Promise<Record<string, any>> {
    for (let i = 0; i < 600; i++) {
      const job = (await k.call('read', { method: 'GET', url: `/v1/jobs/${id}` })).json();
      if (job.status === 'finished' || job.status === 'failed') return job;
      await new Promise((r) => setTimeout(r, 100));
    }
    throw new Error(`job ${id} did not finish`);
  }

  it('an entry named with a NUL or another control character is refused by name; the rest of the archive is imported', async () => {
    const archive = zipOf({
      'nul\u0000name.txt': Buffer.from(inventedContract('Ashcombe Rivets Ltd')),
      // A non-ASCII letter makes fflate set the UTF-8 flag (APPNOTE 4.4.4 bit 11): without it the name is read as
      // code page 437, where byte 0x07 is the bullet "•", a printable character.
      'bell\u0007nämé.txt': Buffer.from(inventedContract('Ashcombe Rivets Ltd')),
      'good/supply.txt': Buffer.from(inventedContract('Pellinore Castings Ltd')),
    });
    const res = await k.call('write', {
      method: 'POST',
      url: '/v1/jobs/contracts?source=hostile-names',
      payload: archive,
      headers: { 'content-type': 'application/zip' },
    });
    expect(res.statusCode, res.body).toBe(202);
    const job = await finished(res.json().id);
    expect(job.status, JSON.stringify(job.error)).toBe('finished');
    expect(job.result.files).toMatchObject({ read: 3, imported: 1, rejected: 2 });
    expect(job.result.rejectedBy).toEqual({ unsafe_path: 2 });
    // Shown with the control character written out (\x00), so the reject can be stored and read.
    expect(job.result.rejected.map((r: { path: string }) => r.path).sort()).toEqual(['bell\\x07nämé.txt', 'nul\\x00name.txt']);
    expect(job.result.contracts.map((c: { path: string }) => c.path)).toEqual(['good/supply.txt']);
    const stored = await k.call('read', { method: 'GET', url: '/v1/contracts?source=hostile-names' });
    expect(stored.json().items.map((c: { externalId: string }) => c.externalId)).toEqual(['good/supply.txt']);
  });

  it('an entry marked UTF-8 whose name bytes are not UTF-8 is refused by name, never stored with U+FFFD', async () => {
    // Stored (level 0) so that the name bytes are the only place "é" (C3 A9) occurs; each is made FF FE, bytes that
    // begin no UTF-8 sequence (Unicode Table 3-7), in the local header and the central directory of both entries.
    const text = Buffer.from(inventedContract('Wendover Gaskets Ltd'));
    const archive = Buffer.from(zipSync({ 'caf\u00e9-1.txt': text, 'caf\u00e9-2.txt': text, 'plain.txt': text }, { level: 0 }));
    let patched = 0;
    for (let i = 0; i + 1 < archive.length; i++) {
      if (archive[i] === 0xc3 && archive[i + 1] === 0xa9) {
        archive[i] = 0xff;
        archive[i + 1] = 0xfe;
        patched++;
      }
    }
    expect(patched).toBe(4);
    const res = await k.call('write', {
      method: 'POST',
      url: '/v1/jobs/contracts?source=hostile-utf8',
      payload: archive,
      headers: { 'content-type': 'application/zip' },
    });
    expect(res.statusCode, res.body).toBe(202);
    const job = await finished(res.json().id);
    expect(job.status, JSON.stringify(job.error)).toBe('finished');
    expect(job.result.files).toMatchObject({ read: 3, imported: 1, rejected: 2 });
    expect(job.result.rejectedBy).toEqual({ unsafe_path: 2 });
    expect(job.result.contracts.map((c: { path: string }) => c.path)).toEqual(['plain.txt']);
    const stored = await k.call('read', { method: 'GET', url: '/v1/contracts?source=hostile-utf8' });
    expect(stored.json().items.map((c: { externalId: string }) => c.externalId)).toEqual(['plain.txt']);
  });
});
