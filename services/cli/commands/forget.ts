/** `cpreg forget <counterparty-id>` (admin): erase a natural person's personal data from the register and its history. */
import type { Command } from 'commander';
import { CliError } from '../cli-error.ts';
import { DB_OPTION_HELP } from './serve.ts';
import { withRegister } from './own-entities.ts';

/** What the rows of each register table hold, singular and plural, for the summary line. */
const HOLDS: Record<string, [string, string]> = {
  own_entity: ['own entity', 'own entities'],
  counterparty: ['counterparty', 'counterparties'],
  counterparty_name: ['name', 'names'],
  counterparty_identifier: ['identifier', 'identifiers'],
  counterparty_relation: ['relation', 'relations'],
  contract: ['contract', 'contracts'],
  defined_term: ['defined term', 'defined terms'],
  mention: ['mention', 'mentions'],
  contract_party: ['contract party', 'contract parties'],
  review_item: ['review item', 'review items'],
  cannot_link: ['cannot-link decision', 'cannot-link decisions'],
  labelled_pair: ['reviewer decision', 'reviewer decisions'],
};

export default function register(program: Command): void {
  program
    .command('forget')
    .description('erase a person: names, identifiers, mention texts and addresses become a pseudonym in the register and its history')
    .argument('<counterparty-id>', 'the counterparty to erase (a merged id erases its survivor and everything merged into it)')
    .requiredOption('--reason <text>', 'why (kept in the history, e.g. the erasure request reference); never put personal data here')
    .option('--organisation', 'also erase a counterparty recorded as an organisation')
    .option('--db <target>', DB_OPTION_HELP)
    .option('--json', 'print the result as JSON')
    .showHelpAfterError(true)
    .action(async (idText: string, options: { reason: string; organisation?: boolean; db?: string; json?: boolean }) => {
      if (!/^[1-9]\d{0,15}$/.test(idText)) throw new CliError(`counterparty id "${idText}" is not a positive whole number`);
      await withRegister(options.db, 'cpreg forget', 'writes', async ({ ctx }, actor) => {
        const { forgetCounterparty } = await import('../../forget/forget.ts');
        const result = await forgetCounterparty(ctx, Number(idText), { actor, reason: options.reason }, { allowOrganisation: options.organisation ?? false });
        if (options.json) process.stdout.write(`${JSON.stringify(result)}\n`);
        else {
          const { countOf } = await import('../../ingest/cli-support.ts');
          const rows = Object.entries(result.rows).map(([table, n]) => {
            const [one, many] = HOLDS[table] ?? [`${table.replaceAll('_', ' ')} row`, `${table.replaceAll('_', ' ')} rows`];
            return countOf(n, one, many);
          });
          process.stdout.write(
            `counterparty ${result.counterpartyId} erased as "${result.pseudonym}" (change ${result.eventId}): rewrote ${[...rows, countOf(result.events, 'history event'), countOf(result.storedAnswers, 'stored answer')].join(', ')}\n`,
          );
        }
      });
    });
}
