/**
 * `cpreg adjust-weights`: reviewers' decisions adjust the weights in force, within bounds (at most 2 bits a level,
 * and only levels with 5 decisions or more). Mentions keep their outcome until `cpreg reresolve`.
 */
import type { Command } from 'commander';
import { DB_OPTION_HELP } from './serve.ts';
import { withRegister } from './own-entities.ts';

export default function register(program: Command): void {
  program
    .command('adjust-weights')
    .description("adjust the matching weights from reviewers' decisions, within bounds (then run reresolve)")
    .option('--dry-run', 'show the shifts without storing them')
    .option('--db <target>', DB_OPTION_HELP)
    .option('--json', 'print the result as JSON')
    .showHelpAfterError(true)
    .action(async (options: { dryRun?: boolean; db?: string; json?: boolean }) => {
      await withRegister(options.db, 'cpreg adjust-weights', 'writes', async ({ ctx }, actor) => {
        const { adjustWeights } = await import('../../register/matching/adjust-weights.ts');
        const result = await adjustWeights(ctx, { actor }, { dryRun: options.dryRun ?? false });
        if (options.json) {
          process.stdout.write(`${JSON.stringify({ decisions: result.decisions, used: result.used, shifts: result.shifts, version: result.version })}\n`);
          return;
        }
        process.stdout.write(`${result.decisions} reviewers' decisions read, ${result.used} with levels of today's features\n`);
        if (result.shifts.length === 0)
          process.stdout.write('no level moved (a level needs 5 decisions, and decisions the weights already agree with move nothing)\n');
        for (const s of result.shifts) {
          process.stdout.write(`  ${s.feature} ${s.level}: ${s.shift > 0 ? '+' : ''}${s.shift.toFixed(2)} bits (${s.same} same of ${s.decisions})\n`);
        }
        if (result.version !== null)
          process.stdout.write(`stored as settings version ${result.version}; run \`cpreg reresolve\` to apply it to stored mentions\n`);
        else if (options.dryRun) process.stdout.write('dry run: nothing stored\n');
      });
    });
}
