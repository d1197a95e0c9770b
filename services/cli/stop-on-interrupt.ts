/**
 * Ctrl-C for a long command that can resume: the first interrupt asks the command to stop at its next safe point
 * (`requested()`), a second quits at once (exit 130). `release()` removes the handler when the command is done.
 */
export interface StopRequest {
  requested: () => boolean;
  release: () => void;
}

/** `message` is printed on the first interrupt: what the command finishes first, and how to go on. */
export function stopOnInterrupt(message: string): StopRequest {
  let stop = false;
  const onSignal = (): void => {
    if (stop) process.exit(130);
    stop = true;
    process.stderr.write(`\ncpreg: ${message}\n`);
  };
  process.on('SIGINT', onSignal);
  return { requested: () => stop, release: () => process.off('SIGINT', onSignal) };
}
