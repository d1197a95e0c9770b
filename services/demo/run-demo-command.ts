/**
 * What `cpreg demo` does (services/cli/commands/demo.ts holds the options):
 *   1. (--fresh) deletes the demo database and its scenario files, after checking that nobody holds the
 *      database and that it is an embedded cpreg database;
 *   2. writes the scenario's files (contracts, the mentions batch file, the vendor master, truth.json);
 *   3. opens (creating) the embedded database, migrates, and loads the scenario unless it is already there
 *      (loading is idempotent: an interrupted build resumes);
 *   4. prints the summary (stdout; progress goes to stderr);
 *   5. unless --no-serve: creates a local admin key through the keys service (revoking the previous demo key),
 *      serves the API (services/api/server.ts) and prints the address, the key and calls to try; Ctrl-C stops
 *      the server, closes the database and releases its lock.
 */
import { existsSync, mkdirSync, readFileSync, readdirSync, rmSync, writeFileSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { DEFAULT_DATA_DIR } from '../../db/open-database.ts';
import type { Kysely } from 'kysely';
import type { Database } from '../../db/types.ts';
import { CliError } from '../cli/cli-error.ts';
import type { DemoCliOptions } from '../cli/commands/demo.ts';
import { DEMO_KEY_LABEL } from '../cli/commands/demo.ts';
import { countOf } from '../cli/count-words.ts';
import { additionsLine, demoState } from './demo-state.ts';
import { cliActor, progressReporter } from '../ingest/cli-support.ts';
import { CONTRACT_SOURCE, generateScenario, type Scenario } from './scenario/index.ts';
import { writeScenario } from './write-scenario.ts';
import { loadDemo, type DemoStage } from './run-demo.ts';
import { summariseDemo, type DemoSummary } from './summarise-demo.ts';
import { formatSummary } from './run-demo-format.ts';

const STATE_FILE = 'demo-state.json';
const STAGE_LABEL: Record<DemoStage, [string, string]> = {
  own_entities: ['own entities', 'entities'],
  contracts: ['contracts', 'contracts'],
  mentions: ['mentions', 'rows'],
  vendor_master: ['vendor master', 'rows'],
};

export const CAUTION = 'Links are proposals: verify them against official registers before they drive payments or notices.';

export async function runDemoCommand(options: DemoCliOptions): Promise<void> {
  const { isPostgresUrl, MEMORY_TARGET, resolveTarget, DEFAULT_DATA_DIR } = await import('../../db/open-database.ts');
  const { openCommandDatabase, targetOrigin } = await import('../cli/open-command-database.ts');
  // The one rule every command follows: --db, else DATABASE_URL, else ./data/cpreg.
  const dbDir = withoutTrailingSlashes(resolveTarget(options.db));
  if (isPostgresUrl(dbDir) || dbDir === MEMORY_TARGET) {
    throw new CliError(
      `the demo builds an embedded database, and its database (${targetOrigin(options.db)}) is ${dbDir.startsWith('memory') ? dbDir : 'a PostgreSQL URL'}: give a directory with --db (default ${DEFAULT_DATA_DIR})`,
    );
  }
  const filesDir = options.files ?? `${dbDir}-scenario`;
  const note = (line: string): void => {
    process.stderr.write(`${line}\n`);
  };
  if (options.fresh) await removeDemo(dbDir, filesDir, note);
  if (!options.db) noteEarlierDemo(dbDir, note);

  const state = readState(filesDir);
  const seed = options.seed ?? state?.seed ?? 1;
  const scenario = generateScenario(seed);
  const database = await openCommandDatabase(options.db, 'cpreg demo', { writes: true, say: note });

  let stop = false;
  const onSignal = (): void => {
    if (stop) process.exit(130);
    stop = true;
    note('\ncpreg: stopping after the current step (Ctrl-C again to quit at once; run the demo again to resume)');
  };
  process.on('SIGINT', onSignal);
  process.on('SIGTERM', onSignal);
  let summary: DemoSummary;
  let apiKey: string | undefined;
  try {
    const built = await demoState(database.db, scenario, state?.seed);
    if (built.kind === 'other') {
      const was = state && state.seed !== seed ? `seed ${state.seed}` : 'another seed';
      throw new CliError(
        `${dbDir} holds the demo built from ${was}, not from seed ${seed}: run the demo without --seed to reuse it, or add --fresh to rebuild it with seed ${seed} (--fresh deletes that database, with anything added to it)`,
      );
    }
    if (built.kind === 'not_demo') {
      const c = built.contents;
      throw new CliError(
        `${dbDir} holds a register that is not the demo (${countOf(c.contracts, 'contract')}, ${countOf(c.mentions, 'mention')}, ${countOf(c.ownEntities, 'own entity', 'own entities')}); ` +
          'the demo never mixes its invented data into it: give the demo a directory of its own, e.g. --db ./data/demo',
      );
    }
    // Written only once the database is known to hold (or to be about to hold) this scenario.
    mkdirSync(filesDir, { recursive: true });
    await writeScenario(filesDir, scenario);
    writeFileSync(join(filesDir, STATE_FILE), `${JSON.stringify({ seed }, null, 2)}\n`);
    if (built.kind === 'complete') {
      const added = await additionsLine(database.db, built.changedContracts);
      note(`cpreg demo: reusing the demo database in ${dbDir} (seed ${seed}; --fresh rebuilds it)${added ? `; ${added}` : ''}`);
    } else {
      note(`cpreg demo: building the demo in ${dbDir} from seed ${seed} (scenario files in ${filesDir})`);
      await build(database.db, scenario, filesDir, () => stop, note);
      if (stop) throw new CliError('interrupted: the demo database is closed; run the demo again to finish building it', 130);
    }
    const db = database.db;
    summary = await summariseDemo(db, scenario, {
      vendorMaster: async (registerIdOf) => {
        note('cpreg demo: reconciling the vendor master against the register (read-only)');
        const { reconcileDemo } = await import('./run-demo-vendors.ts');
        return reconcileDemo(db, scenario, filesDir, registerIdOf);
      },
    });
    if (options.serve) apiKey = await demoKey(database.db);
  } finally {
    process.off('SIGINT', onSignal);
    process.off('SIGTERM', onSignal);
    await database.close();
  }

  if (options.json) process.stdout.write(`${JSON.stringify({ ...summary, database: dbDir, files: filesDir })}\n`);
  else process.stdout.write(`\n${formatSummary(summary, { filesDir })}\n\n  ${CAUTION}\n\n`);
  if (stop) throw new CliError('interrupted before serving; the database is closed', 130);
  if (!options.serve) return;
  await serve(options, { dbDir, filesDir, apiKey: apiKey!, busiest: summary.busiest[0] }, note);
}

/** Earlier versions kept the demo in ./data/demo: say where it is, once, when the default directory holds none. */
function noteEarlierDemo(dbDir: string, note: (line: string) => void): void {
  const earlier = './data/demo';
  if (!existsSync(join(earlier, 'PG_VERSION')) || existsSync(join(dbDir, 'PG_VERSION'))) return;
  note(
    `cpreg demo: an earlier demo is kept in ${earlier} and left as it is; every command now uses ${dbDir} by default (move it there, or give --db ${earlier})`,
  );
}

function withoutTrailingSlashes(path: string): string {
  let end = path.length;
  while (end > 1 && (path[end - 1] === '/' || path[end - 1] === '\\')) end--;
  return path.slice(0, end) || '.';
}

// ---------------------------------------------------------------- building

async function build(db: Kysely<Database>, scenario: Scenario, filesDir: string, shouldStop: () => boolean, note: (line: string) => void): Promise<void> {
  let current: { stage: DemoStage; bar: ReturnType<typeof progressReporter> } | undefined;
  const load = await loadDemo({
    db,
    scenario,
    filesDir,
    actor: cliActor(),
    shouldStop,
    onProgress: (p) => {
      if (current?.stage !== p.stage) {
        current?.bar.finish();
        const [label, unit] = STAGE_LABEL[p.stage];
        current = { stage: p.stage, bar: progressReporter(`  ${label}`, unit, process.stderr, 2000) };
      }
      current.bar.update({ done: p.done, fraction: p.total > 0 ? p.done / p.total : undefined });
    },
  });
  current?.bar.finish();
  if (load.interrupted) {
    note(
      `cpreg demo: stopped after ${load.contracts.stored + load.contracts.alreadyStored} of ${scenario.contracts.length} contracts and ${load.ingest?.counts.read ?? 0} of ${scenario.mentions.length} mentions`,
    );
    return;
  }
  const s = load.seconds;
  const secs = (x: number | undefined): string => `${(x ?? 0).toFixed(1)} s`;
  note(
    `cpreg demo: ${load.ownEntities.added} own entities declared, ${load.contracts.stored} contracts imported from files` +
      (load.contracts.files ? ` (${load.contracts.files.pdf} PDF, ${load.contracts.files.docx} Word, ${load.contracts.files.txt} text)` : '') +
      ` with ${load.contracts.parties} parties in ${secs(s.contracts)}` +
      (load.contracts.rejected.length > 0
        ? ` (${load.contracts.rejected.length} files not imported: ${load.contracts.rejected.map((r) => `${r.path} ${r.reason}`).join('; ')})`
        : '') +
      ', ' +
      `${load.ingest?.counts.read ?? 0} mentions ingested in ${secs(s.mentions)}` +
      (load.ingest && load.ingest.counts.rejected > 0 ? ` (${load.ingest.counts.rejected} rejected: see ${load.ingest.rejectsFile})` : ''),
  );
}

// ---------------------------------------------------------------- --fresh

async function removeDemo(dbDir: string, filesDir: string, note: (line: string) => void): Promise<void> {
  if (existsSync(dbDir)) {
    const { acquireDirectoryLock, DatabaseLockedError } = await import('../../db/lock.ts');
    const { checkEmbeddedDirectory } = await import('../../db/open-database.ts');
    const { DatabaseOpenError } = await import('../../db/database-errors.ts');
    try {
      checkEmbeddedDirectory(dbDir); // refuses a directory that is not an embedded database (nothing deleted)
      const lock = acquireDirectoryLock(dbDir, { command: 'cpreg demo --fresh', onMessage: (line) => note(`cpreg: ${line}`) });
      lock.release();
    } catch (error) {
      if (error instanceof DatabaseLockedError || error instanceof DatabaseOpenError) throw new CliError(`--fresh: ${error.message}`, 1, { cause: error });
      throw error;
    }
    rmSync(dbDir, { recursive: true, force: true });
  }
  if (existsSync(filesDir)) {
    const ours = existsSync(join(filesDir, STATE_FILE)) || existsSync(join(filesDir, 'truth.json'));
    if (!ours && readdirSync(filesDir).length > 0) {
      throw new CliError(`--fresh: ${filesDir} does not look like demo scenario files (no ${STATE_FILE}); nothing was deleted: choose another --files`);
    }
    rmSync(filesDir, { recursive: true, force: true });
  }
  note(`cpreg demo: --fresh: removed ${dbDir} and ${filesDir}`);
}

function readState(filesDir: string): { seed: number } | undefined {
  try {
    const parsed = JSON.parse(readFileSync(join(filesDir, STATE_FILE), 'utf8')) as { seed?: unknown };
    return typeof parsed.seed === 'number' && Number.isInteger(parsed.seed) ? { seed: parsed.seed } : undefined;
  } catch {
    return undefined;
  }
}

// ---------------------------------------------------------------- serving

/** A fresh local admin key through the keys service; the previous demo key is revoked (its secret is gone). */
async function demoKey(db: Kysely<Database>): Promise<string> {
  const { createApiKey, listApiKeys, revokeApiKey } = await import('../api/auth/keys.ts');
  for (const key of await listApiKeys(db)) if (key.label === DEMO_KEY_LABEL) await revokeApiKey(db, key.id);
  return (await createApiKey(db, { scope: 'admin', label: DEMO_KEY_LABEL })).secret;
}

async function serve(options: DemoCliOptions, suggest: Omit<Suggestions, 'url'>, note: (line: string) => void): Promise<void> {
  const { dbDir, apiKey } = suggest;
  const { startServer, ListenError } = await import('../api/server.ts');
  const { DatabaseOpenError } = await import('../../db/database-errors.ts');
  const { DatabaseLockedError } = await import('../../db/lock.ts');
  const { MigrationError } = await import('../../db/migrate.ts');
  let running;
  try {
    running = await startServer({
      db: dbDir,
      port: options.port,
      host: options.host,
      logLevel: 'warn',
      command: 'cpreg demo',
      say: options.json ? note : undefined,
      onListening: options.json ? (info) => process.stdout.write(`${JSON.stringify({ ...info, apiKey })}\n`) : undefined,
    });
  } catch (error) {
    if (error instanceof DatabaseOpenError || error instanceof DatabaseLockedError || error instanceof MigrationError || error instanceof ListenError) {
      throw new CliError(error.message, 1, { cause: error });
    }
    throw error;
  }
  if (!options.json) process.stdout.write(`${afterServing({ ...suggest, url: running.url })}\n`);
  await running.stopped; // the server has said it stopped and closed the database
}

export interface Suggestions {
  url: string;
  apiKey: string;
  dbDir: string;
  filesDir: string;
  /** The busiest counterparty, to show a search, a read and a mention that find something. */
  busiest?: { id: number; name: string; contractIds: string[] };
}

export function afterServing(x: Suggestions): string {
  const auth = `-H "Authorization: Bearer ${x.apiKey}"`;
  const rel = (p: string): string => (p.startsWith('.') || p.startsWith('/') ? p : `./${p}`);
  // Every command opens the same database by default: name it only when the demo runs elsewhere.
  const db = resolve(x.dbDir) === resolve(DEFAULT_DATA_DIR) ? '' : ` --db ${rel(x.dbDir)}`;
  const word = x.busiest?.name.split(/\s+/)[0] ?? 'logistics';
  const id = x.busiest?.id ?? 1;
  // Its name as an extraction model might send it (capitals, no punctuation), in one of its contracts.
  const shouted = (x.busiest?.name ?? 'Example Logistics Ltd').toUpperCase().replace(/[.,]/g, '');
  const contract = x.busiest?.contractIds[0] ? `,"contract":{"source":"${CONTRACT_SOURCE}","externalId":"${x.busiest.contractIds[0]}"}` : '';
  return [
    '',
    `  API            ${x.url}  (reference: ${x.url}/docs)`,
    `  admin key      ${x.apiKey}`,
    '                 (a local demo key: the next start of the demo revokes it and prints a new one)',
    '',
    '  try',
    `    curl -s ${auth} "${x.url}/v1/counterparties?q=${encodeURIComponent(word)}&limit=5"`,
    `    curl -s ${auth} "${x.url}/v1/counterparties/${id}"`,
    `    curl -s ${auth} "${x.url}/v1/counterparties/${id}/network"`,
    `    curl -s ${auth} "${x.url}/v1/review-items?limit=5"`,
    `    curl -s ${auth} -H "Content-Type: application/json" -d '{"source":"try","externalId":"1","text":"${shouted}"${contract}}' ${x.url}/v1/mentions`,
    '',
    '  after Ctrl-C',
    `    node bin/cpreg.js own-entities list${db}`,
    `    node bin/cpreg.js export links --format csv --out links.csv${db}`,
    `    node bin/cpreg.js reconcile ${rel(x.filesDir)}/vendor-master.csv --out vendor-report.csv${db}`,
    `    node bin/cpreg.js sweep${db}`,
    `    node bin/cpreg.js verify${db}`,
    `    node bin/cpreg.js serve${db}`,
    '',
    '  Ctrl-C stops the server and closes the database.',
  ].join('\n');
}
