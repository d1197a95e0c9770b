/**
 * `cpreg demo`: TEMPORARY stand-in until the demo issue lands (it replaces this file): serves the API
 * on the embedded database in ./data/demo so that `npm start` works on a fresh clone.
 */
import type { Command } from 'commander';
import { DEFAULT_HOST, parsePort, runServe } from './serve.ts';

export const DEMO_DATA_DIR = './data/demo';

export default function register(program: Command): void {
  program
    .command('demo')
    .description(`serve the API on the embedded database in ${DEMO_DATA_DIR} (stop with Ctrl-C)`)
    .showHelpAfterError(true)
    .option('--port <port>', 'TCP port (0: any free port)', parsePort, 8080)
    .option('--host <host>', 'address to listen on', DEFAULT_HOST)
    .action(async (options: { port: number; host: string }) => {
      await runServe(
        { port: options.port, host: options.host, db: DEMO_DATA_DIR, dbTimeout: 5000, logLevel: 'warn' },
        'cpreg demo',
      );
    });
}
