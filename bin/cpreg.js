#!/usr/bin/env node
// Entry point of the `cpreg` command: loads the TypeScript sources through tsx,
// so that a fresh clone runs with `npm ci` alone and no build step.
import { register } from 'tsx/esm/api';

register();
const { main } = await import('../services/cli/main.ts');
await main(process.argv);
