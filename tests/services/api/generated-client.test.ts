/**
 * Issue 19 item 4, a generated client works: every operation of the served /openapi.json has an operationId of our
 * own (services/api/operation-ids.ts), unique, and a typed client generated from the served document by
 * general-purpose tools from the registry (openapi-typescript for the types, openapi-fetch for the calls) compiles
 * under strict TypeScript and runs one contract system's flow against buildApp listening on an ephemeral port:
 * key → contract → mention → counterparty → review item. Invented names.
 */
import { execFileSync } from 'node:child_process';
import { mkdirSync, rmSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { pathToFileURL } from 'node:url';
import type { FastifyInstance } from 'fastify';
import openapiTS, { astToString } from 'openapi-typescript';
import { afterAll, beforeAll, expect, it } from 'vitest';
import { buildApp } from '../../../services/api/app.ts';
import { createApiKey } from '../../../services/api/auth/keys.ts';
import { OPERATION_IDS } from '../../../services/api/operation-ids.ts';
import { REPO_ROOT } from '../../support/cli.ts';
import { describeEachBackend } from '../../support/database.ts';

type OpenApi = { paths: Record<string, Record<string, { operationId?: string }>> };

// Inside the repository (test-output/ is ignored by git), so that the flow resolves openapi-fetch from node_modules.
const OUT = join(REPO_ROOT, 'test-output', `generated-client-${process.pid}`);

/** The flow a contract system writes against the generated types: every call and answer is typed by them. */
const FLOW = `import createClient from 'openapi-fetch';
import type { operations, paths } from './api.ts';

type Decision = operations['decideReviewItem']['requestBody'] extends { content: { 'application/json': infer B } } ? B : never;

function must<T>(answer: { data?: T; error?: unknown; response: Response }, what: string): T {
  if (answer.data === undefined) throw new Error(\`\${what}: \${answer.response.status} \${JSON.stringify(answer.error)}\`);
  return answer.data;
}

export async function flow(baseUrl: string, adminKey: string) {
  const admin = createClient<paths>({ baseUrl, headers: { authorization: \`Bearer \${adminKey}\` } });
  const key = must(await admin.POST('/v1/keys', { body: { scope: 'write', label: 'contract system (write key)' } }), 'createKey');
  const system = createClient<paths>({ baseUrl, headers: { authorization: \`Bearer \${key.secret}\` } });
  const text = 'This Services Agreement is made between Hartsell Cold Chain Limited, a company incorporated in England (the "Provider"), and Dallowmere Foods Ltd (the "Client").';
  const contract = must(await system.POST('/v1/contracts', { body: { source: 'clm', externalId: 'G-1', text } }), 'storeContract');
  const mention = must(await system.POST('/v1/mentions', { body: { source: 'queue', externalId: 'g-1', text: 'Hartsell Cold Chain' } }), 'resolveMention');
  const read = must(await system.GET('/v1/mentions/{id}', { params: { path: { id: mention.mentionId } } }), 'readMention');
  // The response schemas declare the fields always present as required: the generated types do not make them
  // optional. Each annotation below is a check: it does not compile when the field's type is number | undefined.
  const mentionId: number = mention.mentionId;
  const status: string = read.status;
  const provider = contract.parties.find((p) => p.role === 'Provider');
  const counterparty = must(await system.GET('/v1/counterparties/{id}', { params: { path: { id: provider?.counterpartyId ?? 0 } } }), 'readCounterparty');
  const canonicalName: string = counterparty.canonicalName;
  const counterpartyId: number = counterparty.id;
  const item = must(await system.GET('/v1/review-items/{id}', { params: { path: { id: read.reviewItemId ?? 0 } } }), 'readReviewItem');
  const decision: Decision = { decision: 'same', reason: 'the same provider' };
  const decided = must(await admin.POST('/v1/review-items/{id}/decision', { params: { path: { id: item.id } }, body: decision }), 'decideReviewItem');
  void mentionId;
  void status;
  return { key: key.scope, mention: mention.status, reviewItemId: read.reviewItemId, counterparty: canonicalName, counterpartyId, item: item.status, decided };
}
`;

describeEachBackend('a client generated from /openapi.json', (ctx) => {
  let app: FastifyInstance;
  let baseUrl: string;
  let doc: OpenApi;
  beforeAll(async () => {
    app = await buildApp({ db: ctx.db(), backend: ctx.backend, rateLimitPerMinute: false });
    baseUrl = await app.listen({ port: 0, host: '127.0.0.1' });
    doc = (await (await fetch(`${baseUrl}/openapi.json`)).json()) as OpenApi;
  });
  afterAll(async () => {
    await app?.close();
    rmSync(OUT, { recursive: true, force: true });
  });

  it('gives every operation an operationId of our own, unique, and uses every entry of the list', () => {
    const ids: string[] = [];
    const missing: string[] = [];
    for (const [path, operations] of Object.entries(doc.paths)) {
      for (const [method, operation] of Object.entries(operations)) {
        if (operation.operationId === undefined) missing.push(`${method.toUpperCase()} ${path}`);
        else ids.push(operation.operationId);
      }
    }
    expect(missing).toEqual([]);
    expect(ids.length).toBeGreaterThanOrEqual(42); // the issue counted 42 operations
    expect(new Set(ids).size).toBe(ids.length);
    for (const id of ids) expect(id).toMatch(/^[a-z][A-Za-z]+$/);
    // No stale entry: each name in services/api/operation-ids.ts is served.
    expect(ids.sort()).toEqual(Object.values(OPERATION_IDS).sort());
  });

  it('declares the fields always present as required, so generated types do not make them optional', () => {
    type Schema = { required?: string[]; properties?: Record<string, unknown> };
    const components = (
      doc as unknown as { paths: Record<string, Record<string, { responses?: Record<string, { content?: Record<string, { schema?: Schema }> }> }>> }
    ).paths;
    const answer = (path: string, method: string, status: string): Schema | undefined =>
      components[path]?.[method]?.responses?.[status]?.content?.['application/json']?.schema;
    expect(answer('/v1/counterparties/{id}', 'get', '200')?.required).toEqual(expect.arrayContaining(['id', 'canonicalName', 'status', 'version']));
    expect(answer('/v1/mentions/{id}', 'get', '200')?.required).toEqual(expect.arrayContaining(['id', 'source', 'externalId', 'text', 'status']));
    expect(answer('/v1/mentions', 'post', '200')?.required).toEqual(expect.arrayContaining(['mentionId', 'status', 'reviewItemId']));
    expect(answer('/v1/contracts', 'post', '200')?.required).toEqual(expect.arrayContaining(['contractId', 'parties']));
    expect(answer('/v1/review-items/{id}', 'get', '200')?.required).toEqual(expect.arrayContaining(['id', 'kind', 'status']));
  });

  it('generates types that compile with a typed flow, and the flow runs against the service', async () => {
    const types = astToString(await openapiTS(doc as never));
    for (const id of Object.values(OPERATION_IDS)) expect(types).toContain(`${id}: {`);
    mkdirSync(OUT, { recursive: true });
    writeFileSync(join(OUT, 'api.ts'), types);
    writeFileSync(join(OUT, 'flow.ts'), FLOW);
    // Strict type check of the generated types with the flow: a renamed field or operation fails here.
    const tsc = join(REPO_ROOT, 'node_modules', 'typescript', 'bin', 'tsc');
    const args = [
      '--noEmit',
      '--strict',
      '--target',
      'ES2022',
      '--module',
      'ESNext',
      '--moduleResolution',
      'Bundler',
      '--allowImportingTsExtensions',
      '--skipLibCheck',
      '--lib',
      'ES2023,DOM',
      '--types',
      'node',
      join(OUT, 'flow.ts'),
    ];
    try {
      execFileSync(process.execPath, [tsc, ...args], { cwd: REPO_ROOT, encoding: 'utf8' });
    } catch (error) {
      throw new Error(`the generated client does not type-check:\n${(error as { stdout?: string }).stdout ?? String(error)}`);
    }
    const adminKey = (await createApiKey(ctx.db(), { scope: 'admin', label: 'legal operations (admin key)' })).secret;
    const { flow } = (await import(pathToFileURL(join(OUT, 'flow.ts')).href)) as { flow: (url: string, key: string) => Promise<Record<string, unknown>> };
    const result = await flow(baseUrl, adminKey);
    expect(result).toMatchObject({ key: 'write', mention: 'review', counterparty: 'Hartsell Cold Chain Limited', item: 'open' });
    expect(result.reviewItemId).toEqual(expect.any(Number));
    expect(result.decided).toMatchObject({ reviewItemId: result.reviewItemId, decision: 'same', counterpartyId: result.counterpartyId });
  }, 180_000);
});
