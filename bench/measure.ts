/**
 * The measuring helpers a bench file receives in its context (bench/types.ts): calls per second of a function, and
 * the peak memory while a piece of work runs.
 */

export function rate(fn: () => void, options: { minMs?: number; batch?: number } = {}): number {
  const minMs = options.minMs ?? 1000;
  const batch = Math.max(1, options.batch ?? 100);
  const warmUntil = performance.now() + Math.min(200, minMs / 5);
  while (performance.now() < warmUntil) for (let i = 0; i < batch; i++) fn();
  let calls = 0;
  const start = performance.now();
  let now = start;
  while (now - start < minMs) {
    for (let i = 0; i < batch; i++) fn();
    calls += batch;
    now = performance.now();
  }
  return (calls * 1000) / (now - start);
}

export async function withPeakMemory<T>(fn: (sample: () => void) => Promise<T>): Promise<{ result: T; peakRssMb: number; peakHeapMb: number }> {
  let peakRss = 0;
  let peakHeap = 0;
  const sample = (): void => {
    const m = process.memoryUsage();
    peakRss = Math.max(peakRss, m.rss);
    peakHeap = Math.max(peakHeap, m.heapUsed);
  };
  sample();
  const timer = setInterval(sample, 50);
  try {
    const result = await fn(sample);
    sample();
    return { result, peakRssMb: peakRss / 1024 ** 2, peakHeapMb: peakHeap / 1024 ** 2 };
  } finally {
    clearInterval(timer);
  }
}
