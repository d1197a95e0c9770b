#!/usr/bin/env node
// Entry point of the `cpreg` command: loads the TypeScript sources through tsx,
// so that a fresh clone runs with `npm ci` alone and no build step.
import { register } from 'tsx/esm/api';

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
register();
const { main } = await import('../services/cli/main.ts');
await main(process.argv);
