/**
 * `cpreg own-entities add|list|remove`: the legal entities of the organisation that runs cpreg. A mention or a
 * contract party that resolves to one of them is marked own_entity and never becomes a counterparty.
 */
import type { Command } from 'commander';
import { CliError } from '../cli-error.ts';
import { DB_OPTION_HELP } from './serve.ts';

import type { OpenedDatabase } from '../../../db/open-database.ts';
import type { RegisterContext } from '../../register/context.ts';

interface Opened {
  ctx: RegisterContext;
  database: OpenedDatabase;
}

/**
 * Opens the register (services/cli/open-command-database.ts says which database, and whether it may be created),
 * runs `fn`, closes; register errors become one-line CLI errors.
 */
export async function withRegister<T>(
  db: string | undefined,
  command: string,
  access: 'reads' | 'writes',
  fn: (opened: Opened, actor: string) => Promise<T>,
): Promise<T> {
  const { cliActor } = await import('../../register/open-register.ts');
  const { createRegisterContext } = await import('../../register/context.ts');
  const { RegisterError } = await import('../../register/errors.ts');
  const { openCommandDatabase } = await import('../open-command-database.ts');
  const database = await openCommandDatabase(db, command, { writes: access === 'writes' });
  try {
    return await fn({ ctx: createRegisterContext(database.db), database }, cliActor());
  } catch (error) {
    if (error instanceof RegisterError) throw new CliError(error.message, 1, { cause: error });
    throw error;
  } finally {
    await database.close();
  }
}

function print(json: boolean | undefined, value: unknown, text: string): void {
  process.stdout.write(json ? `${JSON.stringify(value)}\n` : `${text}\n`);
}

/** Appends each use of a repeatable option to the list (commander keeps only the last value otherwise). */
function collect(value: string, previous: string[] = []): string[] {
  return [...previous, value];
}

function parseId(value: string): number {
  if (!/^[1-9]\d{0,15}$/.test(value)) throw new CliError(`own entity id "${value}" is not a positive whole number (see: cpreg own-entities list)`);
  return Number(value);
}

interface AddOptions {
  country?: string;
  identifier?: string[];
  tradeName?: string[];
  formerName?: string[];
  alsoKnownAs?: string[];
  reason?: string;
  db?: string;
  json?: boolean;
}

function otherNamesText(names: { name: string; kind: string }[]): string {
  return names.length === 0 ? '' : `\talso: ${names.map((n) => `${n.name} (${n.kind.replace(/_/g, ' ')})`).join('; ')}`;
}

export default function register(program: Command): void {
  const group = program.command('own-entities').description('manage the legal entities of your own organisation (never counterparties)');

  group
    .command('add')
    .description('add one of your own legal entities')
    .argument('<name>', 'the legal name, e.g. "Example Holdings GmbH"')
    .option('--country <code>', 'ISO 3166-1 alpha-2 or ISO 3166-2 country (e.g. DE, US-DE)')
    .option('--identifier <scheme=value...>', 'an identifier, e.g. lei=5299... (repeatable)')
    .option('--trade-name <name>', 'a name it trades under, recognised as ours like the legal name (repeatable)', collect)
    .option('--former-name <name>', 'a name it had before, still found in older contracts (repeatable)', collect)
    .option('--also-known-as <name>', 'any other name it is known by (repeatable)', collect)
    .option('--reason <text>', 'why (kept in the history)')
    .option('--db <target>', DB_OPTION_HELP)
    .option('--json', 'print the result as JSON')
    .showHelpAfterError(true)
    .addHelpText('after', '\nOn an entity already listed, the other names it does not have yet are added to it.')
    .action(async (name: string, options: AddOptions) => {
      const identifiers = (options.identifier ?? []).map((pair) => {
        const at = pair.indexOf('=');
        if (at <= 0) throw new CliError(`--identifier "${pair}": write it as scheme=value, e.g. lei=...`);
        return { scheme: pair.slice(0, at), value: pair.slice(at + 1) };
      });
      await withRegister(options.db, 'cpreg own-entities add', 'writes', async ({ ctx }, actor) => {
        const { addOwnEntity } = await import('../../register/own-entities.ts');
        const otherNames = [
          ...(options.tradeName ?? []).map((n) => ({ name: n, kind: 'trade' as const })),
          ...(options.formerName ?? []).map((n) => ({ name: n, kind: 'former' as const })),
          ...(options.alsoKnownAs ?? []).map((n) => ({ name: n, kind: 'also_known_as' as const })),
        ];
        const result = await addOwnEntity(
          ctx,
          { name, ...(options.country ? { country: options.country } : {}), identifiers, otherNames },
          { actor, ...(options.reason ? { reason: options.reason } : {}) },
        );
        const also = result.otherNamesAdded.length > 0 ? ` (other names added: ${result.otherNamesAdded.join('; ')})` : '';
        print(
          options.json,
          result,
          result.created ? `added own entity ${result.ownEntityId}: ${name}${also}` : `already listed as own entity ${result.ownEntityId}: ${name}${also}`,
        );
      });
    });

  group
    .command('list')
    .description('list your own legal entities')
    .option('--all', 'include removed ones')
    .option('--db <target>', DB_OPTION_HELP)
    .option('--json', 'print the result as JSON')
    .showHelpAfterError(true)
    .action(async (options: { all?: boolean; db?: string; json?: boolean }) => {
      // Reads one table: the query module alone, without loading the register (a second of imports).
      const { withDatabase } = await import('../../ingest/cli-support.ts');
      await withDatabase(options.db, 'cpreg own-entities list', 'reads', async (db) => {
        const { listOwnEntities } = await import('../../../db/queries/own-entities.ts');
        const list = await listOwnEntities(db, { includeRemoved: options.all === true });
        const lines =
          list.length === 0
            ? 'no own entities listed (add one with: cpreg own-entities add "<name>")'
            : list
                .map((o) => `${o.id}\t${o.name}${o.country ? `\t${o.country}` : ''}${otherNamesText(o.otherNames)}${o.removedAt ? '\t(removed)' : ''}`)
                .join('\n');
        print(options.json, list, lines);
      });
    });

  group
    .command('remove')
    .description('remove one of your own legal entities from the list')
    .argument('<id>', 'the own entity id (see: cpreg own-entities list)')
    .option('--reason <text>', 'why (kept in the history)')
    .option('--db <target>', DB_OPTION_HELP)
    .option('--json', 'print the result as JSON')
    .showHelpAfterError(true)
    .action(async (idText: string, options: { reason?: string; db?: string; json?: boolean }) => {
      const id = parseId(idText);
      await withRegister(options.db, 'cpreg own-entities remove', 'writes', async ({ ctx }, actor) => {
        const { removeOwnEntity } = await import('../../register/own-entities.ts');
        const result = await removeOwnEntity(ctx, id, { actor, ...(options.reason ? { reason: options.reason } : {}) });
        print(options.json, { ownEntityId: id, ...result }, result.eventId === null ? `own entity ${id} was already removed` : `removed own entity ${id}`);
      });
    });
}
