/**
 * The README's command table against the commands themselves (issue 19 item 7): a row that names a command shows
 * every option that command requires, so a reader who copies the row is not refused (`cpreg backup` without
 * `--out` was). Read from the same commander program `cpreg` runs.
 */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import type { Command } from 'commander';
import { buildProgram } from '../../../services/cli/main.ts';

const README = readFileSync(new URL('../../../README.md', import.meta.url), 'utf8');

/** The README's command table rows: the first cell of each row under "| Command |". */
function commandCells(): string[] {
  const start = README.indexOf('| Command | What it does |');
  expect(start, 'the README has a command table').toBeGreaterThan(-1);
  const rows: string[] = [];
  for (const line of README.slice(start).split('\n').slice(2)) {
    if (!line.startsWith('|')) break;
    rows.push(line.split(/(?<!\\)\|/)[1]!.trim());
  }
  return rows;
}

/** Each command's invocation path ("keys create") with its required options ("--scope"). */
function requiredOptions(program: Command): { path: string; required: string[] }[] {
  const out: { path: string; required: string[] }[] = [];
  const visit = (command: Command, prefix: string): void => {
    for (const sub of command.commands) {
      const path = prefix ? `${prefix} ${sub.name()}` : sub.name();
      const required = sub.options.filter((o) => o.mandatory).map((o) => o.long!);
      if (sub.commands.length === 0) out.push({ path, required });
      visit(sub, path);
    }
  };
  visit(program, '');
  return out;
}

describe('README command table', () => {
  it('every row that shows a command shows the options it requires', () => {
    const cells = commandCells();
    const missing: string[] = [];
    for (const { path, required } of requiredOptions(buildProgram())) {
      const [top, sub] = path.split(' ');
      // The phrase of the row that names this command: `cpreg backup …` up to the next command of the cell.
      for (const cell of cells) {
        for (const phrase of cell.split(/,\s*(?=`cpreg )/)) {
          const named = sub === undefined ? new RegExp(`^\`cpreg ${top}[\` ]`).test(phrase) : new RegExp(`^\`cpreg ${top} [^\`]*\\b${sub}\\b`).test(phrase);
          if (!named) continue;
          for (const flag of required) if (!phrase.includes(flag)) missing.push(`${path}: ${flag} (README: ${phrase})`);
        }
      }
    }
    expect(missing).toEqual([]);
  });

  it('shows `cpreg backup --out <file>` (the option cannot be left out)', () => {
    expect(commandCells().join('\n')).toContain('`cpreg backup --out <file>`');
  });
});
