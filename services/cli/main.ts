/**
 * The `cpreg` command line. Each command lives in services/cli/commands/<name>.ts and is listed in
 * commands/index.ts; command files import their heavy dependencies lazily so that `cpreg --help` stays quick.
 */
import { Command, CommanderError } from 'commander';
import { COMMANDS } from './commands/index.ts';
import { CliError } from './cli-error.ts';

export function buildProgram(): Command {
  const program = new Command('cpreg')
    .description('cpreg: a counterparty register that links party names in contracts to canonical counterparties')
    .option('--verbose', 'print stack traces on errors')
    .showHelpAfterError(true)
    .exitOverride();
  for (const add of COMMANDS) add(program);
  return program;
}

export async function main(argv: string[]): Promise<void> {
  const program = buildProgram();
  try {
    await program.parseAsync(argv);
  } catch (error) {
    process.exitCode = reportError(error, argv.includes('--verbose'));
  }
}

/** One clear line on stderr, a stack trace only with --verbose; returns the exit code. */
function reportError(error: unknown, verbose: boolean): number {
  if (error instanceof CommanderError) {
    // commander has already printed its message (unknown option, missing argument, help).
    return error.exitCode;
  }
  if (error instanceof CliError) {
    process.stderr.write(`cpreg: ${error.message}\n`);
    if (verbose && error.cause instanceof Error) process.stderr.write(`${error.cause.stack}\n`);
    return error.exitCode;
  }
  const message = error instanceof Error ? error.message : String(error);
  process.stderr.write(`cpreg: ${message}\n`);
  if (verbose && error instanceof Error) process.stderr.write(`${error.stack}\n`);
  return 1;
}
