/**
 * A part of a bench file run in a process of its own, so that a figure of that process (its peak memory) is that
 * part's alone: the runner's child machinery (bench/run-child.ts) started again on the same file, with `env` telling
 * the file which part to run. Rows the part records are recorded in the calling bench's context as they arrive.
 */
import { fork } from 'node:child_process';
import { join } from 'node:path';
import { REPO } from './discover.ts';
import type { ChildMessage } from './run-child.ts';
import type { BenchContext } from './types.ts';

/** Runs bench/`file` in a child with `env` added; answers the child's peak RSS (from the OS, MB) or throws its error. */
export async function runInChild(ctx: BenchContext, file: string, env: Record<string, string>): Promise<{ peakRssMb: number }> {
  const args = ['bench/run.ts', '--child', file, '--mode', ctx.mode, '--seed', String(ctx.seed)];
  // The same heap limit as this process (the runner's --full heap), and the same way of running TypeScript.
  const child = fork(join(REPO, 'bin/run-ts.js'), args, { cwd: REPO, env: { ...process.env, ...env }, stdio: ['ignore', 'inherit', 'inherit', 'ipc'] });
  let peakRssMb: number | undefined;
  let error: string | undefined;
  child.on('message', (message: ChildMessage) => {
    if (message.type === 'row') ctx.record(message.row);
    else if (message.type === 'done') peakRssMb = message.peakRssMb;
    else error = message.error;
  });
  const [code, signal] = await new Promise<[number | null, string | null]>((resolve) => child.on('exit', (c, s) => resolve([c, s])));
  if (peakRssMb === undefined || code !== 0) throw new Error(`${file} (${JSON.stringify(env)}): ${error ?? `exited with ${signal ?? code}`}`);
  return { peakRssMb };
}
