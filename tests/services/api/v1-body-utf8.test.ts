/**
 * Issue 17 item 11: a JSON body whose bytes are not UTF-8 — a byte that begins nothing (0xFF), an overlong form
 * (C0 AF: "/" in two bytes), a sequence cut short (E2 82 before a quote), the CESU-8 bytes of a surrogate (ED A0
 * 80) — was decoded to U+FFFD and stored. It is refused with 400 BODY_NOT_UTF8 naming the byte offset where the
 * bad sequence begins, and nothing is stored; a JSON body declared in another charset answers 415. The byte
 * ranges are those of The Unicode Standard, Table 3-7 (well-formed UTF-8 byte sequences); the offsets below are
 * counted by hand from the bodies written out here.
 */
import { afterAll, beforeAll, expect, it } from 'vitest';
import { describeEachBackend } from '../../support/index.ts';
import { keyedApp, type KeyedApp } from './support.ts';

/** `{"source":"u8","externalId":"<id>","text":"Ab<bad>c"}`: the bad bytes start at a known offset. */
function mentionBody(id: string, bad: number[]): { payload: Buffer; offset: number } {
  const head = Buffer.from(`{"source":"u8","externalId":"${id}","text":"Ab`);
  return { payload: Buffer.concat([head, Buffer.from(bad), Buffer.from('c"}')]), offset: head.length };
}

const ILL_FORMED: [string, number[]][] = [
  ['0xFF', [0xff]],
  ['overlong "/" (C0 AF)', [0xc0, 0xaf]],
  ['overlong three-byte form (E0 80 AF)', [0xe0, 0x80, 0xaf]],
  ['truncated three-byte sequence (E2 82 then a letter)', [0xe2, 0x82, 0x41]],
  ['CESU-8 high surrogate U+D800 (ED A0 80)', [0xed, 0xa0, 0x80]],
  ['CESU-8 surrogate pair for U+1F600 (ED A0 BD ED B8 80)', [0xed, 0xa0, 0xbd, 0xed, 0xb8, 0x80]],
  ['beyond U+10FFFF (F4 90 80 80)', [0xf4, 0x90, 0x80, 0x80]],
  ['lone continuation byte (0x80)', [0x80]],
];

describeEachBackend('JSON bodies must be UTF-8', (t) => {
  let k: KeyedApp;
  const mentions = async (): Promise<number> =>
    Number(
      (
        await t
          .db()
          .selectFrom('mention')
          .select((eb) => eb.fn.countAll<number>().as('n'))
          .executeTakeFirstOrThrow()
      ).n,
    );
  beforeAll(async () => {
    k = await keyedApp(t.db(), t.backend);
  });
  afterAll(async () => {
    await k?.app.close();
  });

  it('refuses each ill-formed sequence with 400 BODY_NOT_UTF8 naming the byte offset, and stores nothing', async () => {
    const before = await mentions();
    for (const [i, [label, bad]] of ILL_FORMED.entries()) {
      const { payload, offset } = mentionBody(`m${i}`, bad);
      const res = await k.call('write', { method: 'POST', url: '/v1/mentions', payload, headers: { 'content-type': 'application/json' } });
      expect(res.statusCode, `${label}: ${res.body}`).toBe(400);
      expect(res.headers['content-type']).toMatch(/^application\/problem\+json/);
      const body = res.json() as { code: string; byteOffset: number; line: number; detail: string };
      expect(body.code, label).toBe('BODY_NOT_UTF8');
      expect(body.byteOffset, label).toBe(offset);
      expect(body.line).toBe(1);
      expect(body.detail).toContain(`byte offset ${offset}`);
    }
    expect(await mentions()).toBe(before);
  });

  it('still takes well-formed UTF-8 of every length (2, 3 and 4 bytes) and stores it as sent', async () => {
    const text = 'Ab\u00e9\u20ac\u{1F600}c Ltd';
    const res = await k.call('write', {
      method: 'POST',
      url: '/v1/mentions',
      payload: Buffer.from(JSON.stringify({ source: 'u8', externalId: 'good', text })),
      headers: { 'content-type': 'application/json; charset=UTF-8' },
    });
    expect(res.statusCode, res.body).toBe(200);
    const read = await k.call('read', { method: 'GET', url: `/v1/mentions/${(res.json() as { mentionId: number }).mentionId}` });
    expect((read.json() as { text: string }).text).toBe(text);
  });

  it('refuses a JSON body declared in another charset with 415 pointing at the header', async () => {
    const before = await mentions();
    for (const charset of ['latin1', 'ISO-8859-1', '"windows-1252"', 'utf-16']) {
      const res = await k.call('write', {
        method: 'POST',
        url: '/v1/mentions',
        payload: JSON.stringify({ source: 'u8', externalId: 'cs', text: 'Plain Ltd' }),
        headers: { 'content-type': `application/json; charset=${charset}` },
      });
      expect(res.statusCode, `${charset}: ${res.body}`).toBe(415);
      const body = res.json() as { code: string; errors: { pointer: string; in: string }[]; detail: string };
      expect(body.code).toBe('UNSUPPORTED_MEDIA_TYPE');
      expect(body.errors[0]).toMatchObject({ pointer: '/content-type', in: 'header' });
      expect(body.detail).not.toContain(charset.replaceAll('"', ''));
    }
    expect(await mentions()).toBe(before);
  });

  it('refuses an NDJSON batch with an ill-formed line, naming its line and byte offset', async () => {
    const lines = [
      JSON.stringify({ source: 'u8', externalId: 'b1', text: 'Firstline Ltd' }),
      JSON.stringify({ source: 'u8', externalId: 'b2', text: 'Second' }),
    ];
    const bad = Buffer.concat([Buffer.from(`${lines[0]}\n${lines[1]!.slice(0, 40)}`), Buffer.from([0xff]), Buffer.from(`${lines[1]!.slice(40)}\n`)]);
    const before = await mentions();
    const res = await k.call('write', { method: 'POST', url: '/v1/mentions/batch', payload: bad, headers: { 'content-type': 'application/x-ndjson' } });
    expect(res.statusCode, res.body).toBe(400);
    const body = res.json() as { code: string; byteOffset: number; line: number };
    expect(body).toMatchObject({ code: 'BODY_NOT_UTF8', line: 2, byteOffset: lines[0]!.length + 1 + 40 });
    expect(await mentions()).toBe(before);
  });
});
