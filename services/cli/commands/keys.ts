/**
 * `cpreg keys create --scope read|write|admin --label <who> [--json]` (prints the secret once),
 * `cpreg keys revoke <key-id> [--json]`, `cpreg keys list [--all] [--json]`.
 */
import type { Command } from 'commander';
import { CliError } from '../cli-error.ts';
import { DB_OPTION_HELP } from './serve.ts';

export default function register(program: Command): void {
  const keys = program.command('keys').description('API keys: create (the secret is shown once), revoke, list').showHelpAfterError(true);

  keys
    .command('create')
    .description('create an API key; its secret is printed once and stored only as a digest')
    .requiredOption('--scope <scope>', 'read, write or admin (admin ⊇ write ⊇ read)')
    .requiredOption('--label <label>', 'the person or system the key is for (the actor in the history)')
    .option('--db <target>', DB_OPTION_HELP)
    .option('--json', 'print the key as JSON')
    .action(async (options: { scope: string; label: string; db?: string; json?: boolean }) => {
      const { createApiKey, isApiScope, checkLabel } = await import('../../api/auth/keys.ts');
      if (!isApiScope(options.scope)) throw new CliError(`--scope ${options.scope}: expected read, write or admin`);
      try {
        checkLabel(options.label);
      } catch (error) {
        throw new CliError(`--${(error as Error).message}`);
      }
      const { withDatabase } = await import('../../ingest/cli-support.ts');
      const created = await withDatabase(options.db, 'cpreg keys create', 'writes', (db) =>
        createApiKey(db, { scope: options.scope as 'read', label: options.label }),
      );
      if (options.json) {
        process.stdout.write(`${JSON.stringify(created)}\n`);
        return;
      }
      process.stdout.write(
        [
          `key ${created.id} (${created.scope}) for ${created.label}`,
          `secret: ${created.secret}`,
          'This secret is shown once and cannot be recovered; store it now. Send it as: Authorization: Bearer <secret>',
        ].join('\n') + '\n',
      );
    });

  keys
    .command('revoke')
    .description('revoke an API key (every instance refuses it at once)')
    .argument('<key-id>', 'the key id (from keys list), not the secret')
    .option('--db <target>', DB_OPTION_HELP)
    .option('--json', 'print the key as JSON')
    .action(async (keyId: string, options: { db?: string; json?: boolean }) => {
      const { revokeApiKey, getApiKey } = await import('../../api/auth/keys.ts');
      const { withDatabase } = await import('../../ingest/cli-support.ts');
      const key = await withDatabase(options.db, 'cpreg keys revoke', 'writes', async (db) =>
        (await getApiKey(db, keyId)) ? revokeApiKey(db, keyId) : undefined,
      );
      if (!key) throw new CliError(`no API key ${keyId}; cpreg keys list shows the key ids`);
      process.stdout.write(options.json ? `${JSON.stringify(key)}\n` : `key ${key.id} (${key.label}) revoked at ${key.revokedAt}\n`);
    });

  keys
    .command('list')
    .description('list API keys (never their secrets)')
    .option('--all', 'include revoked keys')
    .option('--db <target>', DB_OPTION_HELP)
    .option('--json', 'print the keys as JSON')
    .action(async (options: { all?: boolean; db?: string; json?: boolean }) => {
      const { listApiKeys } = await import('../../api/auth/keys.ts');
      const { withDatabase } = await import('../../ingest/cli-support.ts');
      const list = await withDatabase(options.db, 'cpreg keys list', 'reads', (db) => listApiKeys(db, { includeRevoked: options.all }));
      if (options.json) {
        process.stdout.write(`${JSON.stringify(list)}\n`);
        return;
      }
      if (list.length === 0) {
        process.stdout.write('no API keys; create one with: cpreg keys create --scope admin --label "<who uses it, e.g. legal operations>"\n');
        return;
      }
      for (const k of list) {
        process.stdout.write(
          `${k.id}  ${k.scope.padEnd(5)}  ${k.label}  created ${k.createdAt}${k.revokedAt ? `  revoked ${k.revokedAt}` : ''}${k.lastUsedAt ? `  last used ${k.lastUsedAt}` : ''}\n`,
        );
      }
    });
}
