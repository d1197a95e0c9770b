/**
 * Where the time of a batch goes: a caller that wants to know (a bench, a profile) passes a StageTimes, and the
 * batch path adds each stage's wall-clock milliseconds to it. Stages are exclusive (a stage nested in another is
 * not counted twice; `timed` subtracts it). Without one, a stage costs a comparison: nothing is measured or kept.
 *
 * The stages of resolveBatch (services/register/batch.ts), in order: `check` (each input checked and analysed),
 * `read` (stored mentions, candidates, token counts), `decide` (each mention against the register, contracts
 * included), `cluster` (the batch with the register), `write` (locks, the outcome's rows and events per chunk) and
 * `flush` (the chunk's set-based write statement). An ingest adds its own (services/ingest/run-ingest.ts).
 */
export type StageTimes = Record<string, number>;

/** Per StageTimes, what is being timed now, so that an inner stage's time is taken out of the outer one. */
const openFrames = new WeakMap<StageTimes, { inner: number }[]>();

export async function timed<T>(times: StageTimes | undefined, stage: string, work: () => Promise<T>): Promise<T> {
  if (!times) return work();
  const open = openFrames.get(times) ?? [];
  openFrames.set(times, open);
  const frame = { inner: 0 };
  open.push(frame);
  const started = performance.now();
  try {
    return await work();
  } finally {
    const elapsed = performance.now() - started;
    open.splice(open.lastIndexOf(frame), 1);
    times[stage] = (times[stage] ?? 0) + elapsed - frame.inner;
    const outer = open[open.length - 1];
    if (outer) outer.inner += elapsed;
  }
}
