/**
 * Every `cpreg` command, one registering function each. To add a command, create
 * commands/<name>.ts exporting `(program: Command) => void` and add ONE line below.
 */
import type { Command } from 'commander';
import analyse from './analyse.ts';
import generate from './generate.ts';
import evaluate from './evaluate.ts';
import serve from './serve.ts';
import migrate from './migrate.ts';
import demo from './demo.ts';
import contract from './contract.ts';
import contracts from './contracts.ts';
import keys from './keys.ts';
import ingest from './ingest.ts';
import exportCommand from './export.ts';
import reconcile from './reconcile.ts';
import ownEntities from './own-entities.ts';
import reresolve from './reresolve.ts';
import adjustWeights from './adjust-weights.ts';
import sweep from './sweep.ts';
import verify from './verify.ts';
import forget from './forget.ts';
import backup from './backup.ts';
import restore from './restore.ts';
import worker from './worker.ts';
import jobs from './jobs.ts';

export const COMMANDS: Array<(program: Command) => void> = [
  analyse,
  evaluate,
  generate,
  serve,
  migrate,
  demo,
  contract,
  contracts,
  keys,
  ingest,
  exportCommand,
  reconcile,
  ownEntities,
  reresolve,
  adjustWeights,
  sweep,
  verify,
  worker,
  jobs,
  forget,
  backup,
  restore,
];
