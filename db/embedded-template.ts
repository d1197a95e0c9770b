/**
 * A migrated, empty embedded database kept as a data directory, so that a new embedded database is a copy
 * of it instead of a run of PGlite's initdb plus every migration (about 10 s of CPU against 2 s on a small
 * machine). The first new database made on a machine is made the long way and then saved here; every later one
 * starts from the copy. Nothing is downloaded: the archive is made by this machine's own PGlite.
 *
 * The archive's name holds the PGlite version and a digest of the migration file names, so a template made by
 * another engine or for another schema is never used (a newer code base makes and saves its own).
 * Where: CPREG_CACHE_DIR when set, else node_modules/.cache/cpreg of this package (the usual place for a
 * package's caches, left out of version control and rebuilt by `npm ci`). A cache that cannot be read or
 * written is skipped: the database is then made the long way, nothing else changes.
 */
import { createHash } from 'node:crypto';
import { cpSync, existsSync, mkdirSync, readFileSync, readdirSync, renameSync, rmSync, writeFileSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { MIGRATIONS_DIR } from './migrate.ts';
import { LOCK_FILE_NAME } from './lock.ts';
import { INIT_MARKER_NAME } from './embedded-directory.ts';

const PACKAGE_ROOT = fileURLToPath(new URL('../', import.meta.url));

/**
 * Files of the dumped directory a copy must not get: the lock of the process that made the template (a copy
 * would show a stale lock of a process long gone), the first-start marker, and the running engine's pid file (a
 * database closed normally has none).
 */
const LEFT_OUT = new Set([LOCK_FILE_NAME, INIT_MARKER_NAME, 'postmaster.pid']);

/** The folder templates are kept in, or undefined when there is none to use (no node_modules, say). */
export function templateCacheDir(): string | undefined {
  const fromEnv = process.env.CPREG_CACHE_DIR;
  if (fromEnv && fromEnv.trim() !== '') return fromEnv;
  const modules = join(PACKAGE_ROOT, 'node_modules');
  return existsSync(modules) ? join(modules, '.cache', 'cpreg') : undefined;
}

/** The PGlite version installed beside this package (part of the template's name). */
function pgliteVersion(): string {
  try {
    const manifest = JSON.parse(readFileSync(join(PACKAGE_ROOT, 'node_modules', '@electric-sql', 'pglite', 'package.json'), 'utf8')) as { version?: string };
    return manifest.version ?? 'unknown';
  } catch {
    return 'unknown';
  }
}

/** The directory a template for today's engine and migrations has (whether or not it exists yet). */
export function templateFile(dir = templateCacheDir()): string | undefined {
  if (!dir) return undefined;
  let names: string[];
  try {
    names = readdirSync(MIGRATIONS_DIR)
      .filter((f) => /\.(?:ts|js|mjs)$/.test(f) && !f.endsWith('.d.ts'))
      .sort();
  } catch {
    return undefined;
  }
  const digest = createHash('sha256').update(names.join('\n')).digest('hex').slice(0, 16);
  return join(dir, `pglite-${pgliteVersion()}-schema-${digest}`);
}

/** Whether today's template exists, so that a new database can be a copy of it. */
export function hasTemplate(): boolean {
  const template = templateFile();
  return template !== undefined && existsSync(join(template, 'PG_VERSION'));
}

/**
 * Copies today's template into `dir` (a new database directory that holds no cluster yet). Returns false, having
 * copied nothing that stays, when there is no template or it cannot be copied: the caller then runs initdb.
 */
export function copyTemplateInto(dir: string): boolean {
  const template = templateFile();
  if (!template || !existsSync(join(template, 'PG_VERSION'))) return false;
  try {
    cpSync(template, dir, { recursive: true });
    return true;
  } catch {
    for (const name of readdirSync(template)) rmSync(join(dir, name), { recursive: true, force: true });
    return false;
  }
}

/**
 * Saves `dump` (PGlite's tar of a migrated empty database) as today's template unless one exists: unpacked into a
 * directory, so a new database is a plain file copy (unpacking a 40 MB archive through PGlite cost a second more).
 * Unpacked beside and renamed, so two processes saving at once, or one interrupted, never leave a partial
 * template. Failures are ignored.
 */
export function saveTemplate(dump: Uint8Array): boolean {
  const file = templateFile();
  if (!file || existsSync(file)) return false;
  const partial = `${file}.partial-${process.pid}`;
  try {
    mkdirSync(partial, { recursive: true });
    if (!unpack(dump, partial)) throw new Error('an archive this reader does not know');
    renameSync(partial, file);
    return true;
  } catch {
    rmSync(partial, { recursive: true, force: true });
    return false;
  }
}

const BLOCK = 512;

/**
 * Unpacks a tar archive of regular files and directories into `into`, leaving out the top-level names of
 * LEFT_OUT (ustar headers: name at 0..100, prefix at 345..500, size in octal at 124..136, type at 156; each
 * entry's data padded to 512 bytes). False for anything else (links, pax headers, paths leaving `into`).
 */
function unpack(tar: Uint8Array, into: string): boolean {
  let offset = 0;
  while (offset + BLOCK <= tar.length) {
    const header = tar.subarray(offset, offset + BLOCK);
    if (header.every((b) => b === 0)) return true; // end of archive
    const size = parseInt(ascii(header.subarray(124, 136)).trim() || '0', 8);
    const type = String.fromCharCode(header[156]!);
    const prefix = ascii(header.subarray(345, 500));
    const name = `${prefix ? `${prefix}/` : ''}${ascii(header.subarray(0, 100))}`.replace(/^\.?\/+/, '');
    if (!Number.isFinite(size) || name.split('/').includes('..')) return false;
    const data = tar.subarray(offset + BLOCK, offset + BLOCK + size);
    offset += BLOCK + Math.ceil(size / BLOCK) * BLOCK;
    if (name === '' || LEFT_OUT.has(name)) continue;
    const target = join(into, name);
    if (type === '5') mkdirSync(target, { recursive: true });
    else if (type === '0' || type === '\0') {
      mkdirSync(dirname(target), { recursive: true });
      writeFileSync(target, data);
    } else return false;
  }
  return false; // no end-of-archive blocks: cut short
}

function ascii(bytes: Uint8Array): string {
  const end = bytes.indexOf(0);
  return Buffer.from(end === -1 ? bytes : bytes.subarray(0, end)).toString('latin1');
}
