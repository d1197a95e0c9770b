/**
 * Every `cpreg` command, one registering function each. To add a command, create
 * commands/<name>.ts exporting `(program: Command) => void` and add ONE line below.
 */
import type { Command } from 'commander';
import generate from './generate.ts';

export const COMMANDS: Array<(program: Command) => void> = [
  generate,
];
