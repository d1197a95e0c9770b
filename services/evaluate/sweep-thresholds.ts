/** The thresholds an evaluation reports the cpreg method at. */

/** Whole-bit thresholds from 0 to the highest finite score, at most 40 of them. */
export function sweepThresholds(scores: Float64Array): number[] {
  let min = Infinity;
  let max = -Infinity;
  for (const s of scores) {
    if (!Number.isFinite(s)) continue;
    if (s < min) min = s;
    if (s > max) max = s;
  }
  if (min === Infinity) return [0];
  // Below 0 bits the evidence favours a non-match: no one would link there, and huge clusters make it slow.
  const lo = Math.floor(Math.max(min, 0));
  const hi = Math.ceil(max);
  const step = Math.max(1, Math.ceil((hi - lo) / 40));
  const out: number[] = [];
  for (let t = lo; t <= hi; t += step) out.push(t);
  return out;
}
