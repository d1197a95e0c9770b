/**
 * OWASP API7 (server-side request forgery): cpreg makes no outbound requests. Every server-side source file
 * (services/, db/, resolvers/, bin/) is scanned for the ways Node can call out: fetch, the http/https/net/tls/
 * dgram/dns clients, and HTTP client libraries. The only network client allowed is the PostgreSQL driver in
 * db/open-database.ts (the database the operator configured). The console's browser code fetches only its own
 * origin's API (relative URLs), checked separately.
 */
import { readdirSync, readFileSync, statSync } from 'node:fs';
import { join, relative } from 'node:path';
import { expect, it } from 'vitest';
import { REPO_ROOT } from '../support/cli.ts';

function files(dir: string): string[] {
  const out: string[] = [];
  for (const name of readdirSync(dir)) {
    const path = join(dir, name);
    if (statSync(path).isDirectory()) out.push(...files(path));
    else if (/\.(?:ts|js|mjs)$/.test(name)) out.push(path);
  }
  return out;
}

const OUTBOUND = [
  /\bfetch\s*\(/,
  /from\s+['"](?:node:)?(?:http|https|http2|net|tls|dgram|dns)['"]/,
  /import\(\s*['"](?:node:)?(?:http|https|http2|net|tls|dgram|dns)['"]\s*\)/,
  /from\s+['"](?:axios|got|node-fetch|undici|superagent|request)['"]/,
  /\bnew\s+WebSocket\b/,
];

it('server-side code makes no outbound requests (only the configured PostgreSQL)', () => {
  const offenders: string[] = [];
  const browser = join(REPO_ROOT, 'services', 'console', 'static');
  for (const root of ['services', 'db', 'resolvers', 'bin']) {
    for (const file of files(join(REPO_ROOT, root))) {
      if (file.startsWith(browser)) continue;
      const text = readFileSync(file, 'utf8');
      for (const pattern of OUTBOUND) if (pattern.test(text)) offenders.push(`${relative(REPO_ROOT, file)}: ${pattern}`);
    }
  }
  // The API docs page is HTML served to a browser; its script fetches the same origin's openapi.json.
  const allowed = offenders.filter((o) => !(o.startsWith('services/api/docs-page.ts') && o.includes('fetch')));
  // The server itself listens (node:http server types), and answers its own clients' framing errors with node:http's
  // status texts and header limit (client-error-handler.ts) — listening and answering is not calling out.
  const calling = allowed.filter((o) => !/services\/api\/(?:server|app|client-error-handler)\.ts: .*http/.test(o));
  expect(calling).toEqual([]);
});

it('the console and docs page call only relative URLs (their own origin)', () => {
  const browser = [...files(join(REPO_ROOT, 'services', 'console', 'static')), join(REPO_ROOT, 'services', 'api', 'docs-page.ts')];
  const absolute: string[] = [];
  for (const file of browser) {
    const text = readFileSync(file, 'utf8');
    for (const match of text.matchAll(/fetch\(\s*(['"`])([^'"`]*)\1/g))
      if (/^[a-z]+:|^\/\//i.test(match[2]!)) absolute.push(`${relative(REPO_ROOT, file)}: ${match[2]}`);
  }
  expect(absolute).toEqual([]);
});
