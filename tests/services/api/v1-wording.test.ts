/**
 * What the API shows a person, in our own words (issue 19 item 6): the reason a mention waits for review names the
 * thresholds in words, not by their field names (`newAt`, `linkAt`); the score is called the match score everywhere
 * in the API description; its examples use invented identifiers that pass our own validators; /docs labels HTTP
 * methods plainly, one look for every method. Invented names.
 */
import { afterAll, beforeAll, expect, it } from 'vitest';
import { isValidLei } from '../../../resolvers/identifiers/index.ts';
import { describeEachBackend } from '../../support/database.ts';
import { keyedApp, type KeyedApp } from './support.ts';

/** Every value under a key named `key` anywhere in the document. */
function valuesOf(node: unknown, key: string, out: unknown[] = []): unknown[] {
  if (Array.isArray(node)) for (const item of node) valuesOf(item, key, out);
  else if (node && typeof node === 'object') {
    for (const [k, v] of Object.entries(node)) {
      if (k === key) out.push(v);
      valuesOf(v, key, out);
    }
  }
  return out;
}

describeEachBackend('/v1 wording', (ctx) => {
  let k: KeyedApp;
  beforeAll(async () => {
    k = await keyedApp(ctx.db(), ctx.backend);
  });
  afterAll(async () => {
    await k?.app.close();
  });

  it('a mention that waits for a person says so in words: between the new-record threshold and the link threshold', async () => {
    const created = await k.call('admin', {
      method: 'POST',
      url: '/v1/counterparties',
      payload: { name: 'Harnwick Tillage Supplies Ltd', jurisdiction: 'GB' },
    });
    expect(created.statusCode, created.body).toBe(201);
    const res = await k.call('write', {
      method: 'POST',
      url: '/v1/mentions',
      payload: { source: 'wording', externalId: 'w1', text: 'Harnwick Tillage Supplies' },
    });
    expect(res.statusCode, res.body).toBeLessThan(300);
    const mention = res.json() as { status: string; explanation: { summary: string } };
    expect(mention.status, res.body).toBe('review');
    expect(mention.explanation.summary).toMatch(/between the new-record threshold \([-\d.]+\) and the link threshold \([-\d.]+\): a person decides/);
    expect(mention.explanation.summary).not.toMatch(/\b(newAt|linkAt)\b/);
  });

  it('the API description calls the score the match score, and its LEI examples are valid (ISO 17442, MOD 97-10)', async () => {
    const res = await k.app.inject({ method: 'GET', url: '/openapi.json' });
    expect(res.statusCode).toBe(200);
    expect(res.body).not.toMatch(/match weight/i);
    expect(res.body).toMatch(/match score/);
    const leis = valuesOf(res.json(), 'example')
      .flatMap((e) => valuesOf({ e }, 'value').concat([e]))
      .filter((v): v is { scheme: string; value: string } => typeof v === 'object' && v !== null && (v as { scheme?: unknown }).scheme === 'lei')
      .map((v) => v.value);
    expect(leis.length).toBeGreaterThan(0);
    for (const lei of leis) expect(isValidLei(lei), lei).toBe(true);
  });

  it('/docs labels HTTP methods plainly: one style for every method, no colour per method', async () => {
    const res = await k.app.inject({ method: 'GET', url: '/docs' });
    expect(res.statusCode).toBe(200);
    expect(res.body).not.toMatch(/\.m-(get|post|put|patch|delete)\b/);
    expect(res.body).toContain("el('span', { 'class': 'method', text: method })");
    const methodRule = /\.method \{([^}]*)\}/.exec(res.body)?.[1] ?? '';
    expect(methodRule).not.toMatch(/background/);
  });
});
