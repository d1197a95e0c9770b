/** An error meant for the person at the terminal: printed as one line, exit code chosen by the thrower. */
export class CliError extends Error {
  constructor(
    message: string,
    readonly exitCode = 1,
    options?: { cause?: unknown },
  ) {
    super(message, options);
    this.name = 'CliError';
  }
}
