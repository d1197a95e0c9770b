#!/usr/bin/env node
// Entry point of the `cpreg` command: loads the TypeScript sources through tsx,
// so that a fresh clone runs with `npm ci` alone and no build step.
import { register } from 'tsx/esm/api';
import { setFlagsFromString } from 'node:v8';

// Under Node 20 tsx's loader hooks run on another thread: every module loaded after register() costs a round
// trip, and kysely alone is 280 files (about 0.5 s more than loading it plainly). The large plain-JavaScript
// packages a database command needs are loaded first, without the hooks; the TypeScript sources that import
// them later find them already loaded. Commands that open no database skip this.
const NO_DATABASE = new Set([undefined, '--help', '-h', 'help', 'analyse', 'generate', 'evaluate', 'contract']);
const command = process.argv.slice(2).find((arg) => !arg.startsWith('--verbose'));
if (!NO_DATABASE.has(command)) {
  const preload = [
    'kysely',
    '@electric-sql/pglite',
    '@electric-sql/pglite/contrib/pg_trgm',
    '@electric-sql/pglite/contrib/fuzzystrmatch',
    '@electric-sql/pglite/contrib/unaccent',
  ];
  if (command === 'serve' || command === 'demo') preload.push('fastify', '@fastify/swagger', '@fastify/static', 'pino', 'ajv', 'ajv-formats');
  await Promise.all(preload.map((name) => import(name)));
}
// The embedded engine is a 9 MB WebAssembly module. By default V8 also recompiles its busy functions with its
// optimising compiler, on other threads: measured here that is about 0.7 s of CPU at every start, and a command run
// once never earns it back (own-entities list 1.97 -> 1.24 s CPU, an ingest of 6,000 names 19.0 -> 17.7 s user).
// The long-running processes (the service, the demo that serves) keep it. Set before any WebAssembly is compiled.
if (command !== 'serve' && command !== 'demo') setFlagsFromString('--liftoff-only');
register();
const { main } = await import('../services/cli/main.ts');
await main(process.argv);
