/**
 * `npm run bench [-- --quick | --full] [--only <name>[,<name>]] [--sizes <n>[,<n>]] [--seed <n>] [--keep]`: runs every
 * bench/*.bench.ts, or those named by --only (the contract is bench/types.ts, the logic bench/runner.ts).
 *
 *   --quick / --full   the sizes every bench scales with: quick 10,000; default 10,000 and 100,000; full adds 1,000,000
 *   --sizes <n>,…      these sizes only, for every bench run, in place of the mode's; e.g.
 *                      `npm run bench -- --only register --sizes 1000000` loads and measures the 1,000,000 register
 *                      alone (PostgreSQL: the register bench runs PGlite up to 100,000 only), where --full runs 10,000,
 *                      100,000 and 1,000,000 one after the other (about 45 min). A size of 1,000,000 or more gets
 *                      --full's heap and time limit; the mode still sets the rest (--quick: fewer probe calls)
 *   --seed <n>         the seed of every generated input (default 1); --keep keeps each bench's scratch directory
 */
import { main } from './runner.ts';

await main(process.argv.slice(2));
