/**
 * The processes of a scale-out run: the batch file of generated mentions, `cpreg worker` children, and `cpreg`
 * commands run to their end.
 */
import { spawn, type ChildProcess } from 'node:child_process';
import { once } from 'node:events';
import { createWriteStream } from 'node:fs';
import { dirname, join } from 'node:path';
import { createInterface } from 'node:readline';
import { fileURLToPath } from 'node:url';
import type { BenchContext } from '../types.ts';

const REPO = dirname(dirname(dirname(fileURLToPath(import.meta.url))));
const CLI = join(REPO, 'bin/cpreg.js');

export async function writeMentions(ctx: BenchContext, file: string, size: number): Promise<void> {
  const out = createWriteStream(file);
  let i = 0;
  for (const name of ctx.generator.names(size, ctx.seed)) {
    const line = `${JSON.stringify({ externalId: `r${i++}`, text: name.name, country: name.country })}\n`;
    if (!out.write(line)) await once(out, 'drain');
  }
  out.end();
  await once(out, 'finish');
}

/** `cpreg worker --db url`; resolves once it says it is taking jobs. */
export async function startWorker(url: string, tail: string[]): Promise<ChildProcess> {
  const child = spawn(process.execPath, [CLI, 'worker', '--db', url], { cwd: REPO, stdio: ['ignore', 'ignore', 'pipe'] });
  const lines = createInterface({ input: child.stderr! });
  const ready = new Promise<void>((resolve, reject) => {
    lines.on('line', (line) => {
      tail.push(line);
      if (tail.length > 20) tail.shift();
      if (line.includes('taking jobs from')) resolve();
    });
    child.once('exit', (code, signal) => reject(new Error(`cpreg worker exited (${signal ?? code}) before taking jobs: ${tail.join(' | ')}`)));
  });
  await ready;
  return child;
}

export async function stopProcess(child: ChildProcess): Promise<void> {
  if (child.exitCode !== null || child.signalCode !== null) return;
  const exited = once(child, 'exit');
  child.kill('SIGTERM');
  const timer = setTimeout(() => child.kill('SIGKILL'), 5000);
  await exited;
  clearTimeout(timer);
}

/** Runs a cpreg command to its end; answers its stdout (throws with its stderr when it fails). */
export async function cpreg(args: string[]): Promise<string> {
  const child = spawn(process.execPath, [CLI, ...args], { cwd: REPO, stdio: ['ignore', 'pipe', 'pipe'] });
  let out = '';
  let err = '';
  child.stdout!.on('data', (d: Buffer) => (out += d.toString()));
  child.stderr!.on('data', (d: Buffer) => (err += d.toString()));
  const [code] = (await once(child, 'exit')) as [number | null];
  if (code !== 0) throw new Error(`cpreg ${args[0]} exited with ${code}: ${err.trim().slice(-500)}`);
  return out;
}
