import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { FastifyInstance } from 'fastify';
import { buildApp } from '../../../services/api/app.ts';
import { isOpenRoute, OPEN_ROUTES } from '../../../services/api/open-routes.ts';
import { ERROR_CATALOGUE } from '../../../services/api/errors.ts';
import { renderCatalogue } from '../../../services/api/errors-page.ts';
import { openTestDatabase, type TestDatabase } from '../../support/database.ts';

/** Every $ref in the document, to check that each resolves inside it. */
function collectRefs(value: unknown, out: string[] = []): string[] {
  if (Array.isArray(value)) for (const item of value) collectRefs(item, out);
  else if (value && typeof value === 'object') {
    for (const [key, item] of Object.entries(value)) {
      if (key === '$ref' && typeof item === 'string') out.push(item);
      else collectRefs(item, out);
    }
  }
  return out;
}

describe('the API description', () => {
  let database: TestDatabase;
  let app: FastifyInstance;
  beforeAll(async () => {
    database = await openTestDatabase('pglite');
    app = await buildApp({ db: database.db, backend: 'pglite' });
  });
  afterAll(async () => {
    await app?.close();
    await database?.close();
  });

  it('GET /openapi.json is an OpenAPI 3 document whose references all resolve', async () => {
    const res = await app.inject({ method: 'GET', url: '/openapi.json' });
    expect(res.statusCode).toBe(200);
    const spec = res.json();
    // Required top-level members of an OpenAPI 3.0 document (OpenAPI Specification 3.0.3, section 4.7.1).
    expect(spec.openapi).toMatch(/^3\.\d+\.\d+$/);
    expect(spec.info).toMatchObject({ title: 'cpreg', version: expect.any(String) });
    expect(typeof spec.paths).toBe('object');
    expect(spec.paths['/healthz'].get.responses['200']).toBeDefined();
    expect(spec.paths['/healthz'].get.responses['503']).toBeDefined();
    expect(spec.components.schemas.Problem.required).toEqual(['type', 'title', 'status', 'detail', 'code']);
    for (const [path, item] of Object.entries<Record<string, { responses?: object }>>(spec.paths)) {
      expect(path.startsWith('/')).toBe(true);
      for (const operation of Object.values(item)) expect(operation.responses).toBeDefined();
    }
    for (const ref of collectRefs(spec)) {
      expect(ref).toMatch(/^#\/components\/schemas\//);
      expect(spec.components.schemas[ref.slice('#/components/schemas/'.length)]).toBeDefined();
    }
  });

  it('GET /docs is a self-contained HTML page that browses /openapi.json', async () => {
    const res = await app.inject({ method: 'GET', url: '/docs' });
    expect(res.statusCode).toBe(200);
    expect(res.headers['content-type']).toMatch(/^text\/html/);
    expect(res.body).toContain("fetch('openapi.json')");
    // Nothing is loaded from elsewhere: no absolute URLs in the page.
    expect(res.body).not.toMatch(/https?:\/\//);
    expect(res.headers['content-security-policy']).toContain("default-src 'none'");
    // The inline script at least parses (a browser run belongs to the console's tests).
    const script = /<script>([\s\S]*?)<\/script>/.exec(res.body)?.[1];
    expect(script).toBeDefined();
    expect(() => new Function(script!)).not.toThrow();
  });

  it('/docs links to the error catalogue the service serves itself, one section per code, without a key (issue 19 item 4)', async () => {
    const docs = await app.inject({ method: 'GET', url: '/docs' });
    expect(docs.body).toContain('<a href="/docs/errors">');
    const page = await app.inject({ method: 'GET', url: '/docs/errors' });
    expect(page.statusCode).toBe(200);
    expect(page.headers['content-type']).toBe('text/html; charset=utf-8');
    for (const code of Object.keys(ERROR_CATALOGUE)) expect(page.body, code).toContain(`<h2 id="${code}">${code}</h2>`);
    expect((app.swagger() as { info: { description: string } }).info.description).toContain('/docs/errors');
  });
});

describe('the error catalogue page', () => {
  it('renders headings, lists, code and paragraphs, and escapes everything else', () => {
    const html = renderCatalogue('# Errors\n\nText with `<b>` and <i>.\n\n- one\n  more\n- two\n\n```json\n{"a": "<x>"}\n```\n\n## NOT_FOUND\n\nStatus 404.');
    expect(html).toBe(
      '<h1>Errors</h1>\n<p>Text with <code>&lt;b&gt;</code> and &lt;i&gt;.</p>\n<ul><li>one more</li><li>two</li></ul>\n' +
        '<pre>{&quot;a&quot;: &quot;&lt;x&gt;&quot;}</pre>\n<h2 id="NOT_FOUND">NOT_FOUND</h2>\n<p>Status 404.</p>',
    );
  });
});

describe('open routes', () => {
  it('are exactly the health check, the API description, its error catalogue and the console', () => {
    expect(OPEN_ROUTES).toEqual(['/healthz', '/openapi.json', '/docs', '/docs/errors', '/console', '/console/*']);
    expect(isOpenRoute('/healthz')).toBe(true);
    expect(isOpenRoute('/docs?x=1')).toBe(true);
    expect(isOpenRoute('/console/app.js')).toBe(true);
    expect(isOpenRoute('/v1/counterparties')).toBe(false);
    expect(isOpenRoute('/healthz/extra')).toBe(false);
    expect(isOpenRoute('/consoles')).toBe(false);
  });
});
