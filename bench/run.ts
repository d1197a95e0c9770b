/**
 * `npm run bench [-- --quick | --full] [--only <name>[,<name>]] [--seed <n>] [--keep]`: runs every
 * bench/*.bench.ts (the contract is bench/types.ts, the logic bench/runner.ts).
 */
import { main } from './runner.ts';

await main(process.argv.slice(2));
