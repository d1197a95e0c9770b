/**
 * `cpreg demo [--db <dir>] [--fresh] [--seed <n>] [--port] [--host] [--no-serve] [--json]` (= `npm start`):
 * builds the invented demo scenario into an embedded database (the directory every command uses: --db, else
 * DATABASE_URL, else ./data/cpreg; reused when already built, with what a user added since),
 * prints what the register made of it with the accuracy measured against the ground truth, then serves the
 * API with a local admin key until Ctrl-C.
 */
import { InvalidArgumentError, type Command } from 'commander';
import { DEFAULT_HOST, parsePort } from './serve.ts';
export const DEMO_PORT = 4620;
export const DEMO_KEY_LABEL = 'demo (local admin)';

export interface DemoCliOptions {
  db?: string;
  files?: string;
  fresh?: boolean;
  seed?: number;
  port: number;
  host: string;
  serve: boolean;
  json?: boolean;
}

function parseSeed(value: string): number {
  if (!/^\d{1,9}$/.test(value)) throw new InvalidArgumentError('expected a whole number from 0 to 999999999');
  return Number(value);
}

export default function register(program: Command): void {
  program
    .command('demo')
    .description(
      'build the invented demo scenario into the database every command uses (./data/cpreg unless --db or DATABASE_URL say otherwise; reused when built), print what the register made of it, then serve the API (stop with Ctrl-C)',
    )
    .showHelpAfterError(true)
    .option(
      '--db <dir>',
      'embedded database directory (default: $DATABASE_URL, else ./data/cpreg; a PostgreSQL URL is refused: the demo builds an embedded database)',
    )
    .option('--files <dir>', "where the scenario's files go (contracts, mentions, vendor master, truth.json; default: <db>-scenario)")
    .option('--fresh', 'delete the demo database and build it again')
    .option('--seed <n>', 'scenario seed (default 1, or the seed the database was built with)', parseSeed)
    .option('--port <port>', 'TCP port (0: any free port)', parsePort, DEMO_PORT)
    .option('--host <host>', 'address to listen on', DEFAULT_HOST)
    .option('--no-serve', 'build, print the summary and exit')
    .option('--json', 'print the summary as JSON (and the address as one JSON line once serving)')
    .action(async (options: DemoCliOptions) => {
      const { runDemoCommand } = await import('../../demo/run-demo-command.ts');
      await runDemoCommand(options);
    });
}
