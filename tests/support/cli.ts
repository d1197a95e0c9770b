/** Runs the real `cpreg` command (node bin/cpreg.js) as a child process, as a user would. */
import { spawn, type ChildProcess } from 'node:child_process';
import { fileURLToPath } from 'node:url';

export const REPO_ROOT = fileURLToPath(new URL('../../', import.meta.url));
export const CPREG_BIN = fileURLToPath(new URL('../../bin/cpreg.js', import.meta.url));

export interface CliResult {
  code: number | null;
  signal: NodeJS.Signals | null;
  stdout: string;
  stderr: string;
}

/** Environment for a child: DATABASE_URL removed unless given, so the run's own setting never leaks in. */
export function childEnv(extra: Record<string, string | undefined> = {}): NodeJS.ProcessEnv {
  const env: NodeJS.ProcessEnv = { ...process.env };
  delete env.DATABASE_URL;
  for (const [key, value] of Object.entries(extra)) {
    if (value === undefined) delete env[key];
    else env[key] = value;
  }
  return env;
}

/**
 * Runs `cpreg <args>` to completion (killed after timeoutMs, which only catches hangs); `cwd` defaults to the repository.
 * `signal` kills it with SIGKILL when aborted (a test's own end: see crash-ingest-suite.ts), and the answer rejects.
 */
export function runCli(args: string[], options: { env?: NodeJS.ProcessEnv; timeoutMs?: number; cwd?: string; signal?: AbortSignal } = {}): Promise<CliResult> {
  return new Promise((resolve, reject) => {
    const child = spawn(process.execPath, [CPREG_BIN, ...args], {
      cwd: options.cwd ?? REPO_ROOT,
      env: options.env ?? childEnv(),
      ...(options.signal ? { signal: options.signal, killSignal: 'SIGKILL' as const } : {}),
    });
    let stdout = '';
    let stderr = '';
    child.stdout.on('data', (chunk) => (stdout += chunk));
    child.stderr.on('data', (chunk) => (stderr += chunk));
    const timer = setTimeout(() => child.kill('SIGKILL'), options.timeoutMs ?? 60_000);
    child.on('error', reject);
    child.on('close', (code, signal) => {
      clearTimeout(timer);
      resolve({ code, signal, stdout, stderr });
    });
  });
}

export interface ServerProcess {
  child: ChildProcess;
  url: string;
  output(): string;
  /** Sends `signal` and waits for the exit. */
  stop(signal?: NodeJS.Signals): Promise<{ code: number | null; signal: NodeJS.Signals | null }>;
}

/** Starts `cpreg serve <args>` and waits for its "serving <url>" line. */
export function startServe(args: string[], options: { env?: NodeJS.ProcessEnv; timeoutMs?: number } = {}): Promise<ServerProcess> {
  return new Promise((resolve, reject) => {
    const child = spawn(process.execPath, [CPREG_BIN, 'serve', '--log-level', 'warn', ...args], {
      cwd: REPO_ROOT,
      env: options.env ?? childEnv(),
    });
    let output = '';
    const exited = new Promise<{ code: number | null; signal: NodeJS.Signals | null }>((done) => child.on('exit', (code, signal) => done({ code, signal })));
    const timer = setTimeout(() => {
      child.kill('SIGKILL');
      reject(new Error(`cpreg serve did not start in time; output:\n${output}`));
    }, options.timeoutMs ?? 60_000);
    const onData = (chunk: Buffer): void => {
      output += chunk.toString();
      const match = /serving (http:\/\/\S+)/.exec(output);
      if (match) {
        clearTimeout(timer);
        resolve({
          child,
          url: match[1]!,
          output: () => output,
          stop: async (signal = 'SIGTERM') => {
            if (child.exitCode === null && child.signalCode === null) child.kill(signal);
            return exited;
          },
        });
      }
    };
    child.stdout.on('data', onData);
    child.stderr.on('data', onData);
    void exited.then(({ code }) => {
      clearTimeout(timer);
      reject(new Error(`cpreg serve exited (code ${code}) before listening; output:\n${output}`));
    });
  });
}
