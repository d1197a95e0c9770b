#!/usr/bin/env node
// Runs one TypeScript file (a benchmark or a script) through tsx: node bin/run-ts.js <file.ts> [args...]
import { register } from 'tsx/esm/api';
import { pathToFileURL } from 'node:url';
import { resolve } from 'node:path';

register();
const file = process.argv[2];
if (!file) {
  console.error('usage: node bin/run-ts.js <file.ts> [args...]');
  process.exit(2);
}
process.argv.splice(2, 1);
await import(pathToFileURL(resolve(file)).href);
